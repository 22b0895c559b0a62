/**
 * Mellin moments of the leading-order splitting functions and the exact LO
 * evolution kernels built from them.
 *
 * Normalisation: d f(N) / d ln mu^2 = a P(N) f(N), a = alpha_s / (4 pi), so
 * P here is twice the P of the alpha_s / (2 pi) convention (Altarelli and
 * Parisi, Nucl. Phys. B126 (1977) 298; moments as in Ellis, Stirling and
 * Webber, "QCD and collider physics", section 4.3):
 *
 *   P_ns = P_qq = C_F (3 + 2 / (N (N+1)) - 4 S_1(N))
 *   P_qg = 2 nf (N^2 + N + 2) / (N (N+1) (N+2))          (singlet quark from gluon)
 *   P_gq = 2 C_F (N^2 + N + 2) / ((N-1) N (N+1))
 *   P_gg = 4 C_A (1 / (N (N-1)) + 1 / ((N+1) (N+2)) - S_1(N)) + beta0
 *
 * With da / d ln mu^2 = -beta0 a^2 the exact solution over a range of fixed nf is
 * f(N, a) = exp(-P(N) R) f(N, a0), R = ln(a / a0) / beta0 (the sign convention of
 * ../shared/checks.md section 1); the 2x2 singlet exponential uses the
 * eigenvalues lambda+- of P and the projectors e+- = (P - lambda-+) / (lambda+- - lambda-+):
 * E = e+ exp(-lambda+ R) + e- exp(-lambda- R) (applied in ./mellinEvolution.ts).
 */
import { beta0 } from '../alphaS.js';
import { type Complex, add, addReal, div, harmonicS1, inverse, mul, scale, sqrt, sub } from './complex.js';

/** Colour factors of SU(3). */
export const C_F = 4 / 3;
export const C_A = 3;

/** LO anomalous dimensions at one N for one nf. */
export interface LoSplittingMoments {
  readonly nf: number;
  readonly qq: Complex;
  readonly qg: Complex;
  readonly gq: Complex;
  readonly gg: Complex;
}

/**
 * The four LO splitting-function moments at complex N for nf light flavours.
 * `s1` may be passed when already known (it does not depend on nf).
 */
export function loSplittingMoments(n: Complex, nf: number, s1: Complex = harmonicS1(n)): LoSplittingMoments {
  const n1 = addReal(n, 1);
  const n2 = addReal(n, 2);
  const nm1 = addReal(n, -1);
  const nn1 = mul(n, n1);
  const polynomial = add(mul(n, n), addReal(n, 2)); // N^2 + N + 2
  const qq = scale(sub(addReal(scale(inverse(nn1), 2), 3), scale(s1, 4)), C_F);
  const qg = scale(div(polynomial, mul(nn1, n2)), 2 * nf);
  const gq = scale(div(polynomial, mul(nm1, nn1)), 2 * C_F);
  const bracket = sub(add(inverse(mul(n, nm1)), inverse(mul(n1, n2))), s1);
  const gg = addReal(scale(bracket, 4 * C_A), beta0(nf));
  return { nf, qq, qg, gq, gg };
}

/** Exact LO evolution over one range of fixed nf, prepared once per N. */
export interface RangeKernel {
  readonly nf: number;
  /** Non-singlet anomalous dimension P_ns(N). */
  readonly ns: Complex;
  /** Singlet eigenvalues. */
  readonly lambdaPlus: Complex;
  readonly lambdaMinus: Complex;
  /** Projector e+ as (qq, qg, gq, gg); e- = 1 - e+. */
  readonly projectorPlus: readonly [Complex, Complex, Complex, Complex];
}

/** Eigen-decomposition of the singlet matrix at one N and nf. */
export function rangeKernel(moments: LoSplittingMoments): RangeKernel {
  const { qq, qg, gq, gg } = moments;
  const difference = sub(qq, gg);
  const root = sqrt(add(mul(difference, difference), scale(mul(qg, gq), 4)));
  const half = scale(add(qq, gg), 0.5);
  const lambdaPlus = add(half, scale(root, 0.5));
  const lambdaMinus = sub(half, scale(root, 0.5));
  // e+ = (P - lambda- I) / (lambda+ - lambda-), and lambda+ - lambda- = root.
  const projectorPlus: [Complex, Complex, Complex, Complex] = [
    div(sub(qq, lambdaMinus), root),
    div(qg, root),
    div(gq, root),
    div(sub(gg, lambdaMinus), root),
  ];
  return { nf: moments.nf, ns: moments.qq, lambdaPlus, lambdaMinus, projectorPlus };
}
