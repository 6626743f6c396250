import { createHmac, timingSafeEqual } from "node:crypto";
import { env } from "./env";

/*
 * Signed one-click unsubscribe tokens: base64url(JSON {u, k, e}) "." base64url(HMAC-SHA256).
 * The signature covers user, kind and expiry, so none can be changed; the link works until it
 * expires, without a session, and only for what it names.
 */

export type UnsubscribePayload = { userId: string; kind: string; expiresAt: Date };

export const UNSUBSCRIBE_TOKEN_DAYS = 60;

export function mailSecret(): string {
  const s = env().AUTH_SECRET;
  if (s) return s;
  if (env().NODE_ENV === "production" && env().DEMO_MODE !== "on") throw new Error("AUTH_SECRET is required to sign unsubscribe links.");
  return "ovenward-development-secret-change-me";
}

function mac(body: string, secret: string): Buffer {
  return createHmac("sha256", secret).update(`unsubscribe.v1.${body}`).digest();
}

export function signUnsubscribeToken(p: UnsubscribePayload, secret = mailSecret()): string {
  const body = Buffer.from(JSON.stringify({ u: p.userId, k: p.kind, e: p.expiresAt.getTime() })).toString("base64url");
  return `${body}.${mac(body, secret).toString("base64url")}`;
}

export type VerifyResult = { ok: true; payload: UnsubscribePayload } | { ok: false; reason: "malformed" | "bad_signature" | "expired" };

export function verifyUnsubscribeToken(token: string, now: Date, secret = mailSecret()): VerifyResult {
  const parts = token.split(".");
  if (parts.length !== 2 || !parts[0] || !parts[1]) return { ok: false, reason: "malformed" };
  const [body, sig] = parts;
  const given = Buffer.from(sig, "base64url");
  const expected = mac(body, secret);
  if (given.length !== expected.length || !timingSafeEqual(given, expected)) return { ok: false, reason: "bad_signature" };
  let data: { u?: unknown; k?: unknown; e?: unknown };
  try {
    data = JSON.parse(Buffer.from(body, "base64url").toString("utf8"));
  } catch {
    return { ok: false, reason: "malformed" };
  }
  if (typeof data.u !== "string" || typeof data.k !== "string" || typeof data.e !== "number") return { ok: false, reason: "malformed" };
  if (now.getTime() >= data.e) return { ok: false, reason: "expired" };
  return { ok: true, payload: { userId: data.u, kind: data.k, expiresAt: new Date(data.e) } };
}
