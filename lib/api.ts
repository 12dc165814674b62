import "server-only";
import { NextResponse, type NextRequest } from "next/server";
import { z } from "zod";
import { AppError } from "./errors";
import { fieldErrorsOf } from "./validation/common";

const MAX_JSON_BYTES = 1_000_000;

export type RouteContext<P = Record<string, string>> = { params: Promise<P> };

/** JSON success response. */
export function ok<T>(data: T, init?: ResponseInit) {
  return NextResponse.json(data, init);
}

export function errorResponse(error: unknown): NextResponse {
  if (error instanceof AppError) return NextResponse.json(error.toJSON(), { status: error.status });
  if (error instanceof z.ZodError) {
    return NextResponse.json({ error: { code: "bad_request", message: "Some fields need attention.", fieldErrors: fieldErrorsOf(error) } }, { status: 400 });
  }
  const msg = error instanceof Error ? error.message : String(error);
  if (/SQLITE_READONLY|attempt to write a readonly database/i.test(msg)) {
    console.error("[meniscus] database is read-only", error);
    return NextResponse.json({ error: { code: "unavailable", message: "Meniscus cannot save right now: the database is read-only. Your work is kept in this browser; tell your school's IT team." } }, { status: 503 });
  }
  if (/SQLITE_FULL|database or disk is full/i.test(msg)) {
    console.error("[meniscus] disk full", error);
    return NextResponse.json({ error: { code: "unavailable", message: "Meniscus cannot save right now: the server's disk is full. Your work is kept in this browser; tell your school's IT team." } }, { status: 503 });
  }
  console.error("[meniscus] unexpected error", error);
  return NextResponse.json({ error: { code: "internal", message: "Something went wrong on the server. Please try again." } }, { status: 500 });
}

const SAFE_METHODS = new Set(["GET", "HEAD", "OPTIONS"]);

/**
 * Cross-site request forgery guard for state-changing requests: a browser always sends Origin on
 * a cross-site POST, so one that names another site is refused. (Session cookies are also
 * SameSite=Lax.)
 */
export function assertSameOrigin(req: Request): void {
  if (SAFE_METHODS.has(req.method)) return;
  const origin = req.headers.get("origin");
  const site = req.headers.get("sec-fetch-site");
  if (site === "cross-site") throw new AppError("forbidden", "Requests from other sites are not accepted.");
  if (!origin) return;
  const host = req.headers.get("x-forwarded-host") ?? req.headers.get("host");
  let originHost: string;
  try {
    originHost = new URL(origin).host;
  } catch {
    throw new AppError("forbidden", "Requests from other sites are not accepted.");
  }
  if (!host || originHost !== host) throw new AppError("forbidden", "Requests from other sites are not accepted.");
}

/** Wraps a route handler so every refusal becomes a JSON error with the right status. */
export function handle<P = Record<string, string>>(fn: (req: NextRequest, ctx: RouteContext<P>) => Promise<Response>) {
  return async (req: NextRequest, ctx: RouteContext<P>): Promise<Response> => {
    try {
      assertSameOrigin(req);
      return await fn(req, ctx);
    } catch (e) {
      return errorResponse(e);
    }
  };
}

/** Reads and validates a JSON body: malformed, oversized or wrongly typed bodies are 4xx. */
export async function readJson<S extends z.ZodType>(req: Request, schema: S): Promise<z.infer<S>> {
  const type = req.headers.get("content-type") ?? "";
  if (!type.toLowerCase().includes("application/json")) throw new AppError("unsupported_media_type", "Send the data as JSON (Content-Type: application/json).");
  const length = Number(req.headers.get("content-length") ?? 0);
  if (length > MAX_JSON_BYTES) throw new AppError("payload_too_large", "That request is too large.");
  let text: string;
  try {
    text = await req.text();
  } catch {
    // The connection closed before the whole body arrived (a dropped network, a closed tab).
    throw new AppError("bad_request", "The request was cut off before it arrived whole. Try again.");
  }
  if (text.length > MAX_JSON_BYTES) throw new AppError("payload_too_large", "That request is too large.");
  let body: unknown;
  try {
    body = JSON.parse(text);
  } catch {
    throw new AppError("bad_request", "The request body is not valid JSON.");
  }
  const parsed = schema.safeParse(body);
  if (!parsed.success) throw new AppError("bad_request", parsed.error.issues[0]?.message ?? "Some fields need attention.", { fieldErrors: fieldErrorsOf(parsed.error) });
  return parsed.data;
}

/** Validates query-string parameters. */
export function readQuery<S extends z.ZodType>(req: NextRequest, schema: S): z.infer<S> {
  const parsed = schema.safeParse(Object.fromEntries(req.nextUrl.searchParams));
  if (!parsed.success) throw new AppError("bad_request", parsed.error.issues[0]?.message ?? "Some parameters are not valid.", { fieldErrors: fieldErrorsOf(parsed.error) });
  return parsed.data;
}
