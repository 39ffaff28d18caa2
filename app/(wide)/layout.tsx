import type { Metadata } from "next";
import { AppShell } from "@/components/shell/app-shell";

// Same as (app), kept out of search engines too.
export const metadata: Metadata = { robots: { index: false, follow: false } };

// Pages that need the window's whole width (the gradebook). No loading boundary here, as in (app):
// the page renders before the response starts, so a refusal answers with its real status (403, 404).
export default function WideLayout({ children }: { children: React.ReactNode }) {
  return <AppShell wide>{children}</AppShell>;
}
