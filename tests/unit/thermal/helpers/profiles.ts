/**
 * Piecewise-linear test profiles and a small logger-file writer for the thermal tests.
 * Every expected value in the tests is derived by hand from these knots (see the comments there).
 */
export type Knot = readonly [number, number];

/** Value of the piecewise-linear curve through `knots` at t (held constant outside). */
export function at(knots: readonly Knot[], t: number): number {
  if (t <= knots[0][0]) return knots[0][1];
  for (let i = 1; i < knots.length; i++) {
    const [t1, v1] = knots[i];
    if (t <= t1) {
      const [t0, v0] = knots[i - 1];
      // (t − t0)(v1 − v0) first, so the value at a knot is the knot's value exactly.
      return v0 + ((t - t0) * (v1 - v0)) / (t1 - t0);
    }
  }
  return knots[knots.length - 1][1];
}

/**
 * The base profile P(t), °C, t in s, sampled every 1 s for 0…420 s (421 rows, seven minutes):
 *   (0, 20) → (104, 150)  heat-up, 1.25 °C/s
 *   (104, 150) → (194, 200)  soak, 5/9 °C/s
 *   (194, 200) → (214, 240)  ramp to peak, 2 °C/s
 *   (214, 240) → (254, 240)  peak plateau
 *   (254, 240) → (344, 60)  cooling, −2 °C/s
 *   (344, 60) → (424, 40)  −0.25 °C/s (runs past 420 s so scanned channels can be sampled late)
 */
export const P: readonly Knot[] = [[0, 20], [104, 150], [194, 200], [214, 240], [254, 240], [344, 60], [424, 40]];

/** P shifted later by `lag` seconds, holding 20 °C before it starts. */
export function lagged(lag: number): Knot[] {
  return [[0, 20], ...P.map(([t, v]) => [t + lag, v] as const)];
}

/** P raised by `delta` °C. */
export function raised(delta: number): Knot[] {
  return P.map(([t, v]) => [t, v + delta] as const);
}

export interface ChannelSpec {
  header: string;
  /** °C as a function of the sample time. */
  celsius: (t: number) => number;
}

export interface FileSpec {
  timeHeader?: string;
  times: number[];
  channels: ChannelSpec[];
  delimiter?: "," | ";" | "\t";
  decimalComma?: boolean;
  /** Encodes one °C value as the file's unit (default: unchanged). */
  encode?: (celsius: number) => number;
  /** Formats one time value (default: seconds as a number). */
  formatTime?: (t: number) => string;
  /** Channel i is sampled at t + i·skew (a scanning logger). */
  skew?: number;
  newline?: string;
  extraColumns?: Array<{ header: string; cell: (row: number, t: number) => string }>;
}

const num = (x: number, comma: boolean) => (comma ? String(x).replace(".", ",") : String(x));

/** Writes a logger file; numbers are written with String(), which round-trips exactly. */
export function writeFile(spec: FileSpec): string {
  const d = spec.delimiter ?? ",";
  const comma = spec.decimalComma ?? false;
  const encode = spec.encode ?? ((c: number) => c);
  const formatTime = spec.formatTime ?? ((t: number) => num(t, comma));
  const header = [spec.timeHeader ?? "Time (s)", ...spec.channels.map((c) => c.header), ...(spec.extraColumns ?? []).map((c) => c.header)];
  const lines = [header.join(d)];
  spec.times.forEach((t, row) => {
    const cells = [formatTime(t)];
    spec.channels.forEach((c, i) => cells.push(num(encode(c.celsius(t + i * (spec.skew ?? 0))), comma)));
    for (const extra of spec.extraColumns ?? []) cells.push(extra.cell(row, t));
    lines.push(cells.join(d));
  });
  const nl = spec.newline ?? "\n";
  return lines.join(nl) + nl;
}

export const SECONDS_0_TO_420 = Array.from({ length: 421 }, (_, k) => k);

/** Channels A = P, B = P + 4 °C, C = P 6 s later, as TC1, TC2, TC3 with the given header unit. */
export function threeChannels(unit = "°C"): ChannelSpec[] {
  const b = raised(4);
  const c = lagged(6);
  return [
    { header: `TC1 (${unit})`, celsius: (t) => at(P, t) },
    { header: `TC2 (${unit})`, celsius: (t) => at(b, t) },
    { header: `TC3 (${unit})`, celsius: (t) => at(c, t) },
  ];
}

export const toFahrenheit = (c: number) => (c * 9) / 5 + 32;

export function pad2(n: number): string {
  return String(n).padStart(2, "0");
}
