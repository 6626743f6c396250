// Run rules on individual values against the baseline centre and σ (Western Electric 1956;
// Nelson 1984, rules 1, 2, 3 and 5). Each fires on every point while its condition holds.
//  - beyond3Sigma: the point is more than 3σ from the centre.
//  - nineOneSide: nine points in a row strictly on one side (a point exactly on the centre
//    breaks the run).
//  - sixTrending: six points in a row, each higher (or each lower) than the one before — five
//    strict steps in one direction; an equal value breaks the run.
//  - twoOfThree: this point and at least one of the two before it are more than 2σ from the
//    centre on the same side. The flagged point itself must be beyond 2σ.
// With σ = 0 the σ-based rules (beyond3Sigma, twoOfThree) cannot be evaluated and stay silent.
import { RECENT_LENGTH, sigmaUsable, type DriftState, type SignalName } from "./drift-types";

type Side = -1 | 0 | 1;
type Centre = { mean: number; sigma: number };

function sideOf(x: number, centre: number): Side {
  return x > centre ? 1 : x < centre ? -1 : 0;
}

/** +1 / −1 when x is more than 2σ above / below the centre, else 0. */
function beyondTwo(x: number, c: Centre): Side {
  if (!sigmaUsable(c.sigma)) return 0;
  if (x - c.mean > 2 * c.sigma) return 1;
  if (c.mean - x > 2 * c.sigma) return -1;
  return 0;
}

function beyondThree(x: number, c: Centre): boolean {
  return sigmaUsable(c.sigma) && Math.abs(x - c.mean) > 3 * c.sigma;
}

type RuleTail = Pick<DriftState, "recent" | "sideRun" | "trendRun">;

/** Incremental form: the rule signals for `x` and the updated tail, from the stored tail only. */
export function stepRunRules(tail: RuleTail, x: number, c: Centre): { tail: RuleTail; signals: SignalName[] } {
  const signals: SignalName[] = [];
  if (beyondThree(x, c)) signals.push("beyond3Sigma");

  const b2 = beyondTwo(x, c);
  const prev = tail.recent.slice(-2);
  if (b2 !== 0 && prev.some((p) => beyondTwo(p, c) === b2)) signals.push("twoOfThree");

  let trendRun = tail.trendRun;
  if (tail.recent.length > 0) {
    const step = sideOf(x, tail.recent[tail.recent.length - 1]);
    if (step === 0) trendRun = { direction: 0, steps: 0 };
    else if (step === trendRun.direction) trendRun = { direction: step, steps: trendRun.steps + 1 };
    else trendRun = { direction: step, steps: 1 };
  }
  if (trendRun.steps >= 5) signals.push("sixTrending");

  const side = sideOf(x, c.mean);
  let sideRun: RuleTail["sideRun"];
  if (side === 0) sideRun = { side: 0, length: 0 };
  else if (side === tail.sideRun.side) sideRun = { side, length: tail.sideRun.length + 1 };
  else sideRun = { side, length: 1 };
  if (sideRun.length >= 9) signals.push("nineOneSide");

  const recent = [...tail.recent, x].slice(-RECENT_LENGTH);
  return { tail: { recent, sideRun, trendRun }, signals };
}

/** Batch form: the rule signals at `index`, looking back over the whole series. */
export function runRuleSignalsAt(values: readonly number[], index: number, c: Centre): SignalName[] {
  const x = values[index];
  const signals: SignalName[] = [];
  if (beyondThree(x, c)) signals.push("beyond3Sigma");

  const b2 = beyondTwo(x, c);
  const before = values.slice(Math.max(0, index - 2), index);
  if (b2 !== 0 && before.some((p) => beyondTwo(p, c) === b2)) signals.push("twoOfThree");

  if (index >= 5) {
    const dir = sideOf(values[index - 4], values[index - 5]);
    let trending = dir !== 0;
    for (let j = index - 3; j <= index && trending; j++) trending = sideOf(values[j], values[j - 1]) === dir;
    if (trending) signals.push("sixTrending");
  }

  if (index >= 8) {
    const side = sideOf(values[index - 8], c.mean);
    let run = side !== 0;
    for (let j = index - 7; j <= index && run; j++) run = sideOf(values[j], c.mean) === side;
    if (run) signals.push("nineOneSide");
  }
  return signals;
}

/** Tail summary at the end of a series, computed by looking back (used by the batch path). */
export function runRuleTailAt(values: readonly number[], c: Centre): RuleTail {
  const n = values.length;
  const recent = values.slice(-RECENT_LENGTH);
  let sideRun: RuleTail["sideRun"] = { side: 0, length: 0 };
  if (n > 0) {
    const side = sideOf(values[n - 1], c.mean);
    let length = 0;
    if (side !== 0) while (length < n && sideOf(values[n - 1 - length], c.mean) === side) length++;
    sideRun = { side, length };
  }
  let trendRun: RuleTail["trendRun"] = { direction: 0, steps: 0 };
  if (n > 1) {
    const direction = sideOf(values[n - 1], values[n - 2]);
    let steps = 0;
    if (direction !== 0) while (n - 2 - steps >= 0 && sideOf(values[n - 1 - steps], values[n - 2 - steps]) === direction) steps++;
    trendRun = { direction, steps };
  }
  return { recent, sideRun, trendRun };
}
