export { loadModel, parseModel, resolveModel } from './loader.js';
export { modelFileSchema, MAX_COUPLING, MAX_MASS_GEV, type ModelFile } from './schema.js';
export { STANDARD_MODEL_NAMES, ParticleNames, isLepton } from './particleNames.js';
export { canonicalPair, type CanonicalPair } from './canonicalPair.js';
export { resonancePartialWidths } from './resolveResonances.js';
export { BRANCHING_SUM_TOLERANCE } from './resolveDecays.js';
export { MIN_PAIR_MASS_GEV } from './resolveChannels.js';
export type * from './types.js';
