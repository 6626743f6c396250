/**
 * Benchmark of the runs path on the server, against a real libSQL file:
 *  - upload + analysis + save: reading the multipart request, analysing a 7-minute 8-probe
 *    1 Hz logger file with skew and calibration offsets, writing the file and every row;
 *  - the runs list (first page, and a filtered page sorted by ΔT) for an oven with 1 000 runs.
 *   npm run bench:runs
 * Targets: upload median < 150 ms; list median < 50 ms.
 */
import fs from "node:fs";
import os from "node:os";
import path from "node:path";

const dir = fs.mkdtempSync(path.join(os.tmpdir(), "ovenward-bench-runs-"));
process.env.UPLOAD_DIR = path.join(dir, "uploads");

const { openDatabase } = await import("@/db/client");
const { migrateDatabase } = await import("@/db/migrate");
const { createRun, insertRun } = await import("@/db/queries/run-create");
const { listRuns } = await import("@/db/queries/run-list");
const { createCalibration, createInstrument } = await import("@/db/queries/instruments");
const { createBoard } = await import("@/db/queries/boards");
const { ovens, lines, sites } = await import("@/db/schema/fleet");
const { users } = await import("@/db/schema/users");
const { readRunUpload } = await import("@/lib/runs/upload-request");
const { runListQuerySchema } = await import("@/lib/validation/runs");
const { analyzeWithSeries } = await import("@/lib/thermal/analyze");
const { DEFAULT_WINDOW } = await import("@/lib/thermal/windows");
const { runToCsv, simulateReflowRun } = await import("@/lib/thermal/synthetic-profile");

const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[xs.length >> 1];
const p95 = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length * 0.95)];

const { db, client } = await openDatabase(`file:${path.join(dir, "bench.db")}`);
await migrateDatabase(db);
const [site] = await db.insert(sites).values({ name: "Bench", timeZone: "Europe/Dublin" }).returning();
const [line] = await db.insert(lines).values({ siteId: site.id, name: "Bench line" }).returning();
const [oven] = await db.insert(ovens).values({ tag: "BENCH-1", name: "Bench oven", lineId: line.id, kind: "convection", zones: 8 }).returning();
const [listOven] = await db.insert(ovens).values({ tag: "BENCH-2", name: "Bench oven with 1000 runs", lineId: line.id, kind: "convection", zones: 8 }).returning();
const [user] = await db.insert(users).values({ email: "bench@brightwater.example", name: "Bench", role: "technician" }).returning();
const actor = { kind: "session" as const, userId: user.id, tokenId: null, email: user.email, name: user.name, role: "technician" as const };
const probes = Array.from({ length: 8 }, (_, i) => ({ label: `P${i + 1}`, x: 10 + i * 15, y: 20 + (i % 3) * 20, sitsOn: "bench" }));
const board = await createBoard(db, { name: "Bench board", widthMm: 160, heightMm: 100, probes }, actor);
const logger = await createInstrument(db, { kind: "logger", name: "Bench logger", serial: "B-1", channelCount: 8, scanSkewSeconds: 0.05 }, actor);
await createCalibration(db, logger.id, { performedAt: new Date(Date.now() - 30 * 86_400_000), performedBy: "bench", reference: "bench", offsets: { "1": 0.2, "4": -0.1 } }, actor);
const mapping = JSON.stringify(Object.fromEntries(probes.map((p, i) => [`TC${i + 1}`, p.label])));

function uploadRequest(seed: number): Request {
  const csv = runToCsv(simulateReflowRun({ probes: 8, sampleHz: 1, durationSeconds: 420, seed }));
  const form = new FormData();
  form.set("file", new File([csv], `run-${seed}.csv`, { type: "text/csv" }));
  form.set("boardId", String(board.id));
  form.set("instrumentId", String(logger.id));
  form.set("mapping", mapping);
  form.set("startState", "hot");
  return new Request("http://bench/api/v1/ovens/1/runs", { method: "POST", body: form });
}

// Upload + analysis + save, each with a different file (so every save writes new bytes).
const upload: number[] = [];
for (let i = 0; i < 40; i++) {
  const req = uploadRequest(1000 + i);
  const start = performance.now();
  const { input, file } = await readRunUpload(req);
  await createRun(db, oven.id, input, file, actor);
  if (i >= 5) upload.push(performance.now() - start);
}

// An oven with 1 000 runs, inserted directly (as the seed does).
const { result, series } = analyzeWithSeries({ text: runToCsv(simulateReflowRun({ probes: 8, sampleHz: 1, durationSeconds: 420, seed: 7 })) }, { window: DEFAULT_WINDOW });
const labels = Object.fromEntries(probes.map((p, i) => [`TC${i + 1}`, p.label]));
await db.transaction(async (tx) => {
  for (let i = 0; i < 1000; i++) {
    const jittered = { ...result, board: { ...result.board, deltaTPeak: result.board.deltaTPeak + (i % 17) * 0.1 }, verdict: { ...result.verdict, status: (["pass", "marginal", "fail"] as const)[i % 3] } };
    await insertRun(tx, { ovenId: listOven.id, runAt: new Date(Date.UTC(2025, 0, 1) + i * 86_400_000), windowValues: DEFAULT_WINDOW, calibrationStatus: "valid", instrumentId: logger.id, boardId: board.id }, jittered, series, labels);
  }
});
const time = async (q: Record<string, string>) => {
  const query = runListQuerySchema.parse(q);
  const out: number[] = [];
  for (let i = 0; i < 60; i++) {
    const start = performance.now();
    const page = await listRuns(db, query);
    if (i >= 10) out.push(performance.now() - start);
    if (page.total === 0) throw new Error("empty list");
  }
  return out;
};
const listFirst = await time({ ovenId: String(listOven.id) });
const listFiltered = await time({ ovenId: String(listOven.id), verdict: "fail", from: "2025-06-01", to: "2026-06-01", sort: "-deltaTPeak", page: "3" });

client.close();
fs.rmSync(dir, { recursive: true, force: true });
const row = (label: string, xs: number[], target: number) =>
  console.log(`${label.padEnd(58)} median ${median(xs).toFixed(1).padStart(6)} ms   p95 ${p95(xs).toFixed(1).padStart(6)} ms   target < ${target} ms  ${median(xs) < target ? "ok" : "MISSED"}`);
console.log("Ovenward runs benchmark (server time, libSQL file, this machine)");
row("upload + analysis + save, 7 min 8 probes 1 Hz (35 runs)", upload, 150);
row("runs list, oven with 1 000 runs, first page of 25", listFirst, 50);
row("runs list, 1 000 runs, verdict + dates, by ΔT, page 3", listFiltered, 50);
