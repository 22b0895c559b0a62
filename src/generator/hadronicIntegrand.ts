/**
 * The hadronic cross section of one production channel as an integrand on the
 * unit cube (u1, u2, u3) -> (s, y, cos theta):
 *
 *   sigma = integral ds/S dy dcos theta  sum_ij [x1 f_i(x1, mu)] [x2 f_j(x2, mu)] / tau  dsigma_ij/dcos theta (s)
 *
 * (QCD factorisation at leading order with tau = x1 x2 = s/S and
 * y = ln(x1/x2)/2, so dx1 dx2 = dtau dy; e.g. R. K. Ellis, W. J. Stirling and
 * B. R. Webber, "QCD and Collider Physics", chapter 9 — from memory). theta is
 * the angle of the pair's first particle to the +z beam in the pair rest frame.
 *
 * Sub-processes (the "terms" below), with massless initial quarks d, u, s, c, b
 * (no top): neutral channels, q qbar in both orientations; charged channels,
 * u_i dbar_j -> pair (weight |V_ij|^2, CKM of constants.ts) and d_j ubar_i -> the
 * conjugate pair, both orientations. A quark moving along -z sees the angle
 * pi - theta, and the conjugate process looks like the original with every
 * particle swapped for its antiparticle (CP), which fixes the sign of cos theta in each term.
 *
 * `evaluate` keeps every term in a reused buffer so the hard sampler can pick
 * the sub-process of an accepted point without a second evaluation. No
 * allocation per call.
 */
import { TamisError } from '../errors.js';
import { CKM, GEV2_TO_PB, PDG } from '../physics/constants.js';
import type { PartonDensity } from '../physics/partonDensity.js';
import type { ProductionChannel } from './model/types.js';
import { FixedScaleDensity } from './fixedScaleDensity.js';
import { PairMassMapping } from './pairMassMapping.js';
import { PairMatrixElement } from './processes/pairMatrixElement.js';

const UP_TYPE = [PDG.u, PDG.c];
const DOWN_TYPE = [PDG.d, PDG.s, PDG.b];
const NEUTRAL_QUARKS = [PDG.d, PDG.u, PDG.s, PDG.c, PDG.b];

/** Indices into `HadronicIntegrand.lastPoint`. */
export const POINT_S = 0;
export const POINT_Y = 1;
export const POINT_COS_THETA = 2;
export const POINT_X1 = 3;
export const POINT_X2 = 4;
export const POINT_SCALE = 5;

/** Options of a channel integrand. */
export interface HadronicIntegrandOptions {
  /** Collider energy sqrt(S) in GeV. */
  sqrtS: number;
  pdf: PartonDensity;
  /** Multiplies the channel's scale choice (1 central, 0.5 and 2 for the band). */
  scaleFactor: number;
}

export class HadronicIntegrand {
  readonly channel: ProductionChannel;
  readonly matrixElement: PairMatrixElement;
  /** Null when the channel is closed at this energy (threshold or mass window above sqrt S). */
  readonly mapping: PairMassMapping | null;
  readonly s: number;
  readonly scaleFactor: number;
  /** Number of sub-process terms. */
  readonly termCount: number;
  /** Per term: PDG id of the parton from beam 1 (+z) and from beam 2, and +1 (pair as in the channel) or -1 (conjugate pair). */
  readonly termParton1: Int32Array;
  readonly termParton2: Int32Array;
  readonly termConjugate: Int8Array;
  /** Per term: share of the last evaluated point (the terms sum to `termTotal`; the weight is `termTotal` x the Jacobian). */
  readonly termWeight: Float64Array;
  /** Sum of `termWeight` at the last evaluated point. */
  termTotal = 0;
  /**
   * Kinematics of the last evaluated point, at the POINT_* indices: s (GeV^2), y,
   * cos theta, x1, x2, scale (GeV). A typed array rather than fields, so that
   * writing doubles never allocates.
   */
  readonly lastPoint = new Float64Array(6);

  private readonly pdf: PartonDensity;
  private readonly fixedScale: number;
  /** The densities tabulated at the fixed scale (null for a dynamic scale or a closed channel). */
  private readonly table: FixedScaleDensity | null;
  private readonly termFlavour1: Int32Array;
  private readonly termFlavour2: Int32Array;
  /** Per term: which of the four values in `meValues` it uses (up/down quark, +cos/-cos theta). */
  private readonly termMatrixElement: Int32Array;
  private readonly termFactor: Float64Array;
  /** dsigma/dcos theta at the current point: up at +c, up at -c, down at +c, down at -c. */
  private readonly meValues = new Float64Array(4);
  private readonly xf1 = new Float64Array(13);
  private readonly xf2 = new Float64Array(13);
  private readonly coefficients = new Float64Array(6);

  constructor(channel: ProductionChannel, options: HadronicIntegrandOptions) {
    this.channel = channel;
    this.pdf = options.pdf;
    this.scaleFactor = options.scaleFactor;
    this.s = options.sqrtS * options.sqrtS;
    this.matrixElement = PairMatrixElement.forChannel(channel);
    const sMin = channel.massRange[0] ** 2;
    const sMax = Math.min(this.s, channel.massRange[1] ** 2);
    this.mapping = sMax > sMin * (1 + 1e-12) ? new PairMassMapping(sMin, sMax, channel.mediators) : null;
    const scale = channel.scale;
    this.fixedScale = scale.kind === 'average_mass' ? (options.scaleFactor * (channel.firstMass + channel.secondMass)) / 2 : scale.kind === 'fixed' ? options.scaleFactor * scale.value : 0;
    if (this.fixedScale > 0 && (this.fixedScale < this.pdf.qMin || this.fixedScale > this.pdf.qMax)) {
      throw new TamisError('bad_input', `channel ${channel.name}: scale ${this.fixedScale.toPrecision(4)} GeV is outside the parton densities' range [${this.pdf.qMin}, ${this.pdf.qMax}] GeV`);
    }
    this.table = this.fixedScale > 0 && this.mapping !== null ? new FixedScaleDensity(this.pdf, this.fixedScale, sMin / this.s) : null;
    const p1: number[] = [];
    const p2: number[] = [];
    const conj: number[] = [];
    const coeff: number[] = [];
    const sign: number[] = [];
    const factor: number[] = [];
    const add = (a: number, b: number, conjugate: number, coefficient: number, cosSign: number, f: number): void => {
      p1.push(a);
      p2.push(b);
      conj.push(conjugate);
      coeff.push(coefficient);
      sign.push(cosSign);
      factor.push(f);
    };
    if (channel.kind === 'neutral') {
      for (const q of NEUTRAL_QUARKS) {
        const type = q % 2 === 0 ? 0 : 3;
        add(q, -q, 1, type, 1, 1);
        add(-q, q, 1, type, -1, 1);
      }
    } else {
      UP_TYPE.forEach((u, a) =>
        DOWN_TYPE.forEach((d, b) => {
          const v2 = CKM[a]![b]! ** 2;
          add(u, -d, 1, 0, 1, v2);
          add(-d, u, 1, 0, -1, v2);
          add(d, -u, -1, 0, -1, v2);
          add(-u, d, -1, 0, 1, v2);
        }),
      );
    }
    this.termCount = p1.length;
    this.termParton1 = Int32Array.from(p1);
    this.termParton2 = Int32Array.from(p2);
    this.termConjugate = Int8Array.from(conj);
    this.termFlavour1 = Int32Array.from(p1, (id) => id + 6);
    this.termFlavour2 = Int32Array.from(p2, (id) => id + 6);
    this.termMatrixElement = Int32Array.from(coeff, (offset, k) => (offset === 0 ? 0 : 2) + (sign[k]! < 0 ? 1 : 0));
    this.termFactor = Float64Array.from(factor);
    this.termWeight = new Float64Array(this.termCount);
  }

  /** alpha_s of the parton densities at scale q (GeV). */
  alphaS(q: number): number {
    return this.pdf.alphaS(q);
  }

  /** Whether the channel can be produced at this energy. */
  get open(): boolean {
    return this.mapping !== null;
  }

  /**
   * The weight (pb) at a point of the unit cube: the integrand times the
   * Jacobian of (u1, u2, u3) -> (s, y, cos theta). Zero for a closed channel.
   */
  evaluate(u: Float64Array): number {
    const mapping = this.mapping;
    if (mapping === null) return 0;
    const s = mapping.sample(u[0]!);
    const tau = s / this.s;
    const yMax = -0.5 * Math.log(tau);
    const y = yMax * (2 * u[1]! - 1);
    const cosTheta = 2 * u[2]! - 1;
    const rootTau = Math.sqrt(tau);
    const ey = Math.exp(y);
    const x1 = rootTau * ey;
    const x2 = rootTau / ey;
    let q = this.fixedScale;
    if (q === 0) {
      q = this.scaleFactor * Math.sqrt(s);
      if (q < this.pdf.qMin) q = this.pdf.qMin;
      else if (q > this.pdf.qMax) q = this.pdf.qMax;
    }
    const point = this.lastPoint;
    point[POINT_S] = s;
    point[POINT_Y] = y;
    point[POINT_COS_THETA] = cosTheta;
    point[POINT_X1] = x1;
    point[POINT_X2] = x2;
    point[POINT_SCALE] = q;
    if (x1 >= 1 || x2 >= 1) {
      this.termWeight.fill(0);
      this.termTotal = 0;
      return 0;
    }
    if (this.table !== null) {
      // ln(x/(1-x)) = ln x - ln(1-x), with ln x1,2 = ln(tau)/2 +- y
      const halfLnTau = -yMax;
      this.table.xfxAllAt(x1, halfLnTau + y - Math.log1p(-x1), this.xf1);
      this.table.xfxAllAt(x2, halfLnTau - y - Math.log1p(-x2), this.xf2);
    } else {
      this.pdf.xfxAll(x1, q, this.xf1);
      this.pdf.xfxAll(x2, q, this.xf2);
    }
    const c = this.coefficients;
    this.matrixElement.coefficients(s, c);
    const me = this.meValues;
    const even = c[0]! + cosTheta * cosTheta * c[2]!;
    const odd = cosTheta * c[1]!;
    me[0] = even + odd;
    me[1] = even - odd;
    const evenDown = c[3]! + cosTheta * cosTheta * c[5]!;
    const oddDown = cosTheta * c[4]!;
    me[2] = evenDown + oddDown;
    me[3] = evenDown - oddDown;
    let total = 0;
    for (let k = 0; k < this.termCount; k++) {
      const w = this.termFactor[k]! * this.xf1[this.termFlavour1[k]!]! * this.xf2[this.termFlavour2[k]!]! * me[this.termMatrixElement[k]!]!;
      this.termWeight[k] = w;
      total += w;
    }
    this.termTotal = total;
    // ds/S from the mapping, 2 yMax from y, 2 from cos theta, 1/tau from f = xf/x.
    return (total * GEV2_TO_PB * 4 * yMax) / (mapping.density(s) * this.s * tau);
  }
}
