// Every integration test starts from empty tables in the integration database (the schema is migrated
// once by scripts/test.ts before vitest starts).
import { afterAll, beforeEach } from "vitest";
import { db } from "@/db";
import { emptyTables } from "../support/db";

beforeEach(async () => {
  await emptyTables(db);
});

afterAll(async () => {
  await db.destroy();
});
