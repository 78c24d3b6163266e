// `npm test`: prepares a clean test stack (own database, bucket, inbox and ports), then runs
// vitest (unit + integration against the real services) and Playwright in Debian's Chromium.
import {
  profile, ensureNodeModules, ensureChromium, ensurePostgres, ensureDatabase, ensureS3, ensureMailCatcher,
  runTsx, needsBuild, ensureWorker, startApp, stopService, log, root, dataDir,
} from "./stack.mjs";
import { spawnSync } from "node:child_process";
import fs from "node:fs";
import path from "node:path";

const p = profile("test");
// `npm test -- unit` or `-- e2e` runs one part; a path narrows it to those files, e.g.
// `npm test -- integration tests/integration/permits-issue.test.ts`.
const args = process.argv.slice(2);
const only = args.filter((a) => ["checks", "unit", "integration", "e2e"].includes(a));
const files = (part) => args.filter((a) => a.includes(`tests/${part}/`));
const want = (part) => only.length === 0 || only.includes(part);

ensureNodeModules();
if (want("e2e")) ensureChromium();
await ensurePostgres(p);

for (const s of ["app", "worker", "s3", "mail"]) await stopService(`${p.name}-${s}`);
for (const d of [`s3-${p.name}`, `mail-${p.name}`]) fs.rmSync(path.join(dataDir, d), { recursive: true, force: true });
await ensureS3(p);
await ensureMailCatcher(p);

// A second, EMPTY installation (STRUTWISE_DEMO=0) for the first-run journey: its own database
// and app port, sharing this stack's build, S3 fake and SMTP catcher.
const emptyDb = `${p.dbName}_empty`;
const emptyPort = p.appPort + 5;
const emptyUrl = `http://127.0.0.1:${emptyPort}`;
const empty = {
  ...p,
  name: `${p.name}-empty`,
  dbName: emptyDb,
  appPort: emptyPort,
  appUrl: emptyUrl,
  env: {
    ...p.env,
    DATABASE_URL: `postgres://postgres@127.0.0.1:${p.pgPort}/${emptyDb}`,
    APP_URL: emptyUrl,
    NEXTAUTH_URL: emptyUrl,
    STRUTWISE_DEMO: "0",
  },
};
const emptyWanted = () => want("e2e") && (files("e2e").length === 0 || files("e2e").some((f) => f.includes("onboarding-empty")));
for (const s of ["app", "worker"]) await stopService(`${empty.name}-${s}`);

const resetDatabase = () => {
  ensureDatabase(p, { fresh: true });
  runTsx(path.join(root, "db", "migrate.ts"), p.env);
  runTsx(path.join(root, "db", "seed", "index.ts"), p.env);
};

const env = { ...process.env, ...p.env };
resetDatabase();
const bin = (n) => path.join(root, "node_modules", ".bin", n);
let failed = false;
const step = (label, cmd, args) => {
  log(`— ${label}`);
  const r = spawnSync(cmd, args, { cwd: root, env, stdio: "inherit" });
  if (r.status !== 0) {
    failed = true;
    log(`${label} FAILED (exit ${r.status ?? r.signal})`);
    return false;
  }
  return true;
};

// Machine-readable results, summed into one closing line.
const reportFile = (part) => path.join(dataDir, `report-${p.name}-${part}.json`);
for (const part of ["unit", "integration", "e2e"]) fs.rmSync(reportFile(part), { force: true });
const vitestReport = (part) => ["--reporter=default", "--reporter=json", `--outputFile.json=${reportFile(part)}`];

function summary() {
  let passed = 0;
  let failedCount = 0;
  let skipped = 0;
  for (const part of ["unit", "integration"]) {
    if (!fs.existsSync(reportFile(part))) continue;
    const r = JSON.parse(fs.readFileSync(reportFile(part), "utf8"));
    passed += r.numPassedTests ?? 0;
    failedCount += r.numFailedTests ?? 0;
    skipped += (r.numPendingTests ?? 0) + (r.numTodoTests ?? 0);
  }
  if (fs.existsSync(reportFile("e2e"))) {
    const st = JSON.parse(fs.readFileSync(reportFile("e2e"), "utf8")).stats ?? {};
    passed += (st.expected ?? 0) + (st.flaky ?? 0);
    failedCount += st.unexpected ?? 0;
    skipped += st.skipped ?? 0;
  }
  return { passed, failedCount, skipped };
}

try {
  // House habits first (a whole run only, or `npm test -- checks`): types, lint with zero errors,
  // and no dead code, dependencies or exports (knip).
  if (only.length === 0 || only.includes("checks")) {
    step("typecheck (tsc --noEmit)", bin("tsc"), ["--noEmit"]);
    step("lint (ESLint, errors fail)", bin("eslint"), [".", "--quiet"]);
    step("dead code (knip)", bin("knip"), []);
  }
  if (want("unit")) step("unit tests", bin("vitest"), ["run", "--project", "unit", ...vitestReport("unit"), ...files("unit")]);
  // The service worker is built from the app's build output (scripts/build-sw.mjs), right after it.
  const built =
    !(want("integration") || want("e2e")) ||
    !needsBuild(p.distDir) ||
    (step(`build (${p.distDir})`, bin("next"), ["build"]) && step("service worker (sw.js)", process.execPath, [path.join(root, "scripts", "build-sw.mjs"), p.distDir]));
  if (!built) throw new Error("the app did not build; integration and end-to-end tests were not run");
  if (want("integration")) {
    // Integration tests talk to the running app over HTTP and start their own workers.
    await startApp(p);
    step("integration tests", bin("vitest"), ["run", "--project", "integration", ...vitestReport("integration"), ...files("integration")]);
    await stopService(`${p.name}-app`);
  }
  if (want("e2e")) {
    // The browser tests start from the demo seed, whatever the integration tests changed.
    if (want("integration")) resetDatabase();
    await ensureWorker(p);
    await startApp(p);
    if (emptyWanted()) {
      ensureDatabase(empty, { fresh: true });
      runTsx(path.join(root, "db", "migrate.ts"), empty.env);
      await ensureWorker(empty);
      await startApp(empty);
      env.EMPTY_APP_URL = emptyUrl;
    }
    env.PLAYWRIGHT_JSON_OUTPUT_NAME = reportFile("e2e");
    step("end-to-end tests (Chromium)", bin("playwright"), ["test", "--reporter=list,json", ...files("e2e")]);
  }
} catch (e) {
  failed = true;
  log(String(e instanceof Error ? e.message : e));
} finally {
  if (!process.env.KEEP_TEST_STACK) {
    for (const s of ["app", "worker"]) await stopService(`${empty.name}-${s}`);
    for (const s of ["app", "worker", "s3", "mail"]) await stopService(`${p.name}-${s}`);
  }
}
const totals = summary();
log(failed ? "some tests FAILED" : "all tests passed");
if (failed && totals.failedCount === 0) totals.failedCount = 1; // a step failed outside the runners (build, start-up)
process.stdout.write(`${totals.passed} passed, ${totals.failedCount} failed${totals.skipped ? `, ${totals.skipped} skipped` : ""}\n`);
process.exit(failed ? 1 : 0);
