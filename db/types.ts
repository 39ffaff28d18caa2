// The typed shape of the database. Table interfaces are used only inside `Database`; code elsewhere uses
// the Selectable/Insertable aliases. Nullable columns are `T | null`, database defaults `Generated<T>`.
import type { ColumnType, Generated, Insertable, Kysely, Selectable, Transaction, Updateable } from "kysely";

type Timestamp = ColumnType<Date, Date | string | undefined, Date | string>;

export type Role = "student" | "ta" | "instructor";
export const ROLES: readonly Role[] = ["student", "ta", "instructor"] as const;

export interface UsersTable {
  id: Generated<string>;
  email: string;
  name: string;
  password_hash: string | null;
  is_admin: Generated<boolean>;
  email_verified: Date | null;
  created_at: Generated<Date>;
  /** false: the student turned graded e-mails off (staff regrades are sent anyway) */
  grade_mail: Generated<boolean>;
  /** sessions signed in before this time are void (set when a password is chosen through an e-mailed link) */
  sessions_valid_after: Timestamp | null;
  /** set by the site admin: the account cannot sign in and its sessions are gone */
  disabled_at: Timestamp | null;
}

/** One signed-in browser: its cookie carries the id; signing out deletes the row. */
export interface SessionsTable {
  id: Generated<string>;
  user_id: string;
  created_at: Generated<Date>;
  last_seen_at: Generated<Date>;
  user_agent: string | null;
}

export interface CoursesTable {
  id: Generated<string>;
  code: string;
  title: string;
  term: string;
  institution: string;
  join_code: string;
  created_at: Generated<Date>;
  joining_open: Generated<boolean>;
  default_late_penalty_percent_per_day: Generated<number>;
  default_late_floor_percent: Generated<number>;
  copied_from: string | null;
}

export interface MembershipsTable {
  course_id: string;
  user_id: string;
  role: Role;
  section: string | null;
  created_at: Generated<Date>;
}

export interface VerificationTokensTable {
  identifier: string;
  token: string;
  expires: Timestamp;
}

export type LabStatus = "draft" | "published";
export type Counting = "best" | "last";
export type ShowExpected = "after_attempt" | "after_due" | "never";

type Json<T> = ColumnType<T, string, string>;

export interface LabsTable {
  id: Generated<string>;
  course_id: string;
  title: string;
  template_key: string;
  status: Generated<LabStatus>;
  spec: Json<unknown>;
  questions: Json<unknown>;
  policy: Json<unknown>;
  attempts_allowed: Generated<number>;
  counting: Generated<Counting>;
  opens_at: Timestamp | null;
  due_at: Timestamp | null;
  /** late attempts accepted until then; null: the default close (lib/labs/policy.ts closeOf) */
  closes_at: Timestamp | null;
  late_penalty_percent_per_day: Generated<number>;
  late_floor_percent: Generated<number>;
  show_expected: Generated<ShowExpected>;
  instructions: Generated<string>;
  safety_notes: Generated<string>;
  version: Generated<number>;
  created_by: string | null;
  created_at: Generated<Date>;
  updated_at: Generated<Date>;
  published_at: Timestamp | null;
  /** while true, students see "graded, not yet released" and no grade e-mail goes out */
  grades_held: Generated<boolean>;
  grades_released_at: Timestamp | null;
  /** Weight in the course total; null = weighted by the lab's points. */
  weight: number | null;
  /** where the readings come from: the real bench, the simulated bench (lib/simulation) or either */
  bench: Generated<BenchMode>;
}

export type BenchMode = "real" | "simulated" | "either";

export interface LabVariantsTable {
  lab_id: string;
  user_id: string;
  seed: string;
  params: Json<unknown>;
  created_at: Generated<Date>;
}

export type UploadKind = "image" | "trace";
export type UploadStatus = "pending" | "completing" | "analysing" | "ready" | "failed";

/** Where a trace's samples are kept in compact form (see lib/uploads/samples.ts). */
export interface StoredSamples {
  key: string;
  rows: number;
  /** samples per block of the index */
  block: number;
  /** the time (s) of the first sample of each block */
  index: number[];
}

export interface UploadsTable {
  id: Generated<string>;
  owner_id: string;
  course_id: string;
  lab_id: string | null;
  kind: UploadKind;
  content_type: string;
  size: number;
  sha256: string | null;
  storage_key: string;
  original_name: string;
  analysis: Json<unknown> | null;
  created_at: Generated<Date>;
  status: Generated<UploadStatus>;
  multipart_id: string | null;
  progress: number | null;
  failure: string | null;
  samples: Json<StoredSamples> | null;
}

export interface AttemptsTable {
  id: Generated<string>;
  lab_id: string;
  user_id: string;
  number: number;
  idempotency_key: string;
  readings: Json<unknown>;
  measured: Json<unknown>;
  upload_ids: ColumnType<string[], string[] | undefined, string[]>;
  result: Json<unknown>;
  raw_score: number;
  max_score: number;
  late_days: Generated<number>;
  penalty_percent: Generated<number>;
  score: number;
  grader_version: string;
  lab_version: number;
  submitted_at: Generated<Date>;
  graded_at: Generated<Date>;
  review_requested_at: Timestamp | null;
  review_message: string | null;
  review_answer: string | null;
  review_answered_at: Timestamp | null;
  review_answered_by: string | null;
  /** true once staff overrode a question's points or re-ran the grader */
  changed_by_staff: Generated<boolean>;
  /** points set by staff per question, applied over the grader's and kept through recomputations */
  overrides: ColumnType<Record<string, StaffOverride>, string | undefined, string>;
  /** the readings came from the simulated bench */
  simulated: Generated<boolean>;
}

export interface StaffOverride {
  points: number;
  reason: string;
  by: string;
  at: string;
}

export type GradeEventKind = "graded" | "recomputed" | "override" | "rerun" | "review_answer" | "exception";

/** Append-only (a trigger refuses UPDATE and DELETE). Attempt-level events carry the raw points total in points_*; question events the question's points. */
export interface GradeEventsTable {
  id: ColumnType<string, never, never>;
  attempt_id: string;
  question_id: string | null;
  kind: GradeEventKind;
  actor_id: string | null;
  created_at: Generated<Date>;
  points_before: number | null;
  points_after: number | null;
  score_before: number | null;
  score_after: number | null;
  reason: string | null;
  grader_version: string | null;
}

export interface LabRegradesTable {
  id: Generated<string>;
  lab_id: string;
  lab_version: number;
  status: Generated<"queued" | "running" | "done" | "failed">;
  total: Generated<number>;
  done: Generated<number>;
  created_at: Generated<Date>;
  finished_at: Timestamp | null;
}

export interface CourseLessonsTable {
  course_id: string;
  slug: string;
  position: number;
  visible: Generated<boolean>;
  opens_at: Timestamp | null;
  updated_at: Generated<Date>;
}

export type MailStatus = "queued" | "sent" | "failed";

export interface MailOutboxTable {
  id: Generated<string>;
  /** the event key: one row, one job and one message per key */
  key: string;
  kind: string;
  to_address: string;
  subject: string | null;
  data: ColumnType<unknown, string | undefined, string>;
  status: Generated<MailStatus>;
  tries: Generated<number>;
  last_error: string | null;
  message_id: string | null;
  job_id: string | null;
  created_at: Generated<Date>;
  sent_at: Timestamp | null;
  failed_at: Timestamp | null;
}

export type PasswordTokenPurpose = "reset" | "set";

export interface PasswordTokensTable {
  id: Generated<string>;
  user_id: string;
  purpose: PasswordTokenPurpose;
  expires_at: Timestamp;
  used_at: Timestamp | null;
  created_at: Generated<Date>;
}

/** The throttles' counters (rate-limiter-flexible's layout; lib/security/throttle.ts). */
export interface RateLimitsTable {
  key: string;
  points: Generated<number>;
  expire: string | null;
}

/** A bench of a course: where one to four students work together (lib/benches). */
export interface BenchesTable {
  id: Generated<string>;
  course_id: string;
  name: string;
  section: string | null;
  /** the order the instructor arranged them in */
  position: Generated<number>;
  created_at: Generated<Date>;
}

/** Who sits at which bench: a student at most one bench per course. */
export interface BenchSeatsTable {
  course_id: string;
  user_id: string;
  bench_id: string;
}

/** One student's own dates and extra attempts at a lab, with the instructor's reason. */
export interface LabExceptionsTable {
  lab_id: string;
  user_id: string;
  due_at: Timestamp | null;
  closes_at: Timestamp | null;
  extra_attempts: Generated<number>;
  reason: string;
  granted_by: string | null;
  granted_at: Generated<Date>;
}

/** A line of a course's stockroom: parts on the shelf (value in SI: ohms or farads). */
export interface StockItemsTable {
  id: Generated<string>;
  course_id: string;
  kind: "resistor" | "capacitor";
  value: number;
  tolerance_percent: number;
  quantity: number;
}

export interface Database {
  stock_items: StockItemsTable;
  lab_exceptions: LabExceptionsTable;
  benches: BenchesTable;
  bench_seats: BenchSeatsTable;
  rate_limits: RateLimitsTable;
  users: UsersTable;
  sessions: SessionsTable;
  courses: CoursesTable;
  memberships: MembershipsTable;
  verification_tokens: VerificationTokensTable;
  labs: LabsTable;
  lab_variants: LabVariantsTable;
  uploads: UploadsTable;
  attempts: AttemptsTable;
  lab_regrades: LabRegradesTable;
  grade_events: GradeEventsTable;
  course_lessons: CourseLessonsTable;
  mail_outbox: MailOutboxTable;
  password_tokens: PasswordTokensTable;
}

export type User = Selectable<UsersTable>;
export type NewUser = Insertable<UsersTable>;
export type UserUpdate = Updateable<UsersTable>;
export type Course = Selectable<CoursesTable>;
export type NewCourse = Insertable<CoursesTable>;
export type Membership = Selectable<MembershipsTable>;
export type NewMembership = Insertable<MembershipsTable>;

/** What every query function takes: the app's database or a transaction on it. */
export type Db = Kysely<Database> | Transaction<Database>;
