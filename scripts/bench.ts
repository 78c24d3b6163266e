// `npm run bench`: speed figures, printed as a table with each target beside its figure and
// whether it is met (speed targets live here, never in tests).
//  1. the calculation engine (scripts/bench/engine.ts), in this process;
//  2. the register's members list API on the 20,000-member site at 32 concurrent connections,
//     beside a bare route handler (GET /api/v1/ping: no session, no database) in the same run:
//     API targets are ratios to that handler, so a busy machine moves both alike (the handler is
//     measured first and last, and the ratios use the mean of the two);
//  3. the register page as a browser gets it (server-rendered HTML, signed in) at 8 connections;
//  4. issuing a permit to load end to end (transaction + PDF + store + queue): p95
//     (scripts/bench/permits.ts), on the same stack;
//  5. the resident size of the `next start` process group after all of that.
// Part 2 starts its own stack in a bench slot (STRUTWISE_TEST_SLOT=9 unless BENCH_SLOT says
// otherwise: own database, ports and build folder), seeds the demo and the large site into it,
// warms each address up for BENCH_WARMUP s (2; not counted), measures for BENCH_SECONDS s (10) per
// row, and stops what it started.
//
//   npm run bench                 both parts
//   npm run bench -- engine       the engine only;   npm run bench -- api   the API only;
//   npm run bench -- permits      permit issue only
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import autocannon from "autocannon";

type Row = {
  name: string;
  value: string;
  unit: string;
  note?: string;
  /** The target in words, whether it is met, and the figure as a share of the bare handler. */
  target?: string;
  met?: boolean;
  ratio?: string;
};
const rows: Row[] = [];
const only = process.argv.slice(2);
const want = (part: string) => only.length === 0 || only.includes(part);
const root = path.resolve(import.meta.dirname, "..");
const SECONDS = Number(process.env.BENCH_SECONDS ?? 10);
const WARMUP = Number(process.env.BENCH_WARMUP ?? 2);
const CONNECTIONS = 32;
const PAGE_CONNECTIONS = 8;

function printTable() {
  const w = Math.max(...rows.map((r) => r.name.length), 10);
  const t = Math.max(...rows.map((r) => (r.target ?? "").length), 6);
  console.log(`\n${"measure".padEnd(w)}  ${"value".padStart(12)}  ${"unit".padEnd(8)}  ${"vs ping".padStart(7)}  ${"target".padEnd(t)}  met  note`);
  console.log(`${"-".repeat(w)}  ${"-".repeat(12)}  ${"-".repeat(8)}  ${"-".repeat(7)}  ${"-".repeat(t)}  ---  ${"-".repeat(24)}`);
  for (const r of rows) {
    const met = r.met === undefined ? "   " : r.met ? " ✓ " : " ✗ ";
    console.log(
      `${r.name.padEnd(w)}  ${r.value.padStart(12)}  ${r.unit.padEnd(8)}  ${(r.ratio ?? "").padStart(7)}  ${(r.target ?? "").padEnd(t)}  ${met}  ${r.note ?? ""}`.trimEnd(),
    );
  }
  const judged = rows.filter((r) => r.met !== undefined);
  const missed = judged.filter((r) => !r.met);
  console.log(
    `\n${missed.length === 0 ? `every target met (${judged.length})` : `${missed.length} of ${judged.length} targets missed: ${missed.map((r) => r.name).join("; ")}`}; load average ${os.loadavg().map((l) => l.toFixed(2)).join(" ")} on ${os.availableParallelism()} CPUs`,
  );
}

/** "≥ 1000000" / "< 2000" / "<= 300" style goals from the part benches, judged against a value. */
function judge(goal: string | undefined, value: number): { target?: string; met?: boolean } {
  if (!goal) return {};
  const m = /^\s*(>=|<=|<|>|≥|≤)\s*([\d.,_]+)/.exec(goal);
  if (!m) return { target: goal };
  const limit = Number(m[2]!.replace(/[,_]/g, ""));
  const op = m[1]!;
  const met = op === ">=" || op === "≥" ? value >= limit : op === ">" ? value > limit : op === "<" ? value < limit : value <= limit;
  return { target: goal.replace(">=", "≥").replace("<=", "≤"), met };
}

async function engineSection() {
  const file = path.join(root, "scripts", "bench", "engine.ts");
  if (!fs.existsSync(file)) {
    console.log("[bench] scripts/bench/engine.ts is not there; skipping the engine figures.");
    return;
  }
  console.log("[bench] engine…");
  const mod = (await import("./bench/engine")) as { benchEngine: () => Promise<{ name: string; value: number; unit: string; goal?: string }[]> };
  for (const r of await mod.benchEngine()) rows.push({ name: r.name, value: r.value.toLocaleString("en-GB"), unit: r.unit, ...judge(r.goal, r.value) });
}

type Measured = { rps: number; p50: number; p95: number; p99: number };

/** One autocannon run after a warm-up run: requests per second and exact percentiles from every response's time. */
async function measure(name: string, url: string, headers: Record<string, string>, connections = CONNECTIONS): Promise<Measured> {
  const run = async (seconds: number) => {
    const times: number[] = [];
    let bad = 0;
    let finish!: (r: autocannon.Result) => void;
    let failRun!: (e: unknown) => void;
    const done = new Promise<autocannon.Result>((res, rej) => ((finish = res), (failRun = rej)));
    const instance = autocannon({ url, connections, duration: seconds, headers }, (err, r) => (err ? failRun(err) : finish(r)));
    instance.on("response", (_client, status, _bytes, ms) => {
      times.push(ms);
      if (status !== 200) bad++;
    });
    const result = await done;
    if (bad || result.errors || result.timeouts)
      throw new Error(`${name}: ${bad} non-200 responses, ${result.errors} errors, ${result.timeouts} timeouts — the figures would be meaningless`);
    times.sort((a, b) => a - b);
    const p = (q: number) => times[Math.min(times.length - 1, Math.floor(q * times.length))] ?? NaN;
    return { rps: result.requests.total / (result.duration || seconds), p50: p(0.5), p95: p(0.95), p99: p(0.99) };
  };
  if (WARMUP > 0) await run(WARMUP);
  return run(SECONDS);
}

/** Signs in through next-auth's credentials flow and returns the Cookie header to send. */
async function signIn(appUrl: string, email: string): Promise<string> {
  const jar = new Map<string, string>();
  const keep = (res: Response) => {
    for (const c of res.headers.getSetCookie()) {
      const pair = c.split(";")[0]!;
      const i = pair.indexOf("=");
      jar.set(pair.slice(0, i), pair.slice(i + 1));
    }
  };
  const header = () => [...jar].map(([k, v]) => `${k}=${v}`).join("; ");
  const csrfRes = await fetch(`${appUrl}/api/auth/csrf`);
  keep(csrfRes);
  const { csrfToken } = (await csrfRes.json()) as { csrfToken: string };
  const res = await fetch(`${appUrl}/api/auth/callback/credentials`, {
    method: "POST",
    headers: { "content-type": "application/x-www-form-urlencoded", cookie: header() },
    body: new URLSearchParams({ csrfToken, email, password: "strutwise-demo", json: "true" }),
    redirect: "manual",
  });
  keep(res);
  if (![...jar.keys()].some((k) => k.includes("session-token"))) throw new Error(`sign-in as ${email} failed (${res.status})`);
  return header();
}

/** Resident memory of a process group (the app is started as its own group): the sum, and each process. */
function appResidentMb(pid: number | null): { total: number; note: string } | null {
  if (!pid || !fs.existsSync("/proc")) return null;
  const procs: { pid: number; mb: number; cmd: string }[] = [];
  for (const d of fs.readdirSync("/proc")) {
    if (!/^\d+$/.test(d)) continue;
    try {
      const stat = fs.readFileSync(`/proc/${d}/stat`, "utf8");
      // pgrp is the 5th field, after "pid (comm) state ppid".
      const fields = stat.slice(stat.lastIndexOf(")") + 2).split(" ");
      if (Number(fields[2]) !== pid) continue;
      const rssKb = Number(/VmRSS:\s+(\d+)/.exec(fs.readFileSync(`/proc/${d}/status`, "utf8"))?.[1] ?? 0);
      const cmd = fs.readFileSync(`/proc/${d}/cmdline`, "utf8").split("\0").filter(Boolean).slice(0, 2).map((a) => path.basename(a)).join(" ");
      procs.push({ pid: Number(d), mb: rssKb / 1024, cmd });
    } catch {
      /* gone meanwhile */
    }
  }
  if (procs.length === 0) return null;
  const total = procs.reduce((a, b) => a + b.mb, 0);
  return { total, note: `process group of ${procs.length}: ${procs.map((q) => `${q.cmd} ${q.mb.toFixed(0)} MB`).join(", ")}` };
}

async function apiSection() {
  process.env.STRUTWISE_TEST_SLOT = process.env.BENCH_SLOT ?? "9";
  // stack.mjs is plain JavaScript (it runs before npm install); this is the part of it used here.
  type Profile = { name: string; dbName: string; appUrl: string; distDir: string; env: Record<string, string> };
  const stackFile: string = "./stack.mjs";
  const stack = (await import(stackFile)) as {
    profile: (name: string) => Profile;
    ensurePostgres: (p: Profile) => Promise<void>;
    ensureDatabase: (p: Profile, o?: { fresh?: boolean }) => void;
    runTsx: (script: string, env: Record<string, string>) => void;
    needsBuild: (distDir: string) => boolean;
    build: (p: Profile) => void;
    ensureS3: (p: Profile) => Promise<void>;
    ensureMailCatcher: (p: Profile) => Promise<void>;
    startApp: (p: Profile) => Promise<boolean>;
    stopService: (name: string) => Promise<void>;
    runningPid: (name: string) => number | null;
  };
  const p = stack.profile("test");
  Object.assign(process.env, p.env);
  console.log(`[bench] API: stack ${p.name} (database ${p.dbName}, app ${p.appUrl})`);
  const started: string[] = [];
  try {
    await stack.ensurePostgres(p);
    // The demo seed stores generated photos, so the S3 fake must be up before it.
    for (const s of ["s3", "mail", "app"]) started.push(`${p.name}-${s}`);
    await stack.ensureS3(p);
    await stack.ensureMailCatcher(p);
    stack.ensureDatabase(p, { fresh: true });
    stack.runTsx(path.join(root, "db", "migrate.ts"), p.env);
    stack.runTsx(path.join(root, "db", "seed", "index.ts"), p.env);
    if (want("permits")) {
      console.log("[bench] permit issue…");
      const { benchPermitIssue } = (await import("./bench/permits")) as {
        benchPermitIssue: () => Promise<{ name: string; value: number; unit: string; goal?: string }[]>;
      };
      for (const r of await benchPermitIssue())
        rows.push({ name: r.name, value: Number.isInteger(r.value) ? String(r.value) : r.value.toFixed(1), unit: r.unit, ...judge(r.goal, r.value) });
    }
    if (!want("api")) return;
    const { seedLarge, LARGE_SITE } = await import("../db/seed/large");
    const t0 = Date.now();
    const large = await seedLarge(p.env.DATABASE_URL);
    console.log(`[bench] ${LARGE_SITE.name} seeded in ${((Date.now() - t0) / 1000).toFixed(1)} s`);
    if (stack.needsBuild(p.distDir)) stack.build(p);
    await stack.startApp(p);

    const cookie = await signIn(p.appUrl, "coordinator@demo.example");
    const headers = { cookie };
    const get = async <T,>(q: string): Promise<T> => {
      const r = await fetch(`${p.appUrl}/api/v1/sites/${large.siteId}/members${q}`, { headers });
      if (r.status !== 200) throw new Error(`the members API answered ${r.status} for ${q}`);
      return (await r.json()) as T;
    };
    const { total } = await get<{ total: number }>("?limit=1");
    console.log(`[bench] the large site lists ${total} members`);

    // A cursor from the middle of the register, so "a deep page" is a real keyset page.
    let cursor = (await get<{ nextCursor: string }>("?limit=200&sort=utilisation&dir=desc")).nextCursor;
    for (let i = 0; i < 49; i++) cursor = (await get<{ nextCursor: string }>(`?limit=200&sort=utilisation&dir=desc&cursor=${cursor}`)).nextCursor;

    const base = `${p.appUrl}/api/v1`;
    const list = `${base}/sites/${large.siteId}/members`;
    // The whole server warmed up first (compiled code, pools, kept answers), so the first ping is
    // not measured against a cold process while the rest are measured warm.
    for (const u of [`${base}/ping`, `${base}/me`, list, `${list}?limit=200&sort=utilisation&dir=desc&cursor=${cursor}`, `${list}?pass=false&q=L0&sort=extension`])
      await measure("warm-up", u, u.endsWith("/ping") ? {} : headers);
    const ping1 = await measure("ping", `${base}/ping`, {});
    const api: { name: string; url: string; share: number }[] = [
      // Sign-in check and one small read: what every signed-in handler pays before its own work.
      { name: "signed-in handler GET /api/v1/me", url: `${base}/me`, share: 0.85 },
      { name: "members list, first page (50 by tag)", url: list, share: 0.6 },
      { name: "members list, page 51 of 100 (200 by utilisation)", url: `${list}?limit=200&sort=utilisation&dir=desc&cursor=${cursor}`, share: 0.5 },
      { name: "members list, failing in one zone, search", url: `${list}?pass=false&q=L0&sort=extension`, share: 0.5 },
    ];
    const figures = [];
    for (const a of api) figures.push({ ...a, m: await measure(a.name, a.url, headers) });
    const ping2 = await measure("ping (again)", `${base}/ping`, {});
    const ping = (ping1.rps + ping2.rps) / 2;
    const note = (m: Measured) => `p50 ${m.p50.toFixed(1)} ms, p95 ${m.p95.toFixed(1)} ms, p99 ${m.p99.toFixed(1)} ms; ${CONNECTIONS} connections, ${SECONDS} s`;
    rows.push({ name: "bare handler GET /api/v1/ping: requests/s", value: ping.toFixed(0), unit: "req/s", ratio: "100 %", note: `mean of ${ping1.rps.toFixed(0)} (first) and ${ping2.rps.toFixed(0)} (last); ${note(ping1)}` });
    for (const f of figures) {
      const share = f.m.rps / ping;
      rows.push({
        name: `${f.name}: requests/s`,
        value: f.m.rps.toFixed(0),
        unit: "req/s",
        ratio: `${(share * 100).toFixed(0)} %`,
        target: `≥ ${(f.share * 100).toFixed(0)} % of ping`,
        met: share >= f.share,
        note: note(f.m),
      });
    }

    // The register as a browser opens it: the server-rendered page, signed in.
    const html = await measure("register page HTML", `${p.appUrl}/sites/${large.siteId}/members`, headers, PAGE_CONNECTIONS);
    rows.push({
      name: "register page (server-rendered HTML, signed in): p95",
      value: html.p95.toFixed(1),
      unit: "ms",
      ...judge("<= 150 ms", html.p95),
      note: `p50 ${html.p50.toFixed(1)} ms, p99 ${html.p99.toFixed(1)} ms, ${html.rps.toFixed(0)} req/s; ${PAGE_CONNECTIONS} connections, ${SECONDS} s`,
    });

    const rss = appResidentMb(stack.runningPid(`${p.name}-app`));
    if (rss)
      rows.push({ name: "`next start` resident size after the bench", value: rss.total.toFixed(0), unit: "MB", ...judge("<= 400 MB", rss.total), note: rss.note });
  } finally {
    for (const s of started.reverse()) await stack.stopService(s);
  }
}

try {
  if (want("engine")) await engineSection();
  if (want("api") || want("permits")) await apiSection();
  printTable();
} catch (e) {
  printTable();
  console.error(`[bench] ${(e as Error).message}`);
  process.exitCode = 1;
}
// In-process parts leave database pools open; the figures are printed, so end here.
process.exit(process.exitCode ?? 0);
