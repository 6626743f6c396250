import type { PreparedRun } from "@/db/queries/run-prepare";

/** At most this many points per probe go to the preview chart. */
const PREVIEW_POINTS = 400;

export function previewJson(p: PreparedRun) {
  const n = p.series.time.length;
  const step = Math.max(1, Math.ceil(n / PREVIEW_POINTS));
  const idx: number[] = [];
  for (let k = 0; k < n; k += step) idx.push(k);
  if (idx[idx.length - 1] !== n - 1) idx.push(n - 1);
  const round = (x: number) => Math.round(x * 100) / 100;
  return {
    columns: p.description.columns.map((c) => ({ header: c.header, name: c.name, role: c.role, unit: c.unit, note: c.note ?? null })),
    timeColumn: p.description.timeColumn,
    timeFormat: p.description.timeFormat,
    delimiter: p.description.delimiter,
    decimalSeparator: p.description.decimalSeparator,
    units: p.description.units,
    rows: p.description.rows,
    preview: p.description.preview,
    mapping: p.mapping,
    window: { id: p.window.id, name: p.window.name, version: p.window.version, values: p.window.values },
    testBoard: p.board ? { id: p.board.id, name: p.board.name, probes: p.board.probes } : null,
    instrument: p.instrument ? { id: p.instrument.id, name: p.instrument.name, scanSkewSeconds: p.instrument.scanSkewSeconds } : null,
    calibration: { id: p.calibration.id, status: p.calibration.status, dueAt: p.calibration.dueAt?.toISOString() ?? null },
    analysis: p.analysis,
    series: { time: idx.map((k) => round(p.series.time[k])), channels: p.series.channels.map((c) => ({ name: c.name, values: idx.map((k) => round(c.values[k])) })) },
  };
}
export type RunPreview = ReturnType<typeof previewJson>;
