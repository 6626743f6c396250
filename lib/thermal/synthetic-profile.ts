/**
 * A deterministic, physical-ish reflow run for benchmarks, fixtures and demo data: the air
 * temperature a board meets along the oven is piecewise linear in time; each probe follows it as
 * a first-order lag (its own thermal time constant and a position offset), plus logger noise,
 * rounded to the logger's resolution. Invented data; no real oven or logger is modelled.
 */
export interface SyntheticRunOptions {
  probes: number;
  sampleHz: number;
  durationSeconds: number;
  seed: number;
  /** Logger resolution, °C (0.1 unless given). */
  resolution?: number;
  /** Air temperature knots as [fraction of duration, °C]; a SAC305-like convection run unless given. */
  air?: ReadonlyArray<readonly [number, number]>;
}

export interface SyntheticRun {
  time: Float64Array;
  channels: { name: string; values: Float64Array }[];
}

const SAC305_AIR: ReadonlyArray<readonly [number, number]> = [
  [0, 25], [0.06, 130], [0.2, 180], [0.41, 204], [0.47, 251], [0.56, 251], [0.63, 120], [1, 45],
];

/** mulberry32: small, fast, deterministic. */
export function seededRandom(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

function airAt(knots: ReadonlyArray<readonly [number, number]>, fraction: number): number {
  if (fraction <= knots[0][0]) return knots[0][1];
  for (let i = 1; i < knots.length; i++) {
    const [f1, v1] = knots[i];
    if (fraction <= f1) {
      const [f0, v0] = knots[i - 1];
      return v0 + ((fraction - f0) / (f1 - f0)) * (v1 - v0);
    }
  }
  return knots[knots.length - 1][1];
}

export function simulateReflowRun(options: SyntheticRunOptions): SyntheticRun {
  const { probes, sampleHz, durationSeconds, seed } = options;
  const resolution = options.resolution ?? 0.1;
  const knots = options.air ?? SAC305_AIR;
  const random = seededRandom(seed);
  const gauss = () => Math.sqrt(-2 * Math.log(1 - random())) * Math.cos(2 * Math.PI * random());
  const n = Math.round(durationSeconds * sampleHz) + 1;
  const dt = 1 / sampleHz;
  const time = new Float64Array(n);
  for (let k = 0; k < n; k++) time[k] = k / sampleHz;
  // Time constants scale with the run length so a longer run keeps the same shape.
  const scale = durationSeconds / 420;
  const channels = Array.from({ length: probes }, (_, i) => {
    const tau = (29 + 6 * random()) * scale;
    const offset = -1.5 + 2 * random();
    const values = new Float64Array(n);
    let temperature = 23.5 + 0.8 * random();
    // Sub-steps keep the explicit integration stable whatever the sampling rate.
    const steps = Math.max(1, Math.ceil((dt / tau) * 20));
    const h = dt / steps;
    for (let k = 0; k < n; k++) {
      const reading = temperature + 0.04 * gauss();
      values[k] = Math.round(reading / resolution) * resolution;
      for (let s = 0; s < steps; s++) {
        const air = airAt(knots, (time[k] + s * h) / durationSeconds) + offset;
        temperature += (h / tau) * (air - temperature);
      }
    }
    return { name: `TC${i + 1}`, values };
  });
  return { time, channels };
}

/** Writes a run as a comma-separated logger file: "Time (s)", then "TCn (°C)" columns. */
export function runToCsv(run: SyntheticRun, decimals = 1, newline = "\n"): string {
  const header = ["Time (s)", ...run.channels.map((c) => `${c.name} (°C)`)].join(",");
  const lines = [header];
  const timeDecimals = Number.isInteger(run.time[1] - run.time[0]) ? 0 : 1;
  for (let k = 0; k < run.time.length; k++) {
    let line = run.time[k].toFixed(timeDecimals);
    for (const c of run.channels) line += "," + c.values[k].toFixed(decimals);
    lines.push(line);
  }
  return lines.join(newline) + newline;
}
