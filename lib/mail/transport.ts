// The SMTP connection. A local server (the stand-in) gets no STARTTLS, as STACK.md notes; timeouts are
// short so a dead server fails the try quickly and the queue's backoff takes over.
import nodemailer, { type Transporter } from "nodemailer";
import { smtpUrl } from "./config";

const g = globalThis as unknown as { shuntwiseMailTransport?: { url: string; t: Transporter } };

export function transport(url = smtpUrl()): Transporter {
  if (g.shuntwiseMailTransport?.url === url) return g.shuntwiseMailTransport.t;
  const host = new URL(url).hostname;
  const local = host === "127.0.0.1" || host === "localhost" || host === "::1";
  const t = nodemailer.createTransport(url, {
    ignoreTLS: local,
    connectionTimeout: 10_000,
    greetingTimeout: 10_000,
    socketTimeout: 30_000,
  });
  g.shuntwiseMailTransport = { url, t };
  return t;
}
