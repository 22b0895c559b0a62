import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { parseAnalysis } from '../../src/selection/loader.js';
import { analysisTemplate } from '../../src/selection/template.js';
import { withVariableTable } from '../../src/selection/variableDocs.js';
import { VARIABLES } from '../../src/selection/variables.js';

const README = new URL('../../analyses/README.md', import.meta.url);
const text = readFileSync(README, 'utf8');

describe('analyses/README.md', () => {
  it('has the variable table generated from the code (run: node dist/src/tools/writeVariableDocs.js)', () => {
    expect(withVariableTable(text)).toBe(text);
    for (const v of VARIABLES) expect(text).toContain(`| \`${v.name}\` |`);
  });

  it('shows a worked example that passes the check as written', () => {
    const block = /## A worked example[\s\S]*?```yaml\n([\s\S]*?)```/.exec(text);
    expect(block).not.toBeNull();
    const analysis = parseAnalysis(block![1]!, new URL('../../analyses/worked-example.yaml', import.meta.url).pathname);
    expect(analysis.steps).toHaveLength(4);
    expect(analysis.regions.map((r) => r.name)).toEqual(['onz-mt100-met150', 'onz-mt100-met250']);
  });

  it('documents every variable with a unit and a definition', () => {
    for (const v of VARIABLES) {
      expect(v.description.length, v.name).toBeGreaterThan(10);
      expect(['GeV', 'count', 'e']).toContain(v.unit);
      expect(v.name).toMatch(/^[a-z][a-z0-9_]*$/);
    }
  });
});

describe('the new-analysis template', () => {
  it('passes the check as written, at both energies', () => {
    for (const energy of [8, 13] as const) {
      const analysis = parseAnalysis(analysisTemplate('starter', energy), '/tmp/starter.yaml');
      expect(analysis.energyTev).toBe(energy);
      expect(analysis.regions.length).toBeGreaterThan(0);
    }
  });
});
