// GET /api/v1/ping → { ok: true }: no session, no database. The benchmark's baseline for what the
// framework alone costs per request.
export const dynamic = "force-dynamic";

export function GET() {
  return Response.json({ ok: true });
}
