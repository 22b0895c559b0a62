/**
 * The cautions and the list of physics simplifications that every report
 * carries (and the README repeats). One place, so they never drift apart.
 */

export const CAUTIONS: readonly string[] = [
  'These are approximate reinterpretations: a leading-order parton-level generator, a parametrised detector and re-implemented selections stand in for the experiments\u2019 full simulation and analysis.',
  'Before claiming that a model is excluded (or allowed) in a publication, confirm the result with the experiments\u2019 own tools and a full simulation.',
  'The demo analyses and their yields are invented for illustration; they are not real measurements.',
];

export const SIMPLIFICATIONS: readonly string[] = [
  'Leading-order cross sections with toy parton densities (leading-order evolution of the Les Houches 2001 benchmark input); K-factors only where the model file sets them.',
  'No parton shower, no hadronisation, no underlying event or pile-up beyond a soft-term resolution in the missing transverse momentum; quarks and gluons become jets one to one (merged when closer than 0.4).',
  'No leptons from b and c hadron decays and no jets faking electrons or muons: backgrounds come from the published estimates, the signal is modelled alone.',
  'No spin correlations between production and decay: tops, taus, W and Z bosons outside top decays and new particles decay without memory of the production (the W correlation inside top decays is kept).',
  'Narrow-width decays at the pole mass for t, W, Z and new particles; off-shell W* and Z* only in Higgs decays.',
  'Hadronic tau decays produce one visible system per decay mode (pi, rho, a1, other) without polarisation.',
  'Detector response from efficiency and resolution tables typical of each collider era, not any experiment\u2019s own response.',
  'Limits use the published observed counts, background estimates and total uncertainties per region; correlations between regions are only those the analysis file declares.',
];
