import type { Metadata } from "next";
import { forbidden } from "next/navigation";
import { db } from "@/db";
import { DataTable, type Column } from "@/components/ui/table";
import { ResendButton } from "@/components/mail/resend-button";
import { forPage, refused, requireAdmin } from "@/lib/auth/access";
import { outboxSummary } from "@/lib/mail/outbox";
import { QueryProvider } from "@/components/providers/query-provider";

export const metadata: Metadata = { title: "Outbox" };
export const dynamic = "force-dynamic";

const when = (d: Date | null) => (d ? new Date(d).toISOString().slice(0, 16).replace("T", " ") + " UTC" : "—");

type Day = Awaited<ReturnType<typeof outboxSummary>>["days"][number];
const dayColumns: Column<Day>[] = [
  { header: "Day", className: "font-mono text-xs", cell: (d) => d.day },
  { header: "Waiting", numeric: true, cell: (d) => d.queued },
  { header: "Sent", numeric: true, cell: (d) => d.sent },
  { header: "Failed", numeric: true, className: (d) => (d.failed ? "font-semibold text-verdict-wrong" : ""), cell: (d) => d.failed },
];

export default async function OutboxPage() {
  const user = await forPage(requireAdmin(), "/admin/outbox");
  if (refused(user)) forbidden();
  const { days, failures } = await outboxSummary(db);
  return (
    <>
      <h1 className="text-3xl">Outbox</h1>
      <p className="mt-1 text-sm text-ink-soft">
        Every e-mail the site queued in the last 14 days, by the day it was queued (UTC). A message that still fails after its last retry
        shows below with the mail server&apos;s answer.
      </p>
      <DataTable
        caption="Messages per day"
        card="mt-6"
        columns={dayColumns}
        rows={days}
        rowKey={(d) => d.day}
        empty="Nothing queued in the last 14 days."
      />
      <h2 className="mt-8 text-xl">Last failures</h2>
      {failures.length === 0 ? <p className="mt-2 text-sm text-ink-soft">No message has failed.</p> : null}
      <ul className="mt-3 space-y-3">
        {failures.map((f) => (
          <li key={f.id} className="card" data-testid="outbox-failure">
            <p className="text-sm">
              <span className="font-mono text-xs">{f.to}</span> · {f.kind.replace(/_/g, " ")} · queued {when(f.createdAt)}, gave up {when(f.failedAt)} after{" "}
              {f.tries} tries
            </p>
            <p className="mt-1 font-mono text-xs text-verdict-wrong">{f.error ?? "no answer recorded"}</p>
            <div className="mt-2">
              <QueryProvider>
                <ResendButton mailId={f.id} />
              </QueryProvider>
            </div>
          </li>
        ))}
      </ul>
    </>
  );
}
