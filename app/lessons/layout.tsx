import { QueryProvider } from "@/components/providers/query-provider";

// The lessons are static pages; the course navigation on them fetches in the browser.
export default function LessonsLayout({ children }: { children: React.ReactNode }) {
  return <QueryProvider>{children}</QueryProvider>;
}
