/**
 * CSV cells for spreadsheets. A cell that begins with =, +, - or @ (or a tab or carriage return)
 * would be read as a formula, so it gets a leading apostrophe (OWASP "CSV injection").
 * Numbers are written as numbers; a negative number is data, not a formula, and stays as it is.
 */
export function csvCell(value: unknown): string {
  if (value === null || value === undefined) return "";
  if (typeof value === "number") return Number.isFinite(value) ? String(value) : "";
  let s = value instanceof Date ? value.toISOString() : String(value);
  if (/^[=+\-@\t\r]/.test(s)) s = `'${s}`;
  return /[",\n\r]/.test(s) ? `"${s.replace(/"/g, '""')}"` : s;
}

export function csvLine(values: unknown[]): string {
  return values.map(csvCell).join(",");
}

const HEADER = [
  "run id", "oven", "run at (UTC)", "verdict", "window use %", "peak min °C", "peak max °C", "ΔT at peak °C", "critical spread °C",
  "TAL min s", "TAL max s", "heat-up rate °C/s", "time to peak max s", "window", "instrument", "calibration", "start",
];

type ExportRow = {
  id: number; ovenTag: string; runAt: Date; verdict: string; windowUse: number | null; peakMin: number; peakMax: number; deltaTPeak: number;
  criticalSpread: number | null; talMin: number | null; talMax: number | null; heatUpRate: number | null; timeToPeakMax: number | null;
  windowName: string | null; instrumentName: string | null; calibration: string; startState: string | null;
};

/** The runs list as a CSV file (UTF-8 with a byte-order mark so spreadsheets read °C and Δ). */
export function runsCsv(rows: ExportRow[]): string {
  const lines = [csvLine(HEADER)];
  for (const r of rows) {
    lines.push(csvLine([r.id, r.ovenTag, r.runAt, r.verdict, r.windowUse, r.peakMin, r.peakMax, r.deltaTPeak, r.criticalSpread, r.talMin, r.talMax, r.heatUpRate, r.timeToPeakMax, r.windowName, r.instrumentName, r.calibration, r.startState]));
  }
  return "\ufeff" + lines.join("\r\n") + "\r\n";
}
