/**
 * The generator: model files, hard processes, cross sections, unweighted hard
 * events, the shared event record and particle table; decay chains
 * (decays/), event generation, and event files (lhe/, CSV).
 */
export { EventRecord, STATUS_DECAYED, STATUS_FINAL, STATUS_INCOMING } from './eventRecord.js';
export { ParticleTable, STANDARD_MODEL_PARTICLES, type DecayChannel, type DecayTable, type ParticleInfo } from './particles.js';
export * from './model/index.js';
export { ELECTROWEAK_SCHEMES, electroweakCouplings, couplingsFrom, fermionZCouplings, scalarZCoupling, chiralFromVectorAxial, type ElectroweakCouplings, type ElectroweakScheme } from './electroweak.js';
export { vectorToFermionsWidth, vectorToScalarsWidth } from './resonanceWidths.js';
export { PairMatrixElement, scalarPairCoefficients, fermionPairCoefficients, type QuarkType } from './processes/index.js';
export { VegasGrid, VegasIntegrator, DEFAULT_ALPHA, DEFAULT_BINS, type Integrand, type VegasIteration, type VegasResult, type VegasRunOptions } from './vegas.js';
export { PairMassMapping } from './pairMassMapping.js';
export { FixedScaleDensity } from './fixedScaleDensity.js';
export { HadronicIntegrand, type HadronicIntegrandOptions } from './hadronicIntegrand.js';
export { integrateChannel, integrateAtScale, type ChannelIntegration, type ChannelIntegrationOptions } from './channelIntegration.js';
export {
  crossSection,
  checkGeneratorOptions,
  DEFAULT_SEED,
  DEFAULT_TARGET_RELATIVE_ERROR,
  STANDARD_ENERGIES_TEV,
  type ChannelCrossSection,
  type CrossSectionOptions,
  type CrossSectionResult,
} from './crossSection.js';
export { crossSectionJson, type CrossSectionJson } from './crossSectionJson.js';
export { HardSampler, prepareHardSampler, reducedMaximum, OVERWEIGHT_TOLERANCE, type HardSamplerOptions, type SamplerChannel, type SamplerStatistics } from './hardSampler.js';
export * from './decays/index.js';
export * from './lhe/index.js';
export { CsvEventWriter, CSV_COLUMNS, formatCsvReal } from './csvWriter.js';
export { EventGenerator, generateEvents, prepareEventGeneration, EVENTS_PER_CHUNK, STREAM_EVENTS, MAX_EVENTS, type EventSink, type GenerationOptions, type GenerationSummary } from './generateEvents.js';
export { writeEventFile, eventFileFormat, lheInitOf, type EventFileFormat, type WriteEventFileOptions } from './writeEventFile.js';
