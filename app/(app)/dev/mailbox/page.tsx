import type { Metadata } from "next";
import { forbidden, notFound } from "next/navigation";
import { forPage, refused, requireAdmin } from "@/lib/auth/access";
import { mailboxAvailable, readMailbox } from "@/lib/mail/mailbox";

export const metadata: Metadata = { title: "Development mailbox" };

/** Links in a message open in a new tab, as they would from a mail client (the frame itself runs nothing). */
const linksOpenTheSite = (html: string) => (/<head[^>]*>/i.test(html) ? html.replace(/<head([^>]*)>/i, '<head$1><base target="_blank">') : `<base target="_blank">${html}`);
export const dynamic = "force-dynamic";

// What the local SMTP stand-in received, newest first: each message as HTML (in a sandboxed frame that
// runs no scripts) and as text. Only while the stand-in is in use; a deployment answers 404.
export default async function MailboxPage({ searchParams }: { searchParams: Promise<{ to?: string }> }) {
  if (!mailboxAvailable()) notFound();
  const user = await forPage(requireAdmin(), "/dev/mailbox");
  if (refused(user)) forbidden();
  const { to } = await searchParams;
  const messages = await readMailbox({ to: to?.trim() || undefined, limit: 50 });
  return (
    <>
      <h1 className="text-3xl">Development mailbox</h1>
      <p className="mt-1 text-sm text-ink-soft">
        Messages the local mail stand-in received{to ? ` for ${to}` : ""}, newest first. Nothing here left this machine.
      </p>
      <form className="mt-4 flex flex-wrap items-end gap-2" action="/dev/mailbox">
        <div>
          <label htmlFor="mailbox-to" className="field-label">
            Addressed to
          </label>
          <input id="mailbox-to" name="to" type="email" defaultValue={to ?? ""} className="field-input" placeholder="student.one@…" />
        </div>
        <button type="submit" className="btn-quiet">
          Show
        </button>
      </form>
      {messages.length === 0 ? <p className="card mt-6">No messages{to ? " for that address" : ""} yet.</p> : null}
      <ol className="mt-6 space-y-6" aria-label="Messages">
        {messages.map((m) => (
          <li key={m.id} className="card" data-testid="mail-message">
            <h2 className="text-lg">{m.subject}</h2>
            <p className="text-sm text-ink-soft">
              To <span className="font-mono text-xs">{m.to}</span> ·{" "}
              <time dateTime={m.date}>{m.date.slice(0, 16).replace("T", " ")} UTC</time>
            </p>
            <details className="mt-3" open>
              <summary className="cursor-pointer text-sm font-semibold">As HTML</summary>
              <iframe title={`HTML of “${m.subject}”`} sandbox="allow-popups allow-popups-to-escape-sandbox" srcDoc={linksOpenTheSite(m.html)} className="mt-2 h-[28rem] w-full rounded-md border border-ink/10 bg-white" />
            </details>
            <details className="mt-3">
              <summary className="cursor-pointer text-sm font-semibold">As plain text</summary>
              <pre className="mt-2 overflow-x-auto whitespace-pre-wrap rounded-md bg-paper-sunk p-3 text-xs">{m.text}</pre>
            </details>
          </li>
        ))}
      </ol>
    </>
  );
}
