import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { eq, sql } from "drizzle-orm";
import { actorFor, createTestDb } from "./test-db";
import { createRun } from "@/db/queries/run-create";
import { getRunDetail, rejudgeRun, deleteRun } from "@/db/queries/runs";
import { listRunsForExport } from "@/db/queries/run-list";
import { createWindow, updateWindow } from "@/db/queries/windows";
import { createCalibration, createInstrument } from "@/db/queries/instruments";
import { runChannels, runJudgements, runSamples, runs } from "@/db/schema/runs";
import { storedFiles } from "@/db/schema/files";
import { calibrations } from "@/db/schema/instruments";
import { testBoards } from "@/db/schema/windows";
import { changeAttachments, changes } from "@/db/schema/changes";
import { ovens } from "@/db/schema/fleet";
import { analyzeLoggerFile } from "@/lib/thermal/analyze";
import { ThermalFileError } from "@/lib/thermal/errors";
import { DEFAULT_WINDOW } from "@/lib/thermal/windows";
import { runListQuerySchema } from "@/lib/validation/runs";
import { runsCsv } from "@/lib/runs/csv";
import type { Actor } from "@/lib/actor";

// Uploaded files go to a folder of this test's own, so files on disk can be counted.
const uploads = fs.mkdtempSync(path.join(os.tmpdir(), "ovenward-uploads-"));
process.env.UPLOAD_DIR = uploads;

const FIXTURES = "tests/fixtures/logger-files";
const bytesOf = (name: string) => new Uint8Array(fs.readFileSync(path.join(FIXTURES, name)));
const file = (name: string) => ({ bytes: bytesOf(name), name, mediaType: "text/csv" });
const MAPPING = Object.fromEntries(Array.from({ length: 8 }, (_, i) => [`TC${i + 1} (°C)`, `P${i + 1}`]));

let t: Awaited<ReturnType<typeof createTestDb>>;
let engineer: Actor;
let technician: Actor;
let ovenId: number;
let boardId: number;

function filesOnDisk(): number {
  return fs.readdirSync(uploads, { recursive: true }).filter((f) => fs.statSync(path.join(uploads, String(f))).isFile()).length;
}

async function counts() {
  const n = async (table: typeof runs | typeof runChannels | typeof runSamples | typeof storedFiles) => (await t.db.select({ n: sql<number>`count(*)` }).from(table))[0].n;
  return { runs: await n(runs), channels: await n(runChannels), samples: await n(runSamples), files: await n(storedFiles), disk: filesOnDisk() };
}

beforeAll(async () => {
  t = await createTestDb();
  engineer = await actorFor(t.db, "engineer");
  technician = await actorFor(t.db, "technician");
  [{ id: ovenId }] = await t.db.select({ id: ovens.id }).from(ovens).where(eq(ovens.tag, "L1-RF1"));
  [{ id: boardId }] = await t.db.select({ id: testBoards.id }).from(testBoards).where(eq(testBoards.name, "TB-8 line test board"));
});
afterAll(() => {
  t.close();
  fs.rmSync(uploads, { recursive: true, force: true });
});

describe("recording a run applies the instrument's calibration and scan skew", () => {
  it("stores the metrics analyzeLoggerFile gives with the same skew and offsets, and records them", async () => {
    const logger = await createInstrument(t.db, { kind: "logger", name: "Skewed logger", serial: "T-SKEW-1", channelCount: 8, scanSkewSeconds: 0.1 }, engineer);
    await createCalibration(t.db, logger.id, { performedAt: new Date("2026-01-05"), performedBy: "lab", reference: "dry-well", offsets: { "1": 0.5, "3": -0.3 } }, engineer);
    const created = await createRun(t.db, ovenId, { instrumentId: logger.id, boardId, mapping: MAPPING, runAt: new Date("2026-03-01T08:00:00Z") }, file("generic-8ch.csv"), technician);
    const detail = (await getRunDetail(t.db, created.id))!;
    // A second, independent call of the analysis engine with the options the instrument implies.
    const expected = analyzeLoggerFile({ bytes: bytesOf("generic-8ch.csv") }, { window: DEFAULT_WINDOW, skewSeconds: 0.1, offsets: { TC1: 0.5, TC3: -0.3 } });
    expect(detail.run.calibrationStatus).toBe("valid");
    expect(detail.run.skewSeconds).toBe(0.1);
    expect(detail.run.offsetsApplied).toEqual({ TC1: 0.5, TC3: -0.3 });
    expect(detail.run.deltaTPeak).toBeCloseTo(expected.board.deltaTPeak, 9);
    expect(detail.run.criticalSpread).toBeCloseTo(expected.board.criticalSpread!, 9);
    expect(detail.run.verdictStatus).toBe(expected.verdict.status);
    expect(detail.channels.map((c) => c.peak)).toEqual(expected.channels.map((c) => c.peak));
    expect(detail.channels.map((c) => c.probeLabel)).toEqual(["P1", "P2", "P3", "P4", "P5", "P6", "P7", "P8"]);
  });

  it("adds the offset to the raw column (hand check: TC1's largest cell + 0.5 °C, no skew)", async () => {
    const logger = await createInstrument(t.db, { kind: "logger", name: "Plain logger", serial: "T-PLAIN-1", channelCount: 8, scanSkewSeconds: 0 }, engineer);
    await createCalibration(t.db, logger.id, { performedAt: new Date("2026-01-05"), performedBy: "lab", reference: "dry-well", offsets: { "1": 0.5 } }, engineer);
    const created = await createRun(t.db, ovenId, { instrumentId: logger.id, boardId, mapping: MAPPING, runAt: new Date("2026-03-01T09:00:00Z") }, file("generic-8ch.csv"), technician);
    const detail = (await getRunDetail(t.db, created.id))!;
    // Read the CSV by hand: the largest value in the TC1 column (second field of each data row).
    const rows = fs.readFileSync(path.join(FIXTURES, "generic-8ch.csv"), "utf8").trim().split("\n").slice(1);
    const rawMax = Math.max(...rows.map((r) => Number(r.split(",")[1])));
    expect(detail.channels[0].peak).toBeCloseTo(rawMax + 0.5, 9);
  });

  it("flags a run made after the calibration fell due, and does not apply its offsets", async () => {
    const logger = await createInstrument(t.db, { kind: "logger", name: "Lapsed logger", serial: "T-LAPSED-1", channelCount: 8, scanSkewSeconds: 0 }, engineer);
    await createCalibration(t.db, logger.id, { performedAt: new Date("2025-01-05"), performedBy: "lab", reference: "dry-well", offsets: { "1": 0.5 }, dueAt: new Date("2026-01-05") }, engineer);
    const created = await createRun(t.db, ovenId, { instrumentId: logger.id, boardId, mapping: MAPPING, runAt: new Date("2026-01-20T08:00:00Z") }, file("generic-8ch.csv"), technician);
    const detail = (await getRunDetail(t.db, created.id))!;
    expect(detail.run.calibrationStatus).toBe("lapsed");
    expect(detail.run.offsetsApplied).toEqual({});
    const flagged = await listRunsForExport(t.db, runListQuerySchema.parse({ instrumentId: String(logger.id), calibration: "lapsed" }));
    expect(flagged.map((r) => r.id)).toEqual([created.id]);
  });

  it("remembers the mapping: the second file from the same instrument and board needs none", async () => {
    const logger = await createInstrument(t.db, { kind: "logger", name: "Mapping logger", serial: "T-MAP-1", channelCount: 8, scanSkewSeconds: 0 }, engineer);
    const reversed = Object.fromEntries(Array.from({ length: 8 }, (_, i) => [`TC${i + 1}`, `P${8 - i}`]));
    await createRun(t.db, ovenId, { instrumentId: logger.id, boardId, mapping: reversed }, file("generic-8ch.csv"), technician);
    const second = await createRun(t.db, ovenId, { instrumentId: logger.id, boardId }, file("generic-8ch.csv"), technician);
    expect(second.prepared.mapping.source).toBe("remembered");
    const detail = (await getRunDetail(t.db, second.id))!;
    expect(detail.channels.map((c) => c.probeLabel)).toEqual(["P8", "P7", "P6", "P5", "P4", "P3", "P2", "P1"]);
  });
});

describe("bad files", () => {
  for (const name of ["bad-non-numeric.csv", "bad-time-not-increasing.csv"]) {
    it(`${name}: answered with the analysis error, and nothing is stored`, async () => {
      const before = await counts();
      let analysisError: ThermalFileError | undefined;
      try {
        analyzeLoggerFile({ bytes: bytesOf(name) });
      } catch (err) {
        analysisError = err as ThermalFileError;
      }
      expect(analysisError).toBeInstanceOf(ThermalFileError);
      const err = await createRun(t.db, ovenId, {}, file(name), technician).catch((e) => e);
      expect(err).toBeInstanceOf(ThermalFileError);
      expect({ code: err.code, status: err.status, message: err.message, details: err.details }).toEqual({
        code: analysisError!.code, status: analysisError!.status, message: analysisError!.message, details: analysisError!.details,
      });
      expect(await counts()).toEqual(before);
    });
  }
});

describe("re-judging", () => {
  it("keeps the original verdict and adds one against the window's new version", async () => {
    const w = await createWindow(t.db, { name: "Rejudge window", values: DEFAULT_WINDOW }, engineer);
    const created = await createRun(t.db, ovenId, { windowId: w.id, boardId, mapping: MAPPING }, file("generic-8ch.csv"), technician);
    const original = (await getRunDetail(t.db, created.id))!.run;
    expect(original.windowVersion).toBe(1);
    // Tighten ΔT far below the run's own ΔT: the new version must fail it.
    const tighter = await updateWindow(t.db, w.id, { values: { ...DEFAULT_WINDOW, deltaTMax: original.deltaTPeak / 2 } }, engineer);
    expect(tighter.version).toBe(2);
    const result = await rejudgeRun(t.db, created.id, undefined, engineer);
    expect(result.judgement.window.version).toBe(2);
    expect(result.judgement.verdict.status).toBe("fail");
    // deltaT use = ΔT ÷ (ΔT/2) × 100 = 200 % (one-sided, BRIEF §4); the stored curves are Float32,
    // so ΔT re-computed from them differs from the file's by well under 0.001 °C.
    expect(result.judgement.verdict.items.deltaT).toBeCloseTo(200, 1);
    const after = (await getRunDetail(t.db, created.id))!;
    expect(after.run.verdictStatus).toBe(original.verdictStatus);
    expect(after.run.windowVersion).toBe(1);
    expect(after.run.windowValues).toEqual(DEFAULT_WINDOW);
    expect(after.judgements).toHaveLength(1);
    // Re-judging from the stored Float32 curves gives the same board metrics as the file did.
    expect(result.judgement.board.deltaTPeak).toBeCloseTo(original.deltaTPeak, 3);
    expect((await t.db.select().from(runJudgements).where(eq(runJudgements.runId, created.id))).length).toBe(1);
  });
});

describe("deleting", () => {
  it("soft-deletes, and keeps the file until no run refers to it", async () => {
    const text = fs.readFileSync(path.join(FIXTURES, "generic-8ch.csv"), "utf8") + "\n";
    const f = { bytes: new TextEncoder().encode(text), name: "copy.csv", mediaType: "text/csv" };
    const a = await createRun(t.db, ovenId, { boardId, mapping: MAPPING }, f, technician);
    const b = await createRun(t.db, ovenId, { boardId, mapping: MAPPING }, f, technician);
    expect(a.fileSha256).toBe(b.fileSha256);
    const onDisk = path.join(uploads, a.fileSha256.slice(0, 2), a.fileSha256);
    expect((await deleteRun(t.db, a.id, engineer)).fileRemoved).toBe(false);
    expect(fs.existsSync(onDisk)).toBe(true);
    expect(await getRunDetail(t.db, a.id)).toBeNull();
    expect((await t.db.select().from(runs).where(eq(runs.id, a.id)))[0].deletedAt).not.toBeNull();
    expect((await deleteRun(t.db, b.id, engineer)).fileRemoved).toBe(true);
    expect(fs.existsSync(onDisk)).toBe(false);
  });

  it("keeps the bytes while anything else (here a change's attachment) refers to the same hash", async () => {
    const text = fs.readFileSync(path.join(FIXTURES, "generic-8ch.csv"), "utf8") + "\n\n";
    const run = await createRun(t.db, ovenId, { boardId, mapping: MAPPING }, { bytes: new TextEncoder().encode(text), name: "shared.csv", mediaType: "text/csv" }, technician);
    const [change] = await t.db.select({ id: changes.id }).from(changes).limit(1);
    await t.db.insert(changeAttachments).values({ changeId: change.id, sha256: run.fileSha256, fileName: "shared.csv", contentType: "text/csv", sizeBytes: text.length });
    expect((await deleteRun(t.db, run.id, engineer)).fileRemoved).toBe(false);
    expect(fs.existsSync(path.join(uploads, run.fileSha256.slice(0, 2), run.fileSha256))).toBe(true);
  });
});

describe("CSV export", () => {
  it("neutralises cells that begin with =, +, - or @ (OWASP CSV injection guidance)", async () => {
    const evil = await createWindow(t.db, { name: "=HYPERLINK(\"http://x.example\",\"go\")", values: DEFAULT_WINDOW }, engineer);
    const logger = await createInstrument(t.db, { kind: "logger", name: "@SUM(A1:A9)", serial: "T-CSV-1", channelCount: 8, scanSkewSeconds: 0 }, engineer);
    await createRun(t.db, ovenId, { windowId: evil.id, instrumentId: logger.id, boardId, mapping: MAPPING }, file("generic-8ch.csv"), technician);
    const csv = runsCsv(await listRunsForExport(t.db, runListQuerySchema.parse({ windowId: String(evil.id) })));
    const [, line] = csv.trim().split("\r\n");
    expect(line).toContain(`"'=HYPERLINK(""http://x.example"",""go"")"`);
    expect(line).toContain(",'@SUM(A1:A9),");
    expect(line).not.toMatch(/,[=+\-@]/);
  });
});

describe("calibration certificates", () => {
  // Magic bytes per the PNG spec (89 50 4E 47 0D 0A 1A 0A), PDF 1.7 §7.5.2 ("%PDF-"), JPEG SOI + marker (FF D8 FF).
  const PNG = new Uint8Array([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0, 0, 0, 13]);
  const PDF = new TextEncoder().encode("%PDF-1.4\n%%EOF\n");
  const input = { performedAt: new Date("2026-02-01"), performedBy: "lab", reference: "dry-well", offsets: {} };
  it("accepts PDF and PNG by their bytes, stores them by hash, and defaults the due date to a year later", async () => {
    const logger = await createInstrument(t.db, { kind: "logger", name: "Cert logger", serial: "T-CERT-1", channelCount: 8, scanSkewSeconds: 0 }, engineer);
    const a = await createCalibration(t.db, logger.id, input, engineer, { bytes: PNG });
    const b = await createCalibration(t.db, logger.id, { ...input, performedAt: new Date("2026-03-01") }, engineer, { bytes: PDF });
    expect(a.certificateSha256).toMatch(/^[0-9a-f]{64}$/);
    expect(fs.existsSync(path.join(uploads, a.certificateSha256!.slice(0, 2), a.certificateSha256!))).toBe(true);
    expect((await t.db.select().from(storedFiles).where(eq(storedFiles.sha256, b.certificateSha256!)))[0].mediaType).toBe("application/pdf");
    // 2026 is not a leap year: 1 Feb 2026 + 365 days = 1 Feb 2027.
    expect(a.dueAt.toISOString().slice(0, 10)).toBe("2027-02-01");
  });
  it("refuses a certificate that is not a PDF, PNG or JPEG (even if named .pdf), and one over 10 MB", async () => {
    const logger = await createInstrument(t.db, { kind: "logger", name: "Cert logger 2", serial: "T-CERT-2", channelCount: 8, scanSkewSeconds: 0 }, engineer);
    const fake = await createCalibration(t.db, logger.id, input, engineer, { bytes: new TextEncoder().encode("<html>not a pdf</html>") }).catch((e) => e);
    expect(fake).toMatchObject({ code: "unsupported_file", status: 415 });
    const big = new Uint8Array(10 * 1024 * 1024 + 1);
    big.set(PDF);
    expect(await createCalibration(t.db, logger.id, input, engineer, { bytes: big }).catch((e) => e)).toMatchObject({ code: "file_too_large", status: 413 });
    expect(await t.db.$count(calibrations, eq(calibrations.instrumentId, logger.id))).toBe(0);
  });
});
