import Link from "next/link";
import { Wordmark } from "@/components/shell/wordmark";

export default function AuthLayout({ children }: { children: React.ReactNode }) {
  return (
    <main className="mx-auto flex min-h-screen max-w-md flex-col justify-center px-4 py-12">
      <Link href="/" className="mb-8 self-center no-underline" aria-label="Shuntwise home">
        <Wordmark />
      </Link>
      <div className="card">{children}</div>
    </main>
  );
}
