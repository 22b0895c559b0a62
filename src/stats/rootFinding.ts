/**
 * Bracketing root finders that always return a finite number inside the
 * bracket: bracket expansion, Brent's method (R. P. Brent, "Algorithms for
 * Minimization without Derivatives", Prentice-Hall 1973, chapter 4 from
 * memory) and
 * bisection. Newton-based finders are in `newtonRootFinding.ts`.
 * Infinite function values are accepted and only their sign is used
 * (a bisection step replaces the interpolation), so a likelihood that is
 * infinite at the edge of its domain cannot derail the search.
 */
import { TamisError } from '../errors.js';

export interface RootTolerance {
  /** Stop when the bracket is narrower than `absolute + relative * |x|`. @default 1e-12 */
  absolute?: number;
  /** @default 1e-10 */
  relative?: number;
  /** @default 300 */
  maxIterations?: number;
}

/** A bracket [low, high] with the function values at both ends, f(low) and f(high) of opposite signs. */
export interface Bracket {
  low: number;
  high: number;
  fLow: number;
  fHigh: number;
}

/** The value and derivative of a function at one point (filled in by the caller's function). */
export interface ValueAndSlope {
  value: number;
  slope: number;
}

const DEFAULT_ABSOLUTE = 1e-12;
const DEFAULT_RELATIVE = 1e-10;
const DEFAULT_ITERATIONS = 300;
/** Largest argument tried when expanding a bracket. */
const LARGEST_ARGUMENT = 1e300;

/** Returns `value`, throwing a `numeric` error when it is NaN (an undefined function value at x). */
export function checkValue(value: number, x: number): number {
  if (Number.isNaN(value)) throw new TamisError('numeric', `root search met an undefined function value at ${x}`);
  return value;
}

/**
 * Expands [low, first] upwards by `growth` until f changes sign, for a
 * function with f(low) > 0 that becomes <= 0 somewhere above (such as
 * CLs(s) - alpha). `fAtLow`, when given, is f(low) (saves one evaluation).
 * Throws a `numeric` error only if f stays positive up to 1e300.
 *
 * @example
 * expandBracketUpward((x) => 5 - x, 0, 1).high // 8
 */
export function expandBracketUpward(f: (x: number) => number, low: number, first: number, growth = 2, fAtLow?: number): Bracket {
  let fLow = checkValue(fAtLow ?? f(low), low);
  if (!(fLow > 0)) return { low, high: low, fLow, fHigh: fLow };
  let high = Math.max(first, low + Number.MIN_VALUE);
  for (;;) {
    const fHigh = checkValue(f(high), high);
    if (fHigh <= 0) return { low, high, fLow, fHigh };
    if (high >= LARGEST_ARGUMENT) break;
    low = high;
    fLow = fHigh;
    high = Math.min(LARGEST_ARGUMENT, high <= 0 ? 1 : high * growth);
  }
  throw new TamisError('numeric', `no sign change found below ${LARGEST_ARGUMENT}`);
}

/**
 * A sign-changing bracket near `guess` for a function with f(0) = `fAtZero` > 0
 * that turns non-positive above its root: steps outwards from the guess by
 * factors of `growth`, so a good guess gives a narrow bracket.
 *
 * @example
 * bracketNear((x) => 5 - x, 4, 5) // { low: 4, high: 5.2, fLow: 1, fHigh: -0.2 } (up to rounding)
 */
export function bracketNear(f: (x: number) => number, guess: number, fAtZero: number, growth = 1.3): Bracket {
  if (!(guess > 0) || !Number.isFinite(guess)) return expandBracketUpward(f, 0, 1, 2, fAtZero);
  const fGuess = checkValue(f(guess), guess);
  if (fGuess > 0) return expandBracketUpward(f, guess, guess * growth, growth, fGuess);
  let high = guess;
  let fHigh = fGuess;
  for (let low = guess / growth; low > 1e-300; low /= growth) {
    const fLow = checkValue(f(low), low);
    if (fLow > 0) return { low, high, fLow, fHigh };
    high = low;
    fHigh = fLow;
  }
  return { low: 0, high, fLow: fAtZero, fHigh };
}

/**
 * A root of f inside a bracket with f(low) and f(high) of opposite signs (or
 * one of them zero), by Brent's method: inverse quadratic interpolation and
 * secant steps, with bisection whenever they would converge slowly.
 *
 * @example
 * findRootBrent((x) => x * x - 2, { low: 0, high: 2, fLow: -2, fHigh: 2 }) // 1.4142135623730951
 */
export function findRootBrent(f: (x: number) => number, bracket: Bracket, tolerance: RootTolerance = {}): number {
  const absolute = tolerance.absolute ?? DEFAULT_ABSOLUTE;
  const relative = tolerance.relative ?? DEFAULT_RELATIVE;
  const maxIterations = tolerance.maxIterations ?? DEFAULT_ITERATIONS;
  let a = bracket.low;
  let b = bracket.high;
  let fa = bracket.fLow;
  let fb = bracket.fHigh;
  if (fa === 0) return a;
  if (fb === 0) return b;
  if (Math.sign(fa) === Math.sign(fb)) {
    throw new TamisError('internal', `root bracket [${a}, ${b}] does not change sign (${fa}, ${fb})`);
  }
  let c = a;
  let fc = fa;
  let d = b - a;
  let e = d;
  for (let iteration = 0; iteration < maxIterations; iteration++) {
    if (Math.sign(fb) === Math.sign(fc)) {
      c = a;
      fc = fa;
      d = b - a;
      e = d;
    }
    if (Math.abs(fc) < Math.abs(fb)) {
      a = b;
      b = c;
      c = a;
      fa = fb;
      fb = fc;
      fc = fa;
    }
    const tol = 2 * Number.EPSILON * Math.abs(b) + 0.5 * (absolute + relative * Math.abs(b));
    const half = 0.5 * (c - b);
    if (Math.abs(half) <= tol || fb === 0) return b;
    const finite = Number.isFinite(fa) && Number.isFinite(fb) && Number.isFinite(fc);
    if (finite && Math.abs(e) >= tol && Math.abs(fa) > Math.abs(fb)) {
      const s = fb / fa;
      let p: number;
      let q: number;
      if (a === c) {
        p = 2 * half * s;
        q = 1 - s;
      } else {
        const qa = fa / fc;
        const r = fb / fc;
        p = s * (2 * half * qa * (qa - r) - (b - a) * (r - 1));
        q = (qa - 1) * (r - 1) * (s - 1);
      }
      if (p > 0) q = -q;
      p = Math.abs(p);
      if (2 * p < Math.min(3 * half * q - Math.abs(tol * q), Math.abs(e * q))) {
        e = d;
        d = p / q;
      } else {
        d = half;
        e = d;
      }
    } else {
      d = half;
      e = d;
    }
    a = b;
    fa = fb;
    b += Math.abs(d) > tol ? d : Math.sign(half) * tol;
    fb = checkValue(f(b), b);
  }
  return b;
}

/**
 * A crossing of f inside a bracket by bisection: the right tool for a
 * piecewise-constant function such as a CLs curve estimated from a fixed set of
 * pseudo-experiments, where interpolation steps only waste evaluations.
 *
 * @example
 * findRootBisection((x) => (x < 1.25 ? 1 : -1), { low: 0, high: 2, fLow: 1, fHigh: -1 }, { relative: 1e-3 }) // 1.25 (to 1e-3)
 */
export function findRootBisection(f: (x: number) => number, bracket: Bracket, tolerance: RootTolerance = {}): number {
  const absolute = tolerance.absolute ?? DEFAULT_ABSOLUTE;
  const relative = tolerance.relative ?? DEFAULT_RELATIVE;
  const maxIterations = tolerance.maxIterations ?? DEFAULT_ITERATIONS;
  let { low, high, fLow } = bracket;
  if (fLow === 0) return low;
  if (bracket.fHigh === 0) return high;
  for (let iteration = 0; iteration < maxIterations; iteration++) {
    const middle = 0.5 * (low + high);
    if (Math.abs(high - low) <= absolute + relative * Math.abs(middle)) return middle;
    const fMiddle = checkValue(f(middle), middle);
    if (fMiddle === 0) return middle;
    if (Math.sign(fMiddle) === Math.sign(fLow)) {
      low = middle;
      fLow = fMiddle;
    } else {
      high = middle;
    }
  }
  return 0.5 * (low + high);
}
