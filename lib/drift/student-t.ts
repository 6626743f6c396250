// Student t distribution: CDF through the regularized incomplete beta function
// (continued fraction evaluated by the modified Lentz method, as in Numerical Recipes §6.4),
// and the quantile by bisection on that CDF.

const LANCZOS_G = 7;
const LANCZOS = [
  0.99999999999980993, 676.5203681218851, -1259.1392167224028, 771.32342877765313, -176.61502916214059,
  12.507343278686905, -0.13857109526572012, 9.9843695780195716e-6, 1.5056327351493116e-7,
];

/** ln Γ(x) by the Lanczos approximation (g = 7, 9 terms); reflection below 0.5. */
export function lnGamma(x: number): number {
  if (x < 0.5) return Math.log(Math.PI / Math.abs(Math.sin(Math.PI * x))) - lnGamma(1 - x);
  const xm = x - 1;
  let a = LANCZOS[0];
  const t = xm + LANCZOS_G + 0.5;
  for (let i = 1; i < LANCZOS.length; i++) a += LANCZOS[i] / (xm + i);
  return 0.5 * Math.log(2 * Math.PI) + (xm + 0.5) * Math.log(t) - t + Math.log(a);
}

const FPMIN = 1e-300;
const EPS = 1e-16;

/** Continued fraction for I_x(a, b), modified Lentz. */
function betaContinuedFraction(a: number, b: number, x: number): number {
  const qab = a + b;
  const qap = a + 1;
  const qam = a - 1;
  let c = 1;
  let d = 1 - (qab * x) / qap;
  if (Math.abs(d) < FPMIN) d = FPMIN;
  d = 1 / d;
  let h = d;
  // Convergence takes O(√max(a, b)) terms; allow generously for large degrees of freedom.
  const maxIter = 1000 + Math.ceil(20 * Math.sqrt(Math.max(a, b)));
  for (let m = 1; m <= maxIter; m++) {
    const m2 = 2 * m;
    let aa = (m * (b - m) * x) / ((qam + m2) * (a + m2));
    d = 1 + aa * d;
    if (Math.abs(d) < FPMIN) d = FPMIN;
    c = 1 + aa / c;
    if (Math.abs(c) < FPMIN) c = FPMIN;
    d = 1 / d;
    h *= d * c;
    aa = (-(a + m) * (qab + m) * x) / ((a + m2) * (qap + m2));
    d = 1 + aa * d;
    if (Math.abs(d) < FPMIN) d = FPMIN;
    c = 1 + aa / c;
    if (Math.abs(c) < FPMIN) c = FPMIN;
    d = 1 / d;
    const del = d * c;
    h *= del;
    if (Math.abs(del - 1) < EPS) return h;
  }
  throw new Error(`incomplete beta continued fraction did not converge (a=${a}, b=${b}, x=${x})`);
}

/**
 * Regularized incomplete beta I_x(a, b). `y` = 1 − x may be passed when it is known more
 * precisely than 1 − x can be computed (it avoids cancellation near x = 1).
 */
export function regularizedIncompleteBeta(a: number, b: number, x: number, y: number = 1 - x): number {
  if (x <= 0) return 0;
  if (y <= 0) return 1;
  const lnFront = lnGamma(a + b) - lnGamma(a) - lnGamma(b) + a * Math.log(x) + b * Math.log(y);
  if (x < (a + 1) / (a + b + 2)) return (Math.exp(lnFront) * betaContinuedFraction(a, b, x)) / a;
  return 1 - (Math.exp(lnFront) * betaContinuedFraction(b, a, y)) / b;
}

/** P(T > t) for t ≥ 0, computed directly so tiny tails keep their relative precision. */
export function studentTUpperTail(t: number, df: number): number {
  if (!(df > 0)) throw new RangeError(`studentT: df must be > 0, got ${df}`);
  if (t === Infinity) return 0;
  if (t < 0) return 1 - studentTUpperTail(-t, df);
  const t2 = t * t;
  // P(|T| > t) = I_{df/(df+t²)}(df/2, 1/2)
  return 0.5 * regularizedIncompleteBeta(df / 2, 0.5, df / (df + t2), t2 / (df + t2));
}

/** P(T ≤ t) for Student's t with `df` degrees of freedom (df may be fractional). */
export function studentTCdf(t: number, df: number): number {
  return t >= 0 ? 1 - studentTUpperTail(t, df) : studentTUpperTail(-t, df);
}

/** Two-sided p-value P(|T| ≥ |t|). */
export function studentTTwoSidedP(t: number, df: number): number {
  return Math.min(1, 2 * studentTUpperTail(Math.abs(t), df));
}

/** t such that P(T ≤ t) = p, by bracketing and bisection on the upper tail. */
export function studentTQuantile(p: number, df: number): number {
  if (Number.isNaN(p) || p < 0 || p > 1) throw new RangeError(`studentTQuantile: p must be in [0, 1], got ${p}`);
  if (p === 0) return -Infinity;
  if (p === 1) return Infinity;
  if (p === 0.5) return 0;
  const tail = Math.min(p, 1 - p);
  let lo = 0;
  let hi = 1;
  while (studentTUpperTail(hi, df) > tail) {
    lo = hi;
    hi *= 2;
    if (hi > 1e300) break;
  }
  for (let i = 0; i < 2000 && hi - lo > 1e-15 * hi; i++) {
    const mid = 0.5 * (lo + hi);
    if (studentTUpperTail(mid, df) > tail) lo = mid;
    else hi = mid;
  }
  const t = 0.5 * (lo + hi);
  return p < 0.5 ? -t : t;
}
