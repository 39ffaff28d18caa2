// The top of a course page: the way back (to the course, or to the page above) and the page's heading.
import Link from "next/link";
import type { ReactNode } from "react";

/** `action` (a button or link) sits at the heading's right end. */
export function CoursePageHeading({ backHref, backLabel, title, className = "mt-2 text-3xl", action }: { backHref: string; backLabel: ReactNode; title: ReactNode; className?: string; action?: ReactNode }) {
  return (
    <>
      <p className="text-sm">
        <Link href={backHref}>← {backLabel}</Link>
      </p>
      {action ? (
        <div className="mt-2 flex flex-wrap items-end justify-between gap-3">
          <h1 className="text-3xl">{title}</h1>
          {action}
        </div>
      ) : (
        <h1 className={className}>{title}</h1>
      )}
    </>
  );
}
