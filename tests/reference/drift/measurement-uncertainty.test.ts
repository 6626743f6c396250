import { describe, expect, it } from "vitest";
import { measurementUncertainty, standardUncertainty, type UncertaintyComponent } from "@/lib/drift/measurement-uncertainty";

describe("GUM Type B rectangular distribution (GUM 4.3.7; EURACHEM/CITAC example, REFERENCES §7)", () => {
  it("a range from 7 to 10 gives a = 1.5 and u = 1.5/√3 = 0.87", () => {
    const u = standardUncertainty({ label: "range", kind: "rectangular", halfWidth: (10 - 7) / 2 });
    expect(u).toBeCloseTo(0.87, 2);
  });

  it("triangular factor 1/√6 = 0.408248 and rectangular factor 1/√3 = 0.577350 (REFERENCES §7 rules)", () => {
    expect(standardUncertainty({ label: "t", kind: "triangular", halfWidth: 1 })).toBeCloseTo(0.408248, 6);
    expect(standardUncertainty({ label: "r", kind: "rectangular", halfWidth: 1 })).toBeCloseTo(0.57735, 6);
  });
});

describe("illustrative Type K class 1 budget at 250 °C (REFERENCES §7, marked NOT a published reference, [COMPUTED])", () => {
  const budget: UncertaintyComponent[] = [
    { label: "thermocouple tolerance", kind: "rectangular", halfWidth: 1.5, systematic: true },
    { label: "logger resolution", kind: "resolution", step: 0.1 },
    { label: "logger calibration certificate", kind: "expanded", expanded: 0.5, k: 2, systematic: true },
    { label: "repeatability", kind: "typeA", sd: 0.3, n: 5 },
  ];

  it("component u values 0.8660, 0.0289, 0.25, 0.1342", () => {
    const rows = measurementUncertainty(budget).components.map((c) => c.u);
    [0.866, 0.0289, 0.25, 0.1342].forEach((v, k) => expect(rows[k]).toBeCloseTo(v, 4));
  });

  it("u_c = 0.9118 °C and U (k = 2) = 1.8235 °C", () => {
    const r = measurementUncertainty(budget);
    expect(r.combined).toBeCloseTo(0.9118, 4);
    expect(r.expanded).toBeCloseTo(1.8235, 4);
    expect(r.coverageFactor).toBe(2);
  });
});
