import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { createTestDb } from "./test-db";
import { createApiToken } from "@/db/queries/api-tokens";
import { getUserByEmail } from "@/db/queries/users";

// The per-token API limit through the real wrapper (withApi) and a real route, and the
// per-address sign-in limit's bookkeeping. The sign-in library's own wiring is exercised through
// its endpoints in tests/integration/auth-endpoints.test.ts and over HTTP in tests/e2e/api.security.spec.ts.
const session = { user: null as null | { id: string } };
vi.mock("@/lib/auth", () => ({ auth: async () => session }));

let t: Awaited<ReturnType<typeof createTestDb>>;
let me: typeof import("@/app/api/v1/me/route");
let engineerId = "";
const secrets: string[] = [];

beforeAll(async () => {
  t = await createTestDb();
  Object.assign(process.env, { DATABASE_URL: t.url, API_RATE_LIMIT_PER_MINUTE: "3", SIGN_IN_RATE_LIMIT: "4" });
  engineerId = (await getUserByEmail(t.db, "engineer@brightwater.example"))!.id;
  for (const name of ["script-a", "script-b"]) secrets.push((await createApiToken(t.db, { userId: engineerId, name }, null)).secret);
  me = await import("@/app/api/v1/me/route");
});
afterAll(() => t.close());

const get = (authorization?: string) =>
  me.GET(new Request("http://localhost/api/v1/me", { headers: authorization ? { authorization } : {} }), { params: Promise.resolve({}) } as never);

describe("API token rate limit", () => {
  it("answers 429 rate_limited with Retry-After once a token has spent its minute's requests", async () => {
    const statuses = [];
    for (let i = 0; i < 3; i++) statuses.push((await get(`Bearer ${secrets[0]}`)).status);
    expect(statuses).toEqual([200, 200, 200]);
    const refused = await get(`Bearer ${secrets[0]}`);
    expect(refused.status).toBe(429);
    const retryAfter = Number(refused.headers.get("retry-after"));
    expect(retryAfter).toBeGreaterThanOrEqual(1);
    expect(retryAfter).toBeLessThanOrEqual(20); // 3 a minute: one token every 20 s
    const body = await refused.json();
    expect(body.error.code).toBe("rate_limited");
    expect(body.error.message).toMatch(/more than 3 requests in a minute.*API_RATE_LIMIT_PER_MINUTE/);
    expect(body.error.details).toEqual({ retryAfterSeconds: retryAfter, limitPerMinute: 3 });
  });

  it("counts each token alone", async () => {
    expect((await get(`Bearer ${secrets[1]}`)).status).toBe(200);
  });

  it("does not limit signed-in people (sessions), nor count unknown tokens against anyone", async () => {
    session.user = { id: engineerId };
    for (let i = 0; i < 5; i++) expect((await get()).status).toBe(200);
    session.user = null;
    expect((await get("Bearer ow_not_a_token")).status).toBe(401);
  });
});

describe("sign-in attempts per client address", () => {
  it("refuses an address after SIGN_IN_RATE_LIMIT attempts and leaves other addresses alone", async () => {
    const { countSignInAttempt, signInAllowed, signInLimitedMessage } = await import("@/lib/auth/sign-in-limit");
    const now = Date.parse("2026-03-02T06:00:00Z");
    const a = new Headers({ "x-forwarded-for": "198.51.100.20" });
    const b = new Headers({ "x-forwarded-for": "198.51.100.21" });
    const spent = [1, 2, 3, 4, 5].map((i) => countSignInAttempt(a, now + i).allowed);
    expect(spent).toEqual([true, true, true, true, false]);
    const gate = signInAllowed(a, now + 10);
    expect(gate.allowed).toBe(false);
    expect(gate.retryAfterMs).toBeGreaterThan(3 * 60_000); // 4 per 15 minutes: a token every 3 min 45 s
    expect(signInLimitedMessage(gate.retryAfterMs)).toMatch(/^Too many sign-in attempts from your network\. Wait about 4 minutes/);
    expect(signInAllowed(b, now + 10).allowed).toBe(true);
    expect(signInAllowed(a, now + 4 * 60_000).allowed).toBe(true);
  });
});
