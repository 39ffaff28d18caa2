// The site admin's list of every course with its people and labs.
import Link from "next/link";

export interface CourseCount {
  id: string;
  code: string;
  title: string;
  term: string;
  institution: string;
  instructors: string;
  students: number;
  staff: number;
  labs: number;
}

export function AllCourses({ courses }: { courses: CourseCount[] }) {
  return (
    <div className="card overflow-x-auto p-0">
      <table className="min-w-full text-sm">
        <caption className="sr-only">Every course</caption>
        <thead className="bg-paper-sunk text-left">
          <tr>
            <th scope="col" className="px-4 py-2">Course</th>
            <th scope="col" className="px-4 py-2">Term</th>
            <th scope="col" className="px-4 py-2">Instructors</th>
            <th scope="col" className="px-4 py-2 text-right">Students</th>
            <th scope="col" className="px-4 py-2 text-right">Staff</th>
            <th scope="col" className="px-4 py-2 text-right">Labs</th>
          </tr>
        </thead>
        <tbody>
          {courses.map((c) => (
            <tr key={c.id} className="border-t border-ink/10">
              <td className="px-4 py-2">
                <Link href={`/courses/${c.id}`}>{c.code}</Link> {c.title}
                <span className="block text-xs text-ink-faint">{c.institution}</span>
              </td>
              <td className="px-4 py-2">{c.term}</td>
              <td className="px-4 py-2">{c.instructors || <span className="text-verdict-wrong">none</span>}</td>
              <td className="px-4 py-2 text-right font-mono">{c.students}</td>
              <td className="px-4 py-2 text-right font-mono">{c.staff}</td>
              <td className="px-4 py-2 text-right font-mono">{c.labs}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
