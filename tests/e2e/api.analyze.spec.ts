import { execFileSync } from "node:child_process";
import fs from "node:fs";
import { expect, test } from "@playwright/test";
import { createTokenWithCli, USERS } from "./support";

// The stateless analysis API: the same numbers as the engineers' CLI, and a 4xx JSON error,
// never a 500, for every kind of bad file.
let token = "";
test.beforeAll(() => {
  token = createTokenWithCli(USERS.viewer, "analyze-viewer");
});
const FIXTURE = "tests/fixtures/logger-files/generic-8ch.csv";
const auth = () => ({ authorization: `Bearer ${token}` });
const upload = (name: string, content: string | Buffer, extra: Record<string, string> = {}) => ({
  file: { name, mimeType: "text/csv", buffer: Buffer.isBuffer(content) ? content : Buffer.from(content) },
  ...extra,
});

test("the endpoint and the CLI return the same figures", async ({ request }) => {
  const res = await request.post("/api/v1/profiles/analyze", { headers: auth(), multipart: upload("run.csv", fs.readFileSync(FIXTURE), { skewSeconds: "0.05" }) });
  expect(res.status()).toBe(200);
  const api = await res.json();
  const cli = JSON.parse(
    execFileSync(process.execPath, ["--import", "tsx", "--import", "./scripts/_shims/server-only.mjs", "scripts/analyze.mts", FIXTURE, "--skew", "0.05", "--json"], { encoding: "utf8" }),
  );
  expect(api.board).toEqual(cli.board);
  expect(api.channels).toEqual(cli.channels);
  expect(api.verdict).toEqual(cli.verdict);
  expect(api.meta.rows).toBe(cli.meta.rows);
  expect(api.channels).toHaveLength(8);
  expect(["pass", "marginal", "fail"]).toContain(api.verdict.status);
});

const rows = (n: number) => ["time,TC1,TC2", ...Array.from({ length: n }, (_, i) => `${i},${25 + i},${25 + i}`)].join("\n");

const BAD: { name: string; body: string | Buffer; status: number; code: string; details?: Record<string, unknown> }[] = [
  { name: "empty file", body: "", status: 400, code: "invalid_file" },
  { name: "no probe columns", body: "time,notes\n" + Array.from({ length: 20 }, (_, i) => `${i},ok`).join("\n"), status: 400, code: "invalid_file" },
  { name: "a non-numeric cell", body: rows(20).replace("\n5,30,30", "\n5,30,abc"), status: 400, code: "invalid_file", details: { row: 7, column: "TC2" } },
  { name: "time that does not increase", body: rows(20).replace("\n5,30,30", "\n3,30,30"), status: 400, code: "invalid_file", details: { row: 7 } },
  { name: "fewer than 10 rows", body: rows(5), status: 400, code: "invalid_file" },
  { name: "binary content", body: Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0, 0, 0, 0x0d, 0x49, 0x48, 0x44, 0x52]), status: 415, code: "unsupported_file" },
];

for (const bad of BAD) {
  test(`a bad file (${bad.name}) is answered ${bad.status} ${bad.code}`, async ({ request }) => {
    const res = await request.post("/api/v1/profiles/analyze", { headers: auth(), multipart: upload("bad.csv", bad.body) });
    expect(res.status(), await res.text()).toBe(bad.status);
    const body = await res.json();
    expect(body.error.code).toBe(bad.code);
    expect(body.error.message.length).toBeGreaterThan(10);
    if (bad.details) expect(body.error.details).toMatchObject(bad.details);
  });
}

test("an oversized upload is 413, a missing file and a bad option are 400 naming the field", async ({ request }) => {
  const big = Buffer.alloc(21 * 1024 * 1024, "1");
  const tooBig = await request.post("/api/v1/profiles/analyze", { headers: auth(), multipart: upload("big.csv", big) });
  expect(tooBig.status()).toBe(413);
  expect((await tooBig.json()).error.code).toBe("file_too_large");

  const noFile = await request.post("/api/v1/profiles/analyze", { headers: auth(), multipart: { skewSeconds: "0.1" } });
  expect(noFile.status()).toBe(400);
  expect((await noFile.json()).error.details.fields.file).toBeTruthy();

  const badOpt = await request.post("/api/v1/profiles/analyze", { headers: auth(), multipart: upload("run.csv", fs.readFileSync(FIXTURE), { thermocouple: "Q" }) });
  expect(badOpt.status()).toBe(400);
  const err = (await badOpt.json()).error;
  expect(err.code).toBe("invalid_input");
  expect(Object.keys(err.details.fields)).toEqual(["thermocouple"]);

  const json = await request.post("/api/v1/profiles/analyze", { headers: auth(), data: { file: "x" } });
  expect(json.status()).toBe(415);
});

test("a logger file over 10 MB (inside the 20 MB limit) is read whole", async ({ request }) => {
  // 0.05 s sampling of eight probes through a 25 → 245 → 60 °C profile, about 12 MB.
  const n = 170_000;
  const lines = ["time;TC1;TC2;TC3;TC4;TC5;TC6;TC7;TC8"];
  for (let i = 0; i < n; i++) {
    const t = i * 0.05;
    const base = t < 5000 ? 25 + (220 * t) / 5000 : 245 - (185 * (t - 5000)) / 3500;
    lines.push([t.toFixed(2), ...Array.from({ length: 8 }, (_, c) => (base - c * 0.5).toFixed(3))].join(";"));
  }
  const body = Buffer.from(lines.join("\n"));
  expect(body.length).toBeGreaterThan(11 * 1024 * 1024);
  const res = await request.post("/api/v1/profiles/analyze", { headers: auth(), multipart: upload("long.csv", body) });
  expect(res.status(), (await res.text()).slice(0, 300)).toBe(200);
  const out = await res.json();
  expect(out.meta.rows).toBe(n);
  expect(out.board.peakMax).toBeCloseTo(245, 1);
  expect(out.board.deltaTPeak).toBeCloseTo(3.5, 3);
});

test("without a token or session the endpoint answers 401", async ({ request }) => {
  const res = await request.post("/api/v1/profiles/analyze", { multipart: upload("run.csv", fs.readFileSync(FIXTURE)) });
  expect(res.status()).toBe(401);
});
