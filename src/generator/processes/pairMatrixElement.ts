/**
 * The spin- and colour-averaged differential cross section dsigma/dcos theta of
 * q qbar(') -> (sum of s-channel vectors) -> pair, for one production channel,
 * with all interferences. Evaluated as the three coefficients of a quadratic
 * in cos theta, once per s, so both beam orientations and all quark flavours
 * reuse one evaluation. Allocation-free after construction.
 *
 * Propagators: P_V(s) = 1 / (s - M_V^2 + i s Gamma_V / M_V) (the running-width
 * Breit–Wigner of W and Z line shapes, common practice); the photon's is 1/s. The q^mu q^nu part of massive
 * propagators drops out against the conserved massless quark current.
 */
import { N_COLOURS } from '../../physics/constants.js';
import { kallen } from '../../physics/phaseSpace.js';
import type { MediatorCouplings, ProductionChannel } from '../model/types.js';
import { fermionPairCoefficients } from './fermionPair.js';
import { scalarPairCoefficients } from './scalarPair.js';

/** Which quark current: 0 up-type (charged channels: u_i dbar_j per unit |V_ij|^2), 1 down-type. */
export type QuarkType = 0 | 1;

export class PairMatrixElement {
  readonly spin: 0 | 0.5;
  readonly kind: 'neutral' | 'charged';
  /** Masses of the first and second particle of the pair, GeV. */
  readonly m1: number;
  readonly m2: number;
  /** Colours averaged over in the initial state (3 for quarks; 1 to compare with e+e- formulas). */
  readonly colours: number;
  private readonly count: number;
  private readonly mass2: Float64Array;
  private readonly widthOverMass: Float64Array;
  /** Per mediator: couplings up L, up R, down L, down R, pair L, pair R. */
  private readonly c: Float64Array;
  private readonly propRe: Float64Array;
  private readonly propIm: Float64Array;
  private readonly scratch = new Float64Array(6);

  constructor(mediators: readonly MediatorCouplings[], spin: 0 | 0.5, kind: 'neutral' | 'charged', m1: number, m2: number, colours: number = N_COLOURS) {
    this.spin = spin;
    this.kind = kind;
    this.m1 = m1;
    this.m2 = m2;
    this.colours = colours;
    this.count = mediators.length;
    this.mass2 = new Float64Array(this.count);
    this.widthOverMass = new Float64Array(this.count);
    this.c = new Float64Array(6 * this.count);
    this.propRe = new Float64Array(this.count);
    this.propIm = new Float64Array(this.count);
    mediators.forEach((v, i) => {
      this.mass2[i] = v.mass * v.mass;
      this.widthOverMass[i] = v.mass > 0 ? v.width / v.mass : 0;
      this.c.set([v.up.left, v.up.right, v.down.left, v.down.right, v.pair.left, v.pair.right], 6 * i);
    });
  }

  /** The matrix element of a resolved production channel. */
  static forChannel(channel: ProductionChannel, colours: number = N_COLOURS): PairMatrixElement {
    return new PairMatrixElement(channel.mediators, channel.spin, channel.kind, channel.firstMass, channel.secondMass, colours);
  }

  /**
   * Writes the coefficients of dsigma/dcos theta = a0 + a1 c + a2 c^2 (GeV^-2) at
   * partonic s (GeV^2), for a quark along +z and theta the angle of the pair's
   * first particle to it: `out[0..2]` up-type quarks (charged channels: the
   * u_i dbar_j current per unit |V_ij|^2), `out[3..5]` down-type (zero for
   * charged channels). All zero at or below threshold.
   */
  coefficients(s: number, out: Float64Array): void {
    const betaBar2 = kallen(1, (this.m1 * this.m1) / s, (this.m2 * this.m2) / s);
    const mSum = this.m1 + this.m2;
    if (!(s > mSum * mSum) || !(betaBar2 > 0)) {
      out.fill(0, 0, 6);
      return;
    }
    const betaBar = Math.sqrt(betaBar2);
    for (let i = 0; i < this.count; i++) {
      const m2 = this.mass2[i]!;
      if (m2 === 0) {
        this.propRe[i] = 1 / s;
        this.propIm[i] = 0;
      } else {
        const re = s - m2;
        const im = s * this.widthOverMass[i]!;
        const d = re * re + im * im;
        this.propRe[i] = re / d;
        this.propIm[i] = -im / d;
      }
    }
    this.quarkType(s, betaBar, 0, out, 0);
    if (this.kind === 'neutral') this.quarkType(s, betaBar, 2, out, 3);
    else out.fill(0, 3, 6);
  }

  /** dsigma/dcos theta (GeV^-2) for one quark type at (s, cos theta); allocation-free. */
  dsigmaDcos(s: number, quarkType: QuarkType, cosTheta: number): number {
    this.coefficients(s, this.scratch);
    const o = 3 * quarkType;
    return this.scratch[o]! + cosTheta * (this.scratch[o + 1]! + cosTheta * this.scratch[o + 2]!);
  }

  /** Partonic cross section sigma(s) = integral of dsigma/dcos theta over [-1, 1] (GeV^-2). */
  partonicCrossSection(s: number, quarkType: QuarkType): number {
    this.coefficients(s, this.scratch);
    const o = 3 * quarkType;
    return 2 * this.scratch[o]! + (2 / 3) * this.scratch[o + 2]!;
  }

  /** Sums the amplitudes of all vectors for the quark couplings at offset `q` (0 up, 2 down) and writes 3 coefficients. */
  private quarkType(s: number, betaBar: number, q: number, out: Float64Array, offset: number): void {
    // Effective couplings: [quark helicity][pair chirality], complex.
    let llRe = 0, llIm = 0, lrRe = 0, lrIm = 0, rlRe = 0, rlIm = 0, rrRe = 0, rrIm = 0;
    const c = this.c;
    for (let i = 0; i < this.count; i++) {
      const o = 6 * i;
      const qL = c[o + q]!;
      const qR = c[o + q + 1]!;
      const fL = c[o + 4]!;
      const fR = c[o + 5]!;
      const pr = this.propRe[i]!;
      const pi = this.propIm[i]!;
      llRe += qL * fL * pr;
      llIm += qL * fL * pi;
      lrRe += qL * fR * pr;
      lrIm += qL * fR * pi;
      rlRe += qR * fL * pr;
      rlIm += qR * fL * pi;
      rrRe += qR * fR * pr;
      rrIm += qR * fR * pi;
    }
    if (this.spin === 0) {
      // Scalars: only the pair's "left" entry is used (left = right = g).
      scalarPairCoefficients(s, betaBar, llRe * llRe + llIm * llIm, rlRe * rlRe + rlIm * rlIm, this.colours, out, offset);
      return;
    }
    // Quark L: L_L = ll, R_L = lr; quark R: L_R = rl, R_R = rr.
    const A = llRe * llRe + llIm * llIm + rrRe * rrRe + rrIm * rrIm;
    const B = lrRe * lrRe + lrIm * lrIm + rlRe * rlRe + rlIm * rlIm;
    const C = llRe * lrRe + llIm * lrIm + (rlRe * rrRe + rlIm * rrIm);
    fermionPairCoefficients(s, betaBar, this.m1, this.m2, A, B, C, this.colours, out, offset);
  }
}
