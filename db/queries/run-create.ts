import "server-only";
import { applyRunToDrift } from "./drift";
import { refreshHealth } from "./health";
import { eq } from "drizzle-orm";
import type { Db, DbOrTx } from "../client";
import { storedFiles } from "../schema/files";
import { runChannels, runSamples, runs, type RunInsert } from "../schema/runs";
import { recordAudit } from "./audit";
import { rememberMapping } from "./instruments";
import { prepareRun, type PreparedRun } from "./run-prepare";
import type { Actor } from "@/lib/actor";
import { packSamples } from "@/lib/runs/samples-codec";
import { blobStore, storeContent } from "@/lib/storage/blob-store";
import type { AnalysisResult } from "@/lib/thermal/types";
import type { MetricSeries } from "@/lib/thermal/metrics";
import type { RunUploadInput } from "@/lib/validation/runs";

/** The columns of a run row that come from an analysis. */
export function analysisColumns(analysis: AnalysisResult) {
  const b = analysis.board;
  const v = analysis.verdict;
  return {
    rows: analysis.meta.rows,
    durationSeconds: analysis.meta.durationSeconds,
    sampleInterval: analysis.meta.sampleInterval,
    units: analysis.meta.units,
    warnings: analysis.meta.warnings,
    skewSeconds: analysis.meta.skewSeconds,
    offsetsApplied: analysis.meta.offsets,
    peakMin: b.peakMin, peakMax: b.peakMax, deltaTPeak: b.deltaTPeak, criticalSpread: b.criticalSpread, heatUpRate: b.heatUpRate,
    rampUpMax: b.rampUpMax, rampDownMax: b.rampDownMax, soakTimeMin: b.soakTimeMin, soakTimeMax: b.soakTimeMax,
    talMin: b.talMin, talMax: b.talMax, timeToPeakMax: b.timeToPeakMax,
    verdictStatus: v.status, windowUse: v.windowUse, verdictItems: v.items,
  };
}

/** Inserts one analysed run with its channels and samples (inside the caller's transaction). */
export async function insertRun(
  tx: DbOrTx,
  row: Omit<RunInsert, keyof ReturnType<typeof analysisColumns>>,
  analysis: AnalysisResult,
  series: MetricSeries,
  labels: Record<string, string>,
) {
  const [run] = await tx.insert(runs).values({ ...row, ...analysisColumns(analysis) }).returning({ id: runs.id });
  await tx.insert(runChannels).values(
    analysis.channels.map((c, i) => ({
      runId: run.id, position: i, column: c.name, probeLabel: labels[c.name] ?? c.name, peak: c.peak, timeAtPeak: c.timeAtPeak, tal: c.tal,
      heatUpRate: c.heatUpRate, rampUpMax: c.rampUpMax, rampDownMax: c.rampDownMax, soakTime: c.soakTime, timeToPeak: c.timeToPeak,
    })),
  );
  const packed = packSamples(series.time, series.channels.map((c) => c.values));
  await tx.insert(runSamples).values({ runId: run.id, ...packed });
  return run.id;
}

export type CreatedRun = { id: number; prepared: PreparedRun; fileSha256: string };

/**
 * Records an uploaded run. The file is analysed first; only then are its bytes written (named by
 * hash) and every row inserted in one transaction, so a bad file leaves nothing behind.
 */
export async function createRun(db: Db, ovenId: number, input: RunUploadInput, file: { bytes: Uint8Array; name: string; mediaType: string }, actor: Actor): Promise<CreatedRun> {
  const prepared = await prepareRun(db, ovenId, input, file.bytes);
  const written = await storeContent(file.bytes);
  const sha = written.sha256;
  try {
    const id = await db.transaction(async (tx) => {
      await tx
        .insert(storedFiles)
        .values({ sha256: sha, size: file.bytes.length, mediaType: file.mediaType || "text/csv", path: written.path })
        .onConflictDoUpdate({ target: storedFiles.sha256, set: { purgedAt: null } });
      // A run deleted meanwhile may have removed these bytes (they existed when written above);
      // under this transaction's write lock they are put back before the row is committed.
      await blobStore().put(sha, file.bytes);
      const runId = await insertRun(
        tx,
        {
          ovenId, runAt: prepared.runAt, windowId: prepared.window.id, windowVersion: prepared.window.version, windowValues: prepared.window.values,
          boardId: prepared.board?.id ?? null, instrumentId: prepared.instrument?.id ?? null, calibrationId: prepared.calibration.id,
          calibrationStatus: prepared.calibration.status, fileSha256: sha, fileName: file.name.slice(0, 200) || null,
          startState: input.startState ?? null, conveyorSpeed: input.conveyorSpeed ?? null, setPoints: input.setPoints ?? null,
          operator: input.operator ?? actor.name ?? null, notes: input.notes ?? null, createdBy: actor.userId,
        },
        prepared.analysis,
        prepared.series,
        prepared.mapping.mapping,
      );
      if (prepared.instrument && prepared.board && (prepared.mapping.source === "given" || prepared.mapping.source === "board-order")) {
        await rememberMapping(tx, prepared.instrument.id, prepared.board.id, prepared.mapping.mapping);
      }
      await recordAudit(tx, { actor, action: "run.create", entity: "run", entityId: runId, after: { ovenId, verdict: prepared.analysis.verdict.status, file: sha, calibration: prepared.calibration.status } });
      // Drift tracking takes one step per metric, then the oven's health (an alert if it worsened).
      await applyRunToDrift(tx, { id: runId, ovenId, runAt: prepared.runAt, ...prepared.analysis.board });
      await refreshHealth(tx, ovenId, new Date(), runId);
      return runId;
    });
    return { id, prepared, fileSha256: sha };
  } catch (err) {
    // Only remove bytes this upload wrote and that no row refers to (checked under the write
    // lock, so an upload of the same file committing meanwhile keeps them).
    if (written.created) {
      await db.transaction(async (tx) => {
        const [stillThere] = await tx.select({ sha: storedFiles.sha256 }).from(storedFiles).where(eq(storedFiles.sha256, sha)).limit(1);
        // A store that fails here must not hide the error that brought us here; the bytes stay as an orphan.
        if (!stillThere) await blobStore().delete(sha).catch((e) => console.error(`[runs] could not remove ${sha} after a failed upload`, e));
      });
    }
    throw err;
  }
}
