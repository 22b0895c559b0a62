/**
 * The toy input densities of the Les Houches LO evolution benchmark
 * (W. Giele et al., "The QCD/SM working group: Summary report", Les Houches 2001,
 * hep-ph/0204316, section 1.3), at mu0^2 = 2 GeV^2:
 *
 *   x u_v  = 5.107200 x^0.8 (1-x)^3        x d_v = 3.064320 x^0.8 (1-x)^4
 *   x g    = 1.7 x^-0.1 (1-x)^5            x dbar = 0.1939875 x^-0.1 (1-x)^6
 *   x ubar = (1-x) x dbar                   x s = x sbar = 0.2 x (ubar + dbar)
 *   c = b = 0
 *
 * Each column is a sum of terms A x^alpha (1-x)^beta with integer beta, so its
 * Mellin moment is a rational function of N (below).
 */
import { TamisError } from '../../errors.js';
import { COLUMN_COUNT } from './flavours.js';
import { type Complex, addReal, complex, div, mul } from './complex.js';

/** One term A x^alpha (1-x)^beta of x f(x) (beta a non-negative integer). */
export interface PowerTerm {
  readonly coefficient: number;
  readonly alpha: number;
  readonly beta: number;
}

/** Starting scale mu0^2 of the benchmark, GeV^2. */
export const LES_HOUCHES_MU0_SQUARED = 2;

const UV: PowerTerm = { coefficient: 5.1072, alpha: 0.8, beta: 3 };
const DV: PowerTerm = { coefficient: 3.06432, alpha: 0.8, beta: 4 };
const GLUON: PowerTerm = { coefficient: 1.7, alpha: -0.1, beta: 5 };
const DBAR: PowerTerm = { coefficient: 0.1939875, alpha: -0.1, beta: 6 };
const UBAR: PowerTerm = { coefficient: 0.1939875, alpha: -0.1, beta: 7 };
const STRANGE: PowerTerm[] = [
  { coefficient: 0.2 * 0.1939875, alpha: -0.1, beta: 7 },
  { coefficient: 0.2 * 0.1939875, alpha: -0.1, beta: 6 },
];

/** Input terms per grid column, in the order of FLAVOUR_KEYS (g d u s c b dbar ubar sbar cbar bbar). */
export const LES_HOUCHES_INPUT: readonly (readonly PowerTerm[])[] = [
  [GLUON],
  [DV, DBAR],
  [UV, UBAR],
  STRANGE,
  [],
  [],
  [DBAR],
  [UBAR],
  STRANGE,
  [],
  [],
];

if (LES_HOUCHES_INPUT.length !== COLUMN_COUNT) throw new TamisError('internal', 'the input table must have one entry per grid column');

/**
 * x f(x) of one input column at mu0^2 = 2 GeV^2.
 *
 * @example
 * lesHouchesInputXf(0, 0.1) // x g = 1.7 * 0.1^-0.1 * 0.9^5 = 1.26375
 */
export function lesHouchesInputXf(column: number, x: number): number {
  let sum = 0;
  for (const term of LES_HOUCHES_INPUT[column]!) sum += term.coefficient * x ** term.alpha * (1 - x) ** term.beta;
  return sum;
}

/**
 * Mellin moment F(N) = integral_0^1 x^(N-1) f(x) dx of the term A x^alpha (1-x)^beta of x f:
 * A B(N + alpha - 1, beta + 1) = A beta! / prod_{k=0..beta} (N + alpha - 1 + k)
 * (Euler's Beta function for integer beta; Abramowitz and Stegun 6.2.1-2).
 */
export function powerTermMoment(term: PowerTerm, n: Complex): Complex {
  const s = addReal(n, term.alpha - 1);
  let denominator = s;
  let factorial = 1;
  for (let k = 1; k <= term.beta; k++) {
    denominator = mul(denominator, addReal(s, k));
    factorial *= k;
  }
  return div(complex(term.coefficient * factorial), denominator);
}

/** Mellin moment of one input column (sum of its terms). */
export function lesHouchesInputMoment(column: number, n: Complex): Complex {
  let re = 0;
  let im = 0;
  for (const term of LES_HOUCHES_INPUT[column]!) {
    const m = powerTermMoment(term, n);
    re += m.re;
    im += m.im;
  }
  return { re, im };
}
