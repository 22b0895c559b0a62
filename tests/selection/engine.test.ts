import { describe, expect, it } from 'vitest';
import { createSelection } from '../../src/selection/engine.js';
import { parseAnalysis } from '../../src/selection/loader.js';
import { mergeSelectionResults, type AnalysisResult, type RegionResult } from '../../src/selection/results.js';
import { expectClose } from '../helpers.js';
import { makeEvent, type EventSpec } from './recoEvents.js';

const ANALYSIS = `
id: engine-test
summary: a constructed analysis with known answers
energy_tev: 13
luminosity_ifb: 100
detector: none.yaml
steps:
  - {name: two leptons, cut: n_leptons >= 2}
  - {name: one jet, cut: n_jets >= 1}
regions:
  - {name: A, cuts: [met < 50], observed: 1, background: 1, background_uncertainty: 0.5}
  - {name: B, cuts: [met >= 50, ht < 200], observed: 1, background: 1, background_uncertainty: 0.5}
  - {name: C, cuts: [met >= 50, ht >= 150], observed: 1, background: 1, background_uncertainty: 0.5}
`;

const analysis = parseAnalysis(ANALYSIS, 'engine-test.yaml', { checkFiles: false });

const twoLeptons: EventSpec['muons'] = [[40, 0, 0, 1], [30, 0.5, Math.PI, -1]];
const oneLepton: EventSpec['muons'] = [[40, 0, 0, 1]];
const jet = (pt: number): EventSpec['jets'] => [[pt, -1.5, Math.PI / 2, 0]];

/** The sample: [spec, what it tests]. */
const SAMPLE: EventSpec[] = [
  { muons: twoLeptons, jets: jet(100), met: [30, 1], weight: 2 }, // 0: A
  { muons: twoLeptons, jets: jet(160), met: [80, 1], weight: 1 }, // 1: B and C (overlap)
  { muons: twoLeptons, jets: jet(300), met: [80, 1], weight: 0.5 }, // 2: C
  { muons: twoLeptons, met: [10, 1], weight: 1 }, // 3: fails "one jet" only; would be in A
  { muons: oneLepton, met: [10, 1], weight: 3 }, // 4: fails both steps
  { muons: oneLepton, jets: jet(100), met: [80, 1], weight: 1.5 }, // 5: fails "two leptons" only; would be in B
  { muons: twoLeptons, jets: jet(100), met: [60, 1], weight: 1 }, // 6: B
  { muons: twoLeptons, jets: jet(250), met: [40, 1], weight: 1 }, // 7: A; fails only C's met cut
];

function run(blame = true): AnalysisResult {
  const selection = createSelection([analysis], { blame });
  for (const spec of SAMPLE) selection.process(makeEvent(spec));
  return selection.results().analyses[0]!;
}

function blameOf(region: RegionResult, name: string): number {
  const entry = region.blame.find((b) => b.name === name);
  if (entry === undefined) throw new Error(`no blame entry ${name}`);
  return entry.gained.weight;
}

describe('selection engine on a constructed sample', () => {
  const result = run();
  const [A, B, C] = result.regions as [RegionResult, RegionResult, RegionResult];

  it('totals every processed event', () => {
    expect(result.total).toEqual({ weight: 11, weight2: 19.5, events: 8 });
  });

  it('counts the cut-flow cumulatively with sums of weights and squared weights', () => {
    expect(result.steps.map((s) => [s.name, s.weight, s.weight2, s.events])).toEqual([
      ['two leptons', 6.5, 8.25, 6],
      ['one jet', 5.5, 7.25, 5],
    ]);
  });

  it('counts regions with Monte Carlo errors sqrt(sum w^2)', () => {
    expect([A.weight, A.weight2, A.events]).toEqual([3, 5, 2]);
    expect([B.weight, B.weight2, B.events]).toEqual([2, 2, 2]);
    expect([C.weight, C.weight2, C.events]).toEqual([1.5, 1.25, 2]);
    expectClose(A.error, Math.sqrt(5));
    expectClose(C.error, Math.sqrt(1.25));
  });

  it('gives efficiencies with the weighted-binomial error', () => {
    const step = result.steps[0]!;
    const e = 6.5 / 11;
    expectClose(step.efficiency, e);
    expectClose(step.efficiencyError, Math.sqrt((1 - e) ** 2 * 8.25 + e ** 2 * (19.5 - 8.25)) / 11);
  });

  it('blames each single cut for the signal it removes from each region', () => {
    expect([blameOf(A, 'two leptons'), blameOf(A, 'one jet'), blameOf(A, 'met < 50')]).toEqual([0, 1, 2.5]);
    expect([blameOf(B, 'two leptons'), blameOf(B, 'one jet'), blameOf(B, 'met >= 50'), blameOf(B, 'ht < 200')]).toEqual([1.5, 0, 2, 0.5]);
    expect([blameOf(C, 'two leptons'), blameOf(C, 'one jet'), blameOf(C, 'met >= 50'), blameOf(C, 'ht >= 150')]).toEqual([0, 0, 1, 1]);
    const dropped = A.blame.find((b) => b.name === 'met < 50')!;
    // Dropping A's only cut leaves every event that passes the steps.
    expect(dropped.without.weight).toBe(result.steps[1]!.weight);
    expect(A.blame.map((b) => b.kind)).toEqual(['step', 'step', 'region']);
  });

  it('reports the events that regions declared disjoint share, with their indices', () => {
    expect(result.regionsDisjoint).toBe(true);
    expect(result.disjointViolated).toBe(true);
    expect(result.overlaps).toEqual([{ first: 'B', second: 'C', events: 1, weight: 1, exampleEvents: [1] }]);
  });

  it('gives the same counts with cut blame switched off', () => {
    const plain = run(false);
    expect(plain.regions.map((r) => r.weight)).toEqual([3, 2, 1.5]);
    expect(plain.steps.map((s) => s.weight)).toEqual([6.5, 5.5]);
    expect(plain.regions.every((r) => r.blame.length === 0)).toBe(true);
  });

  it('merges runs over chunks of events into the single-run result', () => {
    const first = createSelection([analysis]);
    const second = createSelection([analysis]);
    SAMPLE.forEach((spec, i) => (i < 3 ? first : second).process(makeEvent(spec), i));
    const merged = mergeSelectionResults([first.results(), second.results()]).analyses[0]!;
    expect(merged.total).toEqual(result.total);
    expect(merged.regions.map((r) => [r.weight, r.weight2, r.events])).toEqual(result.regions.map((r) => [r.weight, r.weight2, r.events]));
    expect(merged.regions.map((r) => r.blame.map((b) => b.gained.weight))).toEqual(result.regions.map((r) => r.blame.map((b) => b.gained.weight)));
    expect(merged.overlaps).toEqual(result.overlaps);
    expectClose(merged.steps[0]!.efficiencyError, result.steps[0]!.efficiencyError);
  });

  it('refuses to merge results of different analyses', () => {
    const other = parseAnalysis(ANALYSIS.replace('id: engine-test', 'id: other'), 'o.yaml', { checkFiles: false });
    expect(() => mergeSelectionResults([createSelection([analysis]).results(), createSelection([other]).results()])).toThrow(/cannot merge selection results of different analyses/);
  });
});

describe('selection engine: statistics of unit-weight samples', () => {
  it('reduces the efficiency error to the binomial sqrt(eff (1 - eff) / N)', () => {
    const selection = createSelection([analysis]);
    // 30 of 100 events pass both steps and region A.
    for (let i = 0; i < 100; i++) selection.process(makeEvent(i < 30 ? { muons: twoLeptons, jets: jet(100), met: [10, 0] } : { muons: oneLepton }));
    const A = selection.results().analyses[0]!.regions[0]!;
    expectClose(A.efficiency, 0.3);
    expectClose(A.efficiencyError, Math.sqrt((0.3 * 0.7) / 100), { rel: 1e-12 });
    expectClose(A.error, Math.sqrt(30));
  });

  it('shares object building between analyses with the same object definitions and keeps their counts apart', () => {
    const other = parseAnalysis(ANALYSIS.replace('id: engine-test', 'id: engine-test-2').replace('n_jets >= 1', 'n_jets >= 2'), 'b.yaml', { checkFiles: false });
    const selection = createSelection([analysis, other]);
    for (const spec of SAMPLE) selection.process(makeEvent(spec));
    const [a, b] = selection.results().analyses;
    expect(a!.steps[1]!.weight).toBe(5.5);
    expect(b!.steps[1]!.weight).toBe(0);
    expect(b!.regions.map((r) => r.weight)).toEqual([0, 0, 0]);
  });
});

describe('selection engine: isolation sums shared between analyses', () => {
  it('counts as if each analysis isolated its leptons on its own', () => {
    // Two analyses, same 0.3 cone, different isolation limits: the looser keeps the lepton with I = 0.5.
    const text = (id: string, limit: number) =>
      ANALYSIS.replace('id: engine-test', `id: ${id}`).replace('steps:', `objects:\n  muons: {max_relative_isolation: ${limit}}\nsteps:`);
    const tight = parseAnalysis(text('tight', 0.15), 't.yaml', { checkFiles: false });
    const loose = parseAnalysis(text('loose', 0.6), 'l.yaml', { checkFiles: false });
    const selection = createSelection([tight, loose]);
    // The second muon has a 15 GeV jet 0.2 away: I = 15 / 30 = 0.5.
    const spec: EventSpec = { muons: [[40, 0, 0, 1], [30, 0.5, Math.PI, -1]], jets: [[100, -1.5, Math.PI / 2, 0], [15, 0.7, Math.PI, 0]], met: [30, 1] };
    for (let i = 0; i < 3; i++) selection.process(makeEvent(spec));
    const [t, l] = selection.results().analyses;
    expect(t!.steps[0]!.events).toBe(0);
    expect(l!.steps[0]!.events).toBe(3);
  });
});
