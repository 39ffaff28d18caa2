"use client";
// The instructor's switch for a lab's grades: hold them (students see "graded, not yet released"), or
// release them (each student gets one message with their counted score).
import { useMutation } from "@tanstack/react-query";
import { useRouter } from "next/navigation";
import { api, isApiError } from "@/lib/api-client";

export function HoldGrades({ labId, held }: { labId: string; held: boolean }) {
  const router = useRouter();
  const change = useMutation({
    mutationFn: (next: boolean) => api<{ released: number }>(`/api/labs/${labId}/grades-held`, { method: "PUT", body: { held: next } }),
    onSuccess: () => router.refresh(),
  });
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
      <button type="button" className={held ? "btn-primary mt-3" : "btn-quiet mt-3"} disabled={change.isPending} onClick={() => change.mutate(!held)}>
        {held ? "Release grades" : "Hold grades"}
      </button>
      <p role="status" className="mt-2 text-sm">
        {change.isError
          ? isApiError(change.error)
            ? change.error.message
            : "That did not work."
          : change.isSuccess
            ? change.variables
              ? "Grades are held."
              : `Released: ${change.data.released} message${change.data.released === 1 ? "" : "s"} queued.`
            : ""}
      </p>
    </section>
  );
}
