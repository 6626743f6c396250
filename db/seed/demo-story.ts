// The Brightwater demo story (invented), in days before the seed's end day. The changes log
// (another issue) seeds DEMO_CHANGES; the runs seed uses the same dates so the effects line up.
export const HISTORY_DAYS = 548;
export const LAB_WEEKS = 78;

export type DemoChange = {
  ovenTag: string;
  area: "fan" | "baffle" | "heater" | "controller_firmware" | "insulation" | "sensor" | "conveyor" | "exhaust" | "other";
  summary: string;
  daysBeforeEnd: number;
  before: string;
  after: string;
  why: string;
  /** The run metric the change is meant to move, and its typical value before and after. */
  effect: { metric: "deltaTPeak" | "talMin" | "criticalSpread"; before: number; after: number };
};

/** Lab runs are on Wednesdays; a change happens on the Monday before the first run after it. */
const labChangeDay = (week: number) => HISTORY_DAYS - (week * 7 + 6) + 2;

export const LAB_B1_STEPS = { baffleWeek: 26, fanWeek: 44, reshapeWeek: 60 } as const;

export const DEMO_CHANGES: DemoChange[] = [
  {
    ovenTag: "LAB-B1", area: "baffle", summary: "Baffle plate fitted under the emitters", daysBeforeEnd: labChangeDay(LAB_B1_STEPS.baffleWeek),
    before: "open drawer, emitters straight above the board", after: "perforated steel baffle plate, 2 mm, 40 mm under the emitters",
    why: "ΔT at peak about 40 °C: board edges scorched while the centre barely wetted", effect: { metric: "deltaTPeak", before: 40, after: 13.5 },
  },
  {
    ovenTag: "LAB-B1", area: "fan", summary: "Circulation fan added", daysBeforeEnd: labChangeDay(LAB_B1_STEPS.fanWeek),
    before: "no circulation fan", after: "circulation fan, 40 mm blade, 60 % speed",
    why: "still 12–15 °C across the board; stagnant air over the centre", effect: { metric: "deltaTPeak", before: 13.5, after: 7 },
  },
  {
    ovenTag: "LAB-B1", area: "fan", summary: "Circulation fan re-shaped", daysBeforeEnd: labChangeDay(LAB_B1_STEPS.reshapeWeek),
    before: "fan blade 40 mm, speed 60 %", after: "fan blade 55 mm, re-shaped pitch, speed 75 %",
    why: "bring ΔT under the 5 °C the prototype customers ask for", effect: { metric: "deltaTPeak", before: 7, after: 4.5 },
  },
  {
    ovenTag: "L1-RF2", area: "controller_firmware", summary: "Controller firmware update", daysBeforeEnd: 243,
    before: "firmware 2.3.1", after: "firmware 2.4.0",
    why: "maker's update for the zone-controller watchdog", effect: { metric: "talMin", before: 60, after: 56 },
  },
];

/** L2-RF1's blower bearing starts to wear this many days before the end. */
export const L2RF1_WEAR_DAYS = 90;

export const DEMO_INSTRUMENTS = [
  { kind: "logger" as const, name: "Logger LG-1", serial: "BW-LG-0417", channelCount: 8, scanSkewSeconds: 0.05, resolution: 0.1, accuracy: 0.3, notes: "Line 1 logger" },
  { kind: "logger" as const, name: "Logger LG-2", serial: "BW-LG-0522", channelCount: 8, scanSkewSeconds: 0.1, resolution: 0.1, accuracy: 0.3, notes: "Line 2 and lab logger" },
  { kind: "logger" as const, name: "Logger LG-3", serial: "BW-LG-0630", channelCount: 8, scanSkewSeconds: 0.05, resolution: 0.1, accuracy: 0.3, notes: "Spare logger, new this month" },
  { kind: "probe_set" as const, name: "Probe set A", serial: "BW-PS-A", channelCount: 8, scanSkewSeconds: 0, thermocoupleType: "K", toleranceClass: "iec-1" },
  { kind: "probe_set" as const, name: "Probe set B", serial: "BW-PS-B", channelCount: 8, scanSkewSeconds: 0, thermocoupleType: "K", toleranceClass: "iec-1" },
];

const offsets = (xs: number[]) => Object.fromEntries(xs.map((x, i) => [String(i + 1), x]));
/** Calibrations by instrument serial; `atDay` counts days after the history's first day (may be negative). */
export const DEMO_CALIBRATIONS = [
  { serial: "BW-LG-0417", atDay: -100, dueDays: 365, offsets: offsets([0.2, -0.1, 0.15, -0.25, 0.05, 0.1, -0.15, 0.3]), u: 0.25 },
  { serial: "BW-LG-0417", atDay: 260, dueDays: 365, offsets: offsets([0.18, -0.12, 0.1, -0.2, 0.05, 0.12, -0.1, 0.25]), u: 0.25 },
  // Lapses for two weeks: due on day 345, renewed on day 359.
  { serial: "BW-LG-0522", atDay: -20, dueDays: 365, offsets: offsets([-0.1, 0.2, 0.05, 0.1, -0.3, 0.15, 0, -0.05]), u: 0.25 },
  { serial: "BW-LG-0522", atDay: 359, dueDays: 365, offsets: offsets([-0.12, 0.22, 0.05, 0.08, -0.25, 0.1, 0.02, -0.05]), u: 0.25 },
  { serial: "BW-LG-0630", atDay: HISTORY_DAYS - 12, dueDays: 365, offsets: offsets([0.1, 0.05, -0.1, 0.2, -0.05, 0.15, -0.2, 0.1]), u: 0.25 },
  // Probe set A falls due within 30 days of the end; B is fresh.
  { serial: "BW-PS-A", atDay: HISTORY_DAYS - 340, dueDays: 365, offsets: {}, u: 1.1 },
  { serial: "BW-PS-B", atDay: HISTORY_DAYS - 100, dueDays: 365, offsets: {}, u: 1.1 },
];

const probe = (label: string, x: number, y: number, sitsOn: string) => ({ label, x, y, sitsOn });
export const DEMO_BOARDS = [
  {
    name: "TB-8 line test board", widthMm: 160, heightMm: 100,
    probes: [
      probe("P1", 12, 10, "board edge near connector"), probe("P2", 80, 50, "large QFN centre"), probe("P3", 40, 30, "BGA corner ball"),
      probe("P4", 120, 70, "electrolytic capacitor lead"), probe("P5", 148, 12, "board edge, trailing corner"), probe("P6", 60, 82, "0402 chip field"),
      probe("P7", 100, 22, "shielding can"), probe("P8", 140, 88, "ground-plane via field"),
    ],
  },
  {
    name: "LC-8 lab coupon", widthMm: 100, heightMm: 80,
    probes: [
      probe("P1", 8, 8, "coupon corner"), probe("P2", 50, 40, "QFN centre"), probe("P3", 30, 20, "SOIC lead"), probe("P4", 72, 60, "0603 field"),
      probe("P5", 92, 10, "coupon edge"), probe("P6", 20, 70, "through-hole header"), probe("P7", 65, 18, "LED array"), probe("P8", 88, 72, "copper pour"),
    ],
  },
];

/** Where each probe position heats relative to the board mean (−0.5 cold … +0.5 hot): edges hot, heavy parts cold. */
export const PROBE_PATTERN = [0.5, -0.45, -0.2, -0.1, 0.4, 0.15, -0.3, 0.05];
