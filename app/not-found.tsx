import Link from "next/link";

export default function NotFound() {
  return (
    <main className="mx-auto max-w-xl px-4 py-16">
      <div className="card">
        <h1 className="text-2xl">Not found</h1>
        <p className="mt-2 text-ink-soft">There is nothing here, or it is not shared with you.</p>
        <p className="mt-4">
          <Link href="/">Go to my courses</Link>
        </p>
      </div>
    </main>
  );
}
