import "server-only";
import type { DbOrTx } from "../client";
import { getOven } from "./ovens";
import { getWindow } from "./windows";
import { getBoard } from "./boards";
import { getInstrument, getRememberedMapping, latestCalibrationAt } from "./instruments";
import { AppError, notFound } from "@/lib/errors";
import { analyzeWithSeries } from "@/lib/thermal/analyze";
import { describeColumns, type ColumnDescription } from "@/lib/thermal/describe-columns";
import { DEFAULT_WINDOW, type ProcessWindow } from "@/lib/thermal/windows";
import type { AnalysisResult } from "@/lib/thermal/types";
import type { MetricSeries } from "@/lib/thermal/metrics";
import { offsetsByColumn, probeColumns, resolveMapping, type ResolvedMapping } from "@/lib/runs/mapping";
import type { RunUploadInput } from "@/lib/validation/runs";
import type { CalibrationStatus } from "../schema/runs";
import type { TestBoardRow } from "../schema/windows";
import type { InstrumentRow } from "../schema/instruments";

export interface PreparedRun {
  ovenId: number;
  runAt: Date;
  window: { id: number | null; version: number | null; name: string; values: ProcessWindow };
  board: TestBoardRow | null;
  instrument: InstrumentRow | null;
  calibration: { id: number | null; status: CalibrationStatus; offsetsByChannel: Record<string, number>; dueAt: Date | null };
  description: ColumnDescription;
  mapping: ResolvedMapping;
  analysis: AnalysisResult;
  series: MetricSeries;
}

/**
 * Everything about an upload short of storing it: which window, board and instrument apply, the
 * calibration in force at the run's time, the column mapping, and the analysis with the
 * instrument's scan skew and the valid calibration's offsets. Throws the analysis errors.
 */
export async function prepareRun(db: DbOrTx, ovenId: number, input: RunUploadInput, bytes: Uint8Array): Promise<PreparedRun> {
  const oven = await getOven(db, ovenId);
  if (!oven) throw notFound("That oven");
  const runAt = input.runAt ?? new Date();
  const windowId = input.windowId ?? oven.oven.defaultWindowId ?? null;
  const windowRow = windowId ? await getWindow(db, windowId) : null;
  if (windowId && !windowRow) throw new AppError("invalid_input", "windowId: no process window has that id.", { fields: { windowId: "no process window has that id" } });
  const window = windowRow
    ? { id: windowRow.id, version: windowRow.version, name: windowRow.name, values: windowRow.values }
    : { id: null, version: null, name: "SAC305 paste, typical window (built-in)", values: DEFAULT_WINDOW };
  const boardId = input.boardId ?? oven.oven.defaultBoardId ?? null;
  const board = boardId ? await getBoard(db, boardId) : null;
  if (boardId && !board) throw new AppError("invalid_input", "boardId: no test board has that id.", { fields: { boardId: "no test board has that id" } });
  const instrument = input.instrumentId ? await getInstrument(db, input.instrumentId) : null;
  if (input.instrumentId && !instrument) throw new AppError("invalid_input", "instrumentId: no instrument has that id.", { fields: { instrumentId: "no instrument has that id" } });

  let calibration: PreparedRun["calibration"] = { id: null, status: "none", offsetsByChannel: {}, dueAt: null };
  if (instrument) {
    const latest = await latestCalibrationAt(db, instrument.id, runAt);
    if (latest) {
      const valid = latest.dueAt.getTime() >= runAt.getTime();
      // A lapsed calibration's offsets are not trusted: the run is flagged and measured uncorrected.
      calibration = { id: latest.id, status: valid ? "valid" : "lapsed", offsetsByChannel: valid ? latest.offsets : {}, dueAt: latest.dueAt };
    }
  }

  const description = describeColumns({ bytes });
  const cols = probeColumns(description);
  const labels = board ? board.probes.map((p) => p.label) : null;
  const remembered = instrument && board ? await getRememberedMapping(db, instrument.id, board.id) : null;
  const mapping = resolveMapping(cols, input.mapping, remembered, labels);
  if (mapping.problems.length > 0 && mapping.source === "given") {
    throw new AppError("invalid_input", `mapping: ${mapping.problems[0]}`, { fields: { mapping: mapping.problems.join(" ") } });
  }
  const mapped = Object.keys(mapping.mapping);
  const offsets = Object.fromEntries(Object.entries(offsetsByColumn(cols, calibration.offsetsByChannel)).filter(([name]) => mapped.includes(name)));
  const { result, series } = analyzeWithSeries(
    { bytes },
    { window: window.values, skewSeconds: instrument?.scanSkewSeconds ?? 0, offsets, columns: mapped.length ? mapped : undefined },
  );
  return { ovenId, runAt, window, board, instrument, calibration, description, mapping, analysis: result, series };
}
