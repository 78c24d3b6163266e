// `npm start` (and `npm run dev` with --dev): prepares and starts the whole local stack.
import {
  profile, ensureNodeModules, ensurePostgres, ensureDatabase, ensureS3, ensureMailCatcher,
  runTsx, needsBuild, build, ensureWorker, startApp, log, root,
} from "./stack.mjs";
import path from "node:path";

const dev = process.argv.includes("--dev");
const p = profile("app");

ensureNodeModules();
await ensurePostgres(p);
ensureDatabase(p);
await ensureS3(p);
await ensureMailCatcher(p);
log("applying migrations…");
runTsx(path.join(root, "db", "migrate.ts"), p.env);
// STRUTWISE_DEMO=0 starts with an empty database: the app then opens its one-time setup page.
const demo = process.env.STRUTWISE_DEMO !== "0";
if (demo) runTsx(path.join(root, "db", "seed", "index.ts"), p.env, ["--if-empty"]);
if (!dev && needsBuild(p.distDir)) build(p);
await ensureWorker(p);

const banner = () => {
  log("");
  log(`Strutwise is running at ${p.appUrl}${dev ? " (development, hot reload)" : ""}`);
  log(`Local inbox (every e-mail the app sends): ${p.env.INBOX_URL}`);
  if (!demo) {
    log(`No demo data (STRUTWISE_DEMO=0). A new database opens the setup page: ${p.appUrl}/setup`);
    log("Stop everything with: npm run stop");
    return;
  }
  log("Demo sign-ins (password for all: strutwise-demo):");
  for (const [email, role] of [
    ["admin@demo.example", "organisation admin"],
    ["coordinator@demo.example", "temporary works coordinator"],
    ["engineer@demo.example", "site engineer"],
    ["supervisor@demo.example", "temporary works supervisor"],
    ["designer@demo.example", "temporary works designer"],
    ["manager@demo.example", "site manager"],
    ["admin@other.example", "admin of a second organisation (isolation)"],
  ])
    log(`  ${email.padEnd(28)} ${role}`);
  log("Stop everything with: npm run stop");
};

if (dev) {
  // Hot reload in the foreground; the other services keep running until `npm run stop`.
  const { spawn } = await import("node:child_process");
  banner();
  const child = spawn(path.join(root, "node_modules", ".bin", "next"), ["dev", "-H", "127.0.0.1", "-p", String(p.appPort)], {
    cwd: root,
    env: { ...process.env, ...p.env, NEXT_DIST_DIR: ".next-dev" },
    stdio: "inherit",
  });
  child.on("exit", (code) => process.exit(code ?? 0));
} else {
  const started = await startApp(p);
  if (!started) log("the app was already running; kept it (run `npm run stop` first to restart).");
  banner();
}
