// Crafted (invented) sequences on a baseline of centre 0 and σ 1; each case checks that a rule
// fires exactly at the point that completes it and not one point earlier. Rule definitions:
// Western Electric (1956) and Nelson (1984) as summarised in REFERENCES §4e.
import { describe, expect, it } from "vitest";
import { firedAt } from "./helpers";

describe("beyond3Sigma (Nelson 1 / WE 1)", () => {
  it("fires only on a point strictly beyond 3σ, on either side", () => {
    expect(firedAt([0.5, -0.5, 3.0, 3.01, -2.9, -3.2], "beyond3Sigma")).toEqual([3, 5]);
  });
});

describe("nineOneSide (Nelson 2)", () => {
  const nineAbove = [0.5, 0.2, 0.6, 0.3, 0.7, 0.1, 0.4, 0.2, 0.5];
  it("fires on the ninth point in a row above the centre, and keeps firing while the run lasts", () => {
    expect(firedAt([-0.4, ...nineAbove, 0.3], "nineOneSide")).toEqual([9, 10]);
  });
  it("eight in a row is not enough", () => {
    expect(firedAt([-0.4, ...nineAbove.slice(0, 8), -0.1], "nineOneSide")).toEqual([]);
  });
  it("below the centre too", () => {
    expect(firedAt(nineAbove.map((v) => -v), "nineOneSide")).toEqual([8]);
  });
  it("a point exactly on the centre breaks the run", () => {
    expect(firedAt([0.5, 0.2, 0.6, 0.3, 0, 0.7, 0.1, 0.4, 0.2, 0.5, 0.3, 0.6, 0.2], "nineOneSide")).toEqual([]);
    expect(firedAt([0.5, 0.2, 0.6, 0.3, 0, 0.7, 0.1, 0.4, 0.2, 0.5, 0.3, 0.6, 0.2, 0.4], "nineOneSide")).toEqual([13]);
  });
});

describe("sixTrending (Nelson 3: six points in a row, each higher / lower than the one before)", () => {
  it("fires on the sixth rising point (five rises), not the fifth", () => {
    expect(firedAt([0, -0.5, -0.3, -0.1, 0.1, 0.3, 0.5, 0.4], "sixTrending")).toEqual([6]);
  });
  it("falling works the same way and keeps firing", () => {
    expect(firedAt([0.6, 0.5, 0.3, 0.2, 0.0, -0.1, -0.4, 0.0], "sixTrending")).toEqual([5, 6]);
  });
  it("an equal value breaks the run", () => {
    const flatInside = [0.1, 0.2, 0.3, 0.3, 0.4, 0.5, 0.6, 0.7];
    expect(firedAt(flatInside, "sixTrending")).toEqual([]);
    expect(firedAt([...flatInside, 0.8], "sixTrending")).toEqual([8]);
  });
});

describe("twoOfThree (Nelson 5 / WE 2: two of three beyond 2σ on one side)", () => {
  it("fires on the second point beyond 2σ within three consecutive points", () => {
    expect(firedAt([0, 2.1, 0.5, 2.2], "twoOfThree")).toEqual([3]);
    expect(firedAt([0, 2.5, 2.5], "twoOfThree")).toEqual([2]);
  });
  it("does not fire when the two are four points apart, on opposite sides, or at exactly 2σ", () => {
    expect(firedAt([2.1, 0, 0, 2.2], "twoOfThree")).toEqual([]);
    expect(firedAt([2.1, -2.2, 0], "twoOfThree")).toEqual([]);
    expect(firedAt([2.0, 2.0, 2.0], "twoOfThree")).toEqual([]);
  });
  it("below the centre", () => {
    expect(firedAt([-2.3, 0.1, -2.05], "twoOfThree")).toEqual([2]);
  });
});

describe("ewma and cusum signals (defaults λ = 0.2, L = 3, k = 0.5σ, h = 5σ)", () => {
  it("CUSUM on a sustained +1σ shift: S_hi = 0.5·i first exceeds 5 at i = 11", () => {
    const fired = firedAt(Array(14).fill(1), "cusum");
    expect(fired[0]).toBe(10);
    expect(fired).toEqual([10, 11, 12, 13]);
  });
  it("CUSUM low side on a sustained −1σ shift", () => {
    expect(firedAt(Array(11).fill(-1), "cusum")).toEqual([10]);
  });
  it("EWMA on a +1.5σ shift: zᵢ = 1.5(1 − 0.8ⁱ) first exceeds 3√(λ/(2−λ)(1 − 0.64ⁱ)) at i = 5", () => {
    expect(firedAt(Array(6).fill(1.5), "ewma")).toEqual([4, 5]);
  });
});

describe("flat baseline (σ = 0)", () => {
  const flat = { mean: 2, sigma: 0 };
  it("σ-based signals stay silent instead of dividing by zero", () => {
    const values = [2.5, 3, 9, 9, 9, 9, 9, 9, 9, 9, 9];
    for (const s of ["beyond3Sigma", "twoOfThree", "ewma", "cusum"] as const) expect(firedAt(values, s, flat)).toEqual([]);
  });
  it("nine-on-one-side still works, since it needs no σ", () => {
    expect(firedAt([2.5, 3, 2.1, 2.2, 2.7, 2.6, 2.9, 2.3, 2.4], "nineOneSide", flat)).toEqual([8]);
  });
});
