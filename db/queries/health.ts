import "server-only";
import { sql } from "@/db";

/** Whether the database answers at all (the health check). */
export async function pingDatabase(): Promise<boolean> {
  try {
    await sql`select 1`;
    return true;
  } catch {
    return false;
  }
}
