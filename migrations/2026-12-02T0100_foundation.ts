import { type Kysely, sql } from "kysely";

// eslint-disable-next-line @typescript-eslint/no-explicit-any
export async function up(db: Kysely<any>): Promise<void> {
  await db.schema
    .createTable("users")
    .addColumn("id", "uuid", (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn("email", "text", (c) => c.notNull())
    .addColumn("name", "text", (c) => c.notNull())
    .addColumn("password_hash", "text")
    .addColumn("is_admin", "boolean", (c) => c.notNull().defaultTo(false))
    .addColumn("email_verified", "timestamptz")
    .addColumn("created_at", "timestamptz", (c) => c.notNull().defaultTo(sql`now()`))
    .execute();
  // E-mail addresses are unique whatever their case.
  await sql`create unique index users_email_lower_key on users (lower(email))`.execute(db);

  await db.schema
    .createTable("courses")
    .addColumn("id", "uuid", (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn("code", "text", (c) => c.notNull().unique())
    .addColumn("title", "text", (c) => c.notNull())
    .addColumn("term", "text", (c) => c.notNull())
    .addColumn("institution", "text", (c) => c.notNull())
    .addColumn("join_code", "text", (c) => c.notNull().unique())
    .addColumn("created_at", "timestamptz", (c) => c.notNull().defaultTo(sql`now()`))
    .execute();

  await db.schema
    .createTable("memberships")
    .addColumn("course_id", "uuid", (c) => c.notNull().references("courses.id").onDelete("cascade"))
    .addColumn("user_id", "uuid", (c) => c.notNull().references("users.id").onDelete("cascade"))
    .addColumn("role", "text", (c) => c.notNull().check(sql`role in ('student', 'ta', 'instructor')`))
    .addColumn("section", "text")
    .addColumn("created_at", "timestamptz", (c) => c.notNull().defaultTo(sql`now()`))
    .addPrimaryKeyConstraint("memberships_pkey", ["course_id", "user_id"])
    .execute();
  await db.schema.createIndex("memberships_user_idx").on("memberships").column("user_id").execute();

  // For the e-mailed sign-in links of next-auth's e-mail provider.
  await db.schema
    .createTable("verification_tokens")
    .addColumn("identifier", "text", (c) => c.notNull())
    .addColumn("token", "text", (c) => c.notNull())
    .addColumn("expires", "timestamptz", (c) => c.notNull())
    .addPrimaryKeyConstraint("verification_tokens_pkey", ["identifier", "token"])
    .execute();
}

// eslint-disable-next-line @typescript-eslint/no-explicit-any
export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.dropTable("verification_tokens").execute();
  await db.schema.dropTable("memberships").execute();
  await db.schema.dropTable("courses").execute();
  await db.schema.dropTable("users").execute();
}
