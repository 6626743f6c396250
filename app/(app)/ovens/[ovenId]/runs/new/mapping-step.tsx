"use client";
import type { RunPreview } from "@/lib/runs/preview";
import { probeColour } from "@/components/charts/probe-colours";

export function mappingProblems(mapping: Record<string, string>): string[] {
  const problems: string[] = [];
  const used = new Map<string, string>();
  for (const [col, label] of Object.entries(mapping)) {
    if (!label) continue;
    if (used.has(label)) problems.push(`Probe position ${label} is given to both ${used.get(label)} and ${col}; give each position one column.`);
    used.set(label, col);
  }
  if (used.size === 0) problems.push("Map at least one column to a probe position, or the run has nothing to measure.");
  return problems;
}

const SOURCE_TEXT: Record<string, string> = {
  remembered: "This logger's columns were mapped to this board before; the same mapping is used. Nothing to do unless the probes were moved.",
  given: "Your mapping is used, and will be remembered for this logger and board.",
  "board-order": "The columns were matched to the board's probe positions in order. Check each one, then confirm below.",
  "column-names": "The column names are used as probe labels.",
};

/** Step 2: the detected layout and the mapping of probe columns to the board's positions. */
export function MappingStep({ preview, mapping, onChange, confirmed, onConfirm, serverProblem }: {
  preview: RunPreview;
  mapping: Record<string, string>;
  onChange: (column: string, label: string) => void;
  confirmed: boolean;
  onConfirm: (v: boolean) => void;
  serverProblem: string | null;
}) {
  const probeCols = preview.columns.filter((c) => c.role === "probe");
  const others = preview.columns.filter((c) => c.role !== "probe");
  const labels = preview.testBoard?.probes ?? null;
  const problems = mappingProblems(mapping);
  const needsConfirm = labels !== null && preview.mapping.source === "board-order";
  return (
    <div className="min-w-0 space-y-4">
      <p className="text-sm text-ink-soft">
        Read <span className="num">{preview.rows}</span> rows: time in <strong>{preview.timeColumn}</strong> ({preview.timeFormat}), {probeCols.length} probe columns
        {preview.units ? <> in {preview.units === "mixed" ? "mixed units" : preview.units === "mV" ? "millivolts" : `°${preview.units}`}</> : null}, separated by{" "}
        {preview.delimiter === "\t" ? "tabs" : `"${preview.delimiter}"`}, decimal {preview.decimalSeparator === "," ? "comma" : "point"}.
        {others.filter((c) => c.role === "ignored").length ? ` Ignored: ${others.filter((c) => c.role === "ignored").map((c) => `${c.header || "(no header)"}${c.note ? ` — ${c.note}` : ""}`).join("; ")}.` : ""}
      </p>
      <p className={`rounded-lg border p-3 text-sm ${preview.mapping.source === "remembered" ? "border-health-steady/40 bg-teal-50" : "border-paper-line bg-paper-sunk"}`} role="status">
        {SOURCE_TEXT[preview.mapping.source] ?? ""}
        {!labels ? " Choose a test board to map columns to its probe positions." : ""}
      </p>
      <fieldset className="space-y-2">
        <legend className="mb-1 text-sm font-semibold">Column → probe position</legend>
        <ul className="grid gap-2">
          {probeCols.map((c, i) => (
            <li key={c.name} className="flex items-center gap-2">
              <span aria-hidden="true" className="inline-block h-3 w-3 shrink-0 rounded-sm" style={{ background: probeColour(i) }} />
              <label htmlFor={`map-${c.name}`} className="w-28 shrink-0 truncate text-sm" title={c.header}>{c.header}</label>
              <select
                id={`map-${c.name}`}
                value={mapping[c.name] ?? ""}
                onChange={(e) => onChange(c.name, e.target.value)}
                className="min-h-11 min-w-0 flex-1 rounded-lg border border-paper-line bg-paper-raised px-2 text-sm"
              >
                <option value="">not used</option>
                {labels
                  ? labels.map((p) => (
                      <option key={p.label} value={p.label}>{p.label}{p.sitsOn ? ` — ${p.sitsOn}` : ""}</option>
                    ))
                  : <option value={c.name}>{c.name}</option>}
              </select>
            </li>
          ))}
        </ul>
        {problems.length || serverProblem ? (
          <ul role="alert" className="space-y-1 text-sm text-health-act">
            {[...problems, ...(serverProblem ? [serverProblem] : [])].map((p) => <li key={p}>{p}</li>)}
          </ul>
        ) : null}
        {needsConfirm ? (
          <label className="flex min-h-11 items-center gap-3 text-sm">
            <input type="checkbox" className="h-5 w-5" checked={confirmed} onChange={(e) => onConfirm(e.target.checked)} />
            These columns are mapped to the right probe positions.
          </label>
        ) : null}
      </fieldset>
      <details className="text-sm">
        <summary className="min-h-11 cursor-pointer py-2 text-ink-soft">First rows of the file</summary>
        <div className="overflow-x-auto" tabIndex={0} role="region" aria-label="First rows of the file">
          <table className="text-xs">
            <thead><tr>{preview.preview.header.map((h, i) => <th key={i} className="px-2 py-1 text-left">{h}</th>)}</tr></thead>
            <tbody className="num">{preview.preview.rows.map((r, k) => <tr key={k}>{r.map((c, i) => <td key={i} className="px-2 py-0.5">{c}</td>)}</tr>)}</tbody>
          </table>
        </div>
      </details>
    </div>
  );
}
