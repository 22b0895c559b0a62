/**
 * Unweighted hard events: conservation laws in every event, the event-record
 * conventions, determinism, and chi-square tests of the cos theta and pair-mass
 * distributions against the matrix element folded with the parton densities
 * (expected bin contents from a deterministic quadrature of the same integrand).
 */
import { describe, expect, it } from 'vitest';
import jStat from 'jstat';
import { lesHouchesToyDensities } from '../../src/physics/pdf/index.js';
import { RandomStream } from '../../src/physics/random.js';
import { EventRecord, STATUS_FINAL, STATUS_INCOMING } from '../../src/generator/eventRecord.js';
import { prepareHardSampler, reducedMaximum, type HardSampler } from '../../src/generator/hardSampler.js';
import { HadronicIntegrand, POINT_COS_THETA } from '../../src/generator/hadronicIntegrand.js';
import { readFileSync, readdirSync } from 'node:fs';
import { loadModel, parseModel } from '../../src/generator/model/index.js';
import type { Model } from '../../src/generator/model/types.js';
import { expectClose } from '../helpers.js';

const pdf = lesHouchesToyDensities();
const benchmark = loadModel('data-demo/benchmark.model.yaml');
// A chiral variant of the demo heavy lepton (right-handed singlet): its Z coupling violates parity,
// so the pair has a forward-backward asymmetry (the vector-like demo lepton has none).
const heavyLeptonText = readFileSync('data-demo/heavy-lepton.model.yaml', 'utf8');
const chiralText = heavyLeptonText.replace('    weak_isospin: -0.5            # both chiralities: a vector-like doublet\n', '    weak_isospin: -0.5\n    weak_isospin_right: 0\n');
const heavyLepton = parseModel(chiralText, 'chiral-lepton.model.yaml');

/** Events of one channel (by process id) as [cos theta to the incoming quark, pair mass]. */
function sample(sampler: HardSampler, channel: number, count: number, seed: number): { cosToQuark: number[]; pairMass: number[] } {
  const record = new EventRecord();
  const rng = RandomStream.forStream(seed, 7);
  const cosToQuark: number[] = [];
  const pairMass: number[] = [];
  while (cosToQuark.length < count) {
    sampler.fill(record, rng);
    if (record.processId !== channel) continue;
    const p = record.momentum;
    // Pair rest frame: boost particle 2 back along z by the pair's rapidity.
    const e = p[11]! + p[15]!;
    const pz = p[10]! + p[14]!;
    const mass = Math.sqrt(e * e - pz * pz - (p[8]! + p[12]!) ** 2 - (p[9]! + p[13]!) ** 2);
    const gamma = e / mass;
    const gammaBeta = pz / mass;
    const pzStar = gamma * p[10]! - gammaBeta * p[11]!;
    const pStar = Math.hypot(p[8]!, p[9]!, pzStar);
    const quarkAlongPlusZ = record.pdgId[0]! > 0;
    cosToQuark.push(((quarkAlongPlusZ ? 1 : -1) * pzStar) / pStar);
    pairMass.push(mass);
  }
  return { cosToQuark, pairMass };
}

/** Largest violations and broken conventions over `count` events (asserted by the caller: expect() per event is slow). */
function checkEvents(model: Model, sampler: HardSampler, count: number, seed: number) {
  const record = new EventRecord();
  const rng = RandomStream.forStream(seed, 1);
  const table = model.particles;
  const seenChannels = new Set<number>();
  let momentumViolation = 0;
  let massViolation = 0;
  let chargeViolation = 0;
  const problems = new Set<string>();
  for (let n = 0; n < count; n++) {
    sampler.fill(record, rng);
    const p = record.momentum;
    const scale = p[3]! + p[7]!;
    for (let k = 0; k < 4; k++) momentumViolation = Math.max(momentumViolation, Math.abs(p[k]! + p[4 + k]! - p[8 + k]! - p[12 + k]!) / scale);
    const channel = model.channels[record.processId]!;
    seenChannels.add(record.processId);
    for (const [i, m] of [
      [2, channel.firstMass],
      [3, channel.secondMass],
    ] as const) {
      const o = 4 * i;
      const m2 = p[o + 3]! ** 2 - p[o]! ** 2 - p[o + 1]! ** 2 - p[o + 2]! ** 2;
      massViolation = Math.max(massViolation, Math.abs(m2 - m * m) / p[o + 3]! ** 2);
      if (record.mass[i] !== m) problems.add('generated mass');
      if (record.status[i] !== STATUS_FINAL) problems.add('final status');
      if (record.mother1[i] !== 0 || record.mother2[i] !== 1) problems.add('mothers');
      if (Math.abs(record.pdgId[i]!) !== Math.abs(i === 2 ? channel.first : channel.second)) problems.add('pair ids');
    }
    if (record.size !== 4) problems.add('size');
    if (record.status[0] !== STATUS_INCOMING || record.status[1] !== STATUS_INCOMING) problems.add('incoming status');
    // incoming partons: massless along the beams, beam 1 along +z
    if (p[0] !== 0 || p[1] !== 0 || p[4] !== 0 || p[5] !== 0 || !(p[2]! > 0) || !(p[6]! < 0)) problems.add('incoming momenta');
    // a quark and an antiquark sharing one colour line
    const quark = record.pdgId[0]! > 0 ? 0 : 1;
    if (Math.sign(record.pdgId[0]!) !== -Math.sign(record.pdgId[1]!)) problems.add('q qbar');
    if (record.colour1[quark] !== 501 || record.colour2[1 - quark] !== 501 || record.colour2[quark] !== 0 || record.colour1[1 - quark] !== 0) problems.add('colour');
    chargeViolation = Math.max(chargeViolation, Math.abs(table.charge(record.pdgId[0]!) + table.charge(record.pdgId[1]!) - table.charge(record.pdgId[2]!) - table.charge(record.pdgId[3]!)));
    if (record.weight !== sampler.crossSectionPb) problems.add('weight');
    const expectedScale = channel.scale.kind === 'pair_mass' ? Math.sqrt(Math.max(0, (p[11]! + p[15]!) ** 2 - (p[10]! + p[14]!) ** 2 - (p[8]! + p[12]!) ** 2 - (p[9]! + p[13]!) ** 2)) : (channel.firstMass + channel.secondMass) / 2;
    if (Math.abs(record.scale - expectedScale) > 1e-6 * expectedScale) problems.add('scale');
    if (!(record.alphaQcd > 0.05 && record.alphaQcd < 0.2)) problems.add('alpha_s');
    if (record.alphaQed !== model.couplings.alpha) problems.add('alpha');
  }
  return { momentumViolation, massViolation, chargeViolation, problems: [...problems], channels: [...seenChannels].sort() };
}

/** 3-point Gauss–Legendre on [-1, 1] (exact for polynomials up to degree 5; Abramowitz and Stegun 25.4). */
const GL3 = { x: [-Math.sqrt(0.6), 0, Math.sqrt(0.6)], w: [5 / 9, 8 / 9, 5 / 9] };

/**
 * Expected shares of events per bin of cos theta (to the quark) and of the pair
 * mass, for a channel whose pair-mass mapping is a single continuum (monotonic
 * in u1): composite Gauss–Legendre in u1 with panels inside each mass bin, in u2,
 * and in each cos theta bin (the integrand is quadratic in cos theta).
 */
function expectedShares(model: Model, channel: number, cosBins: number, massEdges: number[]): { cos: number[]; mass: number[] } {
  const integrand = new HadronicIntegrand(model.channels[channel]!, { sqrtS: 13000, pdf, scaleFactor: 1 });
  const mapping = integrand.mapping!;
  expect(mapping.resonanceCount).toBe(0);
  const uOfMass = (m: number) => Math.min(1, Math.max(0, Math.log((m * m) / mapping.sMin) / Math.log(mapping.sMax / mapping.sMin)));
  const uEdges = [0, ...massEdges.slice(1, -1).map(uOfMass), 1];
  const cos = new Array<number>(cosBins).fill(0);
  const mass = new Array<number>(uEdges.length - 1).fill(0);
  const u = new Float64Array(3);
  const panels1 = 3;
  const panels2 = 24;
  for (let b = 0; b + 1 < uEdges.length; b++) {
    const h1 = (uEdges[b + 1]! - uEdges[b]!) / panels1;
    for (let p1 = 0; p1 < panels1; p1++) {
      for (let i = 0; i < 3; i++) {
        u[0] = uEdges[b]! + h1 * (p1 + 0.5 + 0.5 * GL3.x[i]!);
        const w1 = 0.5 * h1 * GL3.w[i]!;
        for (let p2 = 0; p2 < panels2; p2++) {
          for (let j = 0; j < 3; j++) {
            u[1] = (p2 + 0.5 + 0.5 * GL3.x[j]!) / panels2;
            const w2 = (0.5 * GL3.w[j]!) / panels2;
            for (let c = 0; c < cosBins; c++) {
              for (let k = 0; k < 3; k++) {
                // u3 in the bin of cos theta (to +z) [c, c+1) / cosBins
                u[2] = (c + 0.5 + 0.5 * GL3.x[k]!) / cosBins;
                const w = w1 * w2 * ((0.5 * GL3.w[k]!) / cosBins);
                const value = integrand.evaluate(u);
                if (!(value > 0)) continue;
                const cosToPlusZ = integrand.lastPoint[POINT_COS_THETA]!;
                for (let t = 0; t < integrand.termCount; t++) {
                  const toQuark = integrand.termParton1[t]! > 0 ? cosToPlusZ : -cosToPlusZ;
                  const bin = Math.min(cosBins - 1, Math.floor(((toQuark + 1) / 2) * cosBins));
                  const weight = (w * value * integrand.termWeight[t]!) / integrand.termTotal;
                  cos[bin] += weight;
                  mass[b] += weight;
                }
              }
            }
          }
        }
      }
    }
  }
  const total = cos.reduce((s, v) => s + v, 0);
  return { cos: cos.map((v) => v / total), mass: mass.map((v) => v / total) };
}

/** Pearson chi-square of counts against expected shares, and its p-value (jStat chi-square CDF). */
function chiSquare(values: number[], edges: number[], shares: number[]): { chi2: number; dof: number; pValue: number } {
  const counts = new Array<number>(shares.length).fill(0);
  for (const v of values) {
    let b = 0;
    while (b < shares.length - 1 && v >= edges[b + 1]!) b++;
    counts[b]++;
  }
  let chi2 = 0;
  for (let b = 0; b < shares.length; b++) {
    const expected = shares[b]! * values.length;
    chi2 += (counts[b]! - expected) ** 2 / expected;
  }
  const dof = shares.length - 1;
  return { chi2, dof, pValue: 1 - jStat.chisquare.cdf(chi2, dof) };
}

describe('hard events of the demo benchmark', () => {
  const sampler = prepareHardSampler(benchmark, { energyTeV: 13, pdf, seed: 11 });

  it('conserves energy and momentum (1e-9 relative), puts the pair on shell, and follows the record conventions', () => {
    const report = checkEvents(benchmark, sampler, 20000, 1);
    expect(report.momentumViolation).toBeLessThan(1e-9);
    expect(report.massViolation).toBeLessThan(1e-9);
    expect(report.chargeViolation).toBeLessThan(1e-12);
    expect(report.problems).toEqual([]);
    expect(report.channels).toEqual([0, 1, 2]);
  });

  it('gives the same cross section as crossSection for the same seed, and the same events for the same stream', () => {
    const again = prepareHardSampler(benchmark, { energyTeV: 13, pdf, seed: 11 });
    expect(again.crossSectionPb).toBe(sampler.crossSectionPb);
    expect(again.channels.map((c) => c.maxWeight)).toEqual(sampler.channels.map((c) => c.maxWeight));
    const a = new EventRecord();
    const b = new EventRecord();
    const ra = RandomStream.forStream(5, 5);
    const rb = RandomStream.forStream(5, 5);
    for (let n = 0; n < 200; n++) {
      sampler.fill(a, ra);
      again.fill(b, rb);
      expect(Array.from(b.momentum.subarray(0, 16))).toEqual(Array.from(a.momentum.subarray(0, 16)));
      expect(Array.from(b.pdgId.subarray(0, 4))).toEqual(Array.from(a.pdgId.subarray(0, 4)));
    }
  });

  it('produces channels in proportion to their cross sections and charge conjugates in both charges', () => {
    const record = new EventRecord();
    const rng = RandomStream.forStream(11, 2);
    const counts = [0, 0, 0];
    let negativeMixed = 0;
    const n = 30000;
    for (let k = 0; k < n; k++) {
      sampler.fill(record, rng);
      counts[record.processId]!++;
      if (record.processId === 2 && record.pdgId[2]! < 0) negativeMixed++;
    }
    sampler.channels.forEach((c, i) => {
      const share = c.sigmaPb / sampler.crossSectionPb;
      // binomial: within 4 standard deviations
      expect(Math.abs(counts[i]! - n * share)).toBeLessThan(4 * Math.sqrt(n * share * (1 - share)));
    });
    // S- S0 (from d ubar) is rarer than S+ S0bar (from u dbar) in proton collisions.
    expect(negativeMixed).toBeGreaterThan(0.15 * counts[2]!);
    expect(negativeMixed).toBeLessThan(0.5 * counts[2]!);
    expect(sampler.overweightFraction).toBeLessThan(1e-3);
  });

  it('scalar pairs follow sin^2 theta to the quark whatever the vectors (chi-square, p > 1e-3)', () => {
    const { cosToQuark } = sample(sampler, 0, 20000, 3);
    // integral of (3/4)(1 - c^2) over [a, b] = (3/4)(b - a) - (b^3 - a^3)/4
    const edges = Array.from({ length: 21 }, (_, i) => -1 + i / 10);
    const shares = edges.slice(0, -1).map((a, i) => {
      const b = edges[i + 1]!;
      return 0.75 * (b - a) - (b ** 3 - a ** 3) / 4;
    });
    const { pValue } = chiSquare(cosToQuark, edges, shares);
    expect(pValue).toBeGreaterThan(1e-3);
  });
});

describe('hard events of chiral heavy leptons through photon and Z', () => {
  it('uses a chiral variant', () => expect(chiralText).not.toBe(heavyLeptonText));
  const sampler = prepareHardSampler(heavyLepton, { energyTeV: 13, pdf, seed: 21 });
  const events = sample(sampler, 0, 20000, 4);
  const cosBins = 10;
  const massEdges = [800, 850, 900, 950, 1000, 1075, 1150, 1250, 1400, 1600, 1900, 13000];
  const expected = expectedShares(heavyLepton, 0, cosBins, massEdges);

  it('cos theta to the quark follows the matrix element, forward-backward asymmetry included (chi-square, p > 1e-3)', () => {
    const edges = Array.from({ length: cosBins + 1 }, (_, i) => -1 + (2 * i) / cosBins);
    const { pValue } = chiSquare(events.cosToQuark, edges, expected.cos);
    expect(pValue).toBeGreaterThan(1e-3);
    // The expectation is not flat and not symmetric: the test could fail.
    expect(Math.abs(expected.cos[0]! - expected.cos[cosBins - 1]!)).toBeGreaterThan(0.003);
  });

  it('the pair mass follows the matrix element times the parton luminosity (chi-square, p > 1e-3)', () => {
    const { pValue } = chiSquare(events.pairMass, massEdges, expected.mass);
    expect(pValue).toBeGreaterThan(1e-3);
  });
});

describe('hard events of every demo model', () => {
  const folder = new URL('../../data-demo/', import.meta.url);
  for (const file of readdirSync(folder).filter((f) => f.endsWith('.model.yaml'))) {
    it(`${file}: every channel appears; conservation, masses and conventions hold in every event`, () => {
      const model = loadModel(`data-demo/${file}`);
      const s = prepareHardSampler(model, { energyTeV: 8, pdf, seed: 31 });
      const report = checkEvents(model, s, 6000, 2);
      expect(report.momentumViolation).toBeLessThan(1e-9);
      expect(report.massViolation).toBeLessThan(1e-9);
      expect(report.chargeViolation).toBeLessThan(1e-12);
      expect(report.problems).toEqual([]);
      // channels below 0.2% of the total may legitimately not show up in 6000 events
      const expected = s.channels.filter((c) => c.sigmaPb > 0.002 * s.crossSectionPb).map((c) => c.index);
      for (const c of expected) expect(report.channels).toContain(c);
    });
  }
});

describe('reducedMaximum', () => {
  it('is the value above which the weights carry the allowed share of the total', () => {
    expect(reducedMaximum(Float64Array.of(1, 1, 1, 1, 6), 0.1)).toBe(5);
    expect(reducedMaximum(Float64Array.of(3, 1, 2), 0)).toBe(3);
    expect(reducedMaximum(Float64Array.of(2, 2, 2), 0.5)).toBe(2);
  });
});

describe('the sampler reports the cross section of its own sample', () => {
  it('sampler.crossSection() equals crossSection() for the same model, energy and seed (one integration, one number)', async () => {
    const { crossSection } = await import('../../src/generator/crossSection.js');
    const model = loadModel('data-demo/benchmark.model.yaml');
    const options = { energyTeV: 8, seed: 3, targetRelativeError: 0.01 };
    const sampler = prepareHardSampler(model, options);
    const fromSampler = sampler.crossSection();
    const direct = crossSection(model, options);
    expect(fromSampler.sigmaPb).toBe(direct.sigmaPb);
    expect(fromSampler.sigmaPb).toBe(sampler.crossSectionPb);
    expect(fromSampler.scaleBandPb).toEqual(direct.scaleBandPb);
    expect(fromSampler.channels.map((c) => c.sigmaPb)).toEqual(direct.channels.map((c) => c.sigmaPb));
  });
});
