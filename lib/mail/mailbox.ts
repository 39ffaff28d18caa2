// The development mailbox: the messages the local SMTP stand-in received (kept as .eml files in
// SHUNTWISE_MAIL_DIR), newest first. Only when the stand-in is in use; a deployment has no such folder.
import fs from "node:fs/promises";
import path from "node:path";
import { simpleParser, type AddressObject } from "mailparser";
import { standInMailDir } from "./config";

export interface StoredMessage {
  id: string;
  to: string;
  subject: string;
  text: string;
  html: string;
  date: string;
}

/**
 * The mailbox shows reset links of every account, so it is served only while the local SMTP stand-in
 * takes the mail and either NODE_ENV is not production or SHUNTWISE_DEV_MAILBOX=1 says so explicitly
 * (`npm start` and `npm test` set it when they run the stand-in); a deployment has neither.
 */
export function mailboxAvailable(): boolean {
  if (standInMailDir() === null) return false;
  return process.env.NODE_ENV !== "production" || process.env.SHUNTWISE_DEV_MAILBOX === "1";
}

const addresses = (a: AddressObject | AddressObject[] | undefined): string[] =>
  (Array.isArray(a) ? a : a ? [a] : []).flatMap((x) => x.value.map((v) => (v.address ?? "").toLowerCase())).filter(Boolean);

/** The stored messages, newest first; only those addressed to `to` when it is given. */
export async function readMailbox(opts: { to?: string; limit?: number } = {}): Promise<StoredMessage[]> {
  const dir = standInMailDir();
  if (!dir) return [];
  const files = (await fs.readdir(dir).catch(() => [] as string[])).filter((f) => f.endsWith(".eml"));
  files.sort().reverse(); // names start with the time of arrival
  const want = opts.to?.toLowerCase();
  const out: StoredMessage[] = [];
  for (const f of files) {
    const m = await simpleParser(await fs.readFile(path.join(dir, f)));
    const to = addresses(m.to);
    if (want && !to.includes(want)) continue;
    out.push({
      id: f.replace(/\.eml$/, ""),
      to: to.join(", "),
      subject: m.subject ?? "",
      text: m.text ?? "",
      html: typeof m.html === "string" ? m.html : "",
      date: (m.date ?? new Date(0)).toISOString(),
    });
  }
  out.sort((a, b) => b.date.localeCompare(a.date) || b.id.localeCompare(a.id));
  return opts.limit ? out.slice(0, opts.limit) : out;
}
