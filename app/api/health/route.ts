import { NextResponse } from "next/server";
import { pingDatabase } from "@/db/queries/health";
import { publicRoute } from "@/lib/api/route";

export const dynamic = "force-dynamic";

/** Liveness and database reachability, for the start script and load balancers. */
export const GET = publicRoute({}, async () =>
  (await pingDatabase()) ? NextResponse.json({ ok: true }) : NextResponse.json({ ok: false, error: "database unreachable" }, { status: 503 }),
);
