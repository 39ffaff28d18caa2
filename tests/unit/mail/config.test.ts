// When the development mailbox exists: only with the local SMTP stand-in (its folder set and SMTP on
// this machine); a deployment that sends through a real mail server has none (the routes answer 404).
import { afterEach, describe, expect, it } from "vitest";
import { mailboxAvailable } from "@/lib/mail/mailbox";
import { messageIdFor } from "@/lib/mail/deliver";
import { retryOptions } from "@/lib/mail/config";
import { SMTP_TIMEOUTS_MS, smtpWorstCaseSeconds, transport } from "@/lib/mail/transport";

const saved = { ...process.env };
afterEach(() => {
  process.env = { ...saved };
});

describe("the development mailbox", () => {
  it("exists with the local stand-in only", () => {
    process.env.SHUNTWISE_MAIL_DIR = "/tmp/mail-dev";
    process.env.SMTP_URL = "smtp://127.0.0.1:2525";
    expect(mailboxAvailable()).toBe(true);
    process.env.SMTP_URL = "smtps://mail.college.example:465";
    expect(mailboxAvailable()).toBe(false);
    delete process.env.SHUNTWISE_MAIL_DIR;
    process.env.SMTP_URL = "smtp://127.0.0.1:2525";
    expect(mailboxAvailable()).toBe(false);
  });
});

describe("message ids and retries", () => {
  it("gives every outbox row one Message-ID in the sender's domain", () => {
    const id = "0b4c9d1e-2f3a-4b5c-8d6e-7f8091a2b3c4";
    expect(messageIdFor(id, "Shuntwise <no-reply@shuntwise.example>")).toBe(`<mail-${id}@shuntwise.example>`);
    expect(messageIdFor(id, "Shuntwise <no-reply@shuntwise.example>")).toBe(messageIdFor(id, "Shuntwise <no-reply@shuntwise.example>"));
  });

  it("retries with exponential backoff, by default for well over a day", () => {
    delete process.env.SHUNTWISE_MAIL_RETRY_LIMIT;
    delete process.env.SHUNTWISE_MAIL_RETRY_DELAY;
    const r = retryOptions();
    expect(r.retryBackoff).toBe(true);
    // pg-boss waits at least delay·2^n before try n+1 (its plans.js): the sum of the shortest waits
    const shortest = Array.from({ length: r.retryLimit }, (_, n) => r.retryDelay * 2 ** n).reduce((a, b) => a + b, 0);
    expect(shortest).toBeGreaterThan(24 * 3600);
    process.env.SHUNTWISE_MAIL_RETRY_DELAY = "1";
    expect(retryOptions().retryDelay).toBe(1);
  });

  it("gives up on a slow SMTP server before the mail job expires", () => {
    delete process.env.SHUNTWISE_MAIL_EXPIRE_SECONDS;
    // the transport really carries these limits (nodemailer keeps its options on the SMTP transport)
    const options = (transport("smtp://127.0.0.1:2525") as unknown as { transporter: { options: Record<string, unknown> } }).transporter.options;
    expect(options).toMatchObject(SMTP_TIMEOUTS_MS);
    expect(smtpWorstCaseSeconds()).toBeLessThan(retryOptions().expireInSeconds);
  });
});
