// `npm run bench`: speed figures, printed as a table (speed targets live here, never in tests).
//  1. the calculation engine (scripts/bench/engine.ts), in this process;
//  2. the register's members list API on the 20,000-member site at 32 concurrent connections,
//     beside a bare route handler (GET /api/v1/ping: no session, no database) in the same run;
//  3. issuing a permit to load end to end (transaction + PDF + store + queue): p95
//     (scripts/bench/permits.ts), on the same stack.
// Part 2 starts its own stack in a bench slot (STRUTWISE_TEST_SLOT=9 unless BENCH_SLOT says
// otherwise: own database, ports and build folder), seeds the demo and the large site into it,
// measures for about 10 s per row, and stops what it started.
//
//   npm run bench                 both parts
//   npm run bench -- engine       the engine only;   npm run bench -- api   the API only;
//   npm run bench -- permits      permit issue only
import fs from "node:fs";
import path from "node:path";
import autocannon from "autocannon";

type Row = { name: string; value: string; unit: string; note?: string };
const rows: Row[] = [];
const only = process.argv.slice(2);
const want = (part: string) => only.length === 0 || only.includes(part);
const root = path.resolve(import.meta.dirname, "..");
const SECONDS = Number(process.env.BENCH_SECONDS ?? 10);
const CONNECTIONS = 32;

function printTable() {
  const w = Math.max(...rows.map((r) => r.name.length), 10);
  console.log(`\n${"measure".padEnd(w)}  ${"value".padStart(12)}  unit`);
  console.log(`${"-".repeat(w)}  ${"-".repeat(12)}  ${"-".repeat(24)}`);
  for (const r of rows) console.log(`${r.name.padEnd(w)}  ${r.value.padStart(12)}  ${r.unit}${r.note ? `  (${r.note})` : ""}`);
}

async function engineSection() {
  const file = path.join(root, "scripts", "bench", "engine.ts");
  if (!fs.existsSync(file)) {
    console.log("[bench] scripts/bench/engine.ts is not there; skipping the engine figures.");
    return;
  }
  console.log("[bench] engine…");
  const mod = (await import("./bench/engine")) as { benchEngine: () => Promise<{ name: string; value: number; unit: string; goal?: string }[]> };
  for (const r of await mod.benchEngine())
    rows.push({ name: r.name, value: r.value.toLocaleString("en-GB"), unit: r.unit, note: r.goal ? `goal ${r.goal}` : undefined });
}

/** One autocannon run: requests per second and exact p95 from every response's time. */
async function measure(name: string, url: string, headers: Record<string, string>) {
  const times: number[] = [];
  let bad = 0;
  let finish!: (r: autocannon.Result) => void;
  let failRun!: (e: unknown) => void;
  const done = new Promise<autocannon.Result>((res, rej) => ((finish = res), (failRun = rej)));
  const instance = autocannon({ url, connections: CONNECTIONS, duration: SECONDS, headers }, (err, r) => (err ? failRun(err) : finish(r)));
  instance.on("response", (_client, status, _bytes, ms) => {
    times.push(ms);
    if (status !== 200) bad++;
  });
  const result = await done;
  times.sort((a, b) => a - b);
  const p = (q: number) => times[Math.min(times.length - 1, Math.floor(q * times.length))] ?? NaN;
  if (bad || result.errors || result.timeouts)
    throw new Error(`${name}: ${bad} non-200 responses, ${result.errors} errors, ${result.timeouts} timeouts — the figures would be meaningless`);
  const rps = result.requests.total / (result.duration || SECONDS);
  rows.push({ name: `${name}: requests/s`, value: rps.toFixed(0), unit: "req/s", note: `${CONNECTIONS} connections, ${SECONDS} s` });
  rows.push({ name: `${name}: p95 latency`, value: p(0.95).toFixed(1), unit: "ms", note: `p50 ${p(0.5).toFixed(1)} ms, p99 ${p(0.99).toFixed(1)} ms` });
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
        rows.push({ name: r.name, value: Number.isInteger(r.value) ? String(r.value) : r.value.toFixed(1), unit: r.unit, note: r.goal });
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
    await measure("bare handler GET /api/v1/ping", `${base}/ping`, {});
    // Sign-in check and one small read: what every signed-in handler pays before its own work.
    await measure("signed-in handler GET /api/v1/me", `${base}/me`, headers);
    await measure("members list, first page (50 by tag)", `${base}/sites/${large.siteId}/members`, headers);
    await measure(
      "members list, page 51 of 100 (200 by utilisation)",
      `${base}/sites/${large.siteId}/members?limit=200&sort=utilisation&dir=desc&cursor=${cursor}`,
      headers,
    );
    await measure("members list, failing in one zone, search", `${base}/sites/${large.siteId}/members?pass=false&q=L0&sort=extension`, headers);
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
