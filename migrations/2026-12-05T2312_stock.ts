import { type Kysely, sql } from "kysely";

// The stockroom of a course: parts on the shelf by kind, value (SI: ohms or farads), tolerance and quantity.
// eslint-disable-next-line @typescript-eslint/no-explicit-any
export async function up(db: Kysely<any>): Promise<void> {
  await db.schema
    .createTable("stock_items")
    .addColumn("id", "uuid", (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn("course_id", "uuid", (c) => c.notNull().references("courses.id").onDelete("cascade"))
    .addColumn("kind", "text", (c) => c.notNull().check(sql`kind in ('resistor', 'capacitor')`))
    .addColumn("value", "double precision", (c) => c.notNull().check(sql`value > 0`))
    .addColumn("tolerance_percent", "real", (c) => c.notNull().check(sql`tolerance_percent > 0 and tolerance_percent <= 50`))
    .addColumn("quantity", "integer", (c) => c.notNull().check(sql`quantity >= 0`))
    .addUniqueConstraint("stock_items_part_key", ["course_id", "kind", "value", "tolerance_percent"])
    .execute();
}

// eslint-disable-next-line @typescript-eslint/no-explicit-any
export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.dropTable("stock_items").execute();
}
