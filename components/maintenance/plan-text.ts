import type { PlanRow } from "@/db/schema/maintenance";
import { describeRrule } from "@/lib/maintenance/rrule-builder";
import { nextOccurrences } from "@/lib/maintenance/recurrence";

// How a plan's trigger reads on the plan list and the oven page.
export function triggerText(p: PlanRow, timeZone: string) {
  if (p.rrule) {
    try {
      return describeRrule(p.rrule, { timeZone });
    } catch {
      return p.rrule;
    }
  }
  if (p.everyRuns) return `Every ${p.everyRuns} verification runs`;
  if (p.everyHeaterHours) return `Every ${p.everyHeaterHours} heater hours`;
  return "No trigger";
}

export function nextDue(p: PlanRow, timeZone: string, now: Date) {
  if (!p.rrule || !p.dtstartLocal || !p.active) return null;
  try {
    return nextOccurrences({ rrule: p.rrule, dtstartLocal: p.dtstartLocal, timeZone, after: now }, 1)[0] ?? null;
  } catch {
    return null;
  }
}

