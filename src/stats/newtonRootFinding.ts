/**
 * Newton's method safeguarded by bisection inside a bracket (Numerical
 * Recipes, 3rd ed., section 9.4, "rtsafe"), for functions whose derivative is
 * cheap (the log CLs curves of the exact and pseudo-experiment methods).
 * Infinite or undefined steps fall back to bisection, so the result is always
 * a finite number inside the bracket.
 */
import { TamisError } from '../errors.js';
import { bracketNear, checkValue, expandBracketUpward, type Bracket, type RootTolerance, type ValueAndSlope } from './rootFinding.js';

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
 * starting from a guess: one Newton step from the guess usually brackets the
 * root, then safeguarded Newton finishes. Falls back to outward expansion
 * when the first step does not bracket.
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
  const atGuess: ValueAndSlope = { value: 0, slope: 0 };
  const scratch: ValueAndSlope = { value: 0, slope: 0 };
  const valueAt = (x: number): number => {
    evaluate(x, scratch);
    return scratch.value;
  };
  if (!(guess > 0) || !Number.isFinite(guess)) {
    return findRootNewtonSafe(evaluate, expandBracketUpward(valueAt, 0, 1, 2, fAtZero), tolerance);
  }
  evaluate(guess, atGuess);
  const f0 = checkValue(atGuess.value, guess);
  if (f0 === 0) return guess;
  const newton = Number.isFinite(atGuess.slope) && atGuess.slope < 0 ? guess - f0 / atGuess.slope : Number.NaN;
  let bracket: Bracket;
  if (f0 > 0) {
    const first = newton > guess ? newton : 2 * guess;
    bracket = expandBracketUpward(valueAt, guess, first, 2, f0);
  } else if (newton > 0) {
    const fNewton = valueAt(newton);
    bracket = fNewton > 0
      ? { low: newton, high: guess, fLow: fNewton, fHigh: f0 }
      : bracketNear(valueAt, newton / 2, fAtZero, 2);
  } else {
    bracket = { low: 0, high: guess, fLow: fAtZero, fHigh: f0 };
  }
  const startAtGuess = bracket.low === guess || bracket.high === guess;
  return findRootNewtonSafe(evaluate, bracket, tolerance, startAtGuess ? guess : undefined, startAtGuess ? atGuess : undefined);
}
