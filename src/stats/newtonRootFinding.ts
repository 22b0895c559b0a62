/**
 * Newton's method safeguarded by bisection inside a bracket (Numerical
 * Recipes, 3rd ed., "rtsafe"; section from memory: 9.4), for functions whose derivative is
 * cheap (the log CLs curves of the exact and pseudo-experiment methods).
 * Infinite or undefined steps fall back to bisection, so the result is always
 * a finite number inside the bracket.
 */
import { TamisError } from '../errors.js';
import { checkValue, type Bracket, type RootTolerance, type ValueAndSlope } from './rootFinding.js';

const DEFAULT_ABSOLUTE = 1e-12;
const DEFAULT_RELATIVE = 1e-10;
const DEFAULT_ITERATIONS = 300;

/**
 * A root of f inside a bracket by Newton steps that fall back to bisection
 * whenever a step would leave the bracket or shrink it too slowly.
 * `evaluate(x, out)` fills `out.value` = f(x) and `out.slope` = f'(x).
 * `startPoint`, when given, holds f and f' at `start` (saves one evaluation).
 *
 * @example
 * const square = (x: number, out: ValueAndSlope) => { out.value = x * x - 2; out.slope = 2 * x; };
 * findRootNewtonSafe(square, { low: 0, high: 2, fLow: -2, fHigh: 2 }) // 1.4142135623730951
 */
export function findRootNewtonSafe(
  evaluate: (x: number, out: ValueAndSlope) => void,
  bracket: Bracket,
  tolerance: RootTolerance = {},
  start?: number,
  startPoint?: ValueAndSlope,
): number {
  const absolute = tolerance.absolute ?? DEFAULT_ABSOLUTE;
  const relative = tolerance.relative ?? DEFAULT_RELATIVE;
  const maxIterations = tolerance.maxIterations ?? DEFAULT_ITERATIONS;
  if (bracket.fLow === 0) return bracket.low;
  if (bracket.fHigh === 0) return bracket.high;
  if (Math.sign(bracket.fLow) === Math.sign(bracket.fHigh)) {
    throw new TamisError('internal', `root bracket [${bracket.low}, ${bracket.high}] does not change sign`);
  }
  // Orient so that f(negativeEnd) < 0 < f(positiveEnd).
  let negativeEnd = bracket.fLow < 0 ? bracket.low : bracket.high;
  let positiveEnd = bracket.fLow < 0 ? bracket.high : bracket.low;
  let x = start !== undefined && start >= Math.min(negativeEnd, positiveEnd) && start <= Math.max(negativeEnd, positiveEnd)
    ? start
    : 0.5 * (bracket.low + bracket.high);
  let stepBefore = Math.abs(bracket.high - bracket.low);
  let step = stepBefore;
  const point: ValueAndSlope = { value: 0, slope: 0 };
  if (startPoint !== undefined && x === start) {
    point.value = startPoint.value;
    point.slope = startPoint.slope;
  } else {
    evaluate(x, point);
  }
  for (let iteration = 0; iteration < maxIterations; iteration++) {
    const f = checkValue(point.value, x);
    if (f === 0) return x;
    if (f < 0) negativeEnd = x;
    else positiveEnd = x;
    const df = point.slope;
    const newtonOutside =
      !Number.isFinite(f) || !Number.isFinite(df) || df === 0 ||
      ((x - positiveEnd) * df - f) * ((x - negativeEnd) * df - f) > 0 ||
      Math.abs(2 * f) > Math.abs(stepBefore * df);
    stepBefore = step;
    if (newtonOutside) {
      step = 0.5 * (positiveEnd - negativeEnd);
      x = negativeEnd + step;
    } else {
      step = f / df;
      x -= step;
    }
    const tol = absolute + relative * Math.abs(x);
    if (Math.abs(step) <= tol || Math.abs(positiveEnd - negativeEnd) <= tol) return x;
    evaluate(x, point);
  }
  return x;
}

/**
 * A root of a decreasing-to-negative function with f(0) = `fAtZero` > 0,
 * starting from a guess: Newton steps from the guess, keeping the tightest
 * bracket seen so far; a step that leaves the bracket, or fails to halve the
 * previous one, becomes a bisection, and without an upper end yet the search
 * doubles outwards. Converges quadratically near the root whichever side the
 * guess is on.
 *
 * @example
 * const line = (x: number, out: ValueAndSlope) => { out.value = 3 - x; out.slope = -1; };
 * findRootNewtonFromGuess(line, 1, 3) // 3
 */
export function findRootNewtonFromGuess(
  evaluate: (x: number, out: ValueAndSlope) => void,
  guess: number,
  fAtZero: number,
  tolerance: RootTolerance = {},
): number {
  const absolute = tolerance.absolute ?? DEFAULT_ABSOLUTE;
  const relative = tolerance.relative ?? DEFAULT_RELATIVE;
  const maxIterations = tolerance.maxIterations ?? DEFAULT_ITERATIONS;
  if (!(fAtZero > 0)) return 0;
  let low = 0;
  let high = Number.POSITIVE_INFINITY;
  let x = guess > 0 && Number.isFinite(guess) ? guess : 1;
  let stepBefore = Number.POSITIVE_INFINITY;
  const point: ValueAndSlope = { value: 0, slope: 0 };
  for (let iteration = 0; iteration < maxIterations; iteration++) {
    evaluate(x, point);
    const f = checkValue(point.value, x);
    if (f === 0) return x;
    if (f > 0) low = x;
    else high = x;
    const df = point.slope;
    const newton = Number.isFinite(f) && Number.isFinite(df) && df < 0 ? x - f / df : Number.NaN;
    const insideBracket = newton > low && newton < high;
    let next: number;
    if (insideBracket && Math.abs(newton - x) <= 0.5 * stepBefore) next = newton;
    else if (high < Number.POSITIVE_INFINITY) next = 0.5 * (low + high);
    else if (insideBracket) next = newton;
    else next = Math.max(2 * x, x + 1);
    stepBefore = Math.abs(next - x);
    x = next;
    if (stepBefore <= absolute + relative * Math.abs(x)) return x;
    if (high - low <= absolute + relative * Math.abs(x)) return 0.5 * (low + high);
  }
  return x;
}
