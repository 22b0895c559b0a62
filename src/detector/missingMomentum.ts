/**
 * Missing transverse momentum of a parametrised detector.
 *
 * MET = -(sum of the reconstructed objects' transverse momenta) - (measured soft
 * term). The soft term is the visible activity not reconstructed as an object
 * (jets below threshold or beyond the jet acceptance, muons failing
 * identification inside the tracker); it is measured with a Gaussian
 * resolution per transverse component (common practice)
 *
 *   sigma = sqrt( constant^2 + stochastic^2 * sum pT(soft) ),
 *
 * where `constant` stands for the pile-up and underlying-event activity that a
 * parton-level event record lacks and the second term grows with the soft
 * activity the record does contain, in the usual sqrt(sum E_T) form of
 * calorimeter-based missing-momentum resolutions (common practice). So an
 * event with no invisible particle still has a missing momentum from object
 * smearing and from the soft term.
 */

/**
 * Resolution per transverse component of the soft term, GeV.
 *
 * @param constant GeV
 * @param stochastic GeV^(1/2)
 * @param softSumPt scalar sum of the soft visible transverse momenta, GeV
 * @example
 * softTermWidth(6, 0.5, 64) // 7.211102550927978 = sqrt(36 + 0.25 * 64)
 */
export function softTermWidth(constant: number, stochastic: number, softSumPt: number): number {
  return Math.sqrt(constant * constant + stochastic * stochastic * softSumPt);
}
