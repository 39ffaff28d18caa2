// Mail settings read from the environment (README, Configuration). No framework imports: the web
// server and `npm run worker` share them.

/** The public address of the app, for links in messages. */
export function publicUrl(): string {
  return (process.env.APP_URL ?? process.env.NEXTAUTH_URL ?? "http://127.0.0.1:3000").replace(/\/+$/, "");
}

export function smtpUrl(): string {
  return process.env.SMTP_URL ?? "smtp://127.0.0.1:2525";
}

export function mailFrom(): string {
  return process.env.MAIL_FROM ?? "Shuntwise <no-reply@shuntwise.example>";
}

function positiveInt(name: string, fallback: number): number {
  const n = Number(process.env[name]);
  return Number.isInteger(n) && n > 0 ? n : fallback;
}

/**
 * Retries of one message: exponential backoff from `retryDelay` seconds (pg-boss doubles the wait each
 * time, with jitter). The defaults, 12 tries from 30 s, keep trying for well over a day, so a mail
 * server that is down for hours loses nothing.
 */
export function retryOptions() {
  return {
    retryLimit: positiveInt("SHUNTWISE_MAIL_RETRY_LIMIT", 12),
    retryDelay: positiveInt("SHUNTWISE_MAIL_RETRY_DELAY", 30),
    retryBackoff: true,
    // longer than the SMTP timeouts' worst case (lib/mail/transport.ts): a slow server fails the try
    // first. Were a job still to expire mid-send, its retry waits on the outbox row's lock and then
    // finds the message sent (lib/mail/deliver.ts), so nothing goes out twice.
    expireInSeconds: positiveInt("SHUNTWISE_MAIL_EXPIRE_SECONDS", 300),
  };
}

/** The local SMTP stand-in keeps its messages in this folder; unset in a real deployment. */
export function standInMailDir(): string | null {
  const dir = process.env.SHUNTWISE_MAIL_DIR;
  if (!dir) return null;
  try {
    const host = new URL(smtpUrl()).hostname;
    return host === "127.0.0.1" || host === "localhost" || host === "::1" ? dir : null;
  } catch {
    return null;
  }
}
