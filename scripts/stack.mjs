// The local stack, shared by `npm start`, `npm run dev`, `npm test` and `npm run stop`.
// Uses only Node built-ins so it can run before `npm install` has happened.
import { spawn, spawnSync, execFileSync } from "node:child_process";
import fs from "node:fs";
import net from "node:net";
import path from "node:path";
import { fileURLToPath } from "node:url";

export const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), "..");
export const dataDir = path.join(root, ".data");
const runDir = path.join(dataDir, "run");
const logDir = path.join(dataDir, "logs");
const isRoot = typeof process.getuid === "function" && process.getuid() === 0;

export function log(msg) {
  process.stdout.write(`[strutwise] ${msg}\n`);
}

export class StackError extends Error {}

/** Stops the current command with a clear message; callers' cleanup (finally) still runs. */
export function fail(msg) {
  process.stderr.write(`[strutwise] ${msg}\n`);
  throw new StackError(msg);
}

function run(cmd, args, opts = {}) {
  const r = spawnSync(cmd, args, { stdio: "inherit", ...opts });
  if (r.status !== 0) fail(`${cmd} ${args.join(" ")} failed (exit ${r.status ?? r.signal})`);
  return r;
}

/**
 * Ports and names of one stack profile ("app" for npm start, "test" for npm test).
 * STRUTWISE_TEST_SLOT=N gives a test stack its own ports, database, bucket, inbox and build
 * folder, so several test runs can share one machine.
 */
export function profile(name) {
  const env = process.env;
  const test = name === "test";
  const slot = test ? Number(env.STRUTWISE_TEST_SLOT ?? 0) : 0;
  const suffix = slot ? `-${slot}` : "";
  const off = slot * 10;
  const pgPort = Number(env.PGPORT_STRUTWISE ?? 55432);
  const dbName = test ? `strutwise_test${slot ? `_${slot}` : ""}` : "strutwise";
  const s3Port = Number(test ? env.TEST_S3_PORT ?? 4579 + off : env.S3_PORT ?? 4569);
  const smtpPort = Number(test ? env.TEST_SMTP_PORT ?? 2025 + off : env.SMTP_PORT ?? 1025);
  const inboxPort = Number(test ? env.TEST_INBOX_PORT ?? 2080 + off : env.INBOX_PORT ?? 1080);
  const appPort = Number(test ? env.TEST_APP_PORT ?? 3100 + off : env.PORT ?? 3000);
  const appUrl = `http://127.0.0.1:${appPort}`;
  const distDir = test ? `.next-test${suffix}` : ".next";
  return {
    name: test ? `test${suffix}` : name,
    pgPort,
    dbName,
    s3Port,
    smtpPort,
    inboxPort,
    appPort,
    appUrl,
    distDir,
    env: {
      DATABASE_URL: env.DATABASE_URL && !test ? env.DATABASE_URL : `postgres://postgres@127.0.0.1:${pgPort}/${dbName}`,
      S3_ENDPOINT: `http://127.0.0.1:${s3Port}`,
      S3_BUCKET: test ? "strutwise-test" : "strutwise",
      S3_ACCESS_KEY_ID: "S3RVER",
      S3_SECRET_ACCESS_KEY: "S3RVER",
      S3_REGION: "us-east-1",
      S3_FORCE_PATH_STYLE: "true",
      SMTP_HOST: "127.0.0.1",
      SMTP_PORT: String(smtpPort),
      INBOX_URL: `http://127.0.0.1:${inboxPort}`,
      APP_URL: appUrl,
      NEXTAUTH_URL: appUrl,
      NEXT_DIST_DIR: distDir,
      NEXT_TELEMETRY_DISABLED: "1",
      AWS_SDK_JS_NODE_VERSION_SUPPORT_WARNING_DISABLED: "true",
      STRUTWISE_PROFILE: test ? "test" : name,
      PLAYWRIGHT_OUTPUT_DIR: `.data/test-results${suffix}`,
    },
  };
}

// ---------------------------------------------------------------- npm install
export function ensureNodeModules() {
  if (process.env.STRUTWISE_SKIP_INSTALL === "1") return;
  const lock = path.join(root, "package-lock.json");
  const marker = path.join(root, "node_modules", ".package-lock.json");
  const stale =
    !fs.existsSync(marker) ||
    (fs.existsSync(lock) && fs.statSync(lock).mtimeMs > fs.statSync(marker).mtimeMs + 1000) ||
    fs.statSync(path.join(root, "package.json")).mtimeMs > fs.statSync(marker).mtimeMs + 1000;
  if (!stale) return;
  log("installing node modules (npm ci)…");
  const ci = fs.existsSync(lock) ? ["ci", "--no-audit", "--no-fund"] : ["install", "--no-audit", "--no-fund"];
  run("npm", ci, { cwd: root });
}

// ----------------------------------------------------------------- apt-get
let aptUpdated = false;
function aptInstall(pkgs) {
  if (!isRoot) fail(`please install ${pkgs.join(" ")} (apt-get install -y ${pkgs.join(" ")}); not running as root`);
  if (!aptUpdated) {
    log("apt-get update…");
    run("apt-get", ["update", "-qq"], { env: { ...process.env, DEBIAN_FRONTEND: "noninteractive" } });
    aptUpdated = true;
  }
  log(`apt-get install ${pkgs.join(" ")}…`);
  run("apt-get", ["install", "-y", "-qq", "--no-install-recommends", ...pkgs], {
    env: { ...process.env, DEBIAN_FRONTEND: "noninteractive" },
  });
}

export function ensureChromium() {
  if (fs.existsSync("/usr/bin/chromium")) return "/usr/bin/chromium";
  aptInstall(["chromium"]);
  return "/usr/bin/chromium";
}

// --------------------------------------------------------------- PostgreSQL
function pgBinDir() {
  const base = "/usr/lib/postgresql";
  if (!fs.existsSync(base)) return null;
  const versions = fs
    .readdirSync(base)
    .filter((v) => fs.existsSync(path.join(base, v, "bin", "pg_ctl")))
    .sort((a, b) => Number(b) - Number(a));
  return versions.length ? path.join(base, versions[0], "bin") : null;
}

function asPostgres(cmd, args, opts = {}) {
  if (isRoot) return run("runuser", ["-u", "postgres", "--", cmd, ...args], opts);
  return run(cmd, args, opts);
}

/** PostgreSQL runs as `postgres`, which must be able to walk down to the data folder. */
function makeTraversable(dir) {
  if (!isRoot) return;
  let d = dir;
  const chain = [];
  while (d !== path.dirname(d)) {
    chain.push(d);
    d = path.dirname(d);
  }
  for (const p of chain.reverse()) {
    const ok = spawnSync("runuser", ["-u", "postgres", "--", "test", "-x", p]).status === 0;
    if (!ok) {
      log(`letting the postgres user pass through ${p} (chmod o+x)`);
      fs.chmodSync(p, fs.statSync(p).mode | 0o001);
    }
  }
}

export function portOpen(port, host = "127.0.0.1", timeoutMs = 500) {
  return new Promise((resolve) => {
    const s = net.connect({ port, host });
    const done = (v) => {
      s.destroy();
      resolve(v);
    };
    s.setTimeout(timeoutMs, () => done(false));
    s.once("connect", () => done(true));
    s.once("error", () => done(false));
  });
}

export async function waitForPort(port, what, timeoutMs = 30000) {
  const until = Date.now() + timeoutMs;
  while (Date.now() < until) {
    if (await portOpen(port)) return;
    await new Promise((r) => setTimeout(r, 150));
  }
  fail(`${what} did not start listening on 127.0.0.1:${port} within ${timeoutMs / 1000} s (logs in ${logDir})`);
}

export async function ensurePostgres(p) {
  let bin = pgBinDir();
  if (!bin) {
    aptInstall(["postgresql"]);
    bin = pgBinDir();
    if (!bin) fail("PostgreSQL was installed but its binaries were not found under /usr/lib/postgresql");
  }
  const pgData = path.join(dataDir, "pg");
  fs.mkdirSync(dataDir, { recursive: true });
  fs.mkdirSync(logDir, { recursive: true });
  const pgLog = path.join(logDir, "postgres.log");
  if (isRoot) {
    makeTraversable(dataDir);
    fs.mkdirSync(pgData, { recursive: true, mode: 0o700 });
    fs.closeSync(fs.openSync(pgLog, "a"));
    execFileSync("chown", ["postgres:postgres", pgData, pgLog]);
  }
  if (!fs.existsSync(path.join(pgData, "PG_VERSION"))) {
    log("initialising PostgreSQL data folder…");
    asPostgres(path.join(bin, "initdb"), ["-D", pgData, "-U", "postgres", "--auth=trust", "--encoding=UTF8", "--locale=C.UTF-8"], {
      stdio: ["ignore", "ignore", "inherit"],
    });
    fs.appendFileSync(
      path.join(pgData, "postgresql.conf"),
      `\n# strutwise: loopback only, TCP only\nlisten_addresses = '127.0.0.1'\nport = ${p.pgPort}\nunix_socket_directories = ''\nmax_connections = 200\nfsync = on\n`,
    );
  }
  if (await portOpen(p.pgPort)) return;
  log(`starting PostgreSQL on 127.0.0.1:${p.pgPort}…`);
  asPostgres(path.join(bin, "pg_ctl"), ["-D", pgData, "-l", pgLog, "-w", "-t", "60", "-o", `-p ${p.pgPort}`, "start"], {
    stdio: ["ignore", "ignore", "inherit"],
  });
  await waitForPort(p.pgPort, "PostgreSQL");
}

export function stopPostgres() {
  const bin = pgBinDir();
  const pgData = path.join(dataDir, "pg");
  if (!bin || !fs.existsSync(path.join(pgData, "postmaster.pid"))) return;
  log("stopping PostgreSQL…");
  const args = ["-D", pgData, "-m", "fast", "-w", "stop"];
  if (isRoot) spawnSync("runuser", ["-u", "postgres", "--", path.join(bin, "pg_ctl"), ...args], { stdio: "ignore" });
  else spawnSync(path.join(bin, "pg_ctl"), args, { stdio: "ignore" });
}

// ------------------------------------------------------- background services
function pidFile(name) {
  return path.join(runDir, `${name}.pid`);
}

export function isAlive(pid) {
  try {
    process.kill(pid, 0);
    return true;
  } catch {
    return false;
  }
}

export function runningPid(name) {
  try {
    const pid = Number(fs.readFileSync(pidFile(name), "utf8"));
    return pid && isAlive(pid) ? pid : null;
  } catch {
    return null;
  }
}

/** Starts a detached service with its own process group, logging to .data/logs/<name>.log. */
export function startService(name, cmd, args, env) {
  fs.mkdirSync(runDir, { recursive: true });
  fs.mkdirSync(logDir, { recursive: true });
  const out = fs.openSync(path.join(logDir, `${name}.log`), "a");
  const child = spawn(cmd, args, {
    cwd: root,
    env: { ...process.env, ...env },
    detached: true,
    stdio: ["ignore", out, out],
  });
  child.unref();
  fs.writeFileSync(pidFile(name), String(child.pid));
  return child.pid;
}

export async function stopService(name) {
  const pid = runningPid(name);
  if (pid) {
    try {
      process.kill(-pid, "SIGTERM");
    } catch {
      try {
        process.kill(pid, "SIGTERM");
      } catch {
        /* already gone */
      }
    }
    const until = Date.now() + 8000;
    while (isAlive(pid) && Date.now() < until) await new Promise((r) => setTimeout(r, 100));
    if (isAlive(pid)) {
      try {
        process.kill(-pid, "SIGKILL");
      } catch {
        /* gone */
      }
    }
  }
  fs.rmSync(pidFile(name), { force: true });
}

export function serviceNames() {
  if (!fs.existsSync(runDir)) return [];
  return fs
    .readdirSync(runDir)
    .filter((f) => f.endsWith(".pid"))
    .map((f) => f.slice(0, -4));
}

const bin = (name) => path.join(root, "node_modules", ".bin", name);
export const tsx = bin("tsx");
export const nextBin = bin("next");

export async function ensureS3(p) {
  const name = `${p.name}-s3`;
  if (runningPid(name) && (await portOpen(p.s3Port))) return;
  if (await portOpen(p.s3Port)) fail(`port ${p.s3Port} (S3 fake) is taken by another program; set ${p.name === "test" ? "TEST_S3_PORT" : "S3_PORT"}`);
  startService(name, process.execPath, [path.join(root, "scripts", "s3-fake.mjs")], {
    S3_FAKE_PORT: String(p.s3Port),
    S3_FAKE_DIR: path.join(dataDir, `s3-${p.name}`),
    S3_FAKE_BUCKETS: p.env.S3_BUCKET,
  });
  await waitForPort(p.s3Port, "S3 fake");
}

export async function ensureMailCatcher(p) {
  const name = `${p.name}-mail`;
  if (runningPid(name) && (await portOpen(p.smtpPort)) && (await portOpen(p.inboxPort))) return;
  for (const port of [p.smtpPort, p.inboxPort])
    if (await portOpen(port)) fail(`port ${port} (mail catcher) is taken by another program`);
  startService(name, process.execPath, [path.join(root, "scripts", "mail-catcher.mjs")], {
    CATCHER_SMTP_PORT: String(p.smtpPort),
    CATCHER_HTTP_PORT: String(p.inboxPort),
    CATCHER_DIR: path.join(dataDir, `mail-${p.name}`),
  });
  await waitForPort(p.smtpPort, "SMTP catcher");
  await waitForPort(p.inboxPort, "mail inbox");
}

/** Node flags to run our TypeScript outside Next.js: tsx, and the server-only marker made harmless. */
export const tsNodeArgs = ["--import", "tsx", "--import", path.join(root, "scripts", "server-only-hook.mjs")];

export function runTsx(script, env, args = []) {
  run(process.execPath, [...tsNodeArgs, script, ...args], { cwd: root, env: { ...process.env, ...env } });
}

/** True when the build in distDir is older than any source file. */
export function needsBuild(distDir) {
  const idFile = path.join(root, distDir, "BUILD_ID");
  if (!fs.existsSync(idFile) || !fs.existsSync(path.join(root, distDir, "sw.js"))) return true;
  const built = fs.statSync(idFile).mtimeMs;
  const dirs = ["app", "components", "lib", "db", "emails", "public"];
  const files = ["package-lock.json", "next.config.mjs", "tailwind.config.ts", "postcss.config.mjs", "tsconfig.json"];
  const newer = (p) => {
    const st = fs.statSync(p, { throwIfNoEntry: false });
    if (!st) return false;
    if (st.isDirectory()) return fs.readdirSync(p).some((f) => newer(path.join(p, f)));
    return st.mtimeMs > built;
  };
  return dirs.some((d) => newer(path.join(root, d))) || files.some((f) => newer(path.join(root, f)));
}

export function build(p) {
  log(`building the app (${p.distDir})…`);
  run(nextBin, ["build"], { cwd: root, env: { ...process.env, ...p.env } });
  // The service worker is bundled from the build's output (precache list of the app shell).
  run(process.execPath, [path.join(root, "scripts", "build-sw.mjs"), p.distDir], { cwd: root, env: { ...process.env, ...p.env } });
}

export async function ensureWorker(p) {
  const name = `${p.name}-worker`;
  if (runningPid(name)) return;
  startService(name, process.execPath, [...tsNodeArgs, path.join(root, "lib", "jobs", "worker.ts")], p.env);
}

export async function startApp(p, { dev = false } = {}) {
  const name = `${p.name}-app`;
  if (!dev && runningPid(name) && (await portOpen(p.appPort))) return false;
  if (await portOpen(p.appPort)) fail(`port ${p.appPort} is taken by another program; set ${p.name === "test" ? "TEST_APP_PORT" : "PORT"}`);
  startService(name, nextBin, [dev ? "dev" : "start", "-H", "127.0.0.1", "-p", String(p.appPort)], p.env);
  await waitForHttp(`${p.appUrl}/api/health`, "the app", 90000);
  return true;
}

export async function waitForHttp(url, what, timeoutMs) {
  const until = Date.now() + timeoutMs;
  while (Date.now() < until) {
    try {
      const r = await fetch(url);
      if (r.ok) return;
    } catch {
      /* not yet */
    }
    await new Promise((r) => setTimeout(r, 300));
  }
  fail(`${what} did not answer ${url} within ${timeoutMs / 1000} s (logs in ${logDir})`);
}

/** Creates the database if missing; with fresh=true drops it first. */
export function ensureDatabase(p, { fresh = false } = {}) {
  runTsx(path.join(root, "scripts", "create-db.ts"), p.env, fresh ? ["--fresh"] : []);
}
