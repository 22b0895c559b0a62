export * from './constants.js';
export * from './fourVector.js';
export * from './phaseSpace.js';
export * from './random.js';
export * from './alphaS.js';
export * from './pdf/index.js';
