import { and, eq, sql } from "drizzle-orm";
import type { Db } from "../client";
import { ovens } from "../schema/fleet";
import { users } from "../schema/users";
import { storedFiles } from "../schema/files";
import { calibrations, columnMappings, instruments } from "../schema/instruments";
import { runs } from "../schema/runs";
import { processWindows, processWindowVersions, testBoards } from "../schema/windows";
import { insertRun } from "../queries/run-create";
import { computeMetrics } from "@/lib/thermal/metrics";
import { judge } from "@/lib/thermal/verdict";
import { findWindowPreset, type ProcessWindow } from "@/lib/thermal/windows";
import { seededRandom } from "@/lib/thermal/synthetic-profile";
import type { AnalysisResult } from "@/lib/thermal/types";
import { storeContent } from "@/lib/storage/blob-store";
import { DEMO_BOARDS, DEMO_CALIBRATIONS, DEMO_INSTRUMENTS, HISTORY_DAYS } from "./demo-story";
import { OVEN_STORIES, modelFor, type OvenStory } from "./run-stories";
import { simulateRun } from "./run-model";

const DAY = 86_400_000;
export const WINDOWS = [
  // The plant's own limit on the critical-phase spread (13 °C) lets drift tracking project towards it.
  { name: "SAC305 — Brightwater standard", presetId: "sac305-typical", overrides: { criticalSpreadMax: 13 } },
  { name: "Sn63Pb37 — legacy builds", presetId: "sn63pb37-typical" },
];

type Ids = { windowId: number; windowVersion: number; window: ProcessWindow; boards: Map<string, number>; instruments: Map<string, number> };

async function seedReference(db: Db, start: number): Promise<Ids> {
  return db.transaction(async (tx) => {
    const windowIds: number[] = [];
    for (const w of WINDOWS) {
      let [row] = await tx.select().from(processWindows).where(eq(processWindows.name, w.name)).limit(1);
      if (!row) {
        const values = { ...findWindowPreset(w.presetId)!.window, ...("overrides" in w ? w.overrides : {}) };
        [row] = await tx.insert(processWindows).values({ name: w.name, presetId: w.presetId, values, version: 1 }).returning();
        await tx.insert(processWindowVersions).values({ windowId: row.id, version: 1, values });
      }
      windowIds.push(row.id);
    }
    const [sac] = await tx.select().from(processWindows).where(eq(processWindows.id, windowIds[0]));
    const boards = new Map<string, number>();
    for (const b of DEMO_BOARDS) {
      let [row] = await tx.select({ id: testBoards.id }).from(testBoards).where(eq(testBoards.name, b.name)).limit(1);
      if (!row) [row] = await tx.insert(testBoards).values(b).returning({ id: testBoards.id });
      boards.set(b.name, row.id);
    }
    const ids = new Map<string, number>();
    for (const i of DEMO_INSTRUMENTS) {
      let [row] = await tx.select({ id: instruments.id }).from(instruments).where(and(eq(instruments.kind, i.kind), eq(instruments.serial, i.serial))).limit(1);
      if (!row) [row] = await tx.insert(instruments).values(i).returning({ id: instruments.id });
      ids.set(i.serial, row.id);
    }
    for (const c of DEMO_CALIBRATIONS) {
      const instrumentId = ids.get(c.serial)!;
      const performedAt = new Date(start + c.atDay * DAY + 9 * 3_600_000);
      const [found] = await tx.select({ id: calibrations.id }).from(calibrations).where(and(eq(calibrations.instrumentId, instrumentId), eq(calibrations.performedAt, performedAt))).limit(1);
      if (found) continue;
      let certificateSha256: string | null = null;
      if (c.serial === "BW-LG-0630") {
        // The newest calibration comes with its certificate, so the download can be tried on the demo.
        const bytes = new TextEncoder().encode(certificatePdf(`Kestrel Metrology - certificate KM-${performedAt.toISOString().slice(0, 10)} - ${c.serial}`));
        const written = await storeContent(bytes);
        certificateSha256 = written.sha256;
        await tx.insert(storedFiles).values({ sha256: certificateSha256, size: bytes.length, mediaType: "application/pdf", path: written.path }).onConflictDoNothing();
      }
      await tx.insert(calibrations).values({
        certificateSha256,
        instrumentId, performedAt, performedBy: "Kestrel Metrology Ltd", reference: "Fluke 9142 dry-well, reference PRT cert. KM-2231",
        offsets: c.offsets, expandedUncertainty: c.u, dueAt: new Date(performedAt.getTime() + c.dueDays * DAY),
      });
    }
    // The loggers in daily use have long had their columns mapped to the board's probe positions.
    const mapping = Object.fromEntries(Array.from({ length: 8 }, (_, i) => [`TC${i + 1}`, `P${i + 1}`]));
    for (const [serial, board] of [["BW-LG-0417", DEMO_BOARDS[0].name], ["BW-LG-0522", DEMO_BOARDS[0].name], ["BW-LG-0522", DEMO_BOARDS[1].name]]) {
      await tx.insert(columnMappings).values({ instrumentId: ids.get(serial)!, boardId: boards.get(board)!, mapping }).onConflictDoNothing();
    }
    return { windowId: sac.id, windowVersion: sac.version, window: sac.values, boards, instruments: ids };
  });
}

/** A one-page PDF with a line of text (enough for a demo certificate). */
function certificatePdf(line: string): string {
  const content = `BT /F1 14 Tf 60 780 Td (${line.replace(/[()\\]/g, "")}) Tj ET`;
  return [
    "%PDF-1.4", "1 0 obj<</Type/Catalog/Pages 2 0 R>>endobj", "2 0 obj<</Type/Pages/Kids[3 0 R]/Count 1>>endobj",
    "3 0 obj<</Type/Page/Parent 2 0 R/MediaBox[0 0 595 842]/Contents 4 0 R/Resources<</Font<</F1 5 0 R>>>>>>endobj",
    `4 0 obj<</Length ${content.length}>>stream`, content, "endstream endobj", "5 0 obj<</Type/Font/Subtype/Type1/BaseFont/Helvetica>>endobj",
    "trailer<</Root 1 0 R>>", "%%EOF", "",
  ].join("\n");
}

/** A simulated run's metrics and verdict, as the analysis of its logger file gives them (1 Hz, °C). */
export function analyseSimulated(sim: { time: Float64Array; channels: Float64Array[] }, window: ProcessWindow, meta: { durationSeconds: number; skewSeconds: number; offsets: Record<string, number> }) {
  const channels = sim.channels.map((values, i) => ({ name: `TC${i + 1}`, values }));
  const metrics = computeMetrics({ time: sim.time, channels }, window);
  const analysis: AnalysisResult = {
    channels: metrics.channels, board: metrics.board, verdict: judge(metrics.board, window),
    meta: { rows: sim.time.length, channels: channels.length, durationSeconds: meta.durationSeconds, sampleInterval: 1, units: "C", warnings: metrics.warnings, skewSeconds: meta.skewSeconds, offsets: meta.offsets },
  };
  return { analysis, channels };
}

function toCsv(time: Float64Array, channels: Float64Array[]): string {
  const lines = [["Time (s)", ...channels.map((_, i) => `TC${i + 1} (°C)`)].join(",")];
  for (let k = 0; k < time.length; k++) lines.push([String(time[k]), ...channels.map((c) => c[k].toFixed(1))].join(","));
  return lines.join("\n") + "\n";
}

function offsetsAt(serial: string, start: number, at: number): { status: "valid" | "lapsed" | "none"; offsets: Record<string, number>; atDay: number | null } {
  const day = (at - start) / DAY;
  const cal = DEMO_CALIBRATIONS.filter((c) => c.serial === serial && c.atDay + 9 / 24 <= day).sort((a, b) => b.atDay - a.atDay)[0];
  if (!cal) return { status: "none", offsets: {}, atDay: null };
  const valid = day <= cal.atDay + 9 / 24 + cal.dueDays;
  const byColumn = Object.fromEntries(Object.entries(cal.offsets).map(([ch, v]) => [`TC${ch}`, v]));
  return { status: valid ? "valid" : "lapsed", offsets: valid ? byColumn : {}, atDay: cal.atDay };
}

async function seedOvenRuns(db: Db, story: OvenStory, ovenId: number, ids: Ids, start: number, userIds: Map<string, string>) {
  const random = seededRandom(story.seed);
  const days = story.cadence === "daily" ? Array.from({ length: HISTORY_DAYS }, (_, d) => d) : Array.from({ length: Math.floor(HISTORY_DAYS / 7) }, (_, w) => w * 7 + 6);
  const instrumentId = ids.instruments.get(story.loggerSerial)!;
  const boardId = ids.boards.get(story.board)!;
  const calIds = new Map<number, number>();
  for (const c of await db.select().from(calibrations).where(eq(calibrations.instrumentId, instrumentId))) calIds.set(Math.round((c.performedAt.getTime() - 9 * 3_600_000 - start) / DAY), c.id);
  const labels = Object.fromEntries(Array.from({ length: 8 }, (_, i) => [`TC${i + 1}`, `P${i + 1}`]));
  await db.transaction(async (tx) => {
    for (let n = 0; n < days.length; n++) {
      const day = days[n];
      const runAt = new Date(start + day * DAY + story.minuteOfDay * 60_000 + Math.floor(random() * 20) * 60_000);
      const { model, startState } = modelFor(story, day, n, runAt, random);
      const sim = simulateRun(model);
      const cal = offsetsAt(story.loggerSerial, start, runAt.getTime());
      const { analysis, channels } = analyseSimulated(sim, ids.window, { durationSeconds: model.durationSeconds, skewSeconds: story.skew, offsets: cal.offsets });
      // The newest run of each oven keeps its logger file, so the download can be tried on the demo.
      let fileSha256: string | null = null;
      if (n === days.length - 1) {
        const bytes = new TextEncoder().encode(toCsv(sim.time, sim.channels));
        const written = await storeContent(bytes);
        fileSha256 = written.sha256;
        await tx.insert(storedFiles).values({ sha256: fileSha256, size: bytes.length, mediaType: "text/csv", path: written.path }).onConflictDoNothing();
      }
      await insertRun(
        tx,
        {
          ovenId, runAt, windowId: ids.windowId, windowVersion: ids.windowVersion, windowValues: ids.window, boardId, instrumentId,
          calibrationId: cal.atDay === null ? null : (calIds.get(cal.atDay) ?? null), calibrationStatus: cal.status, fileSha256,
          fileName: fileSha256 ? `${story.tag}-${runAt.toISOString().slice(0, 10)}.csv` : null, startState,
          conveyorSpeed: story.cadence === "daily" ? 80 : null, setPoints: story.setPoints, operator: story.operator,
          notes: null, createdBy: userIds.get(story.operatorEmail) ?? null, createdAt: runAt,
        },
        analysis,
        { time: sim.time, channels },
        labels,
      );
    }
  });
  return days.length;
}

/**
 * Eighteen months of verification runs for the demo plant, ending on the day of `now`.
 * Idempotent: reference rows are looked up by natural key, and an oven that already has runs is
 * left alone. Deterministic: every run comes from a seeded generator.
 */
export async function seedRuns(db: Db, { now }: { now: Date }) {
  const end = Math.floor(now.getTime() / DAY) * DAY;
  const start = end - HISTORY_DAYS * DAY;
  const ids = await seedReference(db, start);
  const userIds = new Map((await db.select({ id: users.id, email: users.email }).from(users)).map((u) => [u.email, u.id]));
  let created = 0;
  for (const story of OVEN_STORIES) {
    const [oven] = await db.select().from(ovens).where(eq(ovens.tag, story.tag)).limit(1);
    if (!oven) continue;
    if (oven.defaultWindowId === null || oven.defaultBoardId === null) {
      await db.update(ovens).set({ defaultWindowId: oven.defaultWindowId ?? ids.windowId, defaultBoardId: oven.defaultBoardId ?? ids.boards.get(story.board)! }).where(eq(ovens.id, oven.id));
    }
    const [{ n }] = await db.select({ n: sql<number>`count(*)` }).from(runs).where(eq(runs.ovenId, oven.id));
    if (Number(n) > 0) continue;
    created += await seedOvenRuns(db, story, oven.id, ids, start, userIds);
  }
  return { runs: created };
}
