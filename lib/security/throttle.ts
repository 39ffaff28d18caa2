// Throttles for the actions someone could try over and over: sign-in, sign-up (join codes), password
// reset and the lessons' check-yourself action. rate-limiter-flexible counts in PostgreSQL (table
// rate_limits), so the limits hold across several app instances. Every attempt counts against both the
// account's e-mail (whether or not an account has it: the answer and the time taken never tell) and the
// caller's address.
import "server-only";
import { timingSafeEqual } from "node:crypto";
import type pg from "pg";
import { RateLimiterPostgres, RateLimiterRes } from "rate-limiter-flexible";
import { newPool } from "@/db/pool";
import { AppError } from "@/lib/errors";

const MIN = 60;
// A classroom behind one address signs in together: the per-address limits are generous, and
// SHUNTWISE_PER_ADDRESS_FACTOR scales them (npm test raises it: the whole suite signs in from 127.0.0.1).
const perAddress = (points: number) => Math.round(points * Math.max(1, Number(process.env.SHUNTWISE_PER_ADDRESS_FACTOR ?? 1) || 1));

export const LIMITS = {
  signInAccount: { points: 10, duration: 15 * MIN },
  signInAddress: { points: perAddress(200), duration: 15 * MIN },
  signUpAddress: { points: perAddress(30), duration: 60 * MIN },
  resetAccount: { points: 3, duration: 60 * MIN },
  resetAddress: { points: perAddress(30), duration: 60 * MIN },
  checkUser: { points: 60, duration: MIN },
};

export type LimitName = keyof typeof LIMITS;

/**
 * A counter's key as stored: lower case, without control characters (PostgreSQL text cannot hold NUL),
 * at most 200 characters (the table's key is varchar(255) with the limit's name in front).
 */
const keyOf = (key: string) => key.toLowerCase().replace(/[\u0000-\u001f\u007f]/g, "").slice(0, 200);

const WHAT: Record<string, string> = {
  signIn: "sign-in attempts",
  signUp: "sign-up attempts",
  reset: "password reset requests",
  check: "answers checked",
};

let pool: pg.Pool | undefined;
const limiters = new Map<LimitName, RateLimiterPostgres>();

function limiter(name: LimitName): RateLimiterPostgres {
  if (!pool) {
    pool = newPool(process.env.DATABASE_URL, 4);
  }
  let l = limiters.get(name);
  if (!l) {
    l = new RateLimiterPostgres({
      storeClient: pool,
      tableName: "rate_limits",
      tableCreated: true, // by the migration
      keyPrefix: name,
      ...LIMITS[name],
    });
    limiters.set(name, l);
  }
  return l;
}

/** Too many tries: 429 with Retry-After and a message a person understands. */
export class TooManyRequests extends AppError {
  constructor(
    public retryAfterSeconds: number,
    what: string,
    field?: string,
  ) {
    const minutes = Math.max(1, Math.ceil(retryAfterSeconds / 60));
    const message = `Too many ${what} in a short time. Wait ${minutes} minute${minutes === 1 ? "" : "s"} and try again.`;
    super("too_many_requests", message, field ? { [field]: [message] } : undefined);
  }
}

/**
 * Counts one try against every given counter; throws TooManyRequests when any is used up. Keys that are
 * empty are skipped. `field`: the form field a 429 names (the one whose value is being tried).
 */
export async function throttle(counters: [LimitName, string | null | undefined][], field?: string): Promise<void> {
  const results = await Promise.allSettled(counters.filter(([, key]) => key).map(([name, key]) => limiter(name).consume(keyOf(key!))));
  let wait = 0;
  for (const r of results) {
    if (r.status === "rejected") {
      if (r.reason instanceof RateLimiterRes) wait = Math.max(wait, r.reason.msBeforeNext);
      else throw r.reason;
    }
  }
  if (wait > 0) {
    const first = counters[0][0];
    const what = WHAT[Object.keys(WHAT).find((k) => first.startsWith(k)) ?? "signIn"];
    throw new TooManyRequests(Math.ceil(wait / 1000), what, field);
  }
}

/**
 * A try at a secret (a password): one point is taken from every counter before the secret is checked,
 * atomically in PostgreSQL (an upsert per counter), so tries sent in parallel cannot all pass a check made
 * before any is counted. Throws TooManyRequests when any counter was already used up. On success the
 * caller gives the points back (giveBack) or forgets the counter.
 */
export async function takeTry(counters: [LimitName, string | null | undefined][], field?: string): Promise<void> {
  await throttle(counters, field);
}

/** Returns the point takeTry took from each counter (the try succeeded). */
export async function giveBack(counters: [LimitName, string | null | undefined][]): Promise<void> {
  await Promise.all(counters.filter(([, key]) => key).map(([name, key]) => limiter(name).reward(keyOf(key!), 1)));
}

/** Forgets a counter (a successful sign-in clears its account's failures). */
export async function forgive(name: LimitName, key: string | null | undefined): Promise<void> {
  if (key) await limiter(name).delete(keyOf(key));
}

/**
 * The caller's address as the server wrapper (scripts/serve.mjs) resolved it: the socket's peer, or with
 * SHUNTWISE_TRUSTED_PROXIES the address a trusted proxy saw. The wrapper's header counts only with its
 * process's key (a client cannot make one up); without the wrapper (`next dev`) every caller shares the
 * one counter "unknown" rather than trusting a header the client writes.
 */
export function clientAddress(headers: Headers | { get(name: string): string | null }): string {
  const key = process.env.SHUNTWISE_CLIENT_HEADER_KEY;
  const stamped = headers.get("x-shuntwise-client");
  if (!key || !stamped) return "unknown";
  const space = stamped.indexOf(" ");
  if (space <= 0) return "unknown";
  const given = Buffer.from(stamped.slice(0, space));
  const expected = Buffer.from(key);
  return given.length === expected.length && timingSafeEqual(given, expected) ? stamped.slice(space + 1) || "unknown" : "unknown";
}
