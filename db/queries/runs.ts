import "server-only";
import { recomputeOven } from "./drift";
import { refreshHealth } from "./health";
import { and, asc, desc, eq, isNotNull, isNull } from "drizzle-orm";
import type { Db, DbOrTx } from "../client";
import { ovens } from "../schema/fleet";
import { storedFiles } from "../schema/files";
import { calibrations, instruments } from "../schema/instruments";
import { runChannels, runJudgements, runSamples, runs, type RunChannelRow, type RunJudgementRow, type RunRow } from "../schema/runs";
import { processWindows, testBoards } from "../schema/windows";
import { recordAudit } from "./audit";
import { contentStillReferenced } from "./stored-files";
import { getWindow } from "./windows";
import type { Actor } from "@/lib/actor";
import { notFound } from "@/lib/errors";
import { unpackSamples } from "@/lib/runs/samples-codec";
import { blobStore } from "@/lib/storage/blob-store";
import { computeMetrics } from "@/lib/thermal/metrics";
import { judge } from "@/lib/thermal/verdict";
import { DEFAULT_WINDOW } from "@/lib/thermal/windows";
import type { BoardMetrics, Verdict } from "@/lib/thermal/types";

export function boardOf(r: Pick<RunRow, keyof BoardMetrics & keyof RunRow>): BoardMetrics {
  return {
    peakMin: r.peakMin, peakMax: r.peakMax, deltaTPeak: r.deltaTPeak, criticalSpread: r.criticalSpread, heatUpRate: r.heatUpRate,
    rampUpMax: r.rampUpMax, rampDownMax: r.rampDownMax, soakTimeMin: r.soakTimeMin, soakTimeMax: r.soakTimeMax,
    talMin: r.talMin, talMax: r.talMax, timeToPeakMax: r.timeToPeakMax,
  };
}
export function verdictOf(r: Pick<RunRow, "verdictStatus" | "windowUse" | "verdictItems">): Verdict {
  return { status: r.verdictStatus, windowUse: r.windowUse, items: r.verdictItems };
}

export async function getRunDetail(db: DbOrTx, id: number) {
  const [row] = await db
    .select({ run: runs, oven: { id: ovens.id, tag: ovens.tag, name: ovens.name }, windowName: processWindows.name, currentWindowVersion: processWindows.version, board: testBoards, instrument: instruments, calibration: calibrations })
    .from(runs)
    .innerJoin(ovens, eq(ovens.id, runs.ovenId))
    .leftJoin(processWindows, eq(processWindows.id, runs.windowId))
    .leftJoin(testBoards, eq(testBoards.id, runs.boardId))
    .leftJoin(instruments, eq(instruments.id, runs.instrumentId))
    .leftJoin(calibrations, eq(calibrations.id, runs.calibrationId))
    .where(and(eq(runs.id, id), isNull(runs.deletedAt)))
    .limit(1);
  if (!row) return null;
  const channels = await db.select().from(runChannels).where(eq(runChannels.runId, id)).orderBy(asc(runChannels.position));
  const judgements = await db.select().from(runJudgements).where(eq(runJudgements.runId, id)).orderBy(desc(runJudgements.id));
  return { ...row, channels, judgements };
}
export type RunDetail = NonNullable<Awaited<ReturnType<typeof getRunDetail>>>;

export async function getRunSeries(db: DbOrTx, runId: number) {
  const [s] = await db.select().from(runSamples).where(eq(runSamples.runId, runId)).limit(1);
  return s ? unpackSamples(s) : null;
}

function channelJson(c: RunChannelRow) {
  return { name: c.column, probe: c.probeLabel, peak: c.peak, timeAtPeak: c.timeAtPeak, tal: c.tal, heatUpRate: c.heatUpRate, rampUpMax: c.rampUpMax, rampDownMax: c.rampDownMax, soakTime: c.soakTime, timeToPeak: c.timeToPeak };
}

function judgementJson(j: RunJudgementRow) {
  return { id: j.id, window: { id: j.windowId, version: j.windowVersion, values: j.windowValues }, board: boardOf(j), verdict: verdictOf(j), createdAt: j.createdAt.toISOString() };
}

/** The upload answer of the API contract: id, ovenId, runAt, board, verdict, calibration. */
export function runSummaryJson(r: RunRow) {
  return { id: r.id, ovenId: r.ovenId, runAt: r.runAt.toISOString(), board: boardOf(r), verdict: verdictOf(r), calibration: { status: r.calibrationStatus } };
}

export function runDetailJson(d: RunDetail) {
  const r = d.run;
  return {
    ...runSummaryJson(r),
    oven: d.oven,
    channels: d.channels.map(channelJson),
    conditions: { startState: r.startState, conveyorSpeed: r.conveyorSpeed, setPoints: r.setPoints, operator: r.operator, notes: r.notes },
    window: { id: r.windowId, name: d.windowName, version: r.windowVersion, currentVersion: d.currentWindowVersion, values: r.windowValues },
    testBoard: d.board ? { id: d.board.id, name: d.board.name } : null,
    instrument: d.instrument ? { id: d.instrument.id, name: d.instrument.name, serial: d.instrument.serial, scanSkewSeconds: d.instrument.scanSkewSeconds } : null,
    calibration: { status: r.calibrationStatus, id: r.calibrationId, dueAt: d.calibration?.dueAt.toISOString() ?? null, skewSeconds: r.skewSeconds, offsetsApplied: r.offsetsApplied },
    meta: { rows: r.rows, durationSeconds: r.durationSeconds, sampleInterval: r.sampleInterval, units: r.units, warnings: r.warnings },
    file: r.fileSha256 ? { sha256: r.fileSha256, name: r.fileName } : null,
    judgements: d.judgements.map(judgementJson),
  };
}
export type RunDetailJson = ReturnType<typeof runDetailJson>;

/**
 * Judges a run again, from its stored curves, against a window (its own window's current
 * version unless another is named). The run's original verdict is kept; this adds a judgement.
 */
export async function rejudgeRun(db: Db, runId: number, windowId: number | undefined, actor: Actor) {
  const detail = await getRunDetail(db, runId);
  if (!detail) throw notFound("That run");
  const targetId = windowId ?? detail.run.windowId;
  const windowRow = targetId ? await getWindow(db, targetId) : null;
  if (targetId && !windowRow) throw notFound("That process window");
  const values = windowRow?.values ?? DEFAULT_WINDOW;
  const series = await getRunSeries(db, runId);
  if (!series) throw notFound("The stored curves of that run");
  const metrics = computeMetrics({ time: series.time, channels: detail.channels.map((c, i) => ({ name: c.column, values: series.channels[i] })) }, values);
  const verdict = judge(metrics.board, values);
  return db.transaction(async (tx) => {
    const b = metrics.board;
    const [j] = await tx
      .insert(runJudgements)
      .values({
        runId, windowId: windowRow?.id ?? null, windowVersion: windowRow?.version ?? null, windowValues: values,
        peakMin: b.peakMin, peakMax: b.peakMax, deltaTPeak: b.deltaTPeak, criticalSpread: b.criticalSpread, heatUpRate: b.heatUpRate,
        rampUpMax: b.rampUpMax, rampDownMax: b.rampDownMax, soakTimeMin: b.soakTimeMin, soakTimeMax: b.soakTimeMax, talMin: b.talMin, talMax: b.talMax,
        timeToPeakMax: b.timeToPeakMax, verdictStatus: verdict.status, windowUse: verdict.windowUse, verdictItems: verdict.items, createdBy: actor.userId,
      })
      .returning();
    await recordAudit(tx, { actor, action: "run.rejudge", entity: "run", entityId: runId, after: { judgementId: j.id, verdict: verdict.status, windowId: j.windowId, windowVersion: j.windowVersion } });
    return { original: { window: { id: detail.run.windowId, version: detail.run.windowVersion }, verdict: verdictOf(detail.run) }, judgement: judgementJson(j) };
  });
}

/** Soft-deletes a run (audited). Its file's bytes go only when no remaining run refers to them. */
export async function deleteRun(db: Db, runId: number, actor: Actor) {
  const [before] = await db.select().from(runs).where(and(eq(runs.id, runId), isNull(runs.deletedAt))).limit(1);
  if (!before) throw notFound("That run");
  const purge = await db.transaction(async (tx) => {
    await tx.update(runs).set({ deletedAt: new Date() }).where(eq(runs.id, runId));
    await recordAudit(tx, { actor, action: "run.delete", entity: "run", entityId: runId, before: { ovenId: before.ovenId, runAt: before.runAt, verdict: before.verdictStatus, file: before.fileSha256 } });
    // A past run changed: drift is rebuilt from the history that remains, then health follows.
    await recomputeOven(tx, before.ovenId);
    await refreshHealth(tx, before.ovenId, new Date());
    if (!before.fileSha256) return null;
    if (await contentStillReferenced(tx, before.fileSha256, runId)) return null;
    const [file] = await tx.update(storedFiles).set({ purgedAt: new Date() }).where(eq(storedFiles.sha256, before.fileSha256)).returning();
    return file ?? null;
  });
  // The bytes go only while the row still says purged, inside a write transaction: an upload of
  // the same file in between clears purgedAt (and puts the bytes back) in its own. The run is
  // deleted (committed) either way; bytes a failed removal leaves behind are unreferenced.
  let removed = false;
  if (purge) {
    removed = await db.transaction(async (tx) => {
      const [still] = await tx.select({ sha: storedFiles.sha256 }).from(storedFiles).where(and(eq(storedFiles.sha256, purge.sha256), isNotNull(storedFiles.purgedAt))).limit(1);
      if (still) await blobStore().delete(purge.sha256).catch((e) => console.error(`[runs] could not remove the file ${purge.sha256}`, e));
      return Boolean(still);
    });
  }
  return { id: runId, fileRemoved: removed };
}

export async function getRunFile(db: DbOrTx, runId: number) {
  const [row] = await db
    .select({ run: { id: runs.id, fileName: runs.fileName }, file: storedFiles })
    .from(runs)
    .innerJoin(storedFiles, eq(storedFiles.sha256, runs.fileSha256))
    .where(and(eq(runs.id, runId), isNull(runs.deletedAt), isNull(storedFiles.purgedAt)))
    .limit(1);
  return row ?? null;
}
