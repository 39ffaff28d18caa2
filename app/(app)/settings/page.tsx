import type { Metadata } from "next";
import { db } from "@/db";
import { findPreferences } from "@/db/queries/users";
import { ChangePasswordForm, GradeMailForm, SignOutEverywhere } from "@/components/mail/settings-forms";
import { SessionList } from "@/components/auth/session-list";
import { listSessions } from "@/db/queries/sessions";
import { currentSessionId, forPage, requireUser } from "@/lib/auth/access";
import { sessionLimits } from "@/lib/auth/sessions";
import { utcDate } from "@/lib/dates";
import { QueryProvider } from "@/components/providers/query-provider";

export const metadata: Metadata = { title: "Settings" };
export const dynamic = "force-dynamic";

export default async function SettingsPage() {
  const user = await forPage(requireUser(), "/settings");
  if ("refused" in user) return null;
  const [prefs, sessions, current] = await Promise.all([findPreferences(db, user.id), listSessions(db, user.id, sessionLimits()), currentSessionId()]);
  return (
    <>
      <h1 className="text-3xl">Settings</h1>
      <p className="mt-1 text-sm text-ink-soft">
        Signed in as <span className="font-mono text-xs">{user.email}</span>.
      </p>
      <QueryProvider>
        <GradeMailForm initial={prefs?.gradeMail ?? true} />
        <ChangePasswordForm />
        <SignOutEverywhere />
      </QueryProvider>
      <SessionList
        sessions={sessions.map((s) => ({
          id: s.id,
          // the browser's own description of itself, as it sent it
          device: s.userAgent ? (s.userAgent.length > 120 ? `${s.userAgent.slice(0, 117)}…` : s.userAgent) : "A browser that did not say what it is",
          signedIn: utcDate(s.createdAt),
          lastSeen: utcDate(s.lastSeenAt),
          current: s.id === current,
        }))}
      />
    </>
  );
}
