"use client";
// The instructor's switch for a lab's grades: hold them (students see "graded, not yet released"), or
// release them (each student gets one message with their counted score). It sends one request and then
// re-renders the server page, so it caches nothing: api() in a transition, no react-query (the lab page
// it sits on is also every student's, which then loads no query client).
import { useRouter } from "next/navigation";
import { useState, useTransition } from "react";
import { api, isApiError } from "@/lib/http/client";

export function HoldGrades({ labId, held }: { labId: string; held: boolean }) {
  const router = useRouter();
  const [pending, startTransition] = useTransition();
  const [outcome, setOutcome] = useState("");

  function change(next: boolean) {
    startTransition(async () => {
      try {
        const { released } = await api<{ released: number }>(`/api/labs/${labId}/grades-held`, { method: "PUT", body: { held: next } });
        setOutcome(next ? "Grades are held." : `Released: ${released} message${released === 1 ? "" : "s"} queued.`);
        router.refresh();
      } catch (e) {
        setOutcome(isApiError(e) ? e.message : "That did not work.");
      }
    });
  }

  return (
    <section aria-labelledby="hold-heading" className="card mt-6">
      <h2 id="hold-heading" className="text-lg">
        Grades {held ? "held" : "released as they are graded"}
      </h2>
      <p className="mt-1 text-sm text-ink-soft">
        {held
          ? "Students see that their attempts were graded, not the scores, and get no e-mail. Releasing sends each student one message with their counted score."
          : "Students see their feedback and get an e-mail as soon as an attempt is graded. Holding hides new and earlier scores from students until you release them."}
      </p>
      <button type="button" className={held ? "btn-primary mt-3" : "btn-quiet mt-3"} disabled={pending} onClick={() => change(!held)}>
        {held ? "Release grades" : "Hold grades"}
      </button>
      <p role="status" className="mt-2 text-sm">
        {outcome}
      </p>
    </section>
  );
}
