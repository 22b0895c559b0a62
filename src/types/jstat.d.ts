// Minimal type declarations for the parts of jstat 1.9.6 that tamis uses
// (the package ships no types). Extend as more functions are needed.
declare module 'jstat' {
  interface ContinuousDistribution {
    pdf(x: number, ...params: number[]): number;
    cdf(x: number, ...params: number[]): number;
    inv(p: number, ...params: number[]): number;
    mean(...params: number[]): number;
  }
  interface DiscreteDistribution {
    pdf(k: number, ...params: number[]): number;
    cdf(k: number, ...params: number[]): number;
  }
  // Under Node ESM the package only has a default export: `import jStat from 'jstat'`.
  const jStat: {
    normal: ContinuousDistribution;
    chisquare: ContinuousDistribution;
    gamma: ContinuousDistribution;
    lognormal: ContinuousDistribution;
    poisson: DiscreteDistribution;
    gammafn(x: number): number;
    gammaln(x: number): number;
    gammap(a: number, x: number): number;
    lowRegGamma(a: number, x: number): number;
    gammapinv(p: number, a: number): number;
    erf(x: number): number;
    erfc(x: number): number;
    erfcinv(p: number): number;
    betafn(a: number, b: number): number;
    betaln(a: number, b: number): number;
    ibeta(x: number, a: number, b: number): number;
  };
  export default jStat;
}
