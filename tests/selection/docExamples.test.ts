/** The literal @example results of the selection's doc comments, and small helper properties. */
import { describe, expect, it } from 'vitest';
import { deltaR } from '../../src/physics/fourVector.js';
import { RandomStream } from '../../src/physics/random.js';
import { checkFile } from '../../src/selection/checkFile.js';
import { compileExpression } from '../../src/selection/expression/compile.js';
import { printExpression } from '../../src/selection/expression/ast.js';
import { tokenize } from '../../src/selection/expression/lexer.js';
import { parseExpression } from '../../src/selection/expression/parser.js';
import { loadAnalysis } from '../../src/selection/loader.js';
import { within } from '../../src/selection/objectGeometry.js';
import { analysisTemplate } from '../../src/selection/template.js';

const analyses = new URL('../../analyses/', import.meta.url).pathname;

describe('doc-comment examples', () => {
  it('tokenize, parseExpression, printExpression, compileExpression', () => {
    expect(tokenize('met >= 50').map((t) => t.kind)).toEqual(['identifier', 'operator', 'number', 'end']);
    expect(parseExpression('50 <= met < 100').kind).toBe('range');
    expect(printExpression(parseExpression('met>50 and not ht<200'))).toBe('(met > 50 and not ht < 200)');
    expect(compileExpression(parseExpression('met > 50'), () => 0)({ value: () => 80 })).toBe(true);
  });
  it('loadAnalysis, checkFile, analysisTemplate', async () => {
    expect(loadAnalysis(`${analyses}three-lepton-8tev.yaml`).regions.length).toBe(36);
    expect((await checkFile(`${analyses}same-sign-8tev.yaml`)).summary).toBe('same-sign-8tev, 8 TeV, 20.3 fb^-1, 6 steps, 18 regions, detector generic-8tev.yaml, invented numbers');
    expect(analysisTemplate('my-search', 13).startsWith('# my-search')).toBe(true);
  });
});

describe('object geometry', () => {
  it('within(cone^2) decides exactly as physics/fourVector deltaR < cone, across the phi wrap (10 000 seeded pairs)', () => {
    const rng = RandomStream.forStream(31, 4);
    for (let k = 0; k < 10_000; k++) {
      const eta1 = rng.uniformIn(-3, 3);
      const eta2 = eta1 + rng.uniformIn(-0.6, 0.6);
      const phi1 = rng.uniformIn(-Math.PI, Math.PI);
      let phi2 = phi1 + rng.uniformIn(-0.6, 0.6);
      if (phi2 > Math.PI) phi2 -= 2 * Math.PI;
      if (phi2 <= -Math.PI) phi2 += 2 * Math.PI;
      const cone = rng.uniformIn(0.1, 0.5);
      const reference = deltaR(eta1, phi1, eta2, phi2);
      if (Math.abs(reference - cone) < 1e-12) continue;
      expect(within(eta1, phi1, eta2, phi2, cone * cone)).toBe(reference < cone);
    }
  });
});
