/**
 * Leptonic tau decays with the V-A matrix element.
 *
 * For tau-(P) -> l-(p1) nu_tau(p2) nubar_l(p3) the spin-summed squared matrix
 * element is |M|^2 = 64 G_F^2 (P . p3)(p1 . p2), the muon-decay result with
 * the roles renamed (D. Griffiths, Introduction to Elementary Particles, 2nd
 * ed., sec. 10.2 (muon decay); L. B. Okun, Leptons and Quarks, ch. 3). For the
 * tau+ the conjugate particles take the same places. It holds for massive
 * leptons as written (the (1 - gamma5) projectors remove the mass terms of the
 * traces). With massless neutrinos and m12^2 = (p1 + p2)^2:
 *   P . p3 = (M^2 - m12^2) / 2,   p1 . p2 = (m12^2 - m_l^2) / 2,
 * so |M|^2 ∝ (M^2 - m12^2)(m12^2 - m_l^2) depends on m12^2 only. Three-body
 * phase space is flat in (m12^2, m23^2) (PDG Review, "Kinematics"), so we draw
 * a uniform point of the Dalitz rectangle, accept it with |M|^2 / max|M|^2
 * and keep it if it lies in the Dalitz region.
 *
 * Result for a massless lepton: dGamma/dx ∝ x^2 (3 - 2x), x = 2 E_l / m_tau in
 * the tau rest frame, mean x = 7/10 (tauLeptonEnergyDensity). Tau polarisation
 * is ignored (unpolarised taus): a tamis simplification.
 */
import type { RandomStream } from '../../physics/random.js';
import { threeBodyAtRest } from './restFrame.js';

/**
 * Samples tau -> l nu nu in the rest frame of a tau of mass `tauMass`: writes
 * the charged lepton (mass `leptonMass`),
 * the neutrino that pairs with it in p1 . p2 (nu_tau for tau-, nubar_tau for
 * tau+) and the other neutrino to slots `iLepton`, `iPartner`, `iOther`.
 */
export function sampleTauLeptonicAtRest(tauMass: number, leptonMass: number, rng: RandomStream, rest: Float64Array, iLepton: number, iPartner: number, iOther: number): void {
  const bigM2 = tauMass * tauMass;
  const ml2 = leptonMass * leptonMass;
  const half = (bigM2 - ml2) / 2;
  const wMax = half * half;
  const hi23 = (tauMass - leptonMass) * (tauMass - leptonMass);
  for (;;) {
    const m12sq = ml2 + (bigM2 - ml2) * rng.uniform();
    const w = (bigM2 - m12sq) * (m12sq - ml2);
    if (rng.uniform() * wMax > w) continue;
    const m23sq = hi23 * rng.uniform();
    if (threeBodyAtRest(rest, iLepton, iPartner, iOther, tauMass, leptonMass, 0, 0, m12sq, m23sq, rng)) return;
  }
}

/**
 * Normalised charged-lepton energy spectrum of leptonic tau (or muon) decay for
 * a massless lepton, unpolarised parent: dGamma/dx / Gamma = 2 x^2 (3 - 2x),
 * x = 2 E / M in [0, 1] (V-A with Michel parameter rho = 3/4: ../shared/checks.md,
 * from memory; Griffiths sec. 10.2). Its mean is 7/10.
 *
 * @example
 * tauLeptonEnergyDensity(1) // 2
 */
export function tauLeptonEnergyDensity(x: number): number {
  return x < 0 || x > 1 ? 0 : 2 * x * x * (3 - 2 * x);
}
