// Every route handler the app declares, read from app/api/**/route.ts with the seam's metadata:
// the role matrix and the malformed-body property test both cover whatever is declared here.
import fs from "node:fs";
import path from "node:path";
import type { RouteMeta } from "@/lib/api/route";

export const METHODS = ["GET", "POST", "PUT", "PATCH", "DELETE"] as const;
export type Method = (typeof METHODS)[number];
type Handler = ((req: Request, ctx: unknown) => Promise<Response>) & { meta?: RouteMeta };
export type DeclaredRoute = { file: string; url: string; method: Method; meta: RouteMeta | undefined };

const ROOT = path.resolve(import.meta.dirname, "../..");

function findRouteFiles(dir: string): string[] {
  const out: string[] = [];
  for (const e of fs.readdirSync(dir, { withFileTypes: true })) {
    const p = path.join(dir, e.name);
    if (e.isDirectory()) out.push(...findRouteFiles(p));
    else if (e.name === "route.ts") out.push(path.relative(ROOT, p).split(path.sep).join("/"));
  }
  return out.sort();
}

/** Route files relative to the project root, e.g. "app/api/v1/me/route.ts". */
export const routeFiles = (): string[] => findRouteFiles(path.join(ROOT, "app/api"));

/** Each exported method of each route file (except `skip`), with its URL template and metadata. */
export async function declaredRoutes({ skip = [] }: { skip?: string[] } = {}): Promise<DeclaredRoute[]> {
  const routes: DeclaredRoute[] = [];
  for (const file of routeFiles()) {
    if (skip.includes(file)) continue;
    const mod = (await import(path.join(ROOT, file))) as Partial<Record<Method, Handler>>;
    for (const method of METHODS) {
      const h = mod[method];
      if (typeof h !== "function") continue;
      routes.push({ file, url: "/" + file.replace(/^app\//, "").replace(/\/route\.ts$/, ""), method, meta: h.meta });
    }
  }
  return routes;
}
