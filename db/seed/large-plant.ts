import { seededRandom } from "@/lib/thermal/synthetic-profile";
import type { ChangeArea } from "../schema/changes";
import { DEMO_BOARDS, PROBE_PATTERN } from "./demo-story";
import type { OvenStory } from "./run-stories";

/*
 * The large data set (invented): Brightwater Circuits grown to four plants and 200 ovens with
 * three years of daily verification runs. Everything here is a pure function of the oven's index
 * and a fixed seed, so the seed is the same on every machine; days count from the history's
 * first day.
 */

export const LARGE_DAYS = 3 * 365;
export const LARGE_CHANGES_PER_OVEN = 25;
export const LARGE_WORK_ORDERS = 60_000;
/** Every tenth run keeps its curves (run_sample); the rest keep their summary only. */
export const SAMPLE_EVERY = 10;

export const LARGE_SITES = [
  { name: "Brightwater Circuits — Main plant", timeZone: "Europe/Dublin", code: "MP" },
  { name: "Brightwater Circuits — Shannon plant", timeZone: "Europe/Dublin", code: "SH" },
  { name: "Brightwater Circuits — Brno plant", timeZone: "Europe/Prague", code: "BR" },
  { name: "Brightwater Circuits — Penang plant", timeZone: "Asia/Kuala_Lumpur", code: "PG" },
];
/** Per site: 21 SMT lines of two convection ovens, and a lab of eight batch ovens (50 ovens). */
export const LINES_PER_SITE = 21;
export const LAB_OVENS_PER_SITE = 8;
export const LOGGERS_PER_SITE = 4;

/** People beyond the demo's five: two technicians and an engineer at each plant. */
export const LARGE_PEOPLE = LARGE_SITES.flatMap((s, i) => [
  { email: `tech.${s.code.toLowerCase()}1@brightwater.example`, name: ["Niamh Walsh", "Ciarán Doyle", "Petra Novák", "Mei Ling Tan"][i], role: "technician" as const, timeZone: s.timeZone },
  { email: `tech.${s.code.toLowerCase()}2@brightwater.example`, name: ["Liam Quinn", "Sinéad Ryan", "Tomáš Dvořák", "Arjun Pillai"][i], role: "technician" as const, timeZone: s.timeZone },
  { email: `engineer.${s.code.toLowerCase()}@brightwater.example`, name: ["Orla Keane", "Fiachra Burke", "Jana Horáková", "Farah Aziz"][i], role: "engineer" as const, timeZone: s.timeZone },
]);

export const loggerSerial = (site: number, k: number) => `BW-LG-${site + 1}${String(k + 1).padStart(2, "0")}`;

/** Annual calibrations of a logger, by day (negative: before the history). One renewal comes two weeks late. */
export function loggerCalibrations(site: number, k: number) {
  const out: { atDay: number; dueDays: number; offsets: Record<string, number> }[] = [];
  const random = seededRandom(31_000 + site * 10 + k);
  const late = site === 2 && k === 2;
  for (let day = -40 - 30 * k; day < LARGE_DAYS; day += 364) {
    const offsets = Object.fromEntries(Array.from({ length: 8 }, (_, c) => [String(c + 1), Math.round((random() - 0.5) * 60) / 100]));
    out.push({ atDay: late && out.length === 2 ? day + 14 : day, dueDays: 365, offsets });
  }
  return out;
}

export type LargeChange = {
  day: number;
  area: ChangeArea;
  summary: string;
  before: string;
  after: string;
  reason: string;
  /** How the change moves the run model from its day on. */
  effect: { g?: number; hold?: number; endsWear?: boolean };
};

export type LargeOven = {
  index: number;
  site: number;
  line: string;
  lineKind: "smt" | "lab";
  tag: string;
  name: string;
  kind: "convection" | "batch_ir";
  zones: number;
  maker: string;
  model: string;
  serial: string;
  installedOn: string;
  nitrogen: boolean;
  loggerSerial: string;
  changes: LargeChange[];
  /** An open breakdown raised this many days before the end, or null. */
  breakdownDaysAgo: number | null;
  story: OvenStory;
};

const ZONES = ["Z1", "Z2", "Z3", "Z4", "Z5", "Z6", "Z7", "Z8"];
const LINE_SET_POINTS = { Z1: 120, Z2: 150, Z3: 165, Z4: 180, Z5: 195, Z6: 215, Z7: 250, Z8: 262 };
const LAB_SET_POINTS = { emitter: 255, dwell: 30 };
const REASONS = ["found at the weekly check", "maker's service bulletin", "after a drift alert", "planned overhaul", "spare on the shelf, old part worn", "process engineer's request"];

type ChangeKind = (r: () => number, zone: string) => Omit<LargeChange, "day" | "reason">;
const CHANGE_KINDS: ChangeKind[] = [
  (r, z) => ({ area: "heater", summary: `${z} heater element replaced`, before: `element lot H-${100 + Math.floor(r() * 800)}`, after: `element lot H-${100 + Math.floor(r() * 800)}`, effect: { g: 0.96 + r() * 0.08 } }),
  (r) => {
    const v = Math.floor(r() * 5);
    return { area: "controller_firmware", summary: "Controller firmware update", before: `firmware 3.${v}.0`, after: `firmware 3.${v + 1}.0`, effect: { hold: r() < 0.5 ? -1 : 1 } };
  },
  (r, z) => ({ area: "fan", summary: `${z} blower motor replaced`, before: "original motor", after: `motor serial BM-${1000 + Math.floor(r() * 9000)}`, effect: { g: 0.95 + r() * 0.07 } }),
  (_r, z) => ({ area: "sensor", summary: `${z} control thermocouple replaced`, before: "type K, 3 mm sheath", after: "type K, 3 mm sheath, new", effect: {} }),
  () => ({ area: "conveyor", summary: "Conveyor chain tension reset", before: "sag 14 mm", after: "sag 8 mm", effect: {} }),
  () => ({ area: "exhaust", summary: "Exhaust duct cleaned and damper reset", before: "damper 40 %", after: "damper 35 %", effect: { g: 0.99 } }),
  (_r, z) => ({ area: "baffle", summary: `${z} nozzle plate cleaned`, before: "flux residue on 30 % of holes", after: "clean", effect: { g: 0.97 } }),
  () => ({ area: "insulation", summary: "Door seal and insulation panel renewed", before: "seal cracked at the hinge side", after: "new silicone seal", effect: {} }),
  () => ({ area: "other", summary: "Edge-rail width sensor replaced", before: "intermittent width reading", after: "new sensor", effect: {} }),
];

/** A bearing that wears from `start` for `days`, lagging the probes unevenly (the critical spread rises). */
type Wear = { start: number; days: number; strength: number };

export function largeOven(index: number): LargeOven {
  const random = seededRandom(70_001 + index * 7919);
  const site = Math.floor(index / 50);
  const inSite = index % 50;
  const isLab = inSite >= LINES_PER_SITE * 2;
  const code = LARGE_SITES[site].code;
  const lineNo = Math.floor(inSite / 2) + 1;
  const tag = isLab ? `${code}-LAB${inSite - LINES_PER_SITE * 2 + 1}` : `${code}-L${String(lineNo).padStart(2, "0")}-RF${(inSite % 2) + 1}`;
  const line = isLab ? "Prototype lab" : `SMT Line ${lineNo}`;
  const nitrogen = !isLab && random() < 0.5;
  const g0 = isLab ? 0.012 + random() * 0.008 : 0.009 + random() * 0.005;
  const lag0 = 0.03 + random() * 0.03;
  const hold0 = isLab ? 0 : 1 + Math.floor(random() * 5);
  const wear: Wear | null = random() < 0.15 ? { start: LARGE_DAYS - 60 - Math.floor(random() * 360), days: 60 + Math.floor(random() * 90), strength: 0.6 + random() * 0.6 } : null;

  // 25 changes on distinct days; when the wear is found in time, one of them is the repair.
  const fixDay = wear && random() < 0.5 ? Math.min(LARGE_DAYS - 3, wear.start + Math.floor(wear.days * (0.7 + random() * 0.6))) : null;
  const days = new Set<number>();
  while (days.size < LARGE_CHANGES_PER_OVEN - (fixDay === null ? 0 : 1)) {
    const day = 10 + Math.floor(random() * (LARGE_DAYS - 12));
    if (day !== fixDay) days.add(day);
  }
  const changes: LargeChange[] = [...days].sort((a, b) => a - b).map((day) => {
    const kind = CHANGE_KINDS[Math.floor(random() * CHANGE_KINDS.length)](random, ZONES[Math.floor(random() * (isLab ? 1 : 8))]);
    return { day, ...kind, reason: REASONS[Math.floor(random() * REASONS.length)] };
  });
  if (fixDay !== null) {
    changes.push({ day: fixDay, area: "fan", summary: "Blower bearings replaced", before: "bearings noisy, play at the shaft", after: "new sealed bearings", reason: "after a drift alert", effect: { endsWear: true } });
    changes.sort((a, b) => a.day - b.day);
  }
  const breakdownDaysAgo = random() < 0.02 ? 1 + Math.floor(random() * 3) : null;

  const shape = (day: number) => {
    let g = g0;
    let hold = hold0;
    let wearFrom = wear?.start ?? Infinity;
    for (const c of changes) {
      if (c.day > day) break;
      g *= c.effect.g ?? 1;
      hold = Math.max(0, hold + (c.effect.hold ?? 0));
      if (c.effect.endsWear) wearFrom = Infinity;
    }
    const w = wear && day >= wearFrom ? Math.min(1, (day - wear.start) / wear.days) * wear.strength : 0;
    return { g: g + 0.002 * w, lag: lag0 + 0.16 * w ** 1.4, peakHold: hold };
  };
  const techNo = 1 + (index % 2);
  const person = LARGE_PEOPLE[site * 3 + techNo - 1];
  return {
    index, site, line, lineKind: isLab ? "lab" : "smt", tag,
    name: isLab ? `${LARGE_SITES[site].name.split("— ")[1]} lab batch oven ${inSite - LINES_PER_SITE * 2 + 1}` : `Line ${lineNo} reflow, ${inSite % 2 ? "second" : "first"}`,
    kind: isLab ? "batch_ir" : "convection", zones: isLab ? 1 : 8,
    maker: isLab ? "Benchline" : "Harrow Thermal", model: isLab ? "IR-Drawer 2" : nitrogen ? "HT-820N" : "HT-820",
    serial: `${isLab ? "BL-D2" : "HT820"}-${String(2000 + index).padStart(4, "0")}`,
    installedOn: `20${17 + Math.floor(random() * 5)}-0${1 + Math.floor(random() * 9)}-1${Math.floor(random() * 9)}`,
    nitrogen, loggerSerial: loggerSerial(site, index % LOGGERS_PER_SITE), changes, breakdownDaysAgo,
    story: {
      tag, cadence: "daily", minuteOfDay: 360 + Math.floor(random() * 120), loggerSerial: loggerSerial(site, index % LOGGERS_PER_SITE),
      skew: 0.05, board: isLab ? DEMO_BOARDS[1].name : DEMO_BOARDS[0].name, kind: isLab ? "batch" : "convection", seed: 1000 + index,
      operator: person.name, operatorEmail: person.email, setPoints: isLab ? LAB_SET_POINTS : LINE_SET_POINTS, shape,
    },
  };
}

export const LARGE_OVEN_COUNT = LARGE_SITES.length * 50;
export const PROBES = PROBE_PATTERN.length;
