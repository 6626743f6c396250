/** Units read from column headers such as "TC1 (°C)", "TC1 [mV]", "Probe 3 degF", "Time (s)". */
export type TemperatureUnit = "C" | "F" | "mV";
export const TEMPERATURE_UNITS: readonly TemperatureUnit[] = ["C", "F", "mV"];

export interface HeaderUnit {
  unit: TemperatureUnit | null;
  /** The header with the unit text removed: the probe's name. */
  name: string;
}

// Bare "C"/"F" count only inside brackets, so a probe simply called "C" keeps its name.
const BRACKETED = /\s*[([]\s*(°\s*[CF]|º\s*[CF]|deg(?:rees?)?\s*[CF]|[CF]|mV|℃|℉)\s*[)\]]\s*/i;
const TOKEN = /(?:^|[\s_/-])(°\s*[CF]|º\s*[CF]|deg(?:rees?)?\s*[CF]|mV|℃|℉)(?=$|[\s_/-])/i;

function normalise(token: string): TemperatureUnit | null {
  const t = token.replace(/\s+/g, "").toLowerCase();
  if (t === "mv") return "mV";
  if (t === "℃" || t.endsWith("c")) return "C";
  if (t === "℉" || t.endsWith("f")) return "F";
  return null;
}

export function headerUnit(header: string): HeaderUnit {
  const trimmed = header.trim();
  const bracket = BRACKETED.exec(trimmed);
  if (bracket && bracket.index > 0) {
    const unit = normalise(bracket[1]);
    const name = (trimmed.slice(0, bracket.index) + " " + trimmed.slice(bracket.index + bracket[0].length)).trim();
    if (unit && name !== "") return { unit, name };
  }
  const token = TOKEN.exec(trimmed);
  if (token) {
    const unit = normalise(token[1]);
    const name = (trimmed.slice(0, token.index) + " " + trimmed.slice(token.index + token[0].length))
      .replace(/[\s_/-]+$/, "")
      .trim();
    if (unit && name !== "") return { unit, name };
  }
  return { unit: null, name: trimmed };
}

export function unitLabel(unit: TemperatureUnit): string {
  return unit === "mV" ? "mV" : `°${unit}`;
}

/** Seconds per unit of a time header such as "Time (s)", "t [ms]", "Elapsed (min)"; 1 if none. */
export function timeHeaderScale(header: string): number {
  const m = /[([]\s*(ms|s|sec|secs|seconds?|min|mins|minutes?|h|hrs?|hours?)\s*[)\]]/i.exec(header);
  if (!m) return 1;
  const u = m[1].toLowerCase();
  if (u === "ms") return 0.001;
  if (u.startsWith("m")) return 60;
  if (u.startsWith("h")) return 3600;
  return 1;
}

export function fahrenheitToCelsius(f: number): number {
  return ((f - 32) * 5) / 9;
}
