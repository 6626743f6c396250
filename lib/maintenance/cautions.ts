/*
 * Cautions shown in the product (product brief §6). Pages show them beside the work they
 * concern: lock-out/tag-out on any task that opens the chamber or touches heaters, wiring or
 * moving parts; certification on change forms and heater work; and so on.
 */

export const CAUTION_IDS = ["lockoutTagout", "fluxFumes", "nitrogen", "certification", "verdicts"] as const;
export type CautionId = (typeof CAUTION_IDS)[number];

export type Caution = { id: CautionId; title: string; text: string };

export const CAUTIONS: Record<CautionId, Caution> = {
  lockoutTagout: {
    id: "lockoutTagout",
    title: "Lock out before you start",
    text:
      "Maintenance on an oven: isolate and lock out power, let the chamber cool, and follow the " +
      "site's lock-out/tag-out procedure and local electrical codes. Heater and wiring work is for " +
      "qualified people only.",
  },
  fluxFumes: {
    id: "fluxFumes",
    title: "Flux fumes",
    text: "Flux fumes are a respiratory hazard: keep extraction running and filters serviced.",
  },
  nitrogen: {
    id: "nitrogen",
    title: "Nitrogen atmosphere",
    text: "Ovens with a nitrogen atmosphere: risk of oxygen depletion in enclosed spaces.",
  },
  certification: {
    id: "certification",
    title: "Safety certification",
    text:
      "Modifying heating, wiring or airflow may void the equipment's safety certification; follow " +
      "the maker's guidance and local codes.",
  },
  verdicts: {
    id: "verdicts",
    title: "Verdicts support people",
    text:
      "Ovenward's verdicts support, and do not replace, the paste maker's and component makers' " +
      "specifications and the plant's qualified process owners.",
  },
};
