import Link from "next/link";

/** Shown, with status 403, when a page calls `forbidden()`: a member whose role does not allow the page. */
export default function Forbidden() {
  return (
    <main className="mx-auto max-w-xl px-4 py-16">
      <div className="card" role="alert">
        <h1 className="text-2xl">Not available to you</h1>
        <p className="mt-2 text-ink-soft">Your role in this course does not allow this page.</p>
        <p className="mt-4">
          <Link href="/">Go to my courses</Link>
        </p>
      </div>
    </main>
  );
}
