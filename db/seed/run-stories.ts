import { DEMO_BOARDS, DEMO_CHANGES, HISTORY_DAYS, L2RF1_WEAR_DAYS, LAB_B1_STEPS, PROBE_PATTERN } from "./demo-story";
import { batchAir, convectionAir, type RunModel } from "./run-model";

export type OvenStory = {
  tag: string;
  cadence: "daily" | "weekly";
  /** Minutes after midnight UTC of the usual run time. */
  minuteOfDay: number;
  loggerSerial: string;
  skew: number;
  board: string;
  kind: "convection" | "batch";
  seed: number;
  operator: string;
  operatorEmail: string;
  setPoints: Record<string, number>;
  /** Board coupling spread g (ΔT at peak ≈ 230·g °C) and lag spread, by day and run number. */
  shape: (day: number, n: number) => { g: number; lag: number; peakHold: number };
};

const LINE_SET_POINTS = { Z1: 120, Z2: 150, Z3: 165, Z4: 180, Z5: 195, Z6: 215, Z7: 250, Z8: 262 };
const LAB_SET_POINTS = { emitter: 255, dwell: 30 };
const firmwareDay = HISTORY_DAYS - DEMO_CHANGES.find((c) => c.ovenTag === "L1-RF2")!.daysBeforeEnd;
const tech = { operator: "Tomás Kelly", operatorEmail: "tech@brightwater.example" };
const eng = { operator: "Priya Nair", operatorEmail: "engineer@brightwater.example" };

export const OVEN_STORIES: OvenStory[] = [
  { tag: "L1-RF1", cadence: "daily", minuteOfDay: 390, loggerSerial: "BW-LG-0417", skew: 0.05, board: DEMO_BOARDS[0].name, kind: "convection", seed: 101, ...tech, setPoints: LINE_SET_POINTS, shape: () => ({ g: 0.011, lag: 0.04, peakHold: 3 }) },
  {
    tag: "L1-RF2", cadence: "daily", minuteOfDay: 430, loggerSerial: "BW-LG-0417", skew: 0.05, board: DEMO_BOARDS[0].name, kind: "convection", seed: 202, ...tech, setPoints: LINE_SET_POINTS,
    // Firmware 2.4.0 ends the peak zone's hold a few seconds sooner: shorter time above liquidus.
    shape: (day) => ({ g: 0.012, lag: 0.04, peakHold: day < firmwareDay ? 6 : 1 }),
  },
  {
    tag: "L2-RF1", cadence: "daily", minuteOfDay: 400, loggerSerial: "BW-LG-0522", skew: 0.1, board: DEMO_BOARDS[0].name, kind: "convection", seed: 303, ...tech, setPoints: LINE_SET_POINTS,
    // A wearing blower bearing moves less air: probes lag more unevenly, so the critical-phase spread creeps up.
    shape: (day) => {
      const wear = Math.max(0, Math.min(1, (day - (HISTORY_DAYS - L2RF1_WEAR_DAYS)) / L2RF1_WEAR_DAYS));
      return { g: 0.011 + 0.002 * wear, lag: 0.04 + 0.16 * wear ** 1.4, peakHold: 3 };
    },
  },
  { tag: "L2-RF2", cadence: "daily", minuteOfDay: 445, loggerSerial: "BW-LG-0522", skew: 0.1, board: DEMO_BOARDS[0].name, kind: "convection", seed: 404, ...tech, setPoints: LINE_SET_POINTS, shape: () => ({ g: 0.013, lag: 0.05, peakHold: 3 }) },
  {
    tag: "LAB-B1", cadence: "weekly", minuteOfDay: 600, loggerSerial: "BW-LG-0522", skew: 0.1, board: DEMO_BOARDS[1].name, kind: "batch", seed: 505, ...eng, setPoints: LAB_SET_POINTS,
    // ΔT ≈ 40 °C, then the baffle (12–15), the circulation fan (≈ 7) and the re-shaped fan (< 5).
    shape: (_day, week) => {
      const g = week < LAB_B1_STEPS.baffleWeek ? 0.155 : week < LAB_B1_STEPS.fanWeek ? 0.056 : week < LAB_B1_STEPS.reshapeWeek ? 0.025 : 0.013;
      return { g, lag: week < LAB_B1_STEPS.baffleWeek ? 0.2 : 0.04, peakHold: 0 };
    },
  },
  { tag: "LAB-B2", cadence: "weekly", minuteOfDay: 660, loggerSerial: "BW-LG-0522", skew: 0.1, board: DEMO_BOARDS[1].name, kind: "batch", seed: 606, ...eng, setPoints: LAB_SET_POINTS, shape: () => ({ g: 0.017, lag: 0.05, peakHold: 0 }) },
];

const gaussOf = (random: () => number) => () => Math.sqrt(-2 * Math.log(1 - random())) * Math.cos(2 * Math.PI * random());

/** The model of one run: the oven's state that day, a cold or hot start, and run-to-run scatter. */
export function modelFor(story: OvenStory, day: number, n: number, runAt: Date, random: () => number): { model: RunModel; startState: "cold" | "hot" } {
  const gauss = gaussOf(random);
  const shape = story.shape(day, n);
  // Line ovens are switched off over the weekend, so Monday's run is a cold start; lab ovens start cold every other run.
  const cold = story.cadence === "daily" ? runAt.getUTCDay() === 1 : n % 2 === 0;
  const g = shape.g * (1 + 0.06 * gauss());
  const level = 0.7 * gauss() + (cold ? -1.6 : 0);
  const air = story.kind === "convection" ? convectionAir(level, shape.peakHold) : batchAir(level);
  const probes = PROBE_PATTERN.map((u) => ({ tau: 28 * (1 + shape.lag * (-u) * 2) * (cold ? 1.03 : 1), gain: 1 + g * (u + 0.03 * gauss()) }));
  return { model: { air, probes, durationSeconds: 420, startC: cold ? 21.5 : 24, noiseC: 0.1, seed: story.seed * 100_000 + n }, startState: cold ? "cold" : "hot" };
}
