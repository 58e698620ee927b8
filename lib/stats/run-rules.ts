/**
 * Run rules of the Shewhart control chart: the eight tests for special causes of
 * L. S. Nelson, "The Shewhart Control Chart — Tests for Special Causes",
 * Journal of Quality Technology 16(4), 1984, pp. 237–239, which gathered the zone
 * rules of the Western Electric Statistical Quality Control Handbook (1956) and
 * added trend and stratification tests. The zones are bands of one sigma about the
 * centre line: C within 1σ, B between 1σ and 2σ, A between 2σ and 3σ.
 *
 *   1  one point beyond 3σ (Western Electric rule 1)
 *   2  nine points in a row on the same side of the centre line (Western Electric's
 *      rule 4 counts eight; Nelson's nine keeps the false-alarm rate near test 1's)
 *   3  six points in a row steadily increasing or steadily decreasing
 *   4  fourteen points in a row alternating up and down
 *   5  two out of three points in a row beyond 2σ on the same side (Western Electric rule 2)
 *   6  four out of five points in a row beyond 1σ on the same side (Western Electric rule 3)
 *   7  fifteen points in a row within 1σ, on either side
 *   8  eight points in a row beyond 1σ, on either side, none within 1σ
 *
 * A point exactly on the centre line is on neither side (it ends a run of test 2); two equal
 * points in a row are neither an increase nor a decrease (they end tests 3 and 4). A test
 * signals at every point that completes its pattern, as Nelson's chart marks them.
 */

export const runRuleNumbers = [1, 2, 3, 4, 5, 6, 7, 8] as const;
export type RunRuleNumber = (typeof runRuleNumbers)[number];

/** Each test in words, for alerts and the chart's legend. */
export const runRuleWords: Record<RunRuleNumber, string> = {
  1: "one point beyond 3σ",
  2: "nine points in a row on one side of the centre line",
  3: "six points in a row steadily increasing or decreasing",
  4: "fourteen points in a row alternating up and down",
  5: "two of three points in a row beyond 2σ on one side",
  6: "four of five points in a row beyond 1σ on one side",
  7: "fifteen points in a row within 1σ",
  8: "eight points in a row beyond 1σ with none within",
};

export const runRuleSource =
  "Nelson, L. S. (1984), The Shewhart Control Chart — Tests for Special Causes, Journal of Quality Technology 16(4); " +
  "zone rules from the Western Electric Statistical Quality Control Handbook (1956)";

export interface RunRuleSignal {
  rule: RunRuleNumber;
  /** The point (0-based) that completes the pattern. */
  index: number;
  /** Every point of the pattern, oldest first. */
  points: number[];
}

export interface ControlLimits {
  centre: number;
  sigma: number;
}

/** Which side of the centre line: +1 above, −1 below, 0 on it. */
function side(z: number): -1 | 0 | 1 {
  return z > 0 ? 1 : z < 0 ? -1 : 0;
}

function range(from: number, to: number): number[] {
  const out: number[] = [];
  for (let i = from; i <= to; i++) out.push(i);
  return out;
}

/** The points of the window ending at i beyond `zones` sigma on side s. */
function beyondOnSide(z: number[], i: number, length: number, zones: number, s: 1 | -1): number[] {
  return range(Math.max(0, i - length + 1), i).filter((k) => s * z[k] > zones);
}

/**
 * Every signal of the chosen tests (all eight unless given) on the values, in order of the point
 * that completes it, then of the test number. `sigma` must be positive and finite.
 */
export function evaluateRunRules(values: readonly number[], limits: ControlLimits, rules: readonly RunRuleNumber[] = runRuleNumbers): RunRuleSignal[] {
  const { centre, sigma } = limits;
  if (!(sigma > 0) || !Number.isFinite(sigma)) throw new RangeError(`A control chart needs a positive, finite sigma; got ${sigma}`);
  if (!Number.isFinite(centre)) throw new RangeError(`A control chart needs a finite centre line; got ${centre}`);
  values.forEach((v, i) => {
    if (!Number.isFinite(v)) throw new RangeError(`Point ${i + 1} is not a finite number`);
  });
  const z = values.map((v) => (v - centre) / sigma);
  const wanted = new Set(rules);
  const signals: RunRuleSignal[] = [];
  // Lengths of the current runs ending at i.
  let sameSide = 0;
  let trend = 0;
  let trendDirection = 0;
  let alternating = 0;
  let withinOne = 0;
  let outsideOne = 0;
  for (let i = 0; i < z.length; i++) {
    const s = side(z[i]);
    sameSide = s !== 0 && i > 0 && side(z[i - 1]) === s ? sameSide + 1 : s !== 0 ? 1 : 0;
    const step = i > 0 ? Math.sign(values[i] - values[i - 1]) : 0;
    if (step === 0) {
      trend = 1;
      trendDirection = 0;
    } else if (step === trendDirection) {
      trend += 1;
    } else {
      trend = 2;
      trendDirection = step;
    }
    const previousStep = i > 1 ? Math.sign(values[i - 1] - values[i - 2]) : 0;
    alternating = step === 0 ? 1 : previousStep !== 0 && step === -previousStep ? alternating + 1 : 2;
    withinOne = Math.abs(z[i]) < 1 ? withinOne + 1 : 0;
    outsideOne = Math.abs(z[i]) > 1 ? outsideOne + 1 : 0;

    const add = (rule: RunRuleNumber, points: number[]) => {
      if (wanted.has(rule)) signals.push({ rule, index: i, points });
    };
    if (Math.abs(z[i]) > 3) add(1, [i]);
    if (sameSide >= 9) add(2, range(i - 8, i));
    if (trend >= 6) add(3, range(i - 5, i));
    if (alternating >= 14) add(4, range(i - 13, i));
    // Tests 5 and 6 count within the last three (five) points, fewer at the chart's start; the completing
    // point is itself beyond, so one pattern is reported once, where it arises.
    if (s !== 0 && Math.abs(z[i]) > 2) {
      const beyond = beyondOnSide(z, i, 3, 2, s);
      if (beyond.length >= 2) add(5, beyond);
    }
    if (s !== 0 && Math.abs(z[i]) > 1) {
      const beyond = beyondOnSide(z, i, 5, 1, s);
      if (beyond.length >= 4) add(6, beyond);
    }
    if (withinOne >= 15) add(7, range(i - 14, i));
    if (outsideOne >= 8) add(8, range(i - 7, i));
  }
  return signals;
}
