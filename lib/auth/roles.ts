import type { Role } from "@/db/types";

export const roleLabel: Record<Role, string> = {
  student: "Student",
  ta: "Teaching assistant",
  instructor: "Instructor",
};
