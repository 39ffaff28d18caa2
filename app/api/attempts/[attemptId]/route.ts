import { json, route } from "@/lib/http/route";
import { isStaff } from "@/lib/auth/access";
import { attemptAccess, attemptsUsed, viewAttempt } from "@/lib/labs/attempts";

export const GET = route<{ attemptId: string }>(async (_req, { attemptId }) => {
  const { attempt, lab, access } = await attemptAccess(attemptId);
  return json({ attempt: viewAttempt(attempt, lab, isStaff(access.role), await attemptsUsed(attempt)) });
});
