import { type Kysely, sql } from "kysely";

// A lab's weight in the course total. Null means "weighted by its points" (the sum of its questions'
// points), so a course that never sets weights totals points earned over points available.
// eslint-disable-next-line @typescript-eslint/no-explicit-any
export async function up(db: Kysely<any>): Promise<void> {
  await db.schema
    .alterTable("labs")
    .addColumn("weight", "double precision", (c) => c.check(sql`weight is null or (weight >= 0 and weight <= 1000)`))
    .execute();
}

// eslint-disable-next-line @typescript-eslint/no-explicit-any
export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.alterTable("labs").dropColumn("weight").execute();
}
