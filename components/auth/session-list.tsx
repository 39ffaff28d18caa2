"use client";

// The settings page's list of the account's sessions (browsers signed in), each with a "Sign out" that
// ends it on the server. Signing out this browser goes to the sign-in page; another one leaves the list.
import { useRouter } from "next/navigation";
import { useState, useTransition } from "react";
import { FormMessage } from "@/components/ui/field";
import { api, isApiError } from "@/lib/http/client";

export interface SessionItem {
  id: string;
  device: string;
  signedIn: string;
  lastSeen: string;
  current: boolean;
}

export function SessionList({ sessions }: { sessions: SessionItem[] }) {
  const router = useRouter();
  const [pending, startTransition] = useTransition();
  const [error, setError] = useState<string | null>(null);
  const end = (s: SessionItem) =>
    startTransition(async () => {
      setError(null);
      try {
        await api(`/api/me/sessions/${s.id}`, { method: "DELETE" });
        if (s.current) router.push("/signin");
        else router.refresh();
      } catch (e) {
        setError(isApiError(e) && e.status > 0 ? e.message : "The request did not reach the server. Try again.");
      }
    });
  return (
    <section aria-labelledby="sessions-heading" className="card mt-6">
      <h2 id="sessions-heading" className="text-xl">
        Where you are signed in
      </h2>
      <p className="mt-2 max-w-prose text-sm text-ink-soft">A session ends after 12 hours without use and 14 days after signing in at the latest.</p>
      <FormMessage message={error} />
      <ul className="mt-3 divide-y divide-ink/10">
        {sessions.map((s) => (
          <li key={s.id} className="flex flex-wrap items-center justify-between gap-3 py-3">
            <div className="min-w-0">
              <p className="break-words font-medium">
                {s.device}
                {s.current ? <span className="ml-2 text-sm font-normal text-ink-soft">(this browser)</span> : null}
              </p>
              <p className="text-sm text-ink-soft">
                Signed in {s.signedIn}; last used {s.lastSeen}
              </p>
            </div>
            <button type="button" className="btn-quiet" disabled={pending} onClick={() => end(s)} aria-label={`Sign out ${s.current ? "this browser" : s.device}, signed in ${s.signedIn}`}>
              Sign out
            </button>
          </li>
        ))}
      </ul>
    </section>
  );
}
