import AxeBuilder from "@axe-core/playwright";
import { expect, test, type Page } from "@playwright/test";
import { firstLink, signIn, sinkMessagesTo, USERS } from "./support";

// E-mail as people meet it: each template in Chromium, the outbox, the settings, and the
// unsubscribe link from a captured message. Screenshots land in test-results/screenshots/.
const TEMPLATES = ["fleet-digest", "my-work", "my-work-empty", "drift-alert", "calibration-due", "overdue-work", "magic-link", "invitation"];

async function shot(page: Page, name: string, project: string) {
  await page.screenshot({ path: `test-results/screenshots/${project}-mail-${name}.png`, fullPage: true });
}

async function axe(page: Page) {
  const result = await new AxeBuilder({ page }).withTags(["wcag2a", "wcag2aa"]).analyze();
  const serious = result.violations.filter((v) => v.impact === "serious" || v.impact === "critical");
  expect(serious.map((v) => `${v.id}: ${v.help} (${v.nodes.map((n) => n.target.join(" ")).join(", ")})`)).toEqual([]);
}

test("every template renders, with a plain-text part that carries its links", async ({ page }, info) => {
  await signIn(page, "admin");
  for (const t of TEMPLATES) {
    const res = await page.goto(`/dev/mail/preview/${t}`);
    expect(res?.status(), t).toBe(200);
    await expect(page.getByRole("link").first()).toBeVisible();
    await shot(page, `template-${t}`, info.project.name);
    const text = await (await page.request.get(`/dev/mail/preview/${t}?format=text`)).text();
    expect(text, t).toMatch(/^▲ Ovenward/);
    expect(text, t).not.toMatch(/<[a-z]/i);
  }
});

test("the demo's subscriptions produced messages in the outbox; an admin can resend one", async ({ page }, info) => {
  await signIn(page, "admin");
  await page.goto("/settings/outbox");
  await page.waitForLoadState("networkidle");
  const rows = page.getByTestId("outbox-row");
  await expect(rows.filter({ hasText: /Fleet digest, week of/ })).toHaveCount(1);
  await expect(rows.filter({ hasText: /My work for/ }).first()).toBeVisible();
  await expect(rows.filter({ hasText: "Sent" }).first()).toBeVisible();
  await axe(page);
  await shot(page, "outbox", info.project.name);
  const digest = rows.filter({ hasText: /Fleet digest, week of/ });
  await digest.getByRole("button", { name: /Resend/ }).click();
  await expect(page.getByText("Queued again; the next tick sends it.")).toBeVisible();
});

test("a technician chooses weekdays and a time, and sees the rule it makes", async ({ page }, info) => {
  // Each project (laptop, phone) sets its own days and time, so the test holds on a second run.
  const phone = info.project.name === "phone";
  const want = phone ? ["TU", "TH"] : ["MO", "WE", "FR"];
  const time = phone ? "06:20" : "06:15";
  await signIn(page, "technician");
  await page.goto("/settings/notifications");
  await page.waitForLoadState("networkidle");
  const card = page.locator("form").filter({ hasText: "My work, each morning" });
  const rule = card.getByLabel("The recurrence rule this makes");
  await expect(rule).toContainText("RRULE:FREQ=");
  for (const [code, label] of [["MO", "Mon"], ["TU", "Tue"], ["WE", "Wed"], ["TH", "Thu"], ["FR", "Fri"], ["SA", "Sat"], ["SU", "Sun"]]) {
    const checked = await card.locator(`input[name="day_${code}"]`).isChecked();
    if (checked !== want.includes(code)) await card.getByText(label, { exact: true }).click();
  }
  await card.getByLabel("At", { exact: true }).fill(time);
  await expect(rule).toContainText(`DTSTART;TZID=Europe/Dublin:20240101T${time.replace(":", "")}00`);
  await expect(rule).toContainText(`RRULE:FREQ=WEEKLY;BYDAY=${want.join(",")}`);
  const enabled = card.locator('input[name="enabled"]');
  if (!(await enabled.isChecked())) await enabled.check();
  await card.getByRole("button", { name: "Save" }).click();
  await expect(page.getByText("Saved. The next one follows this schedule.")).toBeVisible();
  await page.reload();
  await expect(page.locator("form").filter({ hasText: "My work, each morning" }).getByText(/Next: /)).toContainText(`${time} GMT`);
  await axe(page);
  await shot(page, "notifications-technician", info.project.name);
});

test("a manager manages a team member's e-mails", async ({ page }, info) => {
  await signIn(page, "manager");
  await page.goto("/settings/notifications");
  await page.getByRole("link", { name: "Tomás Kelly" }).click();
  await expect(page.getByRole("heading", { name: "E-mail settings" })).toBeVisible();
  await expect(page.getByText(/E-mails for Tomás Kelly \(Technician\)/)).toBeVisible();
  await shot(page, "notifications-manager-team", info.project.name);
});

test("the unsubscribe link in a captured message stops it, without signing in", async ({ page }, info) => {
  // Laptop stops the manager's digest, phone the technician's morning list (one kind each).
  const [who, prefix, label] = info.project.name === "phone" ? [USERS.technician, "My work", "My work, each morning"] : [USERS.manager, "Fleet digest", "Weekly fleet digest"];
  let text = "";
  let html = "";
  await expect
    .poll(async () => {
      const m = (await sinkMessagesTo(who)).find((x) => x.subject.startsWith(prefix));
      text = m?.text ?? "";
      html = m?.html ?? "";
      return Boolean(m);
    }, { timeout: 20_000 })
    .toBe(true);
  // The captured HTML, as a mail client would show it.
  await page.setContent(html);
  await shot(page, `captured-${prefix.replace(" ", "-").toLowerCase()}`, info.project.name);
  await page.goto(firstLink(text, "/unsubscribe?token="));
  await expect(page.getByRole("heading", { name: `Stop “${label}”?` })).toBeVisible();
  await shot(page, "unsubscribe-confirm", info.project.name);
  await page.getByRole("button", { name: "Stop this e-mail" }).click();
  await expect(page.getByRole("heading", { name: `Done — no more “${label}”` })).toBeVisible();
  await shot(page, "unsubscribe-done", info.project.name);
  // A tampered link is refused with a sentence, not an error page.
  await page.goto("/unsubscribe?token=abc.def");
  await expect(page.getByRole("heading", { name: "This link does not work" })).toBeVisible();
});
