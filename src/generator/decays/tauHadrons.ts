/**
 * The visible hadronic system of a hadronic tau decay, tau- -> nu_tau + h-.
 *
 * tamis does not hadronise: the hadrons of each mode are written as one
 * status-1 particle carrying their summed four-momentum and invariant mass,
 * so the detector can build a hadronic tau candidate from it.
 *
 * | mode            | PDG id of h+ | mass                                                     |
 * |-----------------|--------------|----------------------------------------------------------|
 * | pi nu           | 211          | m_pi (fixed)                                             |
 * | rho: pi pi0 nu  | 213          | Breit-Wigner (M_RHO, GAMMA_RHO) x spectral weight         |
 * | a1: 3 pions nu  | 20213        | Breit-Wigner (M_A1, GAMMA_A1) x spectral weight           |
 * | other hadrons   | 98           | flat spectral function x spectral weight, above 4 pions   |
 *
 * Spectral weight: for a spin-1 hadronic system of mass^2 s,
 * dGamma/ds ∝ (1 - s/m_tau^2)^2 (1 + 2 s/m_tau^2) v(s)
 * (Y.-S. Tsai, Phys. Rev. D 4 (1971) 2821; from memory), with v(s) the
 * spectral function: a Breit-Wigner for rho and a1, flat for the lumped
 * remaining modes (four-pion and kaon modes; a tamis approximation).
 *
 * Id 98 lies in the range 81-100 that the PDG numbering scheme reserves for
 * generator-specific pseudoparticles (PDG Review, "Monte Carlo particle
 * numbering scheme"; from memory). Its charge is that of the tau's sign.
 */
import { GAMMA_A1, GAMMA_RHO, M_A1, M_PI_CHARGED, M_PI_NEUTRAL, M_RHO, M_TAU, PDG } from '../../physics/constants.js';
import type { RandomStream } from '../../physics/random.js';
import type { ParticleInfo } from '../particles.js';
import { sampleBreitWignerS } from './breitWigner.js';

/** PDG-style id (positive = charge +1) of the lumped "other hadrons" system of tau decays. */
export const TAU_OTHER_HADRONS_ID = 98;

/** Ids (absolute values) of every visible hadronic tau system tamis writes. */
export const TAU_VISIBLE_HADRON_IDS: readonly number[] = [PDG.pi, PDG.rho, PDG.a1, TAU_OTHER_HADRONS_ID];

/** True if |id| is the visible hadronic system of a tau decay (pi, rho, a1 or the lumped system). */
export function isTauVisibleHadrons(id: number): boolean {
  const a = id < 0 ? -id : id;
  return a === PDG.pi || a === PDG.rho || a === PDG.a1 || a === TAU_OTHER_HADRONS_ID;
}

/** Lower mass edge of each visible system (GeV): the lightest pion final state of the mode. */
export const TAU_RHO_MASS_MIN = M_PI_CHARGED + M_PI_NEUTRAL;
export const TAU_A1_MASS_MIN = M_PI_CHARGED + 2 * M_PI_NEUTRAL;
export const TAU_OTHER_MASS_MIN = M_PI_CHARGED + 3 * M_PI_NEUTRAL;

/**
 * The spin-1 kinematic factor of tau -> nu + hadrons at hadronic mass^2 s,
 * (1 - s/m_tau^2)^2 (1 + 2 s/m_tau^2) (Tsai 1971; from memory). Equals 1 at
 * s = 0, decreases monotonically to 0 at s = m_tau^2.
 *
 * @example
 * tauSpectralWeight(0, 1.77693) // 1
 */
export function tauSpectralWeight(s: number, tauMass: number): number {
  const r = s / (tauMass * tauMass);
  const a = 1 - r;
  return a * a * (1 + 2 * r);
}

/**
 * Draws the mass (GeV) of a visible system with a Breit-Wigner spectral
 * function times tauSpectralWeight, between `massMin` and the tau mass:
 * s from the truncated Breit-Wigner, accepted with weight(s) / weight(massMin^2)
 * (the weight decreases in s, so this bounds it).
 */
export function sampleResonantHadronMass(resonanceMass: number, resonanceWidth: number, massMin: number, tauMass: number, rng: RandomStream): number {
  const sLow = massMin * massMin;
  const sHigh = tauMass * tauMass;
  const wMax = tauSpectralWeight(sLow, tauMass);
  for (;;) {
    const s = sampleBreitWignerS(resonanceMass, resonanceWidth, sLow, sHigh, rng);
    if (rng.uniform() * wMax <= tauSpectralWeight(s, tauMass)) return Math.sqrt(s);
  }
}

/** Mass (GeV) of the lumped "other hadrons" system: s flat in [massMin^2, m_tau^2] times tauSpectralWeight. */
export function sampleOtherHadronMass(massMin: number, tauMass: number, rng: RandomStream): number {
  const sLow = massMin * massMin;
  const sHigh = tauMass * tauMass;
  const wMax = tauSpectralWeight(sLow, tauMass);
  for (;;) {
    const s = sLow + (sHigh - sLow) * rng.uniform();
    if (rng.uniform() * wMax <= tauSpectralWeight(s, tauMass)) return Math.sqrt(s);
  }
}

/** Mean of sqrt(s) under flat-v(s) x tauSpectralWeight (Simpson's rule, 400 intervals): the nominal mass of id 98. */
function meanOtherHadronMass(): number {
  const sLow = TAU_OTHER_MASS_MIN ** 2;
  const sHigh = M_TAU ** 2;
  const n = 400;
  const h = (sHigh - sLow) / n;
  let num = 0;
  let den = 0;
  for (let k = 0; k <= n; k++) {
    const s = sLow + k * h;
    const c = k === 0 || k === n ? 1 : k % 2 === 1 ? 4 : 2;
    const w = c * tauSpectralWeight(s, M_TAU);
    num += w * Math.sqrt(s);
    den += w;
  }
  return num / den;
}

/**
 * Particle data of the lumped system (positive id: charge +1). Its `mass` is
 * the mean of the sampled mass distribution (about 1.03 GeV); every generated
 * system carries its own mass in the event record.
 */
export const TAU_OTHER_HADRONS: ParticleInfo = {
  id: TAU_OTHER_HADRONS_ID,
  name: 'tau_hadrons+',
  mass: meanOtherHadronMass(),
  width: 0,
  charge: 1,
  twiceSpin: 2,
  colour: 1,
  selfConjugate: false,
};

/** The visible-mass sampler for a hadronic tau system of id `absId` (pi gets its fixed mass). */
export function sampleTauVisibleMass(absId: number, tauMass: number, rng: RandomStream): number {
  switch (absId) {
    case PDG.rho:
      return sampleResonantHadronMass(M_RHO, GAMMA_RHO, TAU_RHO_MASS_MIN, tauMass, rng);
    case PDG.a1:
      return sampleResonantHadronMass(M_A1, GAMMA_A1, TAU_A1_MASS_MIN, tauMass, rng);
    case TAU_OTHER_HADRONS_ID:
      return sampleOtherHadronMass(TAU_OTHER_MASS_MIN, tauMass, rng);
    default:
      return M_PI_CHARGED;
  }
}
