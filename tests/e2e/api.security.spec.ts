import { expect, test } from "@playwright/test";
import { PASSWORD, USERS } from "./support";

// Security basics of every response: a content security policy that forbids framing, no
// content sniffing, and a session cookie that scripts cannot read.
test("pages and API answers carry the security headers", async ({ request }) => {
  for (const path of ["/sign-in", "/api/health", "/api/v1/me"]) {
    const res = await request.get(path);
    const h = res.headers();
    expect(h["content-security-policy"], path).toContain("frame-ancestors 'none'");
    expect(h["content-security-policy"], path).toContain("default-src 'self'");
    expect(h["x-content-type-options"], path).toBe("nosniff");
    expect(h["x-frame-options"], path).toBe("DENY");
    expect(h["x-powered-by"], path).toBeUndefined();
  }
});

test("the session cookie is httpOnly and SameSite=Lax", async ({ browser, baseURL }) => {
  const context = await browser.newContext();
  const page = await context.newPage();
  await page.goto("/sign-in");
  await page.waitForLoadState("networkidle");
  await page.getByLabel("E-mail", { exact: true }).fill(USERS.viewer);
  await page.getByLabel("Password", { exact: true }).fill(PASSWORD);
  await page.getByRole("button", { name: "Sign in", exact: true }).click();
  await expect(page).toHaveURL(/\/fleet/);
  const cookies = await context.cookies(baseURL);
  const session = cookies.find((c) => c.name.endsWith("authjs.session-token"));
  expect(session, JSON.stringify(cookies.map((c) => c.name))).toBeTruthy();
  expect(session!.httpOnly).toBe(true);
  expect(session!.sameSite).toBe("Lax");
  expect(await page.evaluate(() => document.cookie)).not.toContain("session-token");
  await context.close();
});

test("a client-supplied role or user id changes nothing", async ({ request }) => {
  // The role comes from the token's user, never from the request.
  const res = await request.get("/api/v1/me", { headers: { "x-role": "admin", authorization: "Bearer ow_forged" } });
  expect(res.status()).toBe(401);
});
