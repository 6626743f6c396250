import "server-only";
import { NextResponse } from "next/server";
import type { z } from "zod";
import { getDb } from "@/db";
import type { Db } from "@/db/client";
import type { Actor } from "./actor";
import { AppError, forbidden, invalidInput, unauthorized } from "./errors";
import { can, type Permission } from "./permissions";
import { getRequestActor } from "./session";
import { env } from "./env";
import { retryAfterSeconds, sharedLimiter, waitPhrase } from "./rate-limit";

export type ApiContext<P> = { req: Request; actor: Actor; db: Db; params: P };
type RouteCtx = { params: Promise<Record<string, string | string[]>> };

export function errorResponse(err: AppError) {
  const retryAfter = err.details?.retryAfterSeconds;
  const headers = typeof retryAfter === "number" ? { "retry-after": String(retryAfter) } : undefined;
  return NextResponse.json({ error: { code: err.code, message: err.message, details: err.details ?? null } }, { status: err.status, headers });
}

/**
 * Each API token may make API_RATE_LIMIT_PER_MINUTE requests a minute (a bucket of that size,
 * refilled evenly), so one runaway script cannot starve the plant's other users. Per app
 * instance (lib/rate-limit.ts says why). Sessions are people clicking, and are not limited here.
 */
function checkTokenRate(actor: Actor, now = Date.now()) {
  const perMinute = env().API_RATE_LIMIT_PER_MINUTE;
  if (actor.kind !== "token" || actor.tokenId === null || perMinute === 0) return;
  const d = sharedLimiter("api-token", { capacity: perMinute, windowMs: 60_000 }).take(String(actor.tokenId), now);
  if (d.allowed) return;
  const seconds = retryAfterSeconds(d.retryAfterMs);
  throw new AppError("rate_limited", `This API token has made more than ${perMinute} requests in a minute. Wait ${waitPhrase(d.retryAfterMs)} (Retry-After) and slow down, or ask an admin to raise API_RATE_LIMIT_PER_MINUTE.`, {
    retryAfterSeconds: seconds,
    limitPerMinute: perMinute,
  });
}

function toResponse(err: unknown) {
  if (err instanceof AppError) return errorResponse(err);
  const status = (err as { status?: number })?.status;
  if (typeof status === "number" && status >= 400 && status < 500 && err instanceof Error && "code" in err) {
    // Errors from the pure core (e.g. a bad logger file) carry a code and a status of their own.
    const e = err as Error & { code: string; details?: Record<string, unknown> };
    return NextResponse.json({ error: { code: e.code, message: e.message, details: e.details ?? null } }, { status });
  }
  console.error("[api] unexpected error", err);
  return errorResponse(new AppError("internal", "Something went wrong on the server. It has been logged; try again."));
}

/**
 * The one wrapper for route handlers: authenticate (bearer token or session cookie),
 * check the permission, hand over the database, and turn every error into the JSON shape.
 */
export function withApi<P = Record<string, string>>(
  handler: (ctx: ApiContext<P>) => Promise<Response | unknown>,
  options: { permission: Permission | null; what?: string },
) {
  const route = async (req: Request, ctx: RouteCtx) => {
    const started = performance.now();
    let response: Response;
    try {
      const actor = await getRequestActor(req.headers.get("authorization"));
      if (!actor) throw unauthorized();
      checkTokenRate(actor);
      if (options.permission && !can(actor.role, options.permission)) throw forbidden(options.what ?? options.permission.replace(".", " "));
      const params = ((await ctx?.params) ?? {}) as P;
      const result = await handler({ req, actor, db: await getDb(), params });
      response = result instanceof Response ? result : NextResponse.json(result);
    } catch (err) {
      response = toResponse(err);
    }
    return withServerTiming(response, performance.now() - started);
  };
  // Read by the security test that checks every route is in the role matrix.
  Object.assign(route, { permission: options.permission });
  return route;
}

/**
 * The handler's time (authentication, queries, serialising the answer) as a Server-Timing
 * header, so benchmarks (npm run bench) and browsers' network panels can tell it from the wire.
 */
function withServerTiming(response: Response, ms: number): Response {
  try {
    response.headers.append("Server-Timing", `app;dur=${ms.toFixed(1)}`);
  } catch {
    // A response with immutable headers (none of ours today) simply goes without.
  }
  return response;
}

/** Parses a JSON body with a zod schema; a broken or invalid body is a 400 naming the fields. */
export async function readJson<S extends z.ZodType>(req: Request, schema: S): Promise<z.infer<S>> {
  let body: unknown;
  try {
    body = await req.json();
  } catch {
    throw new AppError("invalid_input", "The request body is not valid JSON.", { fields: { _: "not valid JSON" } });
  }
  const parsed = schema.safeParse(body);
  if (!parsed.success) throw invalidInput(parsed.error.issues);
  return parsed.data;
}

export function parseQuery<S extends z.ZodType>(req: Request, schema: S): z.infer<S> {
  const params = Object.fromEntries(new URL(req.url).searchParams.entries());
  const parsed = schema.safeParse(params);
  if (!parsed.success) throw invalidInput(parsed.error.issues);
  return parsed.data;
}

/** Ids in paths are plain decimals: Number() alone would also take "0x10", " 7" or "1e1". */
export function parseId(raw: string | undefined, what: string): number {
  const id = /^[1-9]\d{0,15}$/.test(raw ?? "") ? Number(raw) : NaN;
  if (!Number.isSafeInteger(id)) throw new AppError("not_found", `${what} was not found.`);
  return id;
}

/**
 * Reads a multipart body, refusing oversized uploads before reading them when the client
 * states a length, and after reading when it does not.
 */
export async function readMultipart(req: Request, { maxBytes, label }: { maxBytes: number; label: string }): Promise<FormData> {
  const type = req.headers.get("content-type") ?? "";
  if (!type.toLowerCase().startsWith("multipart/form-data"))
    throw new AppError("unsupported_file", `Send the ${label} as multipart/form-data (a form upload).`, { contentType: type || null });
  const declared = Number(req.headers.get("content-length") ?? "0");
  const limit = maxBytes + 256 * 1024; // room for the other form fields
  const tooLarge = () => new AppError("file_too_large", `The ${label} is larger than ${Math.round(maxBytes / 1024 / 1024)} MB.`, { maxBytes });
  if (declared > limit) throw tooLarge();
  // A body sent without a length (chunked) is counted as it arrives and cut off at the limit,
  // rather than read whole into memory first.
  let seen = 0;
  const source =
    req.headers.get("content-length") === null && req.body
      ? new Request(req.url, {
          method: req.method,
          headers: req.headers,
          body: req.body.pipeThrough(
            new TransformStream<Uint8Array, Uint8Array>({
              transform(chunk, out) {
                seen += chunk.byteLength;
                if (seen > limit) out.error(tooLarge());
                else out.enqueue(chunk);
              },
            }),
          ),
          duplex: "half",
        } as RequestInit)
      : req;
  try {
    return await source.formData();
  } catch {
    if (seen > limit) throw tooLarge();
    throw new AppError("invalid_input", "The multipart body could not be read. Check that the upload finished.", { fields: { file: "unreadable upload" } });
  }
}

/** A multipart upload with one file in the field `file` and plain string fields beside it. */
export async function readFileUpload(req: Request, { maxBytes, label }: { maxBytes: number; label: string }) {
  const form = await readMultipart(req, { maxBytes, label });
  const file = form.get("file");
  if (!(file instanceof File)) throw new AppError("invalid_input", `file: attach the ${label} in the form field named file.`, { fields: { file: "is required" } });
  if (file.size > maxBytes) throw new AppError("file_too_large", `The ${label} is larger than ${Math.round(maxBytes / 1024 / 1024)} MB.`, { maxBytes });
  const fields: Record<string, string> = {};
  for (const [key, value] of form.entries()) if (key !== "file" && typeof value === "string") fields[key] = value;
  return { file: { bytes: new Uint8Array(await file.arrayBuffer()), name: file.name, mediaType: file.type }, fields };
}
