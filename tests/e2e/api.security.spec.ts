import { expect, test, type APIResponse } from "@playwright/test";
import { E2E } from "../../playwright.config";
import { PASSWORD, signIn, USERS } from "./support";

// Security basics of every response: a content security policy that forbids framing, plugins,
// foreign forms and base URLs, no content sniffing, a session cookie that scripts cannot read,
// and sign-in attempts limited per client address.

/** "default-src 'self'; frame-ancestors 'none'" → { "default-src": ["'self'"], … } */
function csp(res: APIResponse | { headers(): Record<string, string> }): Record<string, string[]> {
  const header = res.headers()["content-security-policy"] ?? "";
  return Object.fromEntries(
    header.split(";").map((d) => d.trim().split(/\s+/)).filter((d) => d[0]).map(([name, ...values]) => [name.toLowerCase(), values]),
  );
}

function expectStrictPolicy(policy: Record<string, string[]>, where: string) {
  expect(policy["default-src"], where).toEqual(["'self'"]);
  expect(policy["frame-ancestors"], where).toEqual(["'none'"]);
  expect(policy["object-src"], where).toEqual(["'none'"]);
  expect(policy["base-uri"], where).toEqual(["'self'"]);
  expect(policy["form-action"], where).toEqual(["'self'"]);
  expect(policy["connect-src"], where).toEqual(["'self'"]);
  // The production build needs no eval, and no directive opens the page to other hosts.
  expect(policy["script-src"], where).not.toContain("'unsafe-eval'");
  for (const [name, values] of Object.entries(policy)) {
    for (const v of values) expect(v, `${where}: ${name} ${v}`).toMatch(/^('self'|'none'|'unsafe-inline'|data:|blob:)$/);
  }
}

test("pages and API answers carry the security headers", async ({ request }) => {
  for (const path of ["/sign-in", "/api/health", "/api/v1/me", "/api/v1/ovens/not-a-number", "/favicon.svg"]) {
    const res = await request.get(path);
    const h = res.headers();
    expectStrictPolicy(csp(res), path);
    expect(h["x-content-type-options"], path).toBe("nosniff");
    expect(h["x-frame-options"], path).toBe("DENY");
    expect(h["referrer-policy"], path).toBe("strict-origin-when-cross-origin");
    expect(h["x-powered-by"], path).toBeUndefined();
  }
});

test("the session cookie is httpOnly, SameSite=Lax, and not Secure on this http server; signed-in pages carry the policy", async ({ browser, baseURL }) => {
  const context = await browser.newContext();
  const page = await context.newPage();
  await signIn(page, "viewer");
  const cookies = await context.cookies(baseURL);
  const session = cookies.find((c) => c.name.endsWith("authjs.session-token"));
  expect(session, JSON.stringify(cookies.map((c) => c.name))).toBeTruthy();
  expect(session!.httpOnly).toBe(true);
  expect(session!.sameSite).toBe("Lax");
  // Secure (with the __Secure- prefix) when AUTH_URL is https: tests/integration/auth-endpoints.test.ts.
  expect(new URL(baseURL!).protocol).toBe("http:");
  expect(session!.secure).toBe(false);
  expect(await page.evaluate(() => document.cookie)).not.toContain("session-token");
  const fleet = await page.goto("/fleet");
  expectStrictPolicy(csp(fleet!), "/fleet (signed in)");
  await context.close();
});

test("a client-supplied role or user id changes nothing", async ({ request }) => {
  // The role comes from the token's user, never from the request.
  const res = await request.get("/api/v1/me", { headers: { "x-role": "admin", authorization: "Bearer ow_forged" } });
  expect(res.status()).toBe(401);
});

test("failed sign-ins from one address are limited, through the library's endpoint and the form", async ({ playwright, browser, baseURL }) => {
  const from = (address: string) => playwright.request.newContext({ baseURL, extraHTTPHeaders: { "x-forwarded-for": address } });
  const attempt = async (ctx: Awaited<ReturnType<typeof from>>, email: string, password: string) => {
    const { csrfToken } = await (await ctx.get("/api/auth/csrf")).json();
    const res = await ctx.post("/api/auth/callback/credentials", { form: { email, password, csrfToken, callbackUrl: "/fleet" }, maxRedirects: 0 });
    return res.headers()["location"] ?? "";
  };
  const noisy = await from("198.51.100.77");
  for (let i = 0; i < E2E.signInRateLimit; i++) expect(await attempt(noisy, `nobody${i}@brightwater.example`, "guess")).toMatch(/code=credentials/);
  const refused = await attempt(noisy, USERS.viewer, PASSWORD);
  expect(refused).toMatch(/\/sign-in\?.*code=rate_limited/);
  expect(await (await noisy.get(refused)).text()).toContain("Too many sign-in attempts from your network");
  // The sign-in form from that address says so too, before checking anything.
  const context = await browser.newContext({ extraHTTPHeaders: { "x-forwarded-for": "198.51.100.77" } });
  const page = await context.newPage();
  await signIn(page, "viewer", PASSWORD, false);
  await expect(page.getByText(/Too many sign-in attempts from your network\. Wait about \d+ (seconds|minutes?)/)).toBeVisible();
  await context.close();
  // Another address signs in as usual.
  const quiet = await from("198.51.100.78");
  expect(await attempt(quiet, USERS.viewer, PASSWORD)).toMatch(/\/fleet$/);
  await noisy.dispose();
  await quiet.dispose();
});
