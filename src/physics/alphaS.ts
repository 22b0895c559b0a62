/**
 * The strong coupling alpha_s(Q) at one loop with flavour thresholds.
 *
 * Exact one-loop solution (any QCD textbook; the form used by the Les Houches
 * benchmark, Giele et al., hep-ph/0204316, section 1.3):
 *
 *   1/a(mu^2) = 1/a(mu_ref^2) + beta0(nf) ln(mu^2 / mu_ref^2),
 *   a = alpha_s / (4 pi),  beta0(nf) = 11 - 2 nf / 3,
 *
 * applied piecewise between the quark-mass thresholds, where nf changes and
 * alpha_s is continuous (matching is trivial at one loop). Units: GeV.
 */
import { ALPHA_S_MZ, M_B, M_C, M_TOP, M_Z } from './constants.js';
import { TamisError } from '../errors.js';

/** Settings of a one-loop running coupling. */
export interface OneLoopAlphaSSettings {
  /** Scale (GeV) at which the coupling is fixed. */
  referenceScale: number;
  /** alpha_s at `referenceScale`. */
  referenceAlphaS: number;
  /** Charm, bottom and top thresholds (GeV): nf = 3 below charm, 4 up to bottom, 5 up to top, 6 above. */
  thresholds: readonly [charm: number, bottom: number, top: number];
  /** Largest number of active flavours: 5 keeps nf = 5 above the top threshold, 6 switches to 6. */
  maxFlavours: 5 | 6;
}

/** beta0 = 11 - 2 nf / 3 in the normalisation d a / d ln mu^2 = -beta0 a^2, a = alpha_s / (4 pi). */
export function beta0(nf: number): number {
  return 11 - (2 * nf) / 3;
}

/**
 * A one-loop running coupling with flavour thresholds. Immutable and cheap:
 * `alphaS(q)` costs one logarithm.
 *
 * @example
 * lesHouchesAlphaS.alphaS(100) // 0.12230552 (checks.md section 1: 0.1223055)
 */
export class OneLoopAlphaS {
  readonly settings: OneLoopAlphaSSettings;
  /** ln m^2 of the thresholds that are used (charm, bottom[, top]). */
  private readonly lnThreshold2: Float64Array;
  /** 1/a at each threshold in `lnThreshold2`. */
  private readonly inverseAAtThreshold: Float64Array;
  /** 1/a and ln mu^2 at the reference, and nf there. */
  private readonly inverseARef: number;
  private readonly lnRef2: number;
  private readonly nfRef: number;

  constructor(settings: OneLoopAlphaSSettings) {
    const [mc, mb, mt] = settings.thresholds;
    if (!(settings.referenceScale > 0) || !(settings.referenceAlphaS > 0) || !(settings.referenceAlphaS < 4 * Math.PI)) {
      throw new TamisError('bad_input', `alpha_s reference must be a positive scale and a coupling in (0, 4 pi), got alpha_s(${settings.referenceScale}) = ${settings.referenceAlphaS}`);
    }
    if (!(mc > 0 && mc < mb && mb < mt)) {
      throw new TamisError('bad_input', `flavour thresholds must satisfy 0 < m_c < m_b < m_t, got ${mc}, ${mb}, ${mt}`);
    }
    this.settings = settings;
    const used = settings.maxFlavours === 6 ? [mc, mb, mt] : [mc, mb];
    this.lnThreshold2 = Float64Array.from(used, (m) => Math.log(m * m));
    this.lnRef2 = Math.log(settings.referenceScale ** 2);
    this.inverseARef = (4 * Math.PI) / settings.referenceAlphaS;
    this.nfRef = this.flavoursAtLn2(this.lnRef2);
    this.inverseAAtThreshold = new Float64Array(used.length);
    // Walk from the reference outwards, so each threshold value uses the running of the range it closes.
    for (let k = 0; k < used.length; k++) this.inverseAAtThreshold[k] = this.runFromReference(this.lnThreshold2[k]!);
  }

  /** ln(m^2 / GeV^2) of the thresholds where nf changes, ascending (the top one only if nf = 6 is enabled). */
  thresholdsLnQ2(): number[] {
    return Array.from(this.lnThreshold2);
  }

  /** Active flavours at ln(mu^2 / GeV^2); at a threshold the upper range's nf. */
  activeFlavoursAtLnQ2(lnQ2: number): number {
    return this.flavoursAtLn2(lnQ2);
  }

  /** Active flavours at scale Q (GeV): 3 below m_c, then 4, 5 (and 6 above m_t if enabled). */
  activeFlavours(q: number): number {
    return this.flavoursAtLn2(Math.log(q * q));
  }

  /**
   * alpha_s at scale Q (GeV).
   * @throws TamisError('physics') at or below the Landau pole of the lowest range.
   */
  alphaS(q: number): number {
    return this.alphaSAtLnQ2(Math.log(q * q));
  }

  /** alpha_s at mu^2 (GeV^2). */
  alphaSAtQ2(q2: number): number {
    return this.alphaSAtLnQ2(Math.log(q2));
  }

  /** alpha_s at ln(mu^2 / GeV^2): the form used inside evolution codes. */
  alphaSAtLnQ2(lnQ2: number): number {
    const thresholds = this.lnThreshold2;
    let k = 0;
    while (k < thresholds.length && lnQ2 >= thresholds[k]!) k++;
    // Range k has nf = 3 + k and starts at threshold k - 1 (or extends down from threshold 0 for k = 0).
    const anchor = k === 0 ? 0 : k - 1;
    const inverseA = this.inverseAAtThreshold[anchor]! + beta0(3 + k) * (lnQ2 - thresholds[anchor]!);
    if (!(inverseA > 0)) {
      throw new TamisError('physics', `alpha_s is not defined at Q = ${Math.exp(lnQ2 / 2).toPrecision(4)} GeV: below the one-loop Landau pole`, {
        suggestion: 'use a scale of at least 1 GeV',
      });
    }
    return (4 * Math.PI) / inverseA;
  }

  private flavoursAtLn2(lnQ2: number): number {
    let k = 0;
    while (k < this.lnThreshold2.length && lnQ2 >= this.lnThreshold2[k]!) k++;
    return 3 + k;
  }

  /** 1/a at ln mu^2, running from the reference range by range (used once, in the constructor). */
  private runFromReference(lnQ2: number): number {
    const thresholds = this.lnThreshold2;
    const nfTarget = this.flavoursAtLn2(lnQ2);
    // Thresholds between the reference and the target, crossed in order.
    let inverseA = this.inverseARef;
    let lnFrom = this.lnRef2;
    let nf = this.nfRef;
    while (nf !== nfTarget) {
      const up = nfTarget > nf;
      const lnEdge = thresholds[up ? nf - 3 : nf - 4]!;
      inverseA += beta0(nf) * (lnEdge - lnFrom);
      lnFrom = lnEdge;
      nf += up ? 1 : -1;
    }
    return inverseA + beta0(nf) * (lnQ2 - lnFrom);
  }
}

/**
 * The Les Houches LO benchmark settings (Giele et al., hep-ph/0204316, section 1.3):
 * alpha_s(mu0^2 = 2 GeV^2) = 0.35, m_c = sqrt(2) GeV, m_b = 4.5 GeV. The
 * benchmark also names m_t = 175 GeV; tamis keeps nf = 5 above it (no top
 * density, the common five-flavour scheme of hadron-collider densities), which
 * changes nothing below 175 GeV, where the benchmark tables live.
 */
export const LES_HOUCHES_ALPHA_S_SETTINGS: OneLoopAlphaSSettings = {
  referenceScale: Math.SQRT2,
  referenceAlphaS: 0.35,
  thresholds: [Math.SQRT2, 4.5, 175],
  maxFlavours: 5,
};

/**
 * The coupling that goes with the built-in toy densities (the benchmark's own settings).
 *
 * @example
 * lesHouchesAlphaS.alphaSAtQ2(1e4) // 0.12230552
 */
export const lesHouchesAlphaS = new OneLoopAlphaS(LES_HOUCHES_ALPHA_S_SETTINGS);

/**
 * Settings normalised at alpha_s(M_Z) = ALPHA_S_MZ = 0.1180 (PDG 2024), with
 * thresholds at the kinematic quark masses of constants.ts: m_c = M_C = 1.5 GeV,
 * m_b = M_B = 4.7 GeV, m_t = M_TOP = 172.57 GeV, and nf = 6 above m_t.
 */
export const MZ_NORMALISED_ALPHA_S_SETTINGS: OneLoopAlphaSSettings = {
  referenceScale: M_Z,
  referenceAlphaS: ALPHA_S_MZ,
  thresholds: [M_C, M_B, M_TOP],
  maxFlavours: 6,
};

/**
 * One-loop alpha_s normalised at M_Z, for couplings in cross sections.
 *
 * @example
 * mzNormalisedAlphaS.alphaS(91.188) // 0.118
 */
export const mzNormalisedAlphaS = new OneLoopAlphaS(MZ_NORMALISED_ALPHA_S_SETTINGS);
