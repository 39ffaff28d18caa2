import type { Metadata } from "next";
import Link from "next/link";
import { SignInForm } from "@/components/auth/sign-in-form";
import { safeNext } from "@/lib/auth/safe-next";

export const metadata: Metadata = { title: "Sign in" };

export default async function SignInPage({ searchParams }: { searchParams: Promise<{ next?: string }> }) {
  const { next } = await searchParams;
  return (
    <>
      <h1 className="mb-1 text-2xl">Sign in</h1>
      <p className="mb-6 text-sm text-ink-soft">Lessons, bench labs and your graded attempts.</p>
      <SignInForm next={safeNext(next)} />
      <p className="mt-4 text-sm">
        <Link href="/forgot-password">Forgot your password?</Link>
      </p>
      <p className="mt-6 text-sm text-ink-soft">
        New in a course? <Link href="/signup">Create an account with your join code</Link>.
      </p>
    </>
  );
}
