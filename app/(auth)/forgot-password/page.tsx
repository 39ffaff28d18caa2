import type { Metadata } from "next";
import Link from "next/link";
import { ForgotPasswordForm } from "@/components/auth/forgot-password-form";

export const metadata: Metadata = { title: "Forgot your password" };

export default function ForgotPasswordPage() {
  return (
    <>
      <h1 className="mb-1 text-2xl">Forgot your password?</h1>
      <p className="mb-6 text-sm text-ink-soft">Give the address you sign in with; we e-mail a link to choose a new password.</p>
      <ForgotPasswordForm />
      <p className="mt-6 text-sm text-ink-soft">
        <Link href="/signin">Back to sign-in</Link>
      </p>
    </>
  );
}
