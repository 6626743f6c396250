import type { ColumnDescription } from "@/lib/thermal/describe-columns";

export type MappingSource = "given" | "remembered" | "column-names" | "board-order" | "none";

export interface ResolvedMapping {
  /** probe column name → probe label, in file order. */
  mapping: Record<string, string>;
  source: MappingSource;
  problems: string[];
}

type ProbeColumn = { name: string; header: string };

/** Probe columns of a described file, in file order. */
export function probeColumns(d: Pick<ColumnDescription, "columns">): ProbeColumn[] {
  return d.columns.filter((c) => c.role === "probe").map((c) => ({ name: c.name, header: c.header }));
}

function findColumn(cols: ProbeColumn[], key: string): ProbeColumn | undefined {
  const k = key.trim().toLowerCase();
  return cols.find((c) => c.header === key || c.name === key) ?? cols.find((c) => c.header.toLowerCase() === k || c.name.toLowerCase() === k);
}

/** Turns a mapping keyed by header or name into one keyed by column name; says what does not fit. */
export function normaliseMapping(cols: ProbeColumn[], raw: Record<string, string>, labels: string[] | null): { mapping: Record<string, string>; problems: string[] } {
  const problems: string[] = [];
  const byName = new Map<string, string>();
  for (const [key, label] of Object.entries(raw)) {
    const col = findColumn(cols, key);
    if (!col) {
      problems.push(`Column "${key}" is not a probe column of this file.`);
      continue;
    }
    if (labels && !labels.includes(label)) problems.push(`"${label}" is not a probe position of the test board (${labels.join(", ")}).`);
    byName.set(col.name, label);
  }
  const seen = new Map<string, string>();
  for (const [name, label] of byName) {
    if (seen.has(label)) problems.push(`Probe position ${label} is given to both ${seen.get(label)} and ${name}.`);
    seen.set(label, name);
  }
  const mapping: Record<string, string> = {};
  for (const c of cols) if (byName.has(c.name)) mapping[c.name] = byName.get(c.name)!;
  if (Object.keys(mapping).length === 0 && problems.length === 0) problems.push("Map at least one column to a probe position.");
  return { mapping, problems };
}

/**
 * Which column is which probe: the mapping sent, else the one remembered for this instrument and
 * board, else the column names when they are the board's labels, else the board's order.
 */
export function resolveMapping(cols: ProbeColumn[], given: Record<string, string> | undefined, remembered: Record<string, string> | null, labels: string[] | null): ResolvedMapping {
  if (given) return { ...normaliseMapping(cols, given, labels), source: "given" };
  if (remembered) {
    const r = normaliseMapping(cols, remembered, labels);
    if (r.problems.length === 0) return { ...r, source: "remembered" };
  }
  if (!labels || cols.every((c) => labels.includes(c.name))) {
    return { mapping: Object.fromEntries(cols.map((c) => [c.name, c.name])), source: "column-names", problems: [] };
  }
  const mapping: Record<string, string> = {};
  cols.forEach((c, i) => {
    if (i < labels.length) mapping[c.name] = labels[i];
  });
  const problems = cols.length > labels.length ? [`The file has ${cols.length} probe columns but the board has ${labels.length} positions; columns after the ${labels.length}th are left out.`] : [];
  return { mapping, source: "board-order", problems };
}

/** Calibration offsets are per logger channel (1-based scan order); the analysis wants them by column. */
export function offsetsByColumn(cols: ProbeColumn[], byChannel: Record<string, number>): Record<string, number> {
  const out: Record<string, number> = {};
  cols.forEach((c, i) => {
    const v = byChannel[String(i + 1)];
    if (typeof v === "number" && v !== 0) out[c.name] = v;
  });
  return out;
}
