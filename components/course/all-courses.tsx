// The site admin's list of every course with its people and labs.
import Link from "next/link";
import { DataTable, type Column } from "@/components/ui/table";

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

const columns: Column<CourseCount>[] = [
  {
    header: "Course",
    cell: (c) => (
      <>
        <Link href={`/courses/${c.id}`}>{c.code}</Link> {c.title}
        <span className="block text-xs text-ink-faint">{c.institution}</span>
      </>
    ),
  },
  { header: "Term", cell: (c) => c.term },
  { header: "Instructors", cell: (c) => c.instructors || <span className="text-verdict-wrong">none</span> },
  { header: "Students", numeric: true, className: "font-mono", cell: (c) => c.students },
  { header: "Staff", numeric: true, className: "font-mono", cell: (c) => c.staff },
  { header: "Labs", numeric: true, className: "font-mono", cell: (c) => c.labs },
];

export function AllCourses({ courses }: { courses: CourseCount[] }) {
  return <DataTable caption="Every course" columns={columns} rows={courses} rowKey={(c) => c.id} card="" />;
}
