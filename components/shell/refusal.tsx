import Link from "next/link";

/** Shown when a signed-in member asks for something their role does not allow. */
export function Refusal({ message, backHref }: { message: string; backHref: string }) {
  return (
    <section className="card border-verdict-wrong/30" role="alert">
      <h1 className="text-xl">Not available to you</h1>
      <p className="mt-2 text-ink-soft">{message}</p>
      <p className="mt-4">
        <Link href={backHref}>Back to the course</Link>
      </p>
    </section>
  );
}
