import { json, route } from "@/lib/http/route";
import { attemptHistory } from "@/lib/labs/review";

// The attempt's grade history, oldest first, for its owner and the course staff (held grades: none for the student).
export const GET = route<{ attemptId: string }>(async (_req, { attemptId }) => json(await attemptHistory(attemptId)));
