/**
 * Exact leading-order DGLAP evolution of Mellin moments in a variable flavour
 * number scheme: between thresholds nf is fixed and the solution is the
 * exponential of ./splittingMoments.ts; at a threshold the new heavy quark
 * starts from zero (LO matching, as the Les Houches benchmark prescribes:
 * hep-ph/0204316, section 1.3), and below its threshold a heavy quark is zero.
 *
 * Flavour decomposition (common practice): for each active flavour i,
 * q_i^- = q_i - qbar_i evolves with P_ns, q_i^+ - Sigma / nf with P_ns, and
 * (Sigma, g) with the singlet matrix, Sigma = sum over active i of q_i^+.
 *
 * Moments are stored as interleaved (re, im) pairs in Float64Arrays, one pair
 * per grid column (order of FLAVOUR_KEYS), so that the many evolutions of a
 * grid build do not allocate.
 */
import type { OneLoopAlphaS } from '../alphaS.js';
import { beta0 } from '../alphaS.js';
import { type Complex, add, addReal, div, harmonicS1, mul } from './complex.js';
import { COLUMN_COUNT } from './flavours.js';
import { type RangeKernel, loSplittingMoments, rangeKernel } from './splittingMoments.js';

/** What an LO evolution needs: the coupling (which also fixes the thresholds), the start scale and the input moments. */
export interface EvolutionSetup {
  readonly coupling: OneLoopAlphaS;
  /** Starting scale mu0^2, GeV^2. */
  readonly mu0Squared: number;
  /** Mellin moment at mu0 of grid column `column` (order of FLAVOUR_KEYS). */
  inputMoment(column: number, n: Complex): Complex;
}

const QUARKS = 5;
/** Length of one moment vector: (re, im) per column. */
export const MOMENT_VECTOR_LENGTH = 2 * COLUMN_COUNT;
/** Scales closer than this in ln mu^2 count as equal. */
const ROUNDING = 1e-12;

/**
 * Evolves the moments at one complex N from mu0 to every target ln(mu^2 / GeV^2).
 * Returns the moments as [(target * COLUMN_COUNT + column) * 2 + (0 re | 1 im)].
 *
 * @example
 * // N = 2: the sum over columns of the real parts is the momentum fraction, 1 - 2.2e-8 at every scale
 * evolveMoments(lesHouchesEvolutionSetup, complex(2), [Math.log(1e4)]) // real parts sum to 0.999999978
 */
export function evolveMoments(setup: EvolutionSetup, n: Complex, lnTargets: readonly number[]): Float64Array {
  const s1 = harmonicS1(n);
  const kernels: (RangeKernel | undefined)[] = [];
  const kernelFor = (nf: number): RangeKernel => (kernels[nf] ??= rangeKernel(loSplittingMoments(n, nf, s1)));
  const input = new Float64Array(MOMENT_VECTOR_LENGTH);
  for (let column = 0; column < COLUMN_COUNT; column++) {
    const m = setup.inputMoment(column, n);
    input[2 * column] = m.re;
    input[2 * column + 1] = m.im;
  }
  const ln0 = Math.log(setup.mu0Squared);
  const thresholds = setup.coupling.thresholdsLnQ2();
  // Moments at each threshold reached from mu0, computed once per N.
  const atThreshold = new Map<number, Float64Array>();
  const out = new Float64Array(lnTargets.length * MOMENT_VECTOR_LENGTH);
  const result = new Float64Array(MOMENT_VECTOR_LENGTH);

  for (let target = 0; target < lnTargets.length; target++) {
    const lnTarget = lnTargets[target]!;
    const up = lnTarget >= ln0;
    let moments: Float64Array = input;
    let from = ln0;
    // Thresholds strictly between mu0 and the target, in the order they are crossed
    // (one within rounding of either end is not crossed: m_c^2 = mu0^2 in the benchmark).
    for (let k = 0; k < thresholds.length; k++) {
      const edge = thresholds[up ? k : thresholds.length - 1 - k]!;
      const inside = up ? edge > ln0 + ROUNDING && edge < lnTarget - ROUNDING : edge < ln0 - ROUNDING && edge > lnTarget + ROUNDING;
      if (!inside) continue;
      let cached = atThreshold.get(edge);
      if (cached === undefined) {
        cached = new Float64Array(MOMENT_VECTOR_LENGTH);
        evolveRange(setup.coupling, kernelFor, moments, from, edge, cached);
        atThreshold.set(edge, cached);
      }
      moments = cached;
      from = edge;
    }
    evolveRange(setup.coupling, kernelFor, moments, from, lnTarget, result);
    out.set(result, target * MOMENT_VECTOR_LENGTH);
  }
  return out;
}

/** Evolution over [from, to] (either direction) inside one range of fixed nf, from `moments` into `out`. */
function evolveRange(
  coupling: OneLoopAlphaS,
  kernelFor: (nf: number) => RangeKernel,
  moments: Float64Array,
  from: number,
  to: number,
  out: Float64Array,
): void {
  const nf = coupling.activeFlavoursAtLnQ2((from + to) / 2);
  const r = from === to ? 0 : Math.log(coupling.alphaSAtLnQ2(to) / coupling.alphaSAtLnQ2(from)) / beta0(nf);
  const kernel = kernelFor(nf);
  // E_ns = exp(-P_ns r), e+- = exp(-lambda+- r)
  const nsMag = Math.exp(-kernel.ns.re * r);
  const nsRe = nsMag * Math.cos(-kernel.ns.im * r);
  const nsIm = nsMag * Math.sin(-kernel.ns.im * r);
  const pMag = Math.exp(-kernel.lambdaPlus.re * r);
  const mMag = Math.exp(-kernel.lambdaMinus.re * r);
  const eMinusRe = mMag * Math.cos(-kernel.lambdaMinus.im * r);
  const eMinusIm = mMag * Math.sin(-kernel.lambdaMinus.im * r);
  const spreadRe = pMag * Math.cos(-kernel.lambdaPlus.im * r) - eMinusRe;
  const spreadIm = pMag * Math.sin(-kernel.lambdaPlus.im * r) - eMinusIm;
  // Singlet operator E = e- I + (e+ - e-) P+ (P+ the projector on lambda+).
  const [pqq, pqg, pgq, pgg] = kernel.projectorPlus;
  const qqRe = eMinusRe + spreadRe * pqq.re - spreadIm * pqq.im;
  const qqIm = eMinusIm + spreadRe * pqq.im + spreadIm * pqq.re;
  const qgRe = spreadRe * pqg.re - spreadIm * pqg.im;
  const qgIm = spreadRe * pqg.im + spreadIm * pqg.re;
  const gqRe = spreadRe * pgq.re - spreadIm * pgq.im;
  const gqIm = spreadRe * pgq.im + spreadIm * pgq.re;
  const ggRe = eMinusRe + spreadRe * pgg.re - spreadIm * pgg.im;
  const ggIm = eMinusIm + spreadRe * pgg.im + spreadIm * pgg.re;

  const gRe = moments[0]!;
  const gIm = moments[1]!;
  let sRe = 0;
  let sIm = 0;
  for (let i = 0; i < nf; i++) {
    sRe += moments[2 * (1 + i)]! + moments[2 * (1 + QUARKS + i)]!;
    sIm += moments[2 * (1 + i) + 1]! + moments[2 * (1 + QUARKS + i) + 1]!;
  }
  out[0] = gqRe * sRe - gqIm * sIm + ggRe * gRe - ggIm * gIm;
  out[1] = gqRe * sIm + gqIm * sRe + ggRe * gIm + ggIm * gRe;
  const shareRe = sRe / nf;
  const shareIm = sIm / nf;
  const shareOutRe = (qqRe * sRe - qqIm * sIm + qgRe * gRe - qgIm * gIm) / nf;
  const shareOutIm = (qqRe * sIm + qqIm * sRe + qgRe * gIm + qgIm * gRe) / nf;
  for (let i = 0; i < QUARKS; i++) {
    const q = 2 * (1 + i);
    const qbar = 2 * (1 + QUARKS + i);
    if (i >= nf) {
      out[q] = out[q + 1] = out[qbar] = out[qbar + 1] = 0;
      continue;
    }
    // q+ - Sigma/nf and q- evolve with E_ns; Sigma/nf with the singlet operator.
    const nsPlusRe = moments[q]! + moments[qbar]! - shareRe;
    const nsPlusIm = moments[q + 1]! + moments[qbar + 1]! - shareIm;
    const minusRe = moments[q]! - moments[qbar]!;
    const minusIm = moments[q + 1]! - moments[qbar + 1]!;
    const plusOutRe = nsRe * nsPlusRe - nsIm * nsPlusIm + shareOutRe;
    const plusOutIm = nsRe * nsPlusIm + nsIm * nsPlusRe + shareOutIm;
    const minusOutRe = nsRe * minusRe - nsIm * minusIm;
    const minusOutIm = nsRe * minusIm + nsIm * minusRe;
    out[q] = 0.5 * (plusOutRe + minusOutRe);
    out[q + 1] = 0.5 * (plusOutIm + minusOutIm);
    out[qbar] = 0.5 * (plusOutRe - minusOutRe);
    out[qbar + 1] = 0.5 * (plusOutIm - minusOutIm);
  }
}

/**
 * Moments of d(q_h) / d ln mu^2 at the threshold where a heavy quark h starts
 * from zero: at LO only the gluon feeds it, dq_h/d ln mu^2 = a T_R-kernel g with
 * the moments a (N^2 + N + 2) / (N (N+1) (N+2)) g(N), a = alpha_s / (4 pi), the same for
 * q_h and qbar_h (Altarelli and Parisi 1977, P_qg = T_R (x^2 + (1-x)^2)). This is the limit of
 * q_h / ln(mu^2 / m_h^2) at the threshold. Every column holds that value, one
 * target per threshold, in the layout of evolveMoments.
 */
export function heavyQuarkOnsetMoments(setup: EvolutionSetup, n: Complex, lnThresholds: readonly number[]): Float64Array {
  const atThresholds = evolveMoments(setup, n, lnThresholds);
  const polynomial = add(mul(n, n), addReal(n, 2));
  const kernel = div(polynomial, mul(mul(n, addReal(n, 1)), addReal(n, 2)));
  const out = new Float64Array(lnThresholds.length * MOMENT_VECTOR_LENGTH);
  for (let k = 0; k < lnThresholds.length; k++) {
    const a = setup.coupling.alphaSAtLnQ2(lnThresholds[k]!) / (4 * Math.PI);
    const gRe = atThresholds[k * MOMENT_VECTOR_LENGTH]!;
    const gIm = atThresholds[k * MOMENT_VECTOR_LENGTH + 1]!;
    const re = a * (kernel.re * gRe - kernel.im * gIm);
    const im = a * (kernel.re * gIm + kernel.im * gRe);
    for (let column = 0; column < COLUMN_COUNT; column++) {
      out[k * MOMENT_VECTOR_LENGTH + 2 * column] = re;
      out[k * MOMENT_VECTOR_LENGTH + 2 * column + 1] = im;
    }
  }
  return out;
}
