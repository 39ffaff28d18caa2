// The app's header: the wordmark home, the signed-in person's links, and (on pages that belong to a
// course) the course's navigation. Server component, shared by the app shell and the lesson pages.
import Link from "next/link";
import type { PublicUser } from "@/db/queries/users";
import { mailboxAvailable } from "@/lib/mail/mailbox";
import { SignOutButton } from "./sign-out-button";
import { Wordmark } from "./wordmark";

export interface HeaderCourse {
  id: string;
  code: string;
  title: string;
}

export function AppHeader({ user, course, current, wide = false }: { user: PublicUser | null; course?: HeaderCourse | null; current?: "lessons" | "labs"; wide?: boolean }) {
  const width = wide ? "max-w-none" : "max-w-5xl";
  return (
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
      {course ? (
        <nav aria-label="Course" className={`mx-auto flex ${width} flex-wrap items-center gap-x-4 gap-y-1 px-4 pb-2 text-sm`}>
          <Link href={`/courses/${course.id}`} className="font-semibold">
            {course.code}: {course.title}
          </Link>
          <Link href={`/courses/${course.id}/lessons`} aria-current={current === "lessons" ? "page" : undefined}>
            Lessons
          </Link>
          <Link href={`/courses/${course.id}/labs`} aria-current={current === "labs" ? "page" : undefined}>
            Bench labs
          </Link>
        </nav>
      ) : null}
    </header>
  );
}
