export { PairMatrixElement, type QuarkType } from './pairMatrixElement.js';
export { scalarPairCoefficients } from './scalarPair.js';
export { fermionPairCoefficients } from './fermionPair.js';
