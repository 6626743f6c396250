import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { NextRequest } from "next/server";
import type { AddressInfo } from "node:net";
import { createTestDb } from "./test-db";
import { startMailSink } from "@/lib/mail-sink";

// The session cookie as the sign-in library really sets it with Ovenward's configuration
// (lib/auth.ts), for an app whose address (AUTH_URL, which the library puts in place of the
// request's own origin) is https — behind a TLS proxy — and for a plain-http local demo:
// httpOnly and SameSite=Lax always, Secure (with the __Secure- prefix) exactly when https.
// The e2e server is http, so tests/e2e/api.security.spec.ts sees only the second case.
// Then the per-address sign-in limit through the library's own endpoints, which a client can
// POST to directly (not only through the sign-in form's actions).
// Inside Next.js, headers() returns the incoming request's headers; here the test hands them over.
const incoming = { headers: new Headers() };
vi.mock("next/headers", () => ({ headers: async () => incoming.headers }));

let t: Awaited<ReturnType<typeof createTestDb>>;
let handlers: typeof import("@/lib/auth").handlers;
let sink: Awaited<ReturnType<typeof startMailSink>>;

beforeAll(async () => {
  t = await createTestDb();
  sink = await startMailSink({ db: t.db, port: 0 }); // sign-in links for known addresses are mailed here
  const smtp = `smtp://127.0.0.1:${(sink.server.address() as AddressInfo).port}`;
  Object.assign(process.env, { DATABASE_URL: t.url, SMTP_URL: smtp, AUTH_SECRET: "cookie-test-secret-0123456789abcdef", SIGN_IN_RATE_LIMIT: "3" });
  ({ handlers } = await import("@/lib/auth"));
});
const authUrlBefore = process.env.AUTH_URL;
afterAll(() => {
  process.env.AUTH_URL = authUrlBefore;
  sink.close();
  t.close();
});

type Cookie = { name: string; value: string; attrs: string[] };
const parseSetCookie = (res: Response): Cookie[] =>
  res.headers.getSetCookie().map((line) => {
    const [pair, ...attrs] = line.split(";").map((s) => s.trim());
    const i = pair.indexOf("=");
    return { name: pair.slice(0, i), value: pair.slice(i + 1), attrs: attrs.map((a) => a.toLowerCase()) };
  });

/** Posts a form to one of the library's endpoints with its CSRF token, as the sign-in form's actions do. */
async function post(origin: string, endpoint: string, form: Record<string, string>, address = "192.0.2.10") {
  process.env.AUTH_URL = origin; // read by the sign-in library on every request
  const csrfRes = await handlers.GET(new NextRequest(`${origin}/api/auth/csrf`));
  const { csrfToken } = await csrfRes.json();
  const cookie = parseSetCookie(csrfRes).map((c) => `${c.name}=${c.value}`).join("; ");
  const body = new URLSearchParams({ ...form, csrfToken, callbackUrl: `${origin}/fleet` });
  const req = new NextRequest(`${origin}/api/auth/${endpoint}`, { method: "POST", body, headers: { "content-type": "application/x-www-form-urlencoded", cookie, "x-forwarded-for": address } });
  incoming.headers = new Headers(req.headers);
  const res = await handlers.POST(req);
  return { res, cookies: parseSetCookie(res), location: res.headers.get("location") ?? "" };
}
const signIn = (origin: string, password = "ovenward-demo", address?: string) =>
  post(origin, "callback/credentials", { email: "engineer@brightwater.example", password }, address);

describe("session cookie flags", () => {
  it("over https: __Secure- prefix, Secure, HttpOnly, SameSite=Lax, path /", async () => {
    const { res, cookies } = await signIn("https://ovenward.plant.example");
    expect(res.status).toBe(302);
    const session = cookies.find((c) => c.name.endsWith("authjs.session-token"));
    expect(session, JSON.stringify(cookies.map((c) => c.name))).toBeDefined();
    expect(session!.name).toBe("__Secure-authjs.session-token");
    expect(session!.attrs).toEqual(expect.arrayContaining(["httponly", "secure", "samesite=lax", "path=/"]));
    expect(session!.value.length).toBeGreaterThan(20);
  });

  it("over http: HttpOnly and SameSite=Lax, and not Secure (the browser would drop it)", async () => {
    const { res, cookies } = await signIn("http://localhost:3999");
    expect(res.status).toBe(302);
    const session = cookies.find((c) => c.name.endsWith("authjs.session-token"));
    expect(session!.name).toBe("authjs.session-token");
    expect(session!.attrs).toEqual(expect.arrayContaining(["httponly", "samesite=lax", "path=/"]));
    expect(session!.attrs).not.toContain("secure");
  });
});

describe("sign-in attempts per client address, through the library's endpoints", () => {
  const origin = "http://localhost:3999";
  it("failed passwords from one address are refused after SIGN_IN_RATE_LIMIT, even with the right password", async () => {
    const wrong = [];
    for (let i = 0; i < 3; i++) wrong.push((await post(origin, "callback/credentials", { email: `nobody${i}@brightwater.example`, password: "guess" }, "192.0.2.50")).location);
    for (const loc of wrong) expect(loc).toMatch(/\/sign-in\?.*code=credentials/);
    const refused = await signIn(origin, "ovenward-demo", "192.0.2.50");
    expect(refused.location).toMatch(/\/sign-in\?.*code=rate_limited/);
    expect(refused.cookies.find((c) => c.name.endsWith("session-token"))).toBeUndefined();
    // Another address, and successful sign-ins, are not held back.
    const other = await signIn(origin, "ovenward-demo", "192.0.2.51");
    expect(other.location).toBe(`${origin}/fleet`);
    expect(other.cookies.find((c) => c.name.endsWith("session-token"))).toBeDefined();
  });

  it("magic-link requests count for known and unknown addresses alike", async () => {
    const answers = [];
    for (const email of ["viewer@brightwater.example", "stranger@elsewhere.example", "tech@brightwater.example", "viewer@brightwater.example"]) {
      answers.push((await post(origin, "signin/nodemailer", { email }, "192.0.2.60")).location);
    }
    expect(answers[3]).toMatch(/\/sign-in\?error=AccessDenied&code=rate_limited/);
    for (const loc of answers.slice(0, 3)) expect(loc).not.toMatch(/rate_limited/);
    expect(answers[0]).toMatch(/verify-request|check-email/); // a known address: the link was sent
    expect((await post(origin, "signin/nodemailer", { email: "viewer@brightwater.example" }, "192.0.2.61")).location).not.toMatch(/rate_limited/);
  });
});
