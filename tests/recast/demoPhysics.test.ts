/**
 * Physics sanity of the invented demo scenario (checks of trends, not of
 * invented numbers): the model's cross section and the exclusion ratio r grow
 * as the mass falls, and the 8 TeV searches without a missing-momentum
 * requirement keep more signal than the 13 TeV searches with one, for a final
 * state without new invisible particles (common practice: a missing-momentum
 * cut removes signals whose only invisible particles are neutrinos from taus
 * and W decays).
 */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { recastPoint } from '../../src/recast/recastPoint.js';
import type { PointResult } from '../../src/recast/types.js';
import { loadAnalyses } from '../../src/selection/loader.js';

const ROOT = join(import.meta.dirname, '..', '..');
const MODEL_FILE = join(ROOT, 'data-demo', 'benchmark.model.yaml');
const BASE = readFileSync(MODEL_FILE, 'utf8');
const analyses = loadAnalyses([join(ROOT, 'analyses')]);
const MASSES = [200, 300, 450];
const results = new Map<number, PointResult>();

const atMass = (mass: number) => BASE.replace(/(  - name: S\+\n    id: 9000211\n    spin: 0\n    mass: )300/, `$1${mass}`);
const outcome = (mass: number, id: string) => results.get(mass)!.analyses.find((a) => a.id === id)!;

describe('the invented demo scenario behaves as the physics says', () => {
  beforeAll(async () => {
    for (const [i, mass] of MASSES.entries()) {
      const text = atMass(mass);
      if (mass !== 300) expect(text, 'the S+ mass was substituted').not.toBe(BASE);
      results.set(mass, await recastPoint({ model: { text, file: MODEL_FILE }, analyses, events: 20000, seed: 11, pointId: [i], workers: 1, combinationMethod: 'asymptotic', requirementCosts: false }));
    }
  }, 300_000);

  it('the model cross section falls as the mass rises, at both energies, and rises with the energy', () => {
    for (const energy of [8, 13]) {
      const sigma = MASSES.map((m) => results.get(m)!.energies.find((e) => e.energyTeV === energy)!.sigmaPb);
      expect(sigma[0]).toBeGreaterThan(sigma[1]!);
      expect(sigma[1]).toBeGreaterThan(sigma[2]!);
    }
    for (const m of MASSES) {
      const [s8, s13] = [8, 13].map((e) => results.get(m)!.energies.find((x) => x.energyTeV === e)!.sigmaPb);
      expect(s13).toBeGreaterThan(s8!);
    }
  });

  it('r grows as the mass falls in every analysis that sees the signal (combination of regions, expected)', () => {
    for (const id of ['three-lepton-8tev', 'three-lepton-13tev', 'same-sign-8tev']) {
      const r = MASSES.map((m) => outcome(m, id).combined!.rExpected);
      expect(r[0], id).toBeGreaterThan(r[1]!);
      expect(r[1], id).toBeGreaterThan(r[2]!);
    }
  });

  it('the 8 TeV searches without a missing-momentum requirement keep more signal than the 13 TeV ones with one', () => {
    for (const m of MASSES) {
      const eff = (id: string) => outcome(m, id).signalRegionEfficiency.value;
      expect(eff('three-lepton-8tev'), `three-lepton at ${m} GeV`).toBeGreaterThan(eff('three-lepton-13tev'));
      expect(eff('same-sign-8tev'), `same-sign at ${m} GeV`).toBeGreaterThan(eff('same-sign-13tev'));
    }
  });
});
