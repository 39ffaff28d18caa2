import type { Metadata } from "next";
import Link from "next/link";
import { db } from "@/db";
import { ResetPasswordForm } from "@/components/auth/reset-password-form";
import { LINK_UNUSABLE } from "@/lib/mail/password-reset";
import { checkToken } from "@/lib/mail/tokens";

export const metadata: Metadata = { title: "Choose a new password" };
export const dynamic = "force-dynamic";

export default async function ResetPasswordPage({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
  const usable = await checkToken(db, decodeURIComponent(token));
  if (!usable) {
    return (
      <>
        <h1 className="mb-1 text-2xl">This link no longer works</h1>
        <p className="mb-6 text-sm text-ink-soft" role="status">
          {LINK_UNUSABLE}
        </p>
        <Link className="btn-primary" href="/forgot-password">
          Ask for a new link
        </Link>
      </>
    );
  }
  return (
    <>
      <h1 className="mb-1 text-2xl">Choose a new password</h1>
      <p className="mb-6 text-sm text-ink-soft">Saving it signs you out everywhere you are signed in.</p>
      <ResetPasswordForm token={decodeURIComponent(token)} />
    </>
  );
}
