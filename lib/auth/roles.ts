import type { Role } from "@/db/types";

export const roleLabel: Record<Role, string> = {
  student: "Student",
  ta: "Teaching assistant",
  instructor: "Instructor",
};

/** The course staff: teaching assistants and instructors. */
export const isStaff = (role: Role) => role === "ta" || role === "instructor";
