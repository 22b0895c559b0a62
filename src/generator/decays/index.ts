export { createDecayer, type Decayer, type DecayerOptions } from './decayer.js';
export { BUILTIN_DECAY_TABLES, zQuarkCouplingWeight } from './builtinDecays.js';
export { helicityFractionsLO, type HelicityFractions } from './topDecay.js';
export { vectorPairWeight } from './higgsDecay.js';
export { tauLeptonEnergyDensity } from './tauDecay.js';
export { TAU_OTHER_HADRONS, TAU_OTHER_HADRONS_ID, TAU_VISIBLE_HADRON_IDS, isTauVisibleHadrons, tauSpectralWeight } from './tauHadrons.js';
export { sampleBreitWignerS, breitWignerDensityS } from './breitWigner.js';
