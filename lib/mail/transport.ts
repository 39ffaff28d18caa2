// The SMTP connection. A local server (the stand-in) offers no AUTH and no STARTTLS, so the client is told
// to skip TLS there (nodemailer would otherwise try to upgrade, or send an empty login a server that
// advertises AUTH refuses); timeouts are short so a dead server fails the try quickly and the queue's
// backoff takes over.
import nodemailer, { type Transporter } from "nodemailer";
import { smtpUrl } from "./config";

/**
 * nodemailer's limits: to connect, for the server's greeting, and for any one answer (socket idle).
 * Their worst case for one message (smtpWorstCaseSeconds) stays well under the mail job's expiry
 * (lib/mail/config.ts), so a slow server fails the try before pg-boss gives up on the job.
 */
export const SMTP_TIMEOUTS_MS = { connectionTimeout: 10_000, greetingTimeout: 10_000, socketTimeout: 20_000 } as const;

/** Connect, greeting, then six commands each waiting at most the socket timeout (EHLO, MAIL, RCPT, DATA, the message, QUIT). */
export function smtpWorstCaseSeconds(): number {
  const t = SMTP_TIMEOUTS_MS;
  return (t.connectionTimeout + t.greetingTimeout + 6 * t.socketTimeout) / 1000;
}

const g = globalThis as unknown as { shuntwiseMailTransport?: { url: string; t: Transporter } };

export function transport(url = smtpUrl()): Transporter {
  if (g.shuntwiseMailTransport?.url === url) return g.shuntwiseMailTransport.t;
  const u = new URL(url);
  const host = u.hostname.replace(/^\[|\]$/g, "");
  const local = host === "127.0.0.1" || host === "localhost" || host === "::1";
  const secure = u.protocol === "smtps:";
  // options spelled out: nodemailer ignores every other option when it is given a URL (createTransport
  // takes a URL's second argument as message defaults), which would drop the timeouts
  const t = nodemailer.createTransport({
    host,
    port: u.port ? Number(u.port) : secure ? 465 : 587,
    secure,
    ...(u.username ? { auth: { user: decodeURIComponent(u.username), pass: decodeURIComponent(u.password) } } : {}),
    ignoreTLS: local,
    ...SMTP_TIMEOUTS_MS,
  });
  g.shuntwiseMailTransport = { url, t };
  return t;
}
