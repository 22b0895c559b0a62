/**
 * Electroweak couplings used by the hard processes, in one of two input
 * schemes. Every matrix element and partial width takes its couplings from an
 * `ElectroweakCouplings` object, so one choice holds everywhere.
 *
 * Conventions (the photon and Z vertices share one sign convention, so the
 * photon–Z interference sign is physical):
 *   photon–fermion vertex  -i e Q gamma^mu
 *   Z–fermion vertex       -i g_Z gamma^mu (g_L P_L + g_R P_R),  g_Z = e / (s_W c_W),
 *                          g_L = T3 - Q s_W^2,  g_R = T3_R - Q s_W^2 (T3_R = 0 in the Standard Model)
 *   W–quark vertex         -i (g / sqrt 2) V_ij gamma^mu P_L,  g = e / s_W
 *   scalar currents        -i e Q (k1 - k2)^mu and -i g_Z g_S (k1 - k2)^mu, g_S = T3 - Q s_W^2
 * (the fermion couplings as in the PDG Review, "Electroweak model and constraints on
 * new physics", and M. E. Peskin and D. V. Schroeder, "An Introduction to Quantum
 * Field Theory", section 20.2 — section number from memory; the scalar ones follow
 * from the same covariant derivative acting on a scalar multiplet).
 *
 * Schemes:
 * - `alpha_mz` (default): alpha = alpha_MSbar(M_Z) = 1/127.930 and
 *   sin^2 theta_W = 0.23129 (MSbar at M_Z), both PDG 2024 (constants.ts).
 * - `fermi_constant`: inputs G_F, M_W, M_Z; sin^2 theta_W = 1 - M_W^2 / M_Z^2 and
 *   alpha = sqrt 2 G_F M_W^2 sin^2 theta_W / pi, so that g^2 = 4 sqrt 2 G_F M_W^2
 *   exactly (tree-level relation G_F / sqrt 2 = g^2 / (8 M_W^2), PDG review
 *   "Electroweak model and constraints on new physics").
 * The W and Z propagators use the PDG 2024 pole masses and widths in both schemes.
 */
import { ALPHA_EM_MZ, G_FERMI, M_W, M_Z, SIN2_THETA_W } from '../physics/constants.js';

/** Names of the electroweak input schemes a model file can choose. */
export const ELECTROWEAK_SCHEMES = ['alpha_mz', 'fermi_constant'] as const;
export type ElectroweakScheme = (typeof ELECTROWEAK_SCHEMES)[number];

export interface ElectroweakCouplings {
  scheme: ElectroweakScheme;
  /** Fine-structure constant used in every vertex. */
  alpha: number;
  /** sin^2 theta_W. */
  sin2W: number;
  /** Positron charge e = sqrt(4 pi alpha). */
  e: number;
  /** Z coupling g_Z = e / (s_W c_W). */
  gZ: number;
  /** SU(2) coupling g = e / s_W (the W couples with g / sqrt 2). */
  gW: number;
}

/**
 * The couplings of a scheme.
 *
 * @example
 * electroweakCouplings('fermi_constant').gW ** 2 // 4 sqrt 2 G_F M_W^2 = 0.42620...
 */
export function electroweakCouplings(scheme: ElectroweakScheme = 'alpha_mz'): ElectroweakCouplings {
  let alpha: number;
  let sin2W: number;
  if (scheme === 'fermi_constant') {
    sin2W = 1 - (M_W * M_W) / (M_Z * M_Z);
    alpha = (Math.SQRT2 * G_FERMI * M_W * M_W * sin2W) / Math.PI;
  } else {
    alpha = ALPHA_EM_MZ;
    sin2W = SIN2_THETA_W;
  }
  return couplingsFrom(scheme, alpha, sin2W);
}

/** Couplings from an explicit (alpha, sin^2 theta_W) pair: for tests against formulas quoted with another alpha. */
export function couplingsFrom(scheme: ElectroweakScheme, alpha: number, sin2W: number): ElectroweakCouplings {
  const e = Math.sqrt(4 * Math.PI * alpha);
  const sW = Math.sqrt(sin2W);
  const cW = Math.sqrt(1 - sin2W);
  return { scheme, alpha, sin2W, e, gZ: e / (sW * cW), gW: e / sW };
}

/**
 * Z couplings (g_L, g_R) of a fermion in units of g_Z: g_L = T3_L - Q s_W^2, g_R = T3_R - Q s_W^2
 * (PDG electroweak review; T3_R = 0 for Standard-Model fermions, T3_R = T3_L for vector-like ones).
 *
 * @example
 * fermionZCouplings(-0.5, 0, -1, 0.23129) // [-0.26871, 0.23129]
 */
export function fermionZCouplings(t3Left: number, t3Right: number, charge: number, sin2W: number): [number, number] {
  return [t3Left - charge * sin2W, t3Right - charge * sin2W];
}

/** Z coupling g_S = T3 - Q s_W^2 of a complex scalar in units of g_Z (from the covariant derivative; common practice). */
export function scalarZCoupling(t3: number, charge: number, sin2W: number): number {
  return t3 - charge * sin2W;
}

/**
 * (g_L, g_R) from the vector and axial couplings of the vertex -i (g_Z / 2) gamma^mu (g_V - g_A gamma^5)
 * (normalisation of the PDG electroweak review, where g_V = T3 - 2 Q s_W^2 and g_A = T3):
 * g_L = (g_V + g_A) / 2, g_R = (g_V - g_A) / 2.
 */
export function chiralFromVectorAxial(vector: number, axial: number): [number, number] {
  return [(vector + axial) / 2, (vector - axial) / 2];
}
