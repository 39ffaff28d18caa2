import type { Metadata } from "next";
import Link from "next/link";
import { SignUpForm } from "@/components/auth/sign-up-form";
import { signUpAction } from "./actions";

export const metadata: Metadata = { title: "Create an account" };

export default async function SignUpPage({ searchParams }: { searchParams: Promise<{ code?: string }> }) {
  const { code } = await searchParams;
  return (
    <>
      <h1 className="mb-1 text-2xl">Create your account</h1>
      <p className="mb-6 text-sm text-ink-soft">You join your course as a student with the code your instructor gave you.</p>
      <SignUpForm joinCode={code} signUpAction={signUpAction} />
      <p className="mt-6 text-sm text-ink-soft">
        Already have an account? <Link href="/signin">Sign in</Link>.
      </p>
    </>
  );
}
