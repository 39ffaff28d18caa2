"use client";
// Disables an account (its sessions end at once, its sign-in is refused) or enables it again.
import { useRouter } from "next/navigation";
import { useState, useTransition } from "react";
import { api, isApiError } from "@/lib/http/client";

export function AccountSwitch({ userId, name, disabled }: { userId: string; name: string; disabled: boolean }) {
  const router = useRouter();
  const [pending, startTransition] = useTransition();
  const [error, setError] = useState<string | null>(null);
  const change = () =>
    startTransition(async () => {
      setError(null);
      try {
        await api(`/api/admin/users/${userId}`, { method: "PATCH", body: { disabled: !disabled } });
        router.refresh();
      } catch (e) {
        setError(isApiError(e) && e.status > 0 ? e.message : "The request did not reach the server. Try again.");
      }
    });
  return (
    <span className="inline-flex flex-wrap items-center gap-2">
      <button type="button" className={disabled ? "btn-primary" : "btn-quiet"} disabled={pending} onClick={change} aria-label={`${disabled ? "Enable" : "Disable"} the account of ${name}`}>
        {pending ? "Saving…" : disabled ? "Enable" : "Disable"}
      </button>
      <span role="status" className="text-xs text-verdict-wrong">
        {error ?? ""}
      </span>
    </span>
  );
}
