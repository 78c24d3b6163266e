// Creates the profile's database on the local PostgreSQL server (optionally dropping it first).
import postgres from "postgres";

const url = new URL(process.env.DATABASE_URL!);
const name = url.pathname.slice(1);
const fresh = process.argv.includes("--fresh");
if (!/^[a-z0-9_]+$/.test(name)) throw new Error(`unexpected database name ${name}`);
url.pathname = "/postgres";
const sql = postgres(url.toString(), { max: 1, onnotice: () => {} });
try {
  if (fresh) await sql.unsafe(`drop database if exists ${name} with (force)`);
  const rows = await sql`select 1 from pg_database where datname = ${name}`;
  if (rows.length === 0) await sql.unsafe(`create database ${name}`);
} finally {
  await sql.end();
}
