import { type Kysely, sql } from "kysely";

// Instrument profiles of a course (lib/instruments/profile.ts, stored whole as JSON), the instrument a lab's
// readings are taken with, and the course teaching meter every course starts with: a trigger adds it to each
// new course and the existing courses get it here. The profile below is the teaching meter as built in on
// the day of this migration (lib/instruments/library.ts; tests/unit/instruments/migration-snapshot.test.ts
// checks they agree).
export const TEACHING_METER_SNAPSHOT = {
  name: "Teaching meter",
  kind: "sampling-meter",
  description:
    "The course's own sampling meter: a shunt per range, an amplifier of gain 50 and a 14-bit converter on a 2.5 V reference, with an analogue output of 2.5 V at full scale on every range.",
  ranges: [
    { key: "r5u", label: "5 µA", fullScale: 5e-6, shuntOhms: 10000, sensitivity: 500000, resolution: { bits: 14, referenceVolts: 2.5 }, accuracy: { percentOfReading: 0.5, counts: 4 }, filterCutoffHz: 159.2, settlingSeconds: 0.005 },
    { key: "r500u", label: "500 µA", fullScale: 0.0005, shuntOhms: 100, sensitivity: 5000, resolution: { bits: 14, referenceVolts: 2.5 }, accuracy: { percentOfReading: 0.25, counts: 2 }, filterCutoffHz: 159.2, settlingSeconds: 0.005 },
    { key: "r50m", label: "50 mA", fullScale: 0.05, shuntOhms: 1, sensitivity: 50, resolution: { bits: 14, referenceVolts: 2.5 }, accuracy: { percentOfReading: 0.25, counts: 2 }, filterCutoffHz: 159.2, settlingSeconds: 0.005 },
    { key: "r1", label: "1 A", fullScale: 1, shuntOhms: 0.05, sensitivity: 2.5, resolution: { bits: 14, referenceVolts: 2.5 }, accuracy: { percentOfReading: 0.5, counts: 2 }, filterCutoffHz: 159.2, settlingSeconds: 0.005 },
  ],
  autoRange: { upAtFractionOfFullScale: 0.9, downAtFractionOfFullScale: 0.008, settlingSeconds: 0.005 },
  offset: { volts: 1.25 },
};

const literal = () => `'${JSON.stringify(TEACHING_METER_SNAPSHOT).replace(/'/g, "''")}'::jsonb`;

// eslint-disable-next-line @typescript-eslint/no-explicit-any
export async function up(db: Kysely<any>): Promise<void> {
  await db.schema
    .createTable("instruments")
    .addColumn("id", "uuid", (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn("course_id", "uuid", (c) => c.notNull().references("courses.id").onDelete("cascade"))
    .addColumn("name", "text", (c) => c.notNull().check(sql`length(name) between 1 and 80`))
    .addColumn("kind", "text", (c) => c.notNull().check(sql`kind in ('sampling-meter', 'multimeter', 'feedback-ammeter')`))
    .addColumn("profile", "jsonb", (c) => c.notNull())
    .addColumn("library_key", "text")
    .addColumn("created_at", "timestamptz", (c) => c.notNull().defaultTo(sql`now()`))
    .addColumn("updated_at", "timestamptz", (c) => c.notNull().defaultTo(sql`now()`))
    .execute();
  await db.schema.createIndex("instruments_course_idx").on("instruments").columns(["course_id", "created_at"]).execute();
  await db.schema
    .alterTable("labs")
    .addColumn("instrument_id", "uuid", (c) => c.references("instruments.id").onDelete("set null"))
    .execute();
  await db.schema.createIndex("labs_instrument_idx").on("labs").column("instrument_id").execute();
  await sql
    .raw(
      `create function courses_add_teaching_meter() returns trigger language plpgsql as $fn$
       begin
         insert into instruments (course_id, name, kind, profile, library_key)
         values (new.id, 'Teaching meter', 'sampling-meter', ${literal()}, 'teaching-meter');
         return new;
       end $fn$`,
    )
    .execute(db);
  await sql`create trigger courses_teaching_meter after insert on courses for each row execute function courses_add_teaching_meter()`.execute(db);
  await sql
    .raw(`insert into instruments (course_id, name, kind, profile, library_key) select id, 'Teaching meter', 'sampling-meter', ${literal()}, 'teaching-meter' from courses`)
    .execute(db);
}

// eslint-disable-next-line @typescript-eslint/no-explicit-any
export async function down(db: Kysely<any>): Promise<void> {
  await sql`drop trigger courses_teaching_meter on courses`.execute(db);
  await sql`drop function courses_add_teaching_meter()`.execute(db);
  await db.schema.alterTable("labs").dropColumn("instrument_id").execute();
  await db.schema.dropTable("instruments").execute();
}
