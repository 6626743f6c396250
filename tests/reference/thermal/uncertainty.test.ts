import { describe, expect, it } from "vitest";
import {
  combinedUncertainty, expandedUncertainty, thermocoupleTolerance, uFromExpanded, uOfMean, uRectangular, uTriangular,
} from "@/lib/thermal/uncertainty";

describe("thermocouple tolerance classes", () => {
  /*
   * IEC 60584-1:2013 classes (Pico Technology table; therncway.net JIS/IEC/ASTM comparison) and
   * ASTM E230/E230M limits of error above 0 °C (Pelican Wire; ASTM E230/E230M-12 tolerance table as copied on Scribd):
   * tolerance = greater of the fixed value and the fraction of |t|. Values at reflow
   * temperatures and the crossover points are REFERENCES §3 [COMPUTED].
   */
  it("type K at 183–260 °C: IEC class 1 ±1.5, class 2 ±2.5; ASTM special ±1.1, standard ±2.2", () => {
    for (const t of [183, 217, 250, 260]) {
      expect(thermocoupleTolerance("K", "iec-1", t)).toBe(1.5);
      expect(thermocoupleTolerance("K", "iec-2", t)).toBe(2.5);
      expect(thermocoupleTolerance("K", "astm-special", t)).toBe(1.1);
      expect(thermocoupleTolerance("K", "astm-standard", t)).toBe(2.2);
    }
  });

  it("type K at 300 °C: ASTM special ±1.2, standard ±2.25", () => {
    expect(thermocoupleTolerance("K", "astm-special", 300)).toBeCloseTo(1.2, 12);
    expect(thermocoupleTolerance("K", "astm-standard", 300)).toBeCloseTo(2.25, 12);
  });

  it("type T at 250 °C: class 1 ±1.0, class 2 ±1.875, ASTM special and standard identical", () => {
    expect(thermocoupleTolerance("T", "iec-1", 250)).toBeCloseTo(1.0, 12);
    expect(thermocoupleTolerance("T", "iec-2", 250)).toBeCloseTo(1.875, 12);
    expect(thermocoupleTolerance("T", "astm-special", 250)).toBeCloseTo(1.0, 12);
    expect(thermocoupleTolerance("T", "astm-standard", 250)).toBeCloseTo(1.875, 12);
  });

  it("switches to the proportional term at the published crossover points", () => {
    const crossovers: Array<[Parameters<typeof thermocoupleTolerance>[0], Parameters<typeof thermocoupleTolerance>[1], number, number]> = [
      ["K", "iec-1", 375, 1.5], ["J", "iec-1", 375, 1.5], ["K", "iec-2", 1000 / 3, 2.5], ["J", "iec-2", 1000 / 3, 2.5],
      ["T", "iec-1", 125, 0.5], ["T", "iec-2", 400 / 3, 1.0], ["K", "astm-special", 275, 1.1], ["K", "astm-standard", 880 / 3, 2.2],
    ];
    for (const [type, cls, t, fixed] of crossovers) {
      expect(thermocoupleTolerance(type, cls, t - 1), `${type} ${cls} below`).toBeCloseTo(fixed, 12);
      expect(thermocoupleTolerance(type, cls, t), `${type} ${cls} at`).toBeCloseTo(fixed, 9);
      expect(thermocoupleTolerance(type, cls, t + 10)!, `${type} ${cls} above`).toBeGreaterThan(fixed);
    }
  });

  it("covers N like K, E by ASTM (±1.7 °C or 0.5 %), and class 3 below zero", () => {
    expect(thermocoupleTolerance("N", "iec-1", 800)).toBeCloseTo(3.2, 12);
    expect(thermocoupleTolerance("E", "astm-standard", 250)).toBe(1.7);
    expect(thermocoupleTolerance("E", "astm-standard", 500)).toBeCloseTo(2.5, 12);
    expect(thermocoupleTolerance("E", "astm-special", 500)).toBeCloseTo(2.0, 12);
    expect(thermocoupleTolerance("K", "iec-3", -100)).toBe(2.5);
    expect(thermocoupleTolerance("K", "iec-3", -200)).toBeCloseTo(3.0, 12);
    expect(thermocoupleTolerance("T", "iec-3", -200)).toBeCloseTo(3.0, 12);
  });

  it("answers null outside a class's range and for combinations the sources do not tabulate", () => {
    expect(thermocoupleTolerance("K", "iec-3", 250)).toBeNull();
    expect(thermocoupleTolerance("J", "iec-3", 0)).toBeNull();
    expect(thermocoupleTolerance("E", "iec-1", 250)).toBeNull();
    expect(thermocoupleTolerance("T", "iec-1", 400)).toBeNull();
    expect(thermocoupleTolerance("K", "astm-standard", -10)).toBeNull();
  });
});

describe("GUM helpers (JCGM 100:2008)", () => {
  it("rectangular a/√3, triangular a/√6, normal U/k, mean s/√n", () => {
    // GUM 4.3.7: 1/√3 = 0.577350; EURACHEM/CITAC example: a range 7–10, a = 1.5 → u = 0.87.
    expect(uRectangular(1)).toBeCloseTo(0.57735, 6);
    expect(uRectangular(1.5)).toBeCloseTo(0.87, 2);
    // GUM 4.3.9: 1/√6 = 0.408248.
    expect(uTriangular(1)).toBeCloseTo(0.408248, 6);
    expect(uFromExpanded(0.5, 2)).toBe(0.25);
    expect(uOfMean(0.3, 5)).toBeCloseTo(0.1342, 4);
  });

  it("reproduces the illustrative type K class 1 budget at 250 °C: u_c 0.9118 °C, U(k=2) 1.8235 °C", () => {
    // REFERENCES §7 illustrative budget (computed, not a published reference).
    const tolerance = uRectangular(thermocoupleTolerance("K", "iec-1", 250)!);
    const resolution = uRectangular(0.1 / 2);
    const certificate = uFromExpanded(0.5, 2);
    const repeatability = uOfMean(0.3, 5);
    expect(tolerance).toBeCloseTo(0.866, 4);
    expect(resolution).toBeCloseTo(0.0289, 4);
    const uc = combinedUncertainty([tolerance, resolution, certificate, repeatability]);
    expect(uc).toBeCloseTo(0.9118, 4);
    expect(expandedUncertainty(uc)).toBeCloseTo(1.8235, 4);
    expect(expandedUncertainty(uc, 3)).toBeCloseTo(3 * uc, 12);
  });

  it("applies sensitivity coefficients", () => {
    expect(combinedUncertainty([{ u: 3, c: 2 }, { u: 8 }])).toBe(10);
  });
});
