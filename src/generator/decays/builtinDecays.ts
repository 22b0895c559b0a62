/**
 * Built-in decay tables of the Standard-Model particles that tamis decays:
 * t, W+, Z, h(125) and tau-. Antiparticles decay to the conjugate daughters.
 *
 * Daughter order is a convention the special decay routines rely on:
 * - W+ -> (antifermion, fermion): (l+, nu) and (dbar-type, u-type), so the
 *   first daughter is the one whose helicity angle top decays describe;
 * - t -> (down-type quark, W+);
 * - tau- -> (l-, nubar_l, nu_tau) for leptonic modes and (visible hadrons, nu_tau).
 *
 * Branching fractions come from src/physics/constants.ts (PDG 2024; Higgs:
 * Yellow Report 4); how the hadronic totals are split is documented per table.
 */
import { BR_H, BR_TAU, BR_TAU_HADRONIC, BR_W, BR_Z, CKM, SIN2_THETA_W, PDG } from '../../physics/constants.js';
import type { DecayChannel, DecayTable } from '../particles.js';
import { TAU_OTHER_HADRONS_ID } from './tauHadrons.js';

const UP = [PDG.u, PDG.c] as const;
const DOWN = [PDG.d, PDG.s, PDG.b] as const;

/**
 * t -> q W+ with q = d, s, b in proportion to |V_tq|^2 (the partial widths
 * differ only by |V_tq|^2 when the light-quark masses are neglected; common
 * practice). With the CKM magnitudes of constants.ts, t -> b W+ is 99.82%.
 */
function topTable(): DecayTable {
  const row = CKM[2]!;
  const total = row[0]! ** 2 + row[1]! ** 2 + row[2]! ** 2;
  return {
    parent: PDG.t,
    channels: DOWN.map((q, k) => ({ daughters: [q, PDG.W], branching: row[k]! ** 2 / total })),
  };
}

/**
 * W+ decays. Leptonic modes from BR_W (PDG 2024). The hadronic total is split
 * into (dbar-type, u-type) pairs in proportion to |V_ij|^2: at leading order
 * Gamma(W -> u_i dbar_j) = N_c |V_ij|^2 Gamma(W -> l nu) with the same colour
 * factor and QCD correction for every pair, so only |V_ij|^2 differs
 * (PDG Review, "Electroweak model and constraints on new physics"; from memory).
 * Quark-mass effects (c, b against M_W) are below 1e-3 and neglected.
 */
function wTable(): DecayTable {
  const channels: DecayChannel[] = [
    { daughters: [-PDG.e, PDG.nu_e], branching: BR_W.enu },
    { daughters: [-PDG.mu, PDG.nu_mu], branching: BR_W.munu },
    { daughters: [-PDG.tau, PDG.nu_tau], branching: BR_W.taunu },
  ];
  let sum = 0;
  for (let i = 0; i < UP.length; i++) for (let j = 0; j < DOWN.length; j++) sum += CKM[i]![j]! ** 2;
  for (let i = 0; i < UP.length; i++) {
    for (let j = 0; j < DOWN.length; j++) {
      channels.push({ daughters: [-DOWN[j]!, UP[i]!], branching: (BR_W.hadrons * CKM[i]![j]! ** 2) / sum });
    }
  }
  return { parent: PDG.W, channels };
}

/**
 * Relative Z -> f fbar partial width of one quark flavour at lowest order,
 * N_c (g_L^2 + g_R^2) with g_L = T3 - Q sin^2(theta_W), g_R = -Q sin^2(theta_W)
 * (PDG Review, "Electroweak model", Z partial widths; the common factor is dropped).
 *
 * @example
 * zQuarkCouplingWeight(2 / 3, 0.5) // 0.14336 with sin^2 theta_W = 0.23129
 */
export function zQuarkCouplingWeight(charge: number, t3: number): number {
  const gL = t3 - charge * SIN2_THETA_W;
  const gR = -charge * SIN2_THETA_W;
  return gL * gL + gR * gR;
}

/**
 * Z decays. Leptonic and invisible totals from BR_Z (PDG 2024); invisible is
 * split equally into the three neutrino flavours (lepton universality). The
 * hadronic total is split into d, u, s, c, b by zQuarkCouplingWeight; this
 * lowest-order split gives R_b = 0.2197 and R_c = 0.1704 against the measured
 * 0.2163 and 0.1721 (PDG 2024; from memory): the b-vertex and mass corrections
 * are neglected.
 */
function zTable(): DecayTable {
  const up = zQuarkCouplingWeight(2 / 3, 0.5);
  const down = zQuarkCouplingWeight(-1 / 3, -0.5);
  const sum = 2 * up + 3 * down;
  const quark = (id: number, w: number): DecayChannel => ({ daughters: [id, -id], branching: (BR_Z.hadrons * w) / sum });
  return {
    parent: PDG.Z,
    channels: [
      { daughters: [PDG.e, -PDG.e], branching: BR_Z.ee },
      { daughters: [PDG.mu, -PDG.mu], branching: BR_Z.mumu },
      { daughters: [PDG.tau, -PDG.tau], branching: BR_Z.tautau },
      { daughters: [PDG.nu_e, -PDG.nu_e], branching: BR_Z.invisible / 3 },
      { daughters: [PDG.nu_mu, -PDG.nu_mu], branching: BR_Z.invisible / 3 },
      { daughters: [PDG.nu_tau, -PDG.nu_tau], branching: BR_Z.invisible / 3 },
      quark(PDG.d, down),
      quark(PDG.u, up),
      quark(PDG.s, down),
      quark(PDG.c, up),
      quark(PDG.b, down),
    ],
  };
}

/**
 * h(125) decays with the Yellow Report 4 branching fractions (BR_H). They sum
 * to 0.99977; the missing s sbar and lighter modes are not generated, so the
 * listed modes are renormalised to 1 (each rises by 2.3e-4 relative).
 * W W* and Z Z* get their off-shell masses in higgsDecay.ts.
 */
function higgsTable(): DecayTable {
  const modes: [readonly number[], number][] = [
    [[PDG.b, -PDG.b], BR_H.bb],
    [[PDG.W, -PDG.W], BR_H.ww],
    [[PDG.g, PDG.g], BR_H.gg],
    [[PDG.tau, -PDG.tau], BR_H.tautau],
    [[PDG.c, -PDG.c], BR_H.cc],
    [[PDG.Z, PDG.Z], BR_H.zz],
    [[PDG.gamma, PDG.gamma], BR_H.gammagamma],
    [[PDG.Z, PDG.gamma], BR_H.zgamma],
    [[PDG.mu, -PDG.mu], BR_H.mumu],
  ];
  const sum = modes.reduce((s, [, b]) => s + b, 0);
  return { parent: PDG.h, channels: modes.map(([daughters, b]) => ({ daughters, branching: b / sum })) };
}

/**
 * tau- decays. Leptonic modes from BR_TAU (PDG 2024); the hadronic total is
 * split by BR_TAU_HADRONIC into the visible systems pi-, rho- (pi- pi0),
 * a1- (three pions) and a generic multi-hadron system (tauHadrons.ts).
 */
function tauTable(): DecayTable {
  return {
    parent: PDG.tau,
    channels: [
      { daughters: [PDG.e, -PDG.nu_e, PDG.nu_tau], branching: BR_TAU.enunu },
      { daughters: [PDG.mu, -PDG.nu_mu, PDG.nu_tau], branching: BR_TAU.mununu },
      { daughters: [-PDG.pi, PDG.nu_tau], branching: BR_TAU_HADRONIC.pi },
      { daughters: [-PDG.rho, PDG.nu_tau], branching: BR_TAU_HADRONIC.rho },
      { daughters: [-PDG.a1, PDG.nu_tau], branching: BR_TAU_HADRONIC.a1 },
      { daughters: [-TAU_OTHER_HADRONS_ID, PDG.nu_tau], branching: BR_TAU_HADRONIC.other },
    ],
  };
}

/** The built-in tables: t, W+, Z, h, tau- (each sums to 1 within 1e-12). */
export const BUILTIN_DECAY_TABLES: readonly DecayTable[] = [topTable(), wTable(), zTable(), higgsTable(), tauTable()];
