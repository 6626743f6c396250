import type { CautionId } from "./cautions";
import type { RecurrenceSpec } from "./rrule-builder";
import type { ChecklistItem, WorkOrderKind } from "./work-order-state";

/*
 * Starting points for reflow-oven plans (demo data and the "new plan from template" picker).
 * These are common practice, not requirements: each says where the task and interval were seen
 * (REFERENCES §8 of the project's reference notes) or that it is general practice. The
 * plant sets its own intervals from the oven maker's manual.
 */

export type TemplateTrigger =
  | { type: "calendar"; recurrence: RecurrenceSpec; /** local "HH:mm" */ startTime: string }
  | { type: "runs"; everyRuns: number }
  | { type: "hours"; everyHours: number };

export type PmTemplate = {
  id: string;
  title: string;
  kind: Extract<WorkOrderKind, "preventive" | "calibration">;
  trigger: TemplateTrigger;
  estimatedMinutes: number;
  instructions: string;
  checklist: ChecklistItem[];
  /** What the task touches; any of these means the lock-out/tag-out caution is shown. */
  involves: { heaters: boolean; wiring: boolean; chamber: boolean; movingParts: boolean };
  /** Only for ovens with this equipment. */
  whereFitted?: "nitrogen";
  cautions: CautionId[];
  source: string;
};

const item = (id: string, label: string, mandatory = true): ChecklistItem => ({ id, label, mandatory });
const none = { heaters: false, wiring: false, chamber: false, movingParts: false };

export const REFLOW_PM_TEMPLATES: readonly PmTemplate[] = [
  {
    id: "daily-conveyor-zones",
    title: "Clean conveyor and inspect heating zones",
    kind: "preventive",
    trigger: { type: "calendar", recurrence: { kind: "daily", interval: 1 }, startTime: "06:30" },
    estimatedMinutes: 20,
    instructions:
      "With the oven locked out and cool enough to touch, clean flux and debris from the conveyor " +
      "and board supports, and look into each heating zone for residue, bent baffles or loose parts.",
    checklist: [
      item("conveyor-clean", "Conveyor and board supports cleaned"),
      item("zones-inspected", "Each heating zone inspected; no residue build-up, bent baffle or loose part"),
      item("findings", "Findings noted (or none)", false),
    ],
    involves: { ...none, chamber: true, movingParts: true },
    cautions: ["lockoutTagout", "fluxFumes"],
    source: "Common practice; REFERENCES §8: emtindia.net, daily conveyor cleaning and zone inspection.",
  },
  {
    id: "weekly-exhaust-traps",
    title: "Clean exhaust vents and condensation traps",
    kind: "preventive",
    trigger: { type: "calendar", recurrence: { kind: "weekly", interval: 1, weekdays: ["MO"] }, startTime: "07:00" },
    estimatedMinutes: 45,
    instructions:
      "Flux volatiles condense in the cooler zones and the exhaust, and the build-up is flammable. " +
      "Inspect and clean the exhaust vents and empty and clean the condensation traps and flux filters.",
    checklist: [
      item("vents", "Exhaust vents inspected and cleaned"),
      item("traps", "Condensation traps emptied and cleaned"),
      item("filters", "Flux filters checked; replaced if loaded"),
      item("extraction-flow", "Extraction running normally after reassembly"),
    ],
    involves: { ...none, chamber: true },
    cautions: ["lockoutTagout", "fluxFumes"],
    source: "Common practice; REFERENCES §8: handbook.dannie.cc §7.9, weekly exhaust and condensation-trap cleaning.",
  },
  {
    id: "weekly-chain-lube",
    title: "Lubricate conveyor chain",
    kind: "preventive",
    trigger: { type: "calendar", recurrence: { kind: "weekly", interval: 1, weekdays: ["WE"] }, startTime: "07:00" },
    estimatedMinutes: 15,
    instructions:
      "Lubricate the conveyor chain with the high-temperature oil the oven maker specifies — never " +
      "ordinary oil, which cokes and drips onto boards. Wipe off the excess.",
    checklist: [
      item("oil-type", "High-temperature oil of the specified type used"),
      item("chain-lubricated", "Chain lubricated along its full length"),
      item("excess-wiped", "Excess oil wiped off"),
    ],
    involves: { ...none, movingParts: true },
    cautions: ["lockoutTagout"],
    source:
      "Common practice; REFERENCES §8: Nordson Asymtek TC-V3 PM table 3-1, weekly chain lubrication " +
      "with high-temperature oil (a curing oven, used as an analogue).",
  },
  {
    id: "monthly-profile-exhaust-alarm",
    title: "Verify profile and test exhaust-failure alarm",
    kind: "preventive",
    trigger: {
      type: "calendar",
      recurrence: { kind: "monthly-weekday", interval: 1, ordinal: 1, weekday: "MO" },
      startTime: "08:00",
    },
    estimatedMinutes: 40,
    instructions:
      "Run the reference test board with calibrated probes and record it as a verification run; " +
      "compare with the oven's baseline. Then test that an exhaust failure raises the alarm: a " +
      "failed exhaust leads to uneven heating.",
    checklist: [
      item("verification-run", "Verification run recorded with the reference board"),
      item("within-window", "Run within the process window (or a corrective order raised)"),
      item("exhaust-alarm", "Exhaust-failure alarm raised when tested"),
    ],
    involves: none,
    cautions: ["fluxFumes", "verdicts"],
    source:
      "Common practice; REFERENCES §8: Nordson Asymtek TC-V3 table 3-1 (monthly reproducibility " +
      "check and exhaust-failure alarm test, an analogue); IPC-7801 draft (baseline plus periodic " +
      "verification); smtnet forum thread on exhaust failure.",
  },
  {
    id: "quarterly-blower-bearings",
    title: "Check blower motors and bearings",
    kind: "preventive",
    trigger: {
      type: "calendar",
      recurrence: { kind: "monthly-weekday", interval: 3, ordinal: 1, weekday: "TU" },
      startTime: "07:00",
    },
    estimatedMinutes: 60,
    instructions:
      "Locked out and cool: spin each convection blower by hand and listen and feel for bearing " +
      "roughness or play; check the impellers for flux build-up and balance. Worn bearings widen " +
      "the spread across the board long before they fail.",
    checklist: [
      item("bearings", "Each blower turns freely, without roughness or play"),
      item("impellers", "Impellers clean and undamaged"),
      item("noise-running", "No unusual noise or vibration after restart"),
    ],
    involves: { ...none, chamber: true, movingParts: true },
    cautions: ["lockoutTagout"],
    source: "Common practice (monthly to quarterly); REFERENCES §8, blower/fan motors and bearings.",
  },
  {
    id: "quarterly-conveyor-speed",
    title: "Verify conveyor speed, width and parallelism",
    kind: "preventive",
    trigger: {
      type: "calendar",
      recurrence: { kind: "monthly-weekday", interval: 3, ordinal: 1, weekday: "TH" },
      startTime: "07:00",
    },
    estimatedMinutes: 30,
    instructions:
      "Time the conveyor over a measured length and compare with the displayed speed; the example " +
      "tolerance seen is ±1 cm/min. Check rail width and parallelism along the oven.",
    checklist: [
      item("speed", "Measured speed agrees with the display within tolerance"),
      item("width", "Rail width correct at entry, middle and exit"),
      item("parallel", "Rails parallel along the oven"),
    ],
    involves: none,
    cautions: [],
    source:
      "Common practice; REFERENCES §8: Nordson Asymtek TC-V3 table 3-1, quarterly conveyor-speed " +
      "verification ±1 cm/min (an analogue); conveyor width and parallelism.",
  },
  {
    id: "quarterly-heater-elements",
    title: "Check heater elements and connections",
    kind: "preventive",
    trigger: {
      type: "calendar",
      recurrence: { kind: "monthly-weekday", interval: 3, ordinal: 2, weekday: "TU" },
      startTime: "07:00",
    },
    estimatedMinutes: 90,
    instructions:
      "Qualified person only, with the oven locked out: measure each heater element's resistance " +
      "against the maker's value and check terminals for discolouration or looseness. Replace only " +
      "with the maker's specified part.",
    checklist: [
      item("resistance", "Each element's resistance recorded and within the maker's range"),
      item("terminals", "Terminals tight, no discolouration"),
      item("zone-response", "Each zone reaches its set point after restart"),
    ],
    involves: { heaters: true, wiring: true, chamber: true, movingParts: false },
    cautions: ["lockoutTagout", "certification"],
    source: "Common practice (monthly to quarterly); REFERENCES §8, heater elements.",
  },
  {
    id: "monthly-nitrogen-o2",
    title: "Check nitrogen flow and O₂ analyser",
    kind: "preventive",
    trigger: { type: "calendar", recurrence: { kind: "monthly-day", interval: 1, dayOfMonth: 15 }, startTime: "07:00" },
    estimatedMinutes: 30,
    instructions:
      "Where the oven runs with nitrogen: check supply pressure and flow against the recipe, and " +
      "check the O₂ analyser's reading against its reference gas.",
    checklist: [
      item("n2-flow", "Nitrogen pressure and flow as specified"),
      item("o2-check", "O₂ analyser agrees with the reference gas"),
      item("leaks", "No leaks at fittings"),
    ],
    involves: none,
    whereFitted: "nitrogen",
    cautions: ["nitrogen"],
    source: "Common practice (monthly to quarterly); REFERENCES §8, N₂ flow and the O₂ analyser.",
  },
  {
    id: "probe-inspection-runs",
    title: "Inspect profiling thermocouples",
    kind: "preventive",
    trigger: { type: "runs", everyRuns: 50 },
    estimatedMinutes: 15,
    instructions:
      "Inspect the test board's thermocouples and their attachment; a probe that has lifted reads " +
      "air, not the board. Replace damaged probes. (50 runs is an example; use your probe " +
      "supplier's guidance.)",
    checklist: [
      item("attachment", "Every probe firmly attached to the board"),
      item("insulation", "No damaged insulation or kinked leads"),
      item("replaced", "Probes replaced (list them)", false),
    ],
    involves: none,
    cautions: [],
    source:
      "Common practice; REFERENCES §8: replace profiling thermocouples when damaged or after a " +
      "number of passes; attachment errors (Indium blog).",
  },
  {
    id: "annual-logger-calibration",
    title: "Calibrate data logger and thermocouples",
    kind: "calibration",
    trigger: { type: "calendar", recurrence: { kind: "yearly", interval: 1 }, startTime: "09:00" },
    estimatedMinutes: 30,
    instructions:
      "Send the profiler (data logger) and its thermocouples for calibration under the plant's " +
      "calibration system, and enter the new certificate and per-channel offsets on the instrument.",
    checklist: [
      item("sent", "Logger and probes sent to the calibration lab"),
      item("certificate", "Certificate received and attached"),
      item("offsets", "Per-channel offsets entered on the instrument"),
    ],
    involves: none,
    cautions: [],
    source:
      "Common practice (ISO 9001 / IATF 16949 calibration systems); REFERENCES §8: annual " +
      "calibration; smtnet forum (profiler sent out for calibration).",
  },
];

/** True when the task opens the chamber or touches heaters, wiring or moving parts. */
export function requiresLockout(template: PmTemplate): boolean {
  const i = template.involves;
  return i.heaters || i.wiring || i.chamber || i.movingParts;
}
