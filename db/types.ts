// The typed shape of the database. Table interfaces are used only inside `Database`; code elsewhere uses
// the Selectable/Insertable aliases. Nullable columns are `T | null`, database defaults `Generated<T>`.
import type { ColumnType, Generated, Insertable, Selectable, Updateable } from "kysely";

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
}

export interface CoursesTable {
  id: Generated<string>;
  code: string;
  title: string;
  term: string;
  institution: string;
  join_code: string;
  created_at: Generated<Date>;
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

export interface Database {
  users: UsersTable;
  courses: CoursesTable;
  memberships: MembershipsTable;
  verification_tokens: VerificationTokensTable;
}

export type User = Selectable<UsersTable>;
export type NewUser = Insertable<UsersTable>;
export type UserUpdate = Updateable<UsersTable>;
export type Course = Selectable<CoursesTable>;
export type NewCourse = Insertable<CoursesTable>;
export type Membership = Selectable<MembershipsTable>;
export type NewMembership = Insertable<MembershipsTable>;
