/**
 * Physical constants, masses, widths and branching fractions.
 *
 * Unless stated otherwise the source is the Particle Data Group, Review of
 * Particle Physics 2024 (S. Navas et al., Phys. Rev. D 110 (2024) 030001),
 * "PDG 2024" below. Each value says how it was obtained, as in
 * ../shared/checks.md of the project brief: "checked" = compared with a
 * faithful copy of the primary source; "from memory" = recalled, not yet
 * verified against a primary source. Units: GeV, GeV^-2, pb.
 */

/** Conversion (hbar c)^2 = 0.3893793721 GeV^2 mbarn (PDG 2024, physical constants table; from memory). In pb GeV^2. */
export const GEV2_TO_PB = 0.3893793721e9;

/** Z boson mass (PDG 2024 mass/width file; checked). */
export const M_Z = 91.188;
/** Z boson total width (PDG 2024; checked). */
export const GAMMA_Z = 2.4955;
/** W boson mass (PDG 2024 mass/width file; checked). */
export const M_W = 80.3692;
/** W boson total width (PDG 2024; checked). */
export const GAMMA_W = 2.085;
/** Top quark mass, direct measurements (PDG 2024; checked). */
export const M_TOP = 172.57;
/** Top quark total width (PDG 2024; checked). */
export const GAMMA_TOP = 1.42;
/** Higgs boson mass (PDG 2024; checked). */
export const M_H = 125.2;
/** Higgs total width, Standard-Model prediction at 125 GeV (Higgs cross-section working group, Yellow Report 4, arXiv:1610.07922; from memory). */
export const GAMMA_H = 4.1e-3;
/** Tau lepton mass (PDG 2024; checked). */
export const M_TAU = 1.77693;
/** Muon mass (PDG 2024 / CODATA; from memory). */
export const M_MU = 0.1056583755;
/** Electron mass (PDG 2024 / CODATA; from memory). */
export const M_E = 0.00051099895;
/** Bottom quark mass used for kinematics (pole-mass scale, common practice; the parton densities use 4.5 GeV as their benchmark states). */
export const M_B = 4.7;
/** Charm quark mass used for kinematics (common practice). */
export const M_C = 1.5;
/** Charged pion mass (PDG 2024; from memory). */
export const M_PI_CHARGED = 0.13957039;
/** Neutral pion mass (PDG 2024; from memory). */
export const M_PI_NEUTRAL = 0.1349768;
/** rho(770) mass and width (PDG 2024; from memory). */
export const M_RHO = 0.77526;
export const GAMMA_RHO = 0.1491;
/** a1(1260) mass and width (PDG 2024 gives broad estimates; from memory). */
export const M_A1 = 1.23;
export const GAMMA_A1 = 0.42;

/** Fermi constant G_F in GeV^-2 (PDG 2024; checked). */
export const G_FERMI = 1.1663788e-5;
/** Fine-structure constant at zero momentum, 1/alpha(0) (PDG 2024; checked). */
export const ALPHA_EM_0 = 1 / 137.035999177;
/** MSbar fine-structure constant at M_Z, 1/alpha(M_Z) = 127.930 (PDG 2024; checked). Used for couplings in cross sections. */
export const ALPHA_EM_MZ = 1 / 127.93;
/**
 * sin^2 theta_W in the MSbar scheme at M_Z = 0.23129 (PDG 2024, electroweak review; checked —
 * another copy of the table gives 0.23122, and 0.23129 is the one used here).
 */
export const SIN2_THETA_W = 0.23129;
/** Strong coupling alpha_s(M_Z) (PDG 2024 world average; checked). */
export const ALPHA_S_MZ = 0.118;

/** Number of quark colours. */
export const N_COLOURS = 3;

/** Magnitudes of CKM elements (PDG 2024 CKM review, global fit; from memory). Index [up-type][down-type], up = (u, c, t), down = (d, s, b). */
export const CKM: readonly (readonly number[])[] = [
  [0.97435, 0.22501, 0.003732],
  [0.22487, 0.97349, 0.04183],
  [0.00858, 0.04111, 0.999118],
];

/** W branching fractions (PDG 2024; checked): e nu, mu nu, tau nu; hadrons take the rest. */
export const BR_W = {
  enu: 0.1071,
  munu: 0.1063,
  taunu: 0.1138,
  hadrons: 1 - 0.1071 - 0.1063 - 0.1138,
} as const;

/**
 * Z branching fractions (PDG 2024; rounded values checked, last digits from memory):
 * invisible 20.000%, ee 3.3632%, mumu 3.3662%, tautau 3.3696%; hadrons take the rest
 * (PDG quotes 69.911%, the sum closes to within 1e-4).
 */
export const BR_Z = {
  ee: 0.033632,
  mumu: 0.033662,
  tautau: 0.033696,
  invisible: 0.2,
  hadrons: 1 - 0.033632 - 0.033662 - 0.033696 - 0.2,
} as const;

/** Leptonic tau branching fractions (PDG 2024; checked). Hadronic modes take the rest. */
export const BR_TAU = {
  enunu: 0.1782,
  mununu: 0.1739,
  hadrons: 1 - 0.1782 - 0.1739,
} as const;

/**
 * Split of the hadronic tau decays by visible system (PDG 2024, from memory):
 * pi nu ~10.8%, pi pi0 nu (rho) ~25.5%, pi 2pi0 nu and 3pi nu (a1) ~9.3% + 9.0%;
 * the remaining hadronic modes are lumped into "other" so the sum equals BR_TAU.hadrons.
 * Values are fractions of all tau decays.
 */
export const BR_TAU_HADRONIC = {
  pi: 0.108,
  rho: 0.255,
  a1: 0.093 + 0.09,
  other: 1 - 0.1782 - 0.1739 - 0.108 - 0.255 - 0.093 - 0.09,
} as const;

/**
 * Branching fractions of a 125.00 GeV Higgs boson (Higgs cross-section working
 * group, Yellow Report 4, arXiv:1610.07922; checked). They sum to 0.99977;
 * the remainder (s sbar and lighter modes) is not generated.
 */
export const BR_H = {
  bb: 0.5824,
  ww: 0.2137,
  gg: 0.08187,
  tautau: 0.06272,
  cc: 0.02891,
  zz: 0.02619,
  gammagamma: 0.00227,
  zgamma: 0.001533,
  mumu: 0.0002176,
} as const;

/** Particle numbering scheme ids (PDG, "Monte Carlo particle numbering scheme"). */
export const PDG = {
  d: 1,
  u: 2,
  s: 3,
  c: 4,
  b: 5,
  t: 6,
  e: 11,
  nu_e: 12,
  mu: 13,
  nu_mu: 14,
  tau: 15,
  nu_tau: 16,
  g: 21,
  gamma: 22,
  Z: 23,
  W: 24,
  h: 25,
  pi0: 111,
  pi: 211,
  rho: 213,
  a1: 20213,
} as const;

/** cos^2 theta_W and sin theta_W cos theta_W derived from SIN2_THETA_W. */
export const COS2_THETA_W = 1 - SIN2_THETA_W;
