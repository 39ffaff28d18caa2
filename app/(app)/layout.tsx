import type { Metadata } from "next";
import { AppShell } from "@/components/shell/app-shell";

// The signed-in app stays out of search engines (public/robots.txt says the same to crawlers).
export const metadata: Metadata = { robots: { index: false, follow: false } };

export default function AppLayout({ children }: { children: React.ReactNode }) {
  return <AppShell>{children}</AppShell>;
}
