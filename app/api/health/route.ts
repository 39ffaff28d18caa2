import { sql } from "kysely";
import { db } from "@/db";
import { json } from "@/lib/http/route";

export const dynamic = "force-dynamic";

export async function GET() {
  const started = Date.now();
  try {
    await sql`select 1`.execute(db);
    return json({ status: "ok", database: "reachable", latencyMs: Date.now() - started });
  } catch {
    return json({ status: "degraded", database: "unreachable" }, 503);
  }
}
