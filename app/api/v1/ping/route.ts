// GET /api/v1/ping → { ok: true }: no session, no database. The benchmark's baseline for what the
// framework alone costs per request (through the seam, as every route is).
import { publicRoute } from "@/lib/api/route";

export const dynamic = "force-dynamic";

export const GET = publicRoute({}, async () => ({ ok: true }));
