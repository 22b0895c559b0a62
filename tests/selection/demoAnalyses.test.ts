import { readFileSync, readdirSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { RandomStream } from '../../src/physics/random.js';
import type { Analysis } from '../../src/selection/analysis.js';
import { checkFile } from '../../src/selection/checkFile.js';
import type { CutExpression } from '../../src/selection/expression/ast.js';
import { compileExpression } from '../../src/selection/expression/compile.js';
import { loadAnalysis } from '../../src/selection/loader.js';
import { VARIABLES, variableSlot } from '../../src/selection/variables.js';

const FOLDER = new URL('../../analyses/', import.meta.url).pathname;
const FILES = readdirSync(FOLDER).filter((f) => f.endsWith('.yaml')).sort();
const load = (name: string): Analysis => loadAnalysis(join(FOLDER, name));

/** Lower bound on `variable` implied by the top-level conjunction of the steps and a region's cuts (0 when none). */
function lowerBound(analysis: Analysis, regionIndex: number, variable: string): number {
  let bound = -Infinity;
  const visit = (node: CutExpression): void => {
    if (node.kind === 'and') {
      visit(node.left);
      visit(node.right);
    } else if (node.kind === 'compare' && node.variable === variable && (node.op === '>' || node.op === '>=')) bound = Math.max(bound, node.value);
    else if (node.kind === 'range' && node.variable === variable) bound = Math.max(bound, node.low);
  };
  for (const step of analysis.steps) visit(step.cut.expression);
  for (const cut of analysis.regions[regionIndex]!.cuts) visit(cut.expression);
  return bound;
}

describe('every file in analyses/ passes tamis check', () => {
  for (const name of [...FILES, ...readdirSync(join(FOLDER, 'detectors')).map((f) => `detectors/${f}`)]) {
    it(name, async () => {
      const outcome = await checkFile(join(FOLDER, name));
      expect(outcome.kind).toBe(name.startsWith('detectors/') ? 'detector profile' : 'analysis');
    });
  }
});

describe('the demo analyses', () => {
  it('are the four invented searches of the demo, each labelled invented in its first line and its data', () => {
    expect(FILES).toEqual(['same-sign-13tev.yaml', 'same-sign-8tev.yaml', 'three-lepton-13tev.yaml', 'three-lepton-8tev.yaml']);
    for (const name of FILES) {
      expect(readFileSync(join(FOLDER, name), 'utf8').split('\n')[0]).toBe('# Invented for the tamis demo: not a real measurement.');
      expect(load(name).invented).toBe(true);
    }
  });

  it('(a) three leptons at 8 TeV: at least 30 regions, binned in SFOS, met, HT, b-jets and taus, with low-met bins unbounded below', () => {
    const a = load('three-lepton-8tev.yaml');
    expect(a.energyTev).toBe(8);
    expect(a.regions.length).toBeGreaterThanOrEqual(30);
    const used = new Set(a.regions.flatMap((r) => r.cuts.map((c) => c.text)).join(' ').match(/[a-z_][a-z0-9_]*/g));
    for (const v of ['n_sfos', 'mll_z', 'met', 'ht', 'n_bjets', 'n_taus']) expect(used.has(v), v).toBe(true);
    const unbounded = a.regions.filter((_, i) => lowerBound(a, i, 'met') === -Infinity);
    expect(unbounded.length).toBeGreaterThanOrEqual(8);
  });

  it('(b) same sign at 8 TeV: binned in HT, met and b-jets, with low-met bins unbounded below', () => {
    const b = load('same-sign-8tev.yaml');
    expect(b.energyTev).toBe(8);
    const used = b.regions.flatMap((r) => r.cuts.map((c) => c.text)).join(' ');
    for (const v of ['ht', 'met', 'n_bjets']) expect(used).toContain(v);
    expect(b.regions.some((_, i) => lowerBound(b, i, 'met') === -Infinity)).toBe(true);
  });

  it('(c) three leptons at 13 TeV: every region requires met >= 50', () => {
    const c = load('three-lepton-13tev.yaml');
    expect(c.energyTev).toBe(13);
    c.regions.forEach((r, i) => expect(lowerBound(c, i, 'met'), r.name).toBeGreaterThanOrEqual(50));
  });

  it('(d) same sign at 13 TeV: every region requires missing momentum', () => {
    const d = load('same-sign-13tev.yaml');
    expect(d.energyTev).toBe(13);
    d.regions.forEach((r, i) => expect(lowerBound(d, i, 'met'), r.name).toBeGreaterThanOrEqual(100));
  });

  it('have observed counts consistent with their backgrounds: |n - b| < 3 sqrt(b + db^2) in every region', () => {
    for (const name of FILES) {
      for (const r of load(name).regions) {
        const pull = Math.abs(r.observed - r.background) / Math.sqrt(r.background + r.backgroundUncertainty ** 2);
        expect(pull, `${name} ${r.name}`).toBeLessThan(3);
        expect(r.backgroundUncertainty, `${name} ${r.name}`).toBeLessThan(r.background);
      }
    }
  });

  it('give n95 limits consistent with their counts: within 30% of the fixed-background CLs limit, never below 3.00', () => {
    // CLs = P(N <= n | s + b) / P(N <= n | b) (Read, J. Phys. G 28 (2002) 2693; Junk, NIM A434 (1999) 435),
    // solved for CLs = 0.05 by bisection; s_up(n = 0) = -ln 0.05 = 2.996 for any b (checks.md, section 2).
    const cdf = (n: number, mu: number): number => {
      let term = Math.exp(-mu);
      let sum = term;
      for (let k = 1; k <= n; k++) sum += (term *= mu / k);
      return sum;
    };
    const fixedBackgroundLimit = (n: number, b: number): number => {
      let lo = 0;
      let hi = 200;
      for (let i = 0; i < 100; i++) {
        const mid = (lo + hi) / 2;
        if (cdf(n, mid + b) / cdf(n, b) > 0.05) lo = mid;
        else hi = mid;
      }
      return lo;
    };
    let checked = 0;
    for (const name of FILES) {
      for (const r of load(name).regions) {
        if (r.n95Observed === undefined) continue;
        const reference = fixedBackgroundLimit(r.observed, r.background);
        expect(r.n95Observed, `${name} ${r.name}`).toBeGreaterThanOrEqual(2.99);
        expect(Math.abs(r.n95Observed / reference - 1), `${name} ${r.name}: ${r.n95Observed} vs ${reference}`).toBeLessThan(0.3);
        expect(r.n95Expected, `${name} ${r.name}`).toBeDefined();
        checked++;
      }
    }
    expect(checked).toBeGreaterThanOrEqual(10);
  });

  it('declared disjoint have no two regions passed by one set of variable values (20 000 seeded samples each)', () => {
    const rng = RandomStream.forStream(77, 1);
    const values = new Float64Array(VARIABLES.length);
    const reader = { value: (slot: number) => values[slot]! };
    // Values around every threshold the files use, so bin edges are exercised.
    const thresholds = [0, 1, 2, 3, 4, 5, 12, 20, 25, 49.9, 50, 76, 81.2, 91.188, 100, 101.2, 106, 120, 150, 160, 200, 250, 400, 900];
    for (const name of FILES) {
      const analysis = load(name);
      if (!analysis.regionsDisjoint) continue;
      const regions = analysis.regions.map((r) => r.cuts.map((c) => compileExpression(c.expression, variableSlot)));
      for (let k = 0; k < 20_000; k++) {
        for (let s = 0; s < values.length; s++) values[s] = rng.uniform() < 0.5 ? thresholds[rng.integerBelow(thresholds.length)]! : rng.integerBelow(6);
        const passed = regions.map((cuts, i) => (cuts.every((cut) => cut(reader)) ? i : -1)).filter((i) => i >= 0);
        if (passed.length > 1) expect.fail(`${name}: regions ${passed.map((i) => analysis.regions[i]!.name).join(', ')} overlap`);
      }
    }
  });
});
