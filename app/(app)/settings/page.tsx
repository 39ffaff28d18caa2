import type { Metadata } from "next";
import { db } from "@/db";
import { findPreferences } from "@/db/queries/users";
import { ChangePasswordForm, GradeMailForm, SignOutEverywhere } from "@/components/mail/settings-forms";
import { forPage, requireUser } from "@/lib/auth/access";
import { QueryProvider } from "@/components/providers/query-provider";

export const metadata: Metadata = { title: "Settings" };
export const dynamic = "force-dynamic";

export default async function SettingsPage() {
  const user = await forPage(requireUser(), "/settings");
  if ("refused" in user) return null;
  const prefs = await findPreferences(db, user.id);
  return (
    <>
      <h1 className="text-3xl">Settings</h1>
      <p className="mt-1 text-sm text-ink-soft">
        Signed in as <span className="font-mono text-xs">{user.email}</span>.
      </p>
      <QueryProvider>
        <GradeMailForm initial={prefs?.gradeMail ?? true} />
        <ChangePasswordForm email={user.email} />
        <SignOutEverywhere />
      </QueryProvider>
    </>
  );
}
