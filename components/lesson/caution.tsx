// A safety note, visually distinct from the lesson text and always deferring to the lab's own rules.
import type { ReactNode } from "react";

export function Caution({ title = "Caution", children }: { title?: string; children: ReactNode }) {
  return (
    <aside className="caution-box break-inside-avoid print:border print:border-caution-edge" role="note" aria-label={`Safety: ${title}`}>
      <p className="m-0 flex items-center gap-2 font-semibold">
        <svg aria-hidden="true" viewBox="0 0 24 24" width="20" height="20" className="shrink-0">
          <path d="M12 2 L23 21 H1 Z" fill="none" stroke="currentColor" strokeWidth="2" strokeLinejoin="round" />
          <path d="M12 9 V14" stroke="currentColor" strokeWidth="2.2" strokeLinecap="round" />
          <circle cx="12" cy="17.5" r="1.3" fill="currentColor" />
        </svg>
        <span>Safety — {title}</span>
      </p>
      <div className="mt-1 text-ink [&_p]:my-1 [&_ul]:my-1">{children}</div>
      <p className="mt-2 mb-0 text-sm italic">Your institution&apos;s lab rules and your instructor&apos;s instructions come first.</p>
    </aside>
  );
}
