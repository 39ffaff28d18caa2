// <CheckYourself lesson="burden-voltage" /> lists the lesson's questions (lib/lessons/questions.ts) with
// their prompts filled in on the server; each is answered and checked in the page.
import { questionsFor, renderPrompt } from "@/lib/lessons/questions";
import { CheckQuestion } from "./check-question";

export function CheckYourself({ lesson }: { lesson: string }) {
  const qs = questionsFor(lesson);
  if (qs.length === 0) throw new Error(`lesson "${lesson}" has no check-yourself questions`);
  return (
    <ol className="list-none p-0" aria-label="Check-yourself questions">
      {qs.map((q, i) => (
        <CheckQuestion key={q.id} id={q.id} number={i + 1} prompt={renderPrompt(q)} unitHint={q.unit} />
      ))}
    </ol>
  );
}
