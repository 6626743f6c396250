import { execFileSync } from "node:child_process";
import { createClient } from "@libsql/client";
import { expect, type Page } from "@playwright/test";
import { E2E } from "../../playwright.config";

export const PASSWORD = "ovenward-demo";
export const USERS = {
  admin: "admin@brightwater.example",
  manager: "manager@brightwater.example",
  engineer: "engineer@brightwater.example",
  technician: "tech@brightwater.example",
  viewer: "viewer@brightwater.example",
} as const;
export type RoleName = keyof typeof USERS;

/** Signs in through the form; with the demo password it waits for the fleet unless told the form should refuse. */
export async function signIn(page: Page, role: RoleName | string, password = PASSWORD, expectSuccess = password === PASSWORD) {
  const email = role in USERS ? USERS[role as RoleName] : role;
  await page.goto("/sign-in");
  await page.waitForLoadState("networkidle");
  await page.getByLabel("E-mail", { exact: true }).fill(email);
  await page.getByLabel("Password", { exact: true }).fill(password);
  await page.getByRole("button", { name: "Sign in", exact: true }).click();
  if (expectSuccess) await expect(page).toHaveURL(/\/fleet/);
}

/** The CLI operators use, run against the e2e database; the token is its last line. */
export function createTokenWithCli(email: string, name: string): string {
  const out = execFileSync(process.execPath, ["--import", "tsx", "--import", "./scripts/_shims/server-only.mjs", "scripts/token-create.mts", "--email", email, "--name", name], {
    env: { ...process.env, DATABASE_URL: E2E.databaseUrl },
    encoding: "utf8",
  });
  const lines = out.trim().split("\n");
  return lines[lines.length - 1].trim();
}

/** Messages the app's SMTP sink captured, read straight from the e2e database. */
export async function sinkMessagesTo(address: string) {
  const client = createClient({ url: E2E.databaseUrl });
  try {
    const rs = await client.execute({ sql: "select subject, text, html from sink_message where envelope_to like ? order by id desc", args: [`%${address}%`] });
    return rs.rows.map((r) => ({ subject: String(r.subject), text: String(r.text ?? ""), html: String(r.html ?? "") }));
  } finally {
    client.close();
  }
}

export async function waitForMail(address: string, subject: RegExp) {
  let found: { subject: string; text: string } | undefined;
  await expect
    .poll(async () => {
      found = (await sinkMessagesTo(address)).find((m) => subject.test(m.subject));
      return Boolean(found);
    }, { timeout: 15_000 })
    .toBe(true);
  return found!;
}

export function firstLink(text: string, pathPart: string): string {
  const m = new RegExp(`https?://\\S*${pathPart.replace(/[/?]/g, "\\$&")}\\S*`).exec(text);
  if (!m) throw new Error(`no link containing ${pathPart} in: ${text}`);
  return m[0].replace(/[)>\].,]+$/, "");
}
