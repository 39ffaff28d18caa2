// The stockroom of a course: parts on the shelf.
import type { Kysely, Transaction } from "kysely";
import type { Database } from "../types";

type Db = Kysely<Database> | Transaction<Database>;

export async function listStock(db: Db, courseId: string) {
  return db
    .selectFrom("stock_items")
    .select(["id", "kind", "value", "tolerance_percent as tolerancePercent", "quantity"])
    .where("course_id", "=", courseId)
    .orderBy("kind", "desc")
    .orderBy("value")
    .orderBy("tolerance_percent")
    .execute();
}

/** Replaces the course's stock (call in a transaction). */
export async function replaceStock(trx: Transaction<Database>, courseId: string, items: { kind: "resistor" | "capacitor"; value: number; tolerancePercent: number; quantity: number }[]) {
  await trx.deleteFrom("stock_items").where("course_id", "=", courseId).execute();
  if (!items.length) return;
  await trx
    .insertInto("stock_items")
    .values(items.map((i) => ({ course_id: courseId, kind: i.kind, value: i.value, tolerance_percent: i.tolerancePercent, quantity: i.quantity })))
    .execute();
}
