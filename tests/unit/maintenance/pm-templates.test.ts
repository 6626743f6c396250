import { describe, expect, it } from "vitest";
import { CAUTION_IDS, CAUTIONS } from "@/lib/maintenance/cautions";
import { REFLOW_PM_TEMPLATES, requiresLockout } from "@/lib/maintenance/pm-templates";
import { buildRrule, describeRrule } from "@/lib/maintenance/rrule-builder";
import { nextOccurrences } from "@/lib/maintenance/recurrence";

describe("REFLOW_PM_TEMPLATES", () => {
  it("ids are unique, and checklist ids are unique within each template", () => {
    const ids = REFLOW_PM_TEMPLATES.map((t) => t.id);
    expect(new Set(ids).size).toBe(ids.length);
    for (const t of REFLOW_PM_TEMPLATES) {
      const itemIds = t.checklist.map((i) => i.id);
      expect(new Set(itemIds).size, t.id).toBe(itemIds.length);
      expect(t.checklist.some((i) => i.mandatory), t.id).toBe(true);
    }
  });

  it("every calendar template builds a valid RRULE that produces occurrences at its start time", () => {
    for (const t of REFLOW_PM_TEMPLATES) {
      if (t.trigger.type !== "calendar") continue;
      const rrule = buildRrule(t.trigger.recurrence);
      expect(describeRrule(rrule), t.id).not.toMatch(/^Invalid/);
      const next = nextOccurrences({ rrule, dtstartLocal: `2026-01-05T${t.trigger.startTime}`, timeZone: "Europe/Dublin", after: new Date("2026-01-01Z") }, 2);
      expect(next, t.id).toHaveLength(2);
      // Read the local time back with Intl, independently of our conversion.
      const local = new Intl.DateTimeFormat("en-GB", { timeZone: "Europe/Dublin", hour: "2-digit", minute: "2-digit", hourCycle: "h23" });
      for (const d of next) expect(local.format(d), t.id).toBe(t.trigger.startTime);
    }
  });

  it("covers the typical reflow-oven tasks and intervals", () => {
    const describe = (id: string) => {
      const t = REFLOW_PM_TEMPLATES.find((x) => x.id === id)!;
      return t.trigger.type === "calendar" ? describeRrule(buildRrule(t.trigger.recurrence)) : t.trigger;
    };
    expect(describe("daily-conveyor-zones")).toBe("Every day");
    expect(describe("weekly-exhaust-traps")).toBe("Every week on Monday");
    expect(describe("weekly-chain-lube")).toBe("Every week on Wednesday");
    expect(describe("monthly-profile-exhaust-alarm")).toBe("Every month on the 1st Monday");
    expect(describe("quarterly-blower-bearings")).toBe("Every 3 months on the 1st Tuesday");
    expect(describe("quarterly-conveyor-speed")).toBe("Every 3 months on the 1st Thursday");
    expect(describe("quarterly-heater-elements")).toBe("Every 3 months on the 2nd Tuesday");
    expect(describe("monthly-nitrogen-o2")).toBe("Every month on the 15th");
    expect(describe("annual-logger-calibration")).toBe("Every year");
    expect(describe("probe-inspection-runs")).toEqual({ type: "runs", everyRuns: 50 });
  });

  it("shows the lock-out/tag-out caution exactly when heaters, wiring, chamber or moving parts are involved", () => {
    for (const t of REFLOW_PM_TEMPLATES) {
      expect(t.cautions.includes("lockoutTagout"), t.id).toBe(requiresLockout(t));
    }
    const heater = REFLOW_PM_TEMPLATES.find((t) => t.id === "quarterly-heater-elements")!;
    expect(heater.involves).toMatchObject({ heaters: true, wiring: true });
    expect(heater.cautions).toContain("certification");
    const n2 = REFLOW_PM_TEMPLATES.find((t) => t.whereFitted === "nitrogen")!;
    expect(n2.cautions).toContain("nitrogen");
  });

  it("names its source, as common practice", () => {
    for (const t of REFLOW_PM_TEMPLATES) expect(t.source, t.id).toMatch(/^Common practice/);
    expect(REFLOW_PM_TEMPLATES.find((t) => t.id === "weekly-exhaust-traps")!.source).toContain("REFERENCES §8");
  });
});

describe("CAUTIONS", () => {
  it("has the five cautions, each keyed by its own id, with the product's wording", () => {
    expect(Object.keys(CAUTIONS).sort()).toEqual([...CAUTION_IDS].sort());
    for (const id of CAUTION_IDS) expect(CAUTIONS[id].id).toBe(id);
    expect(CAUTIONS.lockoutTagout.text).toContain("lock-out/tag-out procedure");
    expect(CAUTIONS.fluxFumes.text).toContain("respiratory hazard");
    expect(CAUTIONS.nitrogen.text).toContain("oxygen depletion");
    expect(CAUTIONS.certification.text).toContain("void the equipment's safety certification");
    expect(CAUTIONS.verdicts.text).toContain("do not replace");
  });
});
