import Link from "next/link";
import { SignOutButton } from "@/components/shell/sign-out-button";
import { Wordmark } from "@/components/shell/wordmark";
import { QueryProvider } from "@/components/providers/query-provider";
import { currentUser } from "@/lib/auth/access";
import { mailboxAvailable } from "@/lib/mail/mailbox";

/**
 * The signed-in shell: the header with the wordmark and the user, and the main column. `wide` gives
 * tables such as the gradebook the whole window width.
 */
export async function AppShell({ children, wide = false }: { children: React.ReactNode; wide?: boolean }) {
  const user = await currentUser();
  const width = wide ? "max-w-none" : "max-w-5xl";
  return (
    <div className="min-h-screen">
      <header className="no-print border-b border-ink/10 bg-paper-raised">
        <div className={`mx-auto flex ${width} items-center justify-between px-4 py-3`}>
          <Link href="/" className="no-underline" aria-label="Shuntwise: my courses">
            <Wordmark small />
          </Link>
          {user ? (
            <div className="flex items-center gap-3 text-sm">
              {user.isAdmin ? <Link href="/admin/outbox">Outbox</Link> : null}
              {user.isAdmin && mailboxAvailable() ? <Link href="/dev/mailbox">Mailbox</Link> : null}
              <Link href="/settings">Settings</Link>
              <span className="text-ink-soft">{user.name}</span>
              <SignOutButton />
            </div>
          ) : null}
        </div>
      </header>
      <main className={`mx-auto ${width} px-4 py-8`}>
        <QueryProvider>{children}</QueryProvider>
      </main>
    </div>
  );
}
