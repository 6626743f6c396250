import { seededRandom } from "@/lib/thermal/synthetic-profile";

/**
 * The demo's physical-ish run model (invented): the board meets an air (or emitter) temperature
 * that is piecewise linear in time; each probe follows it as a first-order lag with its own time
 * constant (thermal mass, airflow) and a gain on the excess over ambient (how well it couples to
 * the heat), plus logger noise (0.1 °C) rounded to the logger's 0.1 °C resolution.
 */
export interface ProbeModel {
  /** Time constant, s. */
  tau: number;
  /** Multiplier on (air − 25 °C). */
  gain: number;
}

export interface RunModel {
  /** [t in s, °C] knots of the air temperature. */
  air: ReadonlyArray<readonly [number, number]>;
  probes: ProbeModel[];
  durationSeconds: number;
  /** Board temperature at the start, °C (a hot start begins warm). */
  startC: number;
  noiseC: number;
  seed: number;
}

function airAt(knots: RunModel["air"], t: number): number {
  if (t <= knots[0][0]) return knots[0][1];
  for (let i = 1; i < knots.length; i++) {
    const [t1, v1] = knots[i];
    if (t <= t1) {
      const [t0, v0] = knots[i - 1];
      return v0 + ((t - t0) / (t1 - t0)) * (v1 - v0);
    }
  }
  return knots[knots.length - 1][1];
}

export function simulateRun(m: RunModel): { time: Float64Array; channels: Float64Array[] } {
  const random = seededRandom(m.seed);
  const gauss = () => Math.sqrt(-2 * Math.log(1 - random())) * Math.cos(2 * Math.PI * random());
  const n = Math.round(m.durationSeconds) + 1;
  const time = new Float64Array(n);
  for (let k = 0; k < n; k++) time[k] = k;
  const steps = 4;
  // The air is the same for every probe: work out its excess over 25 °C once per sub-step
  // (the large seed simulates a couple of hundred thousand runs; this was most of the time).
  const excess = new Float64Array(n * steps);
  for (let k = 0; k < n; k++) for (let s = 0; s < steps; s++) excess[k * steps + s] = airAt(m.air, k + s / steps) - 25;
  const channels = m.probes.map((p) => {
    const values = new Float64Array(n);
    let temperature = m.startC + 0.3 * gauss();
    const rate = 1 / steps / p.tau;
    for (let k = 0; k < n; k++) {
      values[k] = Math.round((temperature + m.noiseC * gauss()) * 10) / 10;
      for (let s = 0; s < steps; s++) {
        const air = 25 + p.gain * excess[k * steps + s];
        temperature += rate * (air - temperature);
      }
    }
    return values;
  });
  return { time, channels };
}

/** Convection conveyor, SAC305-like: preheat, soak, spike, cool. `peakHold` stretches the spike. */
export function convectionAir(level = 0, peakHold = 0): Array<[number, number]> {
  return [
    [0, 25], [45, 150], [100, 178], [170, 200], [210, 249.9 + level], [238 + peakHold, 249.9 + level], [265 + peakHold, 140], [420, 50],
  ];
}

/** Batch infrared drawer: a slower climb, a dwell, and the drawer opened to cool. */
export function batchAir(level = 0): Array<[number, number]> {
  return [
    [0, 25], [55, 155], [115, 180], [180, 202], [222, 249.7 + level], [252, 249.7 + level], [278, 135], [420, 45],
  ];
}
