/**
 * Hadronic cross sections: VEGAS against a deterministic quadrature of the same
 * integral, against the narrow-width formula, and the expected trends.
 */
import { describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { lesHouchesToyDensities } from '../../src/physics/pdf/index.js';
import { GEV2_TO_PB, PDG } from '../../src/physics/constants.js';
import { crossSection } from '../../src/generator/crossSection.js';
import { HadronicIntegrand } from '../../src/generator/hadronicIntegrand.js';
import { parseModel } from '../../src/generator/model/index.js';
import { vectorToFermionsWidth, vectorToScalarsWidth } from '../../src/generator/resonanceWidths.js';
import { expectClose } from '../helpers.js';

const pdf = lesHouchesToyDensities();
const benchmarkText = readFileSync(new URL('../../data-demo/benchmark.model.yaml', import.meta.url), 'utf8');
const benchmark = parseModel(benchmarkText, 'benchmark.model.yaml');
const withMass = (mass: number) => parseModel(benchmarkText.replace('    mass: 300\n', `    mass: ${mass}\n`), 'benchmark.model.yaml');

/** Gauss–Legendre nodes and weights on [-1, 1] by Newton iteration on P_n (Abramowitz and Stegun 25.4.29). */
function gaussLegendre(n: number): { x: number[]; w: number[] } {
  const x: number[] = [];
  const w: number[] = [];
  for (let i = 1; i <= n; i++) {
    let z = Math.cos((Math.PI * (i - 0.25)) / (n + 0.5));
    let dp = 0;
    for (let iteration = 0; iteration < 100; iteration++) {
      let p0 = 1;
      let p1 = z;
      for (let k = 2; k <= n; k++) [p0, p1] = [p1, ((2 * k - 1) * z * p1 - (k - 1) * p0) / k];
      dp = (n * (z * p1 - p0)) / (z * z - 1);
      const dz = p1 / dp;
      z -= dz;
      if (Math.abs(dz) < 1e-15) break;
    }
    x.push(z);
    w.push(2 / ((1 - z * z) * dp * dp));
  }
  return { x, w };
}

/**
 * Deterministic product quadrature of a channel integrand over the unit cube:
 * composite Gauss–Legendre in u1 with panels split at the mapping's
 * breakpoints (where the integrand jumps or has a narrow peak), and in u2;
 * 4 points in u3 (the integrand is a polynomial of degree <= 2 in cos theta).
 */
function quadrature(integrand: HadronicIntegrand, panels1: number, panels2: number): number {
  const cuts = integrand.mapping!.breakpoints();
  const g8 = gaussLegendre(8);
  const g4 = gaussLegendre(4);
  const u = new Float64Array(3);
  let total = 0;
  for (let c = 0; c + 1 < cuts.length; c++) {
    // panels1 per segment between breakpoints
    const h1 = (cuts[c + 1]! - cuts[c]!) / panels1;
    for (let p1 = 0; p1 < panels1; p1++) {
      for (let i = 0; i < 8; i++) {
        u[0] = cuts[c]! + h1 * (p1 + 0.5 + 0.5 * g8.x[i]!);
        const w1 = 0.5 * h1 * g8.w[i]!;
        for (let p2 = 0; p2 < panels2; p2++) {
          for (let j = 0; j < 8; j++) {
            u[1] = (p2 + 0.5 + 0.5 * g8.x[j]!) / panels2;
            const w2 = (0.5 * g8.w[j]!) / panels2;
            for (let k = 0; k < 4; k++) {
              u[2] = 0.5 + 0.5 * g4.x[k]!;
              total += w1 * w2 * 0.5 * g4.w[k]! * integrand.evaluate(u);
            }
          }
        }
      }
    }
  }
  return total;
}

describe('hadronic cross sections of the demo benchmark', () => {
  const result = crossSection(benchmark, { energyTeV: 13, pdf, seed: 3 });

  it('reaches the target 0.5% MC error in every channel, with healthy chi^2 per dof', () => {
    expect(result.reachedTarget).toBe(true);
    for (const c of result.channels) {
      expect(c.errorPb / c.sigmaPb).toBeLessThanOrEqual(0.005);
      // chi^2/dof of the production iterations: threshold 4 (p < 1e-3 for >= 2 dof).
      expect(c.chi2PerDof).toBeLessThan(4);
    }
    expectClose(result.sigmaPb, result.channels.reduce((s, c) => s + c.sigmaPb, 0), { rel: 1e-12 });
  });

  it('agrees with a deterministic quadrature of the same integral within 3 MC errors, channel by channel', () => {
    for (const [i, channel] of benchmark.channels.entries()) {
      const integrand = new HadronicIntegrand(channel, { sqrtS: 13000, pdf, scaleFactor: 1 });
      const reference = quadrature(integrand, 12, 8);
      // The quadrature itself converges: doubling the panels changes it by far less than the MC error.
      const finer = quadrature(integrand, 24, 16);
      const c = result.channels[i]!;
      expect(Math.abs(finer - reference)).toBeLessThan(0.2 * c.errorPb);
      expect(Math.abs(c.sigmaPb - finer)).toBeLessThan(3 * c.errorPb);
    }
  });

  it('has a scale band that contains the central value and is a few per cent wide', () => {
    const [low, high] = result.scaleBandPb;
    expect(low).toBeLessThanOrEqual(result.sigmaPb);
    expect(high).toBeGreaterThanOrEqual(result.sigmaPb);
    // LO Drell-Yan-like production: a few per cent to ~15% (common practice for LO scale bands).
    expect((high - low) / result.sigmaPb).toBeGreaterThan(0.02);
    expect((high - low) / result.sigmaPb).toBeLessThan(0.3);
  });

  it('is deterministic for a seed and statistically consistent across seeds', () => {
    const again = crossSection(benchmark, { energyTeV: 13, pdf, seed: 3 });
    expect(again.sigmaPb).toBe(result.sigmaPb);
    const other = crossSection(benchmark, { energyTeV: 13, pdf, seed: 4 });
    expect(other.sigmaPb).not.toBe(result.sigmaPb);
    expect(Math.abs(other.sigmaPb - result.sigmaPb)).toBeLessThan(4 * Math.hypot(other.errorPb, result.errorPb));
  });

  it('multiplies a channel by its K-factor, printed beside it', () => {
    const scaled = parseModel(benchmarkText.replace('    through: [Z, V0]\n', '    through: [Z, V0]\n    k_factor: 1.25\n'), 'k.model.yaml');
    const r = crossSection(scaled, { energyTeV: 13, pdf, seed: 3 });
    expect(r.kFactors).toEqual({ charged_pair: 1, neutral_pair: 1.25, mixed_pair: 1 });
    expectClose(r.channels[1]!.sigmaPb, 1.25 * result.channels[1]!.sigmaPb, { rel: 1e-12 });
    expectClose(r.channels[1]!.errorPb, 1.25 * result.channels[1]!.errorPb, { rel: 1e-12 });
    expectClose(r.channels[1]!.sigmaLoPb, result.channels[1]!.sigmaLoPb, { rel: 1e-12 });
  });
});

describe('trends', () => {
  it('falls as the mass rises and rises with the collider energy', () => {
    const sigma = (mass: number, energy: number) => crossSection(withMass(mass), { energyTeV: energy, pdf, targetRelativeError: 0.01 }).sigmaPb;
    const byMass = [200, 300, 450].map((m) => sigma(m, 13));
    expect(byMass[0]!).toBeGreaterThan(byMass[1]!);
    expect(byMass[1]!).toBeGreaterThan(byMass[2]!);
    const byEnergy = [7, 8, 13, 13.6, 14].map((e) => sigma(300, e));
    for (let i = 1; i < byEnergy.length; i++) expect(byEnergy[i]!).toBeGreaterThan(byEnergy[i - 1]!);
  });

  it('is zero, not an error, when the pair is too heavy for the collider', () => {
    const r = crossSection(withMass(4000), { energyTeV: 7, pdf });
    expect(r.channels.every((c) => !c.open && c.sigmaPb === 0)).toBe(true);
  });

  it('rejects bad options with a located TamisError', () => {
    expect(() => crossSection(benchmark, { energyTeV: -1, pdf })).toThrow(/energy must be in \(0, 100\] TeV/);
    expect(() => crossSection(benchmark, { energyTeV: 13, pdf, seed: 1.5 })).toThrow(/seed/);
    expect(() => crossSection(benchmark, { energyTeV: 13, pdf, targetRelativeError: 0 })).toThrow(/target relative error/);
  });
});

describe('narrow resonance in proton collisions (Gamma/M = 1e-3)', () => {
  // sigma(pp -> R -> f) = sum_q (4 pi^2 / (3 M^3)) Gamma(R -> q qbar) BR(R -> f) integral dy [x1 q(x1) x2 qbar(x2) + (q <-> qbar)]
  // at tau0 = M^2/S: the partonic narrow-width formula (PDG Review, "Cross-section formulae",
  // resonance formation; see narrowWidth.test.ts) folded with the parton densities.
  const M = 1200;
  const Gamma = 1.2;
  const text = (pair: string, through: string) => `name: narrow
particles:
  - {name: S+, id: 9000211, spin: 0, mass: 300, charge: 1, weak_isospin: 0.5}
  - {name: E-, id: 9000011, spin: 0.5, mass: 400, charge: -1, weak_isospin: -0.5}
  - {name: N0, id: 9000012, spin: 0.5, mass: 250, charge: 0, weak_isospin: 0.5}
resonances:
  - name: V0
    id: 9000023
    charge: 0
    mass: ${M}
    width: ${Gamma}
    quark_couplings: {left: 0.02, right: 0.01}
    pair_couplings:
      - {pair: [S+, S-], coupling: 0.3}
  - name: V+
    id: 9000024
    charge: 1
    mass: ${M}
    width: ${Gamma}
    quark_couplings: {left: 0.03}
    pair_couplings:
      - {pair: [N0, E+], left: 0.2, right: 0.05}
channels:
  - {name: c, pair: ${pair}, through: [${through}], mass_range: [${M - 60}, ${M + 60}]}
`;

  /** The narrow-width prediction restricted to the same window (fraction of a fixed-width Breit–Wigner inside it). */
  function narrowWidth(kind: 'neutral' | 'charged', gammaOut: number, quark: { left: number; right: number }, scale: number): number {
    const S = 13000 ** 2;
    const tau0 = (M * M) / S;
    const yMax = -0.5 * Math.log(tau0);
    const xf1 = new Float64Array(13);
    const xf2 = new Float64Array(13);
    const n = 400;
    const gq = vectorToFermionsWidth(M, quark.left, quark.right, 0, 0, 3);
    // CKM of the charged current, as in the generator (constants.ts).
    const pairs: [number, number, number][] =
      kind === 'neutral'
        ? [PDG.d, PDG.u, PDG.s, PDG.c, PDG.b].map((q) => [q, -q, 1] as [number, number, number])
        : [];
    if (kind === 'charged') {
      const ckm = [
        [0.97435, 0.22501, 0.003732],
        [0.22487, 0.97349, 0.04183],
      ];
      [PDG.u, PDG.c].forEach((u, a) => [PDG.d, PDG.s, PDG.b].forEach((d, b) => {
        pairs.push([u, -d, ckm[a]![b]! ** 2], [d, -u, ckm[a]![b]! ** 2]);
      }));
    }
    let lumi = 0;
    for (let i = 0; i < n; i++) {
      const y = -yMax + ((i + 0.5) * 2 * yMax) / n;
      const x1 = Math.sqrt(tau0) * Math.exp(y);
      const x2 = Math.sqrt(tau0) * Math.exp(-y);
      pdf.xfxAll(x1, scale, xf1);
      pdf.xfxAll(x2, scale, xf2);
      for (const [a, b, v2] of pairs) lumi += (v2 * (xf1[a + 6]! * xf2[b + 6]! + xf1[b + 6]! * xf2[a + 6]!) * 2 * yMax) / n;
    }
    const t = (x: number) => Math.atan(((x * x - M * M) / (M * Gamma)));
    const inside = (t(M + 60) - t(M - 60)) / Math.PI;
    return (((4 * Math.PI ** 2) / (3 * M ** 3)) * gq * (gammaOut / Gamma) * lumi * inside * GEV2_TO_PB);
  }

  it('q qbar -> V0 -> S+ S-: VEGAS with the full Breit–Wigner within 1% of the narrow-width formula', () => {
    const model = parseModel(text('[S+, S-]', 'V0'), 'n.model.yaml');
    const r = crossSection(model, { energyTeV: 13, pdf, targetRelativeError: 0.002 });
    const expected = narrowWidth('neutral', vectorToScalarsWidth(M, 0.3, 300, 300), { left: 0.02, right: 0.01 }, 300);
    expectClose(r.sigmaPb, expected, { rel: 0.01 + 3 * (r.errorPb / r.sigmaPb) });
  });

  it('u dbar -> V+ -> N0 E+ (chiral couplings, unequal masses, CKM): within 1%', () => {
    const model = parseModel(text('[N0, E+]', 'V+'), 'n.model.yaml');
    const r = crossSection(model, { energyTeV: 13, pdf, targetRelativeError: 0.002 });
    const expected = narrowWidth('charged', vectorToFermionsWidth(M, 0.2, 0.05, 250, 400, 1), { left: 0.03, right: 0 }, 325);
    expectClose(r.sigmaPb, expected, { rel: 0.01 + 3 * (r.errorPb / r.sigmaPb) });
  });
});
