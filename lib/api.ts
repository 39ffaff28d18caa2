// Route-handler plumbing: every handler is wrapped so that errors become `{ error: { code, message,
// fields? } }` JSON with a 4xx status, and nothing unexpected leaks beyond a generic 500 message.
import { NextResponse } from "next/server";
import { z } from "zod";
import { AppError } from "@/lib/errors";
import { invalid, parseOr400 } from "@/lib/validation/zod-errors";

type Ctx<P> = { params: Promise<P> };

export function route<P = Record<string, string>>(handler: (req: Request, params: P) => Promise<Response>) {
  return async (req: Request, ctx: Ctx<P>): Promise<Response> => {
    try {
      return await handler(req, await ctx.params);
    } catch (e) {
      return errorResponse(e);
    }
  };
}

export function errorResponse(e: unknown): Response {
  if (e instanceof AppError) return NextResponse.json(e.toJSON(), { status: e.status });
  if (e instanceof z.ZodError) {
    const err = invalid(e);
    return NextResponse.json(err.toJSON(), { status: err.status });
  }
  console.error("unexpected error in a route handler", e);
  return NextResponse.json({ error: { code: "internal", message: "Something went wrong on the server." } }, { status: 500 });
}

/** Reads a JSON body and validates it; malformed JSON is a 400 that says so. */
export async function jsonBody<T extends z.ZodType>(req: Request, schema: T): Promise<z.infer<T>> {
  let data: unknown;
  try {
    data = await req.json();
  } catch {
    throw new AppError("bad_request", "The request body must be JSON.");
  }
  return parseOr400(schema, data);
}

export const json = (data: unknown, status = 200) => NextResponse.json(data, { status });
