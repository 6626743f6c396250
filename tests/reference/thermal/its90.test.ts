import { describe, expect, it } from "vitest";
import {
  celsiusFromEmf, emfMillivolts, inverseErrorBand, millivoltConverter, type ThermocoupleType,
} from "@/lib/thermal/its90";
import k0to300 from "./fixtures/its90-k-0-300.json";
import j0to300 from "./fixtures/its90-j-0-300.json";
import t0to300 from "./fixtures/its90-t-0-300.json";

/*
 * Source: NIST Standard Reference Database 60 / NIST Monograph 175 (Burns et al. 1993),
 * ITS-90 thermocouple tables and reference functions (all.tab, allcoeff.tab from
 * https://srdata.nist.gov/its90/download/). Table values are mV with the reference junction at
 * 0 °C, rounded by NIST to 0.001 mV. The fixtures hold every 1 °C value from 0 to 300 °C,
 * extracted from all.tab.
 */

// Check values from the NIST tables (all.tab).
const CHECK: Array<[number, number | null, number | null, number | null]> = [
  // t °C, type K, type J, type T
  [0, 0.0, 0.0, 0.0],
  [25, 1.0, 1.277, 0.992],
  [50, 2.023, null, null],
  [100, 4.096, 5.269, 4.279],
  [150, 6.138, null, null],
  [183, 7.46, 9.836, 8.393],
  [200, 8.138, null, null],
  [217, 8.819, 11.723, 10.2],
  [220, 8.94, null, null],
  [230, 9.343, null, null],
  [235, 9.545, null, null],
  [245, 9.95, null, null],
  [250, 10.153, 13.555, 12.013],
  [260, 10.561, 14.11, 12.574],
  [300, 12.209, 16.327, 14.862],
  [400, 16.397, null, null],
  [500, 20.644, null, null],
  [-100, -3.554, null, null],
];

const round3 = (x: number) => Math.round(x * 1000) / 1000;

describe("ITS-90 forward functions reproduce the NIST tables to 0.001 mV", () => {
  it.each(CHECK)("%s °C", (t, k, j, tt) => {
    const cases: Array<[ThermocoupleType, number | null]> = [["K", k], ["J", j], ["T", tt]];
    for (const [type, table] of cases) {
      if (table === null) continue;
      expect(round3(emfMillivolts(type, t)!), `type ${type}`).toBeCloseTo(table, 10);
    }
  });

  it.each([
    ["K", k0to300.emfMillivolts],
    ["J", j0to300.emfMillivolts],
    ["T", t0to300.emfMillivolts],
  ] as Array<[ThermocoupleType, number[]]>)("every 1 °C from 0 to 300 °C, type %s", (type, table) => {
    expect(table).toHaveLength(301);
    let worst = 0;
    table.forEach((e, t) => {
      const diff = Math.abs(emfMillivolts(type, t)! - e);
      worst = Math.max(worst, diff);
      expect(round3(emfMillivolts(type, t)!), `${type} at ${t} °C`).toBeCloseTo(e, 10);
    });
    // Pure rounding: at most half a table digit (REFERENCES §2 cross-check: ≤ 0.50 µV).
    expect(worst).toBeLessThanOrEqual(0.0005 + 1e-9);
  });

  it("includes type K's exponential term above 0 °C (it cancels c0 at 0 °C)", () => {
    expect(Math.abs(emfMillivolts("K", 0)!)).toBeLessThan(1e-6);
    // Type K Seebeck coefficient 40.5 µV/°C at 25 °C (REFERENCES §2, computed from NIST's function).
    expect((emfMillivolts("K", 25.5)! - emfMillivolts("K", 24.5)!) * 1000).toBeCloseTo(40.5, 1);
  });

  it("answers null outside the functions' ranges", () => {
    expect(emfMillivolts("K", 1400)).toBeNull();
    expect(emfMillivolts("T", 450)).toBeNull();
    expect(celsiusFromEmf("K", 60)).toBeNull();
    expect(celsiusFromEmf("T", -6)).toBeNull();
  });
});

describe("ITS-90 inverse functions stay within NIST's stated error bands", () => {
  // NIST error bands of the inverse polynomials (allcoeff.tab / all.tab), °C. The last column is
  // the slack allowed beyond the band: 0.001 °C for the sweep itself, except for type J below 0 °C
  // and above 760 °C. There NIST's own polynomials, fed the exact forward E(t), miss the stated
  // +0.03 °C: measured here, +0.033 °C at −5 °C and +0.037 °C at the 760 °C range boundary.
  // That is a property of the published coefficients, not of our code (the J forward function
  // matches the tables at −200, −100, 800, 1000 and 1190 °C below).
  const sweeps: Array<[ThermocoupleType, number, number, [number, number], number]> = [
    ["K", -200, 0, [-0.02, 0.04], 0.001],
    ["K", 0, 500, [-0.05, 0.04], 0.001],
    ["K", 500, 1372, [-0.05, 0.06], 0.001],
    ["J", -210, 0, [-0.05, 0.03], 0.01],
    ["J", 0, 760, [-0.04, 0.04], 0.001],
    ["J", 760, 1200, [-0.04, 0.03], 0.01],
    ["T", -200, 0, [-0.02, 0.04], 0.001],
    ["T", 0, 400, [-0.03, 0.03], 0.001],
  ];

  it.each(sweeps)("type %s, %s…%s °C, fed the exact E(t)", (type, from, to, [lo, hi], slack) => {
    let worstLow = 0;
    let worstHigh = 0;
    for (let t = from; t <= to; t += 0.25) {
      const err = celsiusFromEmf(type, emfMillivolts(type, t)!)! - t;
      worstLow = Math.min(worstLow, err);
      worstHigh = Math.max(worstHigh, err);
    }
    expect(worstLow).toBeGreaterThanOrEqual(lo - slack);
    expect(worstHigh).toBeLessThanOrEqual(hi + slack);
  });

  it("type J forward function matches NIST table values outside 0–300 °C", () => {
    // all.tab, type J: −200 °C −7.890, −100 °C −4.633, 800 °C 45.494, 1000 °C 57.953, 1190 °C 68.980 mV.
    const table: Array<[number, number]> = [[-200, -7.89], [-100, -4.633], [800, 45.494], [1000, 57.953], [1190, 68.98]];
    for (const [t, e] of table) expect(round3(emfMillivolts("J", t)!), `${t} °C`).toBeCloseTo(e, 10);
  });

  it("type K 0–500 °C worst errors match the published cross-check (−0.047 / +0.034 °C)", () => {
    let low = 0;
    let high = 0;
    for (let t = 0; t <= 500; t += 0.05) {
      const err = celsiusFromEmf("K", emfMillivolts("K", t)!)! - t;
      low = Math.min(low, err);
      high = Math.max(high, err);
    }
    // REFERENCES §2 [COMPUTED] cross-check of NIST's polynomials.
    expect(low).toBeCloseTo(-0.047, 3);
    expect(high).toBeCloseTo(0.034, 3);
  });

  it("reads the 3-decimal table E within the band plus the 0.0005 mV rounding (type K, 0–300 °C)", () => {
    k0to300.emfMillivolts.forEach((e, t) => {
      const err = celsiusFromEmf("K", e)! - t;
      // Band −0.05…+0.04 °C widened by 0.0005 mV ÷ 39.5 µV/°C ≈ 0.0127 °C.
      expect(err, `${t} °C`).toBeGreaterThanOrEqual(-0.0627);
      expect(err, `${t} °C`).toBeLessThanOrEqual(0.0527);
    });
    // Published example inverse values from table E (REFERENCES §2, computed).
    expect(celsiusFromEmf("K", 7.46)).toBeCloseTo(183.011, 3);
    expect(celsiusFromEmf("K", 8.819)).toBeCloseTo(216.966, 3);
    expect(celsiusFromEmf("K", 10.153)).toBeCloseTo(249.987, 3);
    expect(celsiusFromEmf("K", 10.561)).toBeCloseTo(259.998, 3);
  });

  it("knows which band applies", () => {
    expect(inverseErrorBand("K", 10)).toEqual([-0.05, 0.04]);
    expect(inverseErrorBand("K", 30)).toEqual([-0.05, 0.06]);
    expect(inverseErrorBand("T", 25)).toBeNull();
  });
});

describe("cold-junction compensation (REFERENCES §2 worked example)", () => {
  it("250 °C hot junction, 25 °C reference: 9.1531 mV → 249.996 °C; the naive sum gives 250.275 °C", () => {
    const measured = emfMillivolts("K", 250)! - emfMillivolts("K", 25)!;
    expect(measured).toBeCloseTo(9.1531, 4);
    const correct = millivoltConverter("K", 25)(9.1531)!;
    expect(correct).toBeCloseTo(249.996, 3);
    // The published naive figure was computed from the unrounded voltage (9.153126 mV);
    // from 9.1531 mV exactly the naive sum is 250.274 °C.
    const naive = celsiusFromEmf("K", measured)! + 25;
    expect(naive).toBeCloseTo(250.275, 3);
    expect(celsiusFromEmf("K", 9.1531)! + 25).toBeCloseTo(250.274, 3);
    expect(naive - correct).toBeGreaterThan(0.27);
  });

  it("returns null when the compensated voltage is outside the inverse range", () => {
    expect(millivoltConverter("K", 25)(60)).toBeNull();
    expect(() => millivoltConverter("K", 2000)).toThrow(RangeError);
  });
});
