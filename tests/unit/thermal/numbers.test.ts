import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { parseDecimal } from "@/lib/thermal/numbers";

describe("parseDecimal", () => {
  it("reads exactly what Number() reads for plain decimal numbers, with a point or a comma", () => {
    fc.assert(
      fc.property(fc.double({ noNaN: true, noDefaultInfinity: true, min: -1e6, max: 1e6 }), fc.integer({ min: 0, max: 6 }), (x, digits) => {
        for (const s of [String(x), x.toFixed(digits)]) {
          expect(parseDecimal(s, false)).toBe(Number(s));
          expect(parseDecimal(s.replace(".", ","), true)).toBe(Number(s));
        }
      }),
      { numRuns: 1000 },
    );
  });

  it("accepts spaces, a plus sign, exponents and long mantissas", () => {
    expect(parseDecimal("  12.5 ", false)).toBe(12.5);
    expect(parseDecimal("+3", false)).toBe(3);
    expect(parseDecimal("1.5e2", false)).toBe(150);
    expect(parseDecimal("1,5E-1", true)).toBe(0.15);
    expect(parseDecimal("0.1234567890123456789", false)).toBe(0.1234567890123456789);
    expect(parseDecimal(".5", false)).toBe(0.5);
    expect(parseDecimal("-0", false)).toBe(-0);
  });

  it("refuses anything else", () => {
    for (const s of ["", " ", "-", ".", "abc", "12.5.1", "12,5", "0x10", "NaN", "Infinity", "1e400", "12 °C", "1 000", "--1", "1e", "1.2.3e4"]) {
      expect(parseDecimal(s, false), JSON.stringify(s)).toBeNaN();
    }
    expect(parseDecimal("12.5", true)).toBeNaN();
  });
});
