import fs from "node:fs";
import { expect, test } from "@playwright/test";
import { createTokenWithCli, USERS } from "./support";

// The runs API over HTTP with bearer tokens, as loggers and scripts use it.
const tokens: Record<string, string> = {};
let ovenId = 0;
test.beforeAll(async ({ request }) => {
  for (const role of ["viewer", "technician", "engineer"] as const) tokens[role] = createTokenWithCli(USERS[role], `runs-${role}`);
  const res = await request.get("/api/v1/ovens", { headers: { authorization: `Bearer ${tokens.viewer}` } });
  ovenId = (await res.json()).items.find((o: { tag: string }) => o.tag === "L2-RF2").id;
});
const as = (role: string) => ({ authorization: `Bearer ${tokens[role]}` });
const file = (name: string) => ({ file: { name, mimeType: "text/csv", buffer: fs.readFileSync(`tests/fixtures/logger-files/${name}`) } });
const total = async (request: import("@playwright/test").APIRequestContext) =>
  (await (await request.get(`/api/v1/runs?ovenId=${ovenId}&pageSize=1`, { headers: as("viewer") })).json()).total as number;

test("a technician records a run: 201 with the contract's fields, and GET returns channels, conditions and window", async ({ request }) => {
  const res = await request.post(`/api/v1/ovens/${ovenId}/runs`, { headers: as("technician"), multipart: { ...file("generic-8ch.csv"), startState: "cold", conveyorSpeed: "82", setPoints: '{"Z1":120}', runAt: "2026-11-30T06:30:00Z", notes: "matrix" } });
  expect(res.status(), await res.text()).toBe(201);
  const body = await res.json();
  expect(Object.keys(body).sort()).toEqual(["board", "calibration", "id", "ovenId", "runAt", "verdict"]);
  expect(body).toMatchObject({ ovenId, runAt: "2026-11-30T06:30:00.000Z", calibration: { status: "none" } });
  const detail = await (await request.get(`/api/v1/runs/${body.id}`, { headers: as("viewer") })).json();
  expect(detail.channels).toHaveLength(8);
  expect(detail.conditions).toMatchObject({ startState: "cold", conveyorSpeed: 82, setPoints: { Z1: 120 }, notes: "matrix" });
  expect(detail.window.values.liquidus).toBe(217);
  const original = await request.get(`/api/v1/runs/${body.id}/file`, { headers: as("viewer") });
  expect(Buffer.from(await original.body()).equals(fs.readFileSync("tests/fixtures/logger-files/generic-8ch.csv"))).toBe(true);
});

test("a viewer cannot upload; a technician cannot edit windows", async ({ request }) => {
  const up = await request.post(`/api/v1/ovens/${ovenId}/runs`, { headers: as("viewer"), multipart: file("generic-8ch.csv") });
  expect(up.status()).toBe(403);
  const win = await request.post("/api/v1/windows", { headers: as("technician"), data: { name: "nope" } });
  expect(win.status()).toBe(403);
  expect((await win.json()).error.code).toBe("forbidden");
});

for (const name of ["bad-non-numeric.csv", "bad-time-not-increasing.csv"]) {
  test(`${name}: the analysis API's error, and no run stored`, async ({ request }) => {
    const before = await total(request);
    const analysis = await request.post("/api/v1/profiles/analyze", { headers: as("technician"), multipart: file(name) });
    const upload = await request.post(`/api/v1/ovens/${ovenId}/runs`, { headers: as("technician"), multipart: file(name) });
    expect(upload.status()).toBe(analysis.status());
    expect(upload.status()).toBe(400);
    expect(await upload.json()).toEqual(await analysis.json());
    expect(await total(request)).toBe(before);
  });
}

test("the CSV export neutralises formula cells", async ({ request }) => {
  const name = `=HYPERLINK("http://x.example","w${Date.now()}")`;
  const w = await request.post("/api/v1/windows", { headers: as("engineer"), data: { name, values: { liquidus: 217, peakMin: 235, peakMax: 245, talMin: 50, talMax: 70, soakStart: 150, soakEnd: 200, soakMin: 60, soakMax: 120, rampUpMax: 3, rampDownMax: 4, rampWindow: 10, heatUpFrom: 50, heatUpTo: 150, deltaTMax: 10, timeToPeakMax: 480 } } });
  expect(w.status(), await w.text()).toBe(201);
  const windowId = (await w.json()).id;
  expect((await request.post(`/api/v1/ovens/${ovenId}/runs`, { headers: as("technician"), multipart: { ...file("generic-8ch.csv"), windowId: String(windowId) } })).status()).toBe(201);
  const csv = await (await request.get(`/api/v1/runs/export.csv?windowId=${windowId}`, { headers: as("viewer") })).text();
  const line = csv.trim().split("\r\n")[1];
  expect(line).toContain(`"'=HYPERLINK(`);
  expect(line).not.toMatch(/(^|,)"?[=+\-@]/);
});
