import { expect, test } from "@playwright/test";
import { createTokenWithCli, firstLink, signIn, USERS, waitForMail } from "./support";

test.describe.configure({ mode: "serial" });

test("every demo user signs in with the demo password and sees their role", async ({ page }) => {
  for (const [role, email] of Object.entries(USERS)) {
    await signIn(page, email);
    await expect(page).toHaveURL(/\/fleet$/);
    await expect(page.getByRole("heading", { name: "Fleet", level: 1 })).toBeVisible();
    await expect(page.locator("aside")).toContainText(role === "technician" ? "Technician" : role[0].toUpperCase() + role.slice(1));
    await page.locator("aside").getByRole("button", { name: "Sign out" }).click();
    await expect(page).toHaveURL(/\/sign-in/);
  }
});

test("a wrong password is refused with a clear message", async ({ page }) => {
  await signIn(page, USERS.viewer, "not-the-password");
  await expect(page.getByText("That e-mail and password do not match an active account")).toBeVisible();
  await expect(page).toHaveURL(/\/sign-in/);
});

test("a magic link arrives through the SMTP sink and signs the user in", async ({ page }) => {
  await page.goto("/sign-in");
  await page.waitForLoadState("networkidle");
  await page.getByLabel("E-mail for a sign-in link").fill(USERS.technician);
  await page.getByRole("button", { name: "E-mail me a sign-in link" }).click();
  await expect(page.getByRole("heading", { name: "Check your e-mail" })).toBeVisible();
  const mail = await waitForMail(USERS.technician, /sign-in link/);
  const link = firstLink(mail.text, "/api/auth/callback/nodemailer");
  await page.goto(link);
  await expect(page).toHaveURL(/\/fleet$/);
  await expect(page.locator("aside")).toContainText("Tomás Kelly");
});

test("an unknown address gets the same answer and no mail", async ({ page }) => {
  await page.goto("/sign-in");
  await page.waitForLoadState("networkidle");
  await page.getByLabel("E-mail for a sign-in link").fill("stranger@elsewhere.example");
  await page.getByRole("button", { name: "E-mail me a sign-in link" }).click();
  await expect(page.getByRole("heading", { name: "Check your e-mail" })).toBeVisible();
});

test("admin invites a technician, who sets a password; repeated failures then lock the account", async ({ page, browser }) => {
  const email = `new.tech.${Date.now()}@brightwater.example`;
  await signIn(page, "admin");
  await page.goto("/settings/people");
  await page.getByLabel("E-mail", { exact: true }).fill(email);
  await page.getByLabel("Name").fill("Niamh New");
  await page.getByRole("combobox", { name: "Role", exact: true }).selectOption("technician");
  await page.getByRole("button", { name: "Send invitation" }).click();
  await expect(page.getByText(`Invitation sent to ${email}`)).toBeVisible();

  const invite = await waitForMail(email, /Ovenward account/);
  const fresh = await browser.newContext();
  const p2 = await fresh.newPage();
  await p2.goto(firstLink(invite.text, "/invite/"));
  await p2.waitForLoadState("networkidle"); // filled before hydration, the form posts natively and loses the values
  await p2.getByLabel("New password").fill("short");
  await p2.getByLabel("The same password again").fill("short");
  await p2.getByRole("button", { name: "Set password" }).click();
  await expect(p2.getByText("at least 10 characters")).toBeVisible();
  await p2.waitForLoadState("networkidle");
  await p2.getByLabel("New password").fill("brand-new-password");
  await p2.getByLabel("The same password again").fill("brand-new-password");
  await p2.getByRole("button", { name: "Set password" }).click();
  await expect(p2).toHaveURL(/\/sign-in/);
  await signIn(p2, email, "brand-new-password", true);
  await p2.locator("aside").getByRole("button", { name: "Sign out" }).click();

  for (let i = 0; i < 5; i++) await signIn(p2, email, "wrong-password-" + i);
  await expect(p2.getByText("Too many failed sign-ins for this account")).toBeVisible();
  // Even the right password is refused while the account is locked.
  await signIn(p2, email, "brand-new-password");
  await expect(p2.getByText(/It is locked for about \d+ more minute/)).toBeVisible();
  await expect(p2).toHaveURL(/\/sign-in/);
  await fresh.close();
});

test("a token from the CLI works until an admin revokes it, then gets 401", async ({ page, request }) => {
  const token = createTokenWithCli(USERS.technician, "revoke-me");
  const ok = await request.get("/api/v1/me", { headers: { authorization: `Bearer ${token}` } });
  expect(ok.status()).toBe(200);
  await signIn(page, "admin");
  await page.goto("/settings/tokens");
  await page.getByRole("button", { name: "Revoke revoke-me" }).first().click();
  await expect(page.locator("li", { hasText: "revoke-me" }).getByText(/^Revoked/)).toBeVisible();
  const after = await request.get("/api/v1/me", { headers: { authorization: `Bearer ${token}` } });
  expect(after.status()).toBe(401);
  expect((await after.json()).error.code).toBe("unauthorized");
});

test("a technician's session cannot add an oven through the API, and cannot open admin pages", async ({ page }) => {
  await signIn(page, "technician");
  await expect(page).toHaveURL(/\/fleet$/);
  const status = await page.evaluate(async () => {
    const res = await fetch("/api/v1/ovens", { method: "POST", headers: { "content-type": "application/json" }, body: JSON.stringify({ tag: "T-SESSION", name: "x", lineId: 1, kind: "convection" }) });
    return res.status;
  });
  expect(status).toBe(403);
  await page.goto("/settings/people");
  await expect(page.getByRole("heading", { name: "Your role cannot open that page" })).toBeVisible();
  await page.goto("/ovens/new");
  await expect(page.getByRole("heading", { name: "Your role cannot open that page" })).toBeVisible();
});
