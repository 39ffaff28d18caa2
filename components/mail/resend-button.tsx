"use client";
// Sends a failed message again (a new job for the same outbox row).
import { useMutation } from "@tanstack/react-query";
import { useRouter } from "next/navigation";
import { api, isApiError } from "@/lib/http/client";

export function ResendButton({ mailId }: { mailId: string }) {
  const router = useRouter();
  const resend = useMutation({
    mutationFn: () => api(`/api/admin/outbox/${mailId}/resend`, { method: "POST" }),
    onSuccess: () => router.refresh(),
  });
  return (
    <span className="inline-flex items-center gap-2">
      <button type="button" className="btn-quiet" onClick={() => resend.mutate()} disabled={resend.isPending || resend.isSuccess}>
        {resend.isSuccess ? "Queued again" : resend.isPending ? "Queuing…" : "Send again"}
      </button>
      <span role="status" className="text-xs text-verdict-wrong">
        {resend.isError ? (isApiError(resend.error) ? resend.error.message : "Could not queue it.") : ""}
      </span>
    </span>
  );
}
