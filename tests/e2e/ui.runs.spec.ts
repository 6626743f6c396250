import AxeBuilder from "@axe-core/playwright";
import { expect, test, type Page } from "@playwright/test";
import { signIn } from "./support";

// A technician records runs from the oven page: the first file from a logger is mapped once; the
// second needs no mapping. Laptop and phone widths (two projects), each with a board of its own
// so each starts with a logger and board that have never been mapped.
const FILE = "tests/fixtures/logger-files/generic-8ch.csv";
const BOARD: Record<string, string> = { laptop: "TB-8 line test board", phone: "LC-8 lab coupon" };

async function shot(page: Page, name: string, project: string) {
  await page.screenshot({ path: `test-results/screenshots/${project}-runs-${name}.png`, fullPage: true });
}

async function axe(page: Page) {
  const result = await new AxeBuilder({ page }).withTags(["wcag2a", "wcag2aa", "wcag21a", "wcag21aa"]).analyze();
  const serious = result.violations.filter((v) => v.impact === "serious" || v.impact === "critical");
  expect(serious.map((v) => `${v.id}: ${v.help} (${v.nodes.map((n) => n.target.join(" ")).join(", ")})`)).toEqual([]);
}

async function openWizard(page: Page) {
  await page.goto("/fleet");
  await page.locator("main a", { hasText: "L1-RF1" }).first().click();
  await expect(page).toHaveURL(/\/ovens\/\d+\/health$/);
  await page.getByRole("navigation", { name: "Oven sections" }).getByRole("link", { name: "Runs" }).click();
  // The address changes when the runs page has arrived; on a busy two-core machine that took over 10 s.
  await expect(page).toHaveURL(/\/ovens\/\d+\/runs$/, { timeout: 30_000 });
  await page.getByRole("link", { name: "Record a run" }).click();
  await expect(page.getByRole("heading", { name: /Record a verification run on L1-RF1/ })).toBeVisible();
  await page.waitForLoadState("networkidle");
}

async function chooseAndUpload(page: Page, board: string) {
  await page.getByLabel("Test board").selectOption({ label: board });
  await page.getByLabel("Logger", { exact: true }).selectOption({ label: "Logger LG-3 (BW-LG-0630)" });
  await page.locator("#logger-file").setInputFiles(FILE);
  await expect(page.getByText("Column → probe position")).toBeVisible({ timeout: 20_000 });
}

async function expectRunPage(page: Page) {
  await expect(page).toHaveURL(/\/runs\/\d+$/, { timeout: 20_000 });
  await expect(page.getByRole("heading", { name: /L1-RF1 run/ })).toBeVisible();
  await expect(page.getByText(/uses \d+ % of SAC305/)).toBeVisible();
  await expect(page.locator("svg.recharts-surface").first()).toBeVisible();
  await expect(page.getByRole("img", { name: /Board map of/ })).toBeVisible();
  await expect(page.getByRole("heading", { name: "Per probe" })).toBeVisible();
  await expect(page.getByText("Calibration valid").first()).toBeVisible();
}

test("a technician uploads a logger file, maps it once, and the second file needs no mapping", async ({ page }, info) => {
  const board = BOARD[info.project.name] ?? BOARD.laptop;
  await signIn(page, "technician");
  await openWizard(page);

  // First file: the columns are proposed in board order, and Save waits for a confirmation.
  await chooseAndUpload(page, board);
  await expect(page.getByText(/matched to the board's probe positions in order/)).toBeVisible();
  const save = page.getByRole("button", { name: "Save run" });
  await expect(save).toBeDisabled();
  await expect(page.getByText(/Confirm the column mapping/)).toBeVisible();
  await page.getByLabel("These columns are mapped to the right probe positions.").check();
  await expect(save).toBeEnabled();
  // A mistake is said next to the mapping, and Save waits until it is put right.
  await page.getByLabel("TC2 (°C)").selectOption("P3");
  await expect(page.getByRole("alert").filter({ hasText: "P3 is given to both TC2 and TC3" })).toBeVisible();
  await expect(save).toBeDisabled();
  await page.getByLabel("TC2 (°C)").selectOption("P2");
  await page.getByText("Cold start").click();
  await page.getByLabel("Zone set points (°C)").fill("Z1=120, Z2=150, Z3=165");
  await expect(page.getByText(/In window|Near the edge|Out of window/).first()).toBeVisible();
  await expect(save).toBeEnabled();
  await shot(page, "wizard-first", info.project.name);
  await save.click();
  await expectRunPage(page);
  await expect(page.getByText("Cold start")).toBeVisible();
  await axe(page);
  await shot(page, "run-page", info.project.name);

  // Second file from the same logger and board: the remembered mapping is used as it is.
  await openWizard(page);
  await chooseAndUpload(page, board);
  await expect(page.getByText(/were mapped to this board before/)).toBeVisible();
  await expect(page.getByRole("button", { name: "Save run" })).toBeEnabled();
  await shot(page, "wizard-second", info.project.name);
  await page.getByRole("button", { name: "Save run" }).click();
  await expectRunPage(page);
});

test("a viewer sees runs but cannot record one; the list filters and sorts on the server", async ({ page }, info) => {
  const phone = info.project.name === "phone";
  await signIn(page, "viewer");
  await page.goto("/runs");
  await expect(page.getByRole("heading", { name: "Verification runs" })).toBeVisible();
  await page.waitForLoadState("networkidle");
  // Laptop: a table with sortable headers. Phone: one card per run and a sort menu.
  const rows = phone ? page.getByRole("list", { name: "Runs" }).locator("li") : page.locator("main table tbody tr");
  await expect(rows).toHaveCount(25);
  const filters = page.getByRole("form", { name: "Filter runs" });
  await filters.getByLabel("Oven").selectOption({ label: "LAB-B1" });
  await filters.getByLabel("Verdict").selectOption({ label: "Out of window" });
  await expect(page.getByText(/^\d+ runs · page 1 of \d+$/)).toBeVisible();
  await expect(rows.first()).toContainText(phone ? "LAB-B1" : "LAB-B1");
  if (phone) await page.getByLabel("Sort by").selectOption({ label: "Largest ΔT first" });
  else await page.getByRole("button", { name: /ΔT °C/ }).click();
  // The server sorts: wait until the page shown is in order of ΔT, largest first.
  const deltaTs = async () => {
    const texts = phone ? await rows.allInnerTexts() : await page.locator("main table tbody tr td:nth-child(5)").allInnerTexts();
    return texts.map((t) => Number((phone ? /ΔT ([\d.]+)/.exec(t)?.[1] : t) ?? NaN));
  };
  await expect.poll(async () => { const v = await deltaTs(); return v.length > 1 && v.every((x, i) => i === 0 || x <= v[i - 1]); }, { timeout: 10_000 }).toBe(true);
  expect((await deltaTs())[0]).toBeGreaterThan(30);
  await shot(page, "fleet-list", info.project.name);
  const res = await page.request.get("/api/v1/ovens");
  const oven = (await res.json()).items.find((o: { tag: string }) => o.tag === "L1-RF1");
  await page.goto(`/ovens/${oven.id}/runs/new`);
  await expect(page.getByRole("heading", { name: "Your role cannot open that page" })).toBeVisible();
});

test("an engineer makes a window from a preset, edits it into version 2, and sees instruments and setup", async ({ page }, info) => {
  await signIn(page, "engineer");
  await page.goto("/windows");
  await expect(page.getByRole("link", { name: "SAC305 — Brightwater standard" })).toBeVisible();
  await page.getByRole("link", { name: "New window" }).click();
  await page.waitForLoadState("networkidle");
  const name = `Sn63Pb37 trial ${info.project.name} ${Date.now().toString(36)}`;
  await page.getByLabel("Start from preset").selectOption({ label: "Sn63Pb37 paste, typical window" });
  await expect(page.getByLabel("Liquidus (°C)")).toHaveValue("183");
  await page.getByLabel("Name").fill(name);
  await page.getByLabel("Peak, highest (°C)").fill("200");
  await page.getByRole("button", { name: "Create window" }).click();
  // Said beside the field: the highest peak must exceed the lowest.
  await expect(page.getByText(/peakMax \(200 °C\) must be greater than peakMin \(220 °C\)/)).toBeVisible();
  await page.getByLabel("Peak, highest (°C)").fill("235");
  await page.getByRole("button", { name: "Create window" }).click();
  await expect(page).toHaveURL(/\/windows\/\d+$/);
  await expect(page.getByText(/^Version 1/)).toBeVisible();
  await page.waitForLoadState("networkidle");
  await page.getByLabel("ΔT at peak, most (°C)").fill("8");
  await page.getByRole("button", { name: "Save as a new version" }).click();
  await expect(page.getByText(/Saved as version 2/)).toBeVisible();
  await shot(page, "window-edit", info.project.name);
  await page.goto("/instruments");
  await expect(page.getByText("Calibration due within 30 days")).toBeVisible();
  await shot(page, "instruments", info.project.name);
  await page.goto("/windows/boards");
  await expect(page.getByRole("img", { name: /Outline of TB-8 line test board/ })).toBeVisible();
  await shot(page, "boards", info.project.name);
  const res = await page.request.get("/api/v1/ovens");
  const oven = (await res.json()).items.find((o: { tag: string }) => o.tag === "LAB-B1");
  await page.goto(`/ovens/${oven.id}/setup`);
  await expect(page.getByLabel("Default process window")).toBeVisible();
  await shot(page, "setup", info.project.name);
});
