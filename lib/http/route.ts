// Route-handler plumbing: every handler is wrapped so that errors become `{ error: { code, message,
// fields? } }` JSON with a 4xx status, and nothing unexpected leaks beyond a generic 500 message.
import { NextResponse } from "next/server";
import { z } from "zod";
import { AppError, isDatabaseUnavailable, ServiceUnavailable } from "@/lib/errors";
import { invalid, parseOr400, refuseControlCharacters } from "@/lib/validation/zod-errors";

type Ctx<P> = { params: Promise<P> };

const STATE_CHANGING = new Set(["POST", "PUT", "PATCH", "DELETE"]);

/** Largest JSON body a route reads (a lab with long instructions is well under it). */
export const MAX_JSON_BYTES = 256 * 1024;

function originOf(url: string | undefined | null): string | null {
  if (!url) return null;
  try {
    return new URL(url).origin;
  } catch {
    return null;
  }
}

/** The site's public origins as configured (NEXTAUTH_URL, and APP_URL when set); never read from a request. */
function publicOrigins(): (string | null)[] {
  return [originOf(process.env.NEXTAUTH_URL ?? `http://127.0.0.1:${process.env.PORT ?? 3000}`), originOf(process.env.APP_URL)];
}

/**
 * Cross-site request refusal for state-changing methods: the browser's `Origin` must be the configured
 * public address. Host and X-Forwarded-Host are not consulted (a client sets them to anything). Browsers
 * send `Origin` with every POST, PUT, PATCH and DELETE; other clients must send it too.
 */
export function assertSameOrigin(req: Request): void {
  const origin = req.headers.get("origin");
  if (!origin || origin === "null" || !publicOrigins().includes(origin)) {
    throw new AppError("forbidden", "This change must come from a page of this site (the Origin header is missing or another site's).", {
      origin: ["Send the Origin header of this site."],
    });
  }
}

/**
 * Reads a request body as bytes, counting as they arrive and stopping at `cap` (413), whether or not a
 * Content-Length was sent.
 */
export async function readCapped(req: Request, cap: number, field = "body"): Promise<Uint8Array> {
  const tooLarge = () =>
    new AppError("payload_too_large", `The request body is larger than the ${Math.round(cap / 1024)} KB limit.`, {
      [field]: [`At most ${Math.round(cap / 1024)} KB.`],
    });
  const declared = Number(req.headers.get("content-length") ?? NaN);
  if (Number.isFinite(declared) && declared > cap) throw tooLarge();
  if (!req.body) return new Uint8Array();
  const reader = req.body.getReader();
  const chunks: Uint8Array[] = [];
  let total = 0;
  for (;;) {
    const { done, value } = await reader.read();
    if (done) break;
    total += value.byteLength;
    if (total > cap) {
      await reader.cancel().catch(() => {});
      throw tooLarge();
    }
    chunks.push(value);
  }
  const out = new Uint8Array(total);
  let at = 0;
  for (const c of chunks) {
    out.set(c, at);
    at += c.byteLength;
  }
  return out;
}

/**
 * `Cache-Control: no-store` on every answer of the API unless the handler chose otherwise: an answer
 * depends on the caller (their data, a signed URL, a CSV of grades), so no browser or proxy may keep it.
 */
function noStore(res: Response): Response {
  if (!res.headers.has("cache-control")) res.headers.set("cache-control", "no-store");
  return res;
}

export function route<P = Record<string, string>>(handler: (req: Request, params: P) => Promise<Response>) {
  return async (req: Request, ctx: Ctx<P>): Promise<Response> => {
    try {
      if (STATE_CHANGING.has(req.method)) assertSameOrigin(req);
      return noStore(await handler(req, await ctx.params));
    } catch (e) {
      return noStore(errorResponse(e));
    }
  };
}

export function errorResponse(e: unknown): Response {
  // the database restarting or out of reach: 503 with Retry-After, the client may send the same request again
  if (!(e instanceof AppError) && isDatabaseUnavailable(e)) e = new ServiceUnavailable();
  // A body cut at its limit leaves unread bytes on the connection: close it rather than reuse it.
  if (e instanceof AppError && e.code === "payload_too_large") return NextResponse.json(e.toJSON(), { status: e.status, headers: { connection: "close" } });
  if (e instanceof AppError && "retryAfterSeconds" in e) {
    return NextResponse.json(e.toJSON(), { status: e.status, headers: { "retry-after": String(e.retryAfterSeconds) } });
  }
  if (e instanceof AppError) return NextResponse.json(e.toJSON(), { status: e.status });
  if (e instanceof z.ZodError) {
    const err = invalid(e);
    return NextResponse.json(err.toJSON(), { status: err.status });
  }
  console.error("unexpected error in a route handler", e);
  return NextResponse.json({ error: { code: "internal", message: "Something went wrong on the server." } }, { status: 500 });
}

/**
 * Reads a JSON body: Content-Type application/json (else 415), at most MAX_JSON_BYTES counted as it
 * streams (else 413), well-formed (else 400 that says so), no control character in any text (else 400
 * naming the field).
 */
export async function readJson(req: Request): Promise<unknown> {
  const type = (req.headers.get("content-type") ?? "").split(";")[0].trim().toLowerCase();
  if (type !== "application/json") {
    throw new AppError("unsupported_media_type", "Send the body as JSON with Content-Type: application/json.", {
      "content-type": ["Must be application/json."],
    });
  }
  const bytes = await readCapped(req, MAX_JSON_BYTES);
  let data: unknown;
  try {
    data = JSON.parse(new TextDecoder("utf-8", { fatal: true }).decode(bytes));
  } catch {
    throw new AppError("bad_request", "The request body must be JSON.", { body: ["Not valid JSON."] });
  }
  // every text field of every JSON body: a control character is a 400 naming the field, never a 500
  refuseControlCharacters(data);
  return data;
}

/** Reads a JSON body (see readJson) and validates it against the mutation's schema. */
export async function jsonBody<T extends z.ZodType>(req: Request, schema: T): Promise<z.infer<T>> {
  const data = await readJson(req);
  return parseOr400(schema, data);
}

export const json = (data: unknown, status = 200) => NextResponse.json(data, { status });
