import type { InStatement } from "@libsql/client";
import { runChannels, runSamples, runs, type RunInsert } from "../schema/runs";
import { analysisColumns } from "../queries/run-create";
import { packSamples } from "@/lib/runs/samples-codec";
import { seededRandom } from "@/lib/thermal/synthetic-profile";
import type { ProcessWindow } from "@/lib/thermal/windows";
import { LARGE_DAYS, SAMPLE_EVERY, type LargeOven } from "./large-plant";
import { insertStatements } from "./bulk-insert";
import { modelFor } from "./run-stories";
import { simulateRun } from "./run-model";
import { analyseSimulated } from "./seed-runs";

const DAY = 86_400_000;

/** Plain data only: it is posted to the worker threads that build the runs. */
export type LargeRunContext = {
  ovenId: number;
  /** The history's first day, ms (UTC midnight). */
  start: number;
  /** Ids are given, not left to the database: the same seed makes the same ids. */
  firstRunId: number;
  window: { id: number; version: number; values: ProcessWindow };
  boardId: number;
  instrumentId: number;
  /** The logger's calibrations, oldest first. */
  calibrations: { id: number; performedAt: number; dueAt: number; offsets: Record<string, number> }[];
  createdBy: string | null;
};

export type LargeRunBatch = { statements: InStatement[]; runs: number; samples: number };

/** The calibration in force at `at` (as an upload finds it): valid offsets, or lapsed, or none. */
function calibrationAt(cals: LargeRunContext["calibrations"], at: number) {
  let latest: LargeRunContext["calibrations"][number] | null = null;
  for (const c of cals) if (c.performedAt <= at) latest = c;
  if (!latest) return { id: null, status: "none" as const, offsets: {} };
  const valid = latest.dueAt >= at;
  const offsets = valid ? Object.fromEntries(Object.entries(latest.offsets).map(([ch, v]) => [`TC${ch}`, v])) : {};
  return { id: latest.id, status: valid ? ("valid" as const) : ("lapsed" as const), offsets };
}

/**
 * Three years of daily runs of one oven, each simulated and analysed as an uploaded file would
 * be: every run's summary and per-probe figures, and the curves of every tenth run (the newest
 * included). Returns the INSERT statements; the caller runs them in one transaction.
 */
export function largeOvenRunStatements(oven: LargeOven, ctx: LargeRunContext): LargeRunBatch {
  const story = oven.story;
  const random = seededRandom(story.seed);
  const runRows: RunInsert[] = [];
  const channelRows: (typeof runChannels.$inferInsert)[] = [];
  const sampleRows: (typeof runSamples.$inferInsert)[] = [];
  for (let n = 0; n < LARGE_DAYS; n++) {
    const runAt = new Date(ctx.start + n * DAY + story.minuteOfDay * 60_000 + Math.floor(random() * 20) * 60_000);
    const { model, startState } = modelFor(story, n, n, runAt, random);
    const sim = simulateRun(model);
    const cal = calibrationAt(ctx.calibrations, runAt.getTime());
    const { analysis } = analyseSimulated(sim, ctx.window.values, { durationSeconds: model.durationSeconds, skewSeconds: story.skew, offsets: cal.offsets });
    const id = ctx.firstRunId + n;
    runRows.push({
      id, ovenId: ctx.ovenId, runAt, windowId: ctx.window.id, windowVersion: ctx.window.version, windowValues: ctx.window.values,
      boardId: ctx.boardId, instrumentId: ctx.instrumentId, calibrationId: cal.id, calibrationStatus: cal.status, fileSha256: null, fileName: null,
      startState, conveyorSpeed: story.kind === "convection" ? 80 : null, setPoints: story.setPoints, operator: story.operator, notes: null,
      createdBy: ctx.createdBy, createdAt: runAt, ...analysisColumns(analysis),
    });
    analysis.channels.forEach((c, i) =>
      channelRows.push({
        runId: id, position: i, column: c.name, probeLabel: `P${i + 1}`, peak: c.peak, timeAtPeak: c.timeAtPeak, tal: c.tal,
        heatUpRate: c.heatUpRate, rampUpMax: c.rampUpMax, rampDownMax: c.rampDownMax, soakTime: c.soakTime, timeToPeak: c.timeToPeak,
      }),
    );
    if (n % SAMPLE_EVERY === (LARGE_DAYS - 1) % SAMPLE_EVERY) sampleRows.push({ runId: id, ...packSamples(sim.time, sim.channels) });
  }
  return {
    statements: [...insertStatements(runs, runRows), ...insertStatements(runChannels, channelRows), ...insertStatements(runSamples, sampleRows, 200)],
    runs: runRows.length,
    samples: sampleRows.length,
  };
}
