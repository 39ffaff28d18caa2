// Throttles for the actions someone could try over and over: sign-in, sign-up (join codes), password
// reset and the lessons' check-yourself action. rate-limiter-flexible counts in PostgreSQL (table
// rate_limits), so the limits hold across several app instances. Every attempt counts against both the
// account's e-mail (whether or not an account has it: the answer and the time taken never tell) and the
// caller's address.
import "server-only";
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

/** A counter's key as stored: lower case, without control characters (PostgreSQL text cannot hold NUL). */
const keyOf = (key: string) => key.toLowerCase().replace(/[\u0000-\u001f\u007f]/g, "");

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
  ) {
    const minutes = Math.max(1, Math.ceil(retryAfterSeconds / 60));
    super("too_many_requests", `Too many ${what} in a short time. Wait ${minutes} minute${minutes === 1 ? "" : "s"} and try again.`);
  }
}

/**
 * Counts one try against every given counter; throws TooManyRequests when any is used up. Keys that are
 * empty are skipped.
 */
export async function throttle(counters: [LimitName, string | null | undefined][]): Promise<void> {
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
    throw new TooManyRequests(Math.ceil(wait / 1000), what);
  }
}

/** Throws TooManyRequests when any counter is already used up, without counting a try. */
export async function refuseIfUsedUp(counters: [LimitName, string | null | undefined][]): Promise<void> {
  let wait = 0;
  for (const [name, key] of counters) {
    if (!key) continue;
    const res = await limiter(name).get(keyOf(key));
    if (res && res.consumedPoints >= LIMITS[name].points) wait = Math.max(wait, res.msBeforeNext);
  }
  if (wait > 0) throw new TooManyRequests(Math.ceil(wait / 1000), WHAT.signIn);
}

/** Counts one failed try against every counter (a refusal is already handled by refuseIfUsedUp). */
export async function countFailure(counters: [LimitName, string | null | undefined][]): Promise<void> {
  await Promise.allSettled(counters.filter(([, key]) => key).map(([name, key]) => limiter(name).consume(keyOf(key!))));
}

/** Forgets a counter (a successful sign-in clears its account's failures). */
export async function forgive(name: LimitName, key: string | null | undefined): Promise<void> {
  if (key) await limiter(name).delete(keyOf(key));
}

/**
 * The caller's address: the last entry of X-Forwarded-For (the one the nearest proxy, or Next.js
 * itself, wrote; earlier entries come from the client and can be forged).
 */
export function clientAddress(headers: Headers | { get(name: string): string | null }): string {
  const xff = headers.get("x-forwarded-for");
  const last = xff?.split(",").at(-1)?.trim();
  return last || headers.get("x-real-ip") || "unknown";
}
