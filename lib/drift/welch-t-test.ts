// Change impact: Welch's unequal-variance t-test (Welch 1947) of the runs after a change
// against the runs before it. difference = mean(after) − mean(before); t = difference / SE;
// df by Welch–Satterthwaite; the CI uses the Student t quantile at that (fractional) df.
import { mean, sampleSd } from "./stats";
import { studentTCdf, studentTQuantile, studentTTwoSidedP, studentTUpperTail } from "./student-t";

export interface GroupSummary {
  n: number;
  mean: number;
  sd: number;
}

export interface WelchResult {
  before: GroupSummary;
  after: GroupSummary;
  difference: number;
  standardError: number;
  t: number;
  df: number;
  pTwoSided: number;
  /** One-sided p for "after is smaller": P(T ≤ t), precise even when tiny. */
  pLower: number;
  /** One-sided p for "after is larger": P(T ≥ t). */
  pUpper: number;
  confidence: number;
  ci: [number, number];
}

export function summarize(values: readonly number[]): GroupSummary {
  return { n: values.length, mean: mean(values), sd: sampleSd(values) };
}

/**
 * From summary statistics. Null when a group has fewer than two runs. When both groups have
 * zero spread the test is undefined: t, df and p are NaN and the CI collapses to the difference.
 */
export function welchTTestFromSummary(
  before: GroupSummary,
  after: GroupSummary,
  options: { confidence?: number } = {},
): WelchResult | null {
  if (before.n < 2 || after.n < 2) return null;
  const confidence = options.confidence ?? 0.95;
  const vb = (before.sd * before.sd) / before.n;
  const va = (after.sd * after.sd) / after.n;
  const difference = after.mean - before.mean;
  const standardError = Math.sqrt(vb + va);
  if (standardError === 0) {
    return { before, after, difference, standardError, t: NaN, df: NaN, pTwoSided: NaN, pLower: NaN, pUpper: NaN, confidence, ci: [difference, difference] };
  }
  const t = difference / standardError;
  const df = (vb + va) ** 2 / ((vb * vb) / (before.n - 1) + (va * va) / (after.n - 1));
  const half = studentTQuantile(1 - (1 - confidence) / 2, df) * standardError;
  return {
    before,
    after,
    difference,
    standardError,
    t,
    df,
    pTwoSided: studentTTwoSidedP(t, df),
    pLower: studentTCdf(t, df),
    pUpper: studentTUpperTail(t, df),
    confidence,
    ci: [difference - half, difference + half],
  };
}

export function welchTTest(
  before: readonly number[],
  after: readonly number[],
  options: { confidence?: number } = {},
): WelchResult | null {
  return welchTTestFromSummary(summarize(before), summarize(after), options);
}
