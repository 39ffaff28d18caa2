"use client";
import Link from "next/link";
import { usePathname } from "next/navigation";

/** The page a refused address belongs to: its course, or its lab; elsewhere none. */
function wayBack(path: string): { href: string; label: string } | null {
  const course = /^\/courses\/([^/]+)\/./.exec(path);
  if (course) return { href: `/courses/${course[1]}`, label: "Back to the course" };
  const lab = /^\/labs\/([^/]+)\/./.exec(path);
  if (lab) return { href: `/labs/${lab[1]}`, label: "Back to the lab" };
  return null;
}

/**
 * Shown, with status 403, when a page calls `forbidden()` (next/navigation) for a signed-in member whose
 * role does not allow it: the nearest forbidden.tsx says who may open the page and what to do instead;
 * it draws inside the app's shell (header and column) and links back to the course or lab the page
 * belongs to.
 */
export function Refusal({ message, hint = "If your work needs this page, ask the course's instructor." }: { message: string; hint?: string }) {
  const back = wayBack(usePathname());
  return (
    <section className="card border-verdict-wrong/30" role="alert">
      <h1 className="text-xl">Not available to you</h1>
      <p className="mt-2">{message}</p>
      <p className="mt-2 text-ink-soft">{hint}</p>
      <p className="mt-4 flex flex-wrap gap-x-6 gap-y-2">
        {back ? <Link href={back.href}>{back.label}</Link> : null}
        <Link href="/">Go to my courses</Link>
      </p>
    </section>
  );
}
