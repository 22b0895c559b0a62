/**
 * Statistics: Poisson likelihoods of counting regions, CLs upper limits
 * (exact, pseudo-experiments, asymptotic) with expected bands, combinations,
 * and cross-section limits. See DEVELOPERS.md, "Statistics".
 */
export * from './types.js';
export { upperLimit } from './upperLimit.js';
export { combinedUpperLimit } from './combination.js';
export { analysisLimits, type AnalysisLimits, type CrossSectionLimits, type RecastRegion, type RecastSettings, type RegionLimits } from './analysisLimits.js';
export * from './physicsLimits.js';
export { asimovDiscoverySignificance, medianDiscoverySignificance } from './discovery.js';
export { ASYMPTOTIC_MIN_COUNT, chooseMethod, equivalentSingleRegion } from './autoMethod.js';
export { exactCls, exactUpperLimit, exactLimits } from './clsExact.js';
export { asymptoticCls, asymptoticLimits, bandSignificance } from './clsAsymptotic.js';
export { bandProbabilities } from './expectedBands.js';
export { logFactorial, logPoissonCdf, logPoissonPmf, poissonCdf, poissonQuantile } from './poisson.js';
export { poissonInverse, samplePoisson } from './poissonSampling.js';
export { CountingModel, type ModelRegion } from './countingModel.js';
export { ProfileFit } from './profileFit.js';
export { ProfileLikelihoodRatio } from './profileLikelihoodRatio.js';
export { LIMIT_METHODS, UNCERTAINTY_MODELS } from './validate.js';
export { parseRegionsCsv, readRegionsCsv, type RegionRow } from './regionsCsv.js';
export { regionTableLimits, type RegionTableLimits } from './regionTable.js';
export { limitJson, regionTableJson, type LimitJson } from './limitReport.js';
