import Link from "next/link";
import { redirect } from "next/navigation";
import { db } from "@/db";
import { listCoursesForUser } from "@/db/queries/courses";
import { currentUser } from "@/lib/auth/access";
import { roleLabel } from "@/lib/roles";

export default async function HomePage() {
  const user = await currentUser();
  if (!user) redirect("/signin");
  const courses = await listCoursesForUser(db, user.id);
  return (
    <>
      <h1 className="text-3xl">My courses</h1>
      {courses.length === 0 ? (
        <p className="mt-4 text-ink-soft">
          You are not in any course yet. Ask your instructor for the join code, then{" "}
          <Link href="/signup">join with it</Link>.
        </p>
      ) : (
        <ul className="mt-6 grid gap-4 sm:grid-cols-2">
          {courses.map((c) => (
            <li key={c.id} className="card">
              <p className="text-xs font-semibold uppercase tracking-wide text-copper">{c.code} · {c.term}</p>
              <h2 className="mt-1 text-lg">
                <Link href={`/courses/${c.id}`}>{c.title}</Link>
              </h2>
              <p className="mt-1 text-sm text-ink-soft">{c.institution}</p>
              <p className="mt-3 inline-block rounded-full bg-paper-sunk px-3 py-0.5 text-xs font-medium">
                {roleLabel[c.role]}
                {c.section ? ` · section ${c.section}` : ""}
              </p>
            </li>
          ))}
        </ul>
      )}
    </>
  );
}
