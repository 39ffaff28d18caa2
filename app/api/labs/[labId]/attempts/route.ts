import { json, jsonBody, route } from "@/lib/http/route";
import { isStaff } from "@/lib/auth/access";
import { attemptsFor, heldAttempt, labAccess, submitAttempt, viewAttempt } from "@/lib/labs/attempts";
import { attemptInputSchema } from "@/lib/validation/attempts";
import { uuidSchema } from "@/lib/validation/common";
import { AppError } from "@/lib/errors";

type Params = { labId: string };

// A student's own attempts; every attempt for the course staff (or one student's with ?userId=).
export const GET = route<Params>(async (req, { labId }) => {
  const { lab, access } = await labAccess(labId);
  const userId = new URL(req.url).searchParams.get("userId");
  if (userId !== null && !uuidSchema.safeParse(userId).success) {
    throw new AppError("bad_request", "userId must be a user's id.", { userId: ["Not a user id."] });
  }
  const attempts = await attemptsFor(lab, access, new Date(), userId ?? undefined);
  // held grades: a student sees that each attempt was graded, not its result
  if (!isStaff(access.role) && lab.gradesHeld) return json({ attempts: attempts.map((a) => heldAttempt(a, lab)) });
  return json({ attempts });
});

// Submits bench readings and grades them at once. A retry with the same idempotency key answers 200
// with the attempt already made; a new attempt answers 201.
export const POST = route<Params>(async (req, { labId }) => {
  const { lab, access } = await labAccess(labId);
  const input = await jsonBody(req, attemptInputSchema);
  const { attempt, created, attemptsUsed } = await submitAttempt(lab, access, input);
  return json({ attempt: viewAttempt(attempt, lab, isStaff(access.role), attemptsUsed) }, created ? 201 : 200);
});
