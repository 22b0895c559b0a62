import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { TamisError, formatError } from '../../src/errors.js';
import { loadAnalyses, parseAnalysis } from '../../src/selection/loader.js';

const folder = mkdtempSync(join(tmpdir(), 'tamis-loader-'));
afterAll(() => rmSync(folder, { recursive: true, force: true }));
const file = join(folder, 'a.yaml');

/** A valid analysis; each broken case edits one thing. Line numbers below refer to this text. */
const BASE = `id: test-analysis
summary: a small analysis for loader tests
energy_tev: 13
luminosity_ifb: 139
detector: generic-13tev
steps:
  - name: three leptons
    cut: n_leptons >= 3
  - name: missing momentum
    cut: met > 50
regions:
  - name: sr-a
    cuts: [n_sfos == 0, 50 <= met < 100]
    observed: 4
    background: 3.2
    background_uncertainty: 0.8
  - name: sr-b
    cuts: [n_sfos == 0, met >= 100]
    observed: 1
    background: 0.9
    background_uncertainty: 0.4
correlation_groups:
  - name: fakes
    regions: [sr-a, sr-b]
`;

function errorOf(text: string, name = file): TamisError {
  try {
    parseAnalysis(text, name);
  } catch (error) {
    if (error instanceof TamisError) return error;
    throw error;
  }
  throw new Error('expected the analysis to be refused');
}

function edit(from: string, to: string): string {
  if (!BASE.includes(from)) throw new Error(`test bug: "${from}" not in the base text`);
  return BASE.replace(from, to);
}

describe('analysis loader: a valid file', () => {
  it('resolves defaults, parses cuts and keeps locations', () => {
    const a = parseAnalysis(BASE, file);
    expect(a.id).toBe('test-analysis');
    expect(a.steps.map((s) => s.name)).toEqual(['three leptons', 'missing momentum']);
    expect(a.regions[1]!.cuts.map((c) => c.text)).toEqual(['n_sfos == 0', 'met >= 100']);
    expect(a.regions[0]!.location.line).toBe(12);
    expect(a.objects.jets.minPt).toBe(30); // default (objectDefaults.ts)
    expect(a.objects.electrons.maxRelativeIsolation).toBe(Infinity);
    expect(a.regionsDisjoint).toBe(true);
    expect(a.detectorFile).toMatch(/analyses[/\\]detectors[/\\]generic-13tev\.yaml$/);
    expect(a.correlationGroups).toEqual([{ name: 'fakes', regions: ['sr-a', 'sr-b'] }]);
  });
});

describe('analysis loader: every error kind names file, line, column and key', () => {
  const cases: { what: string; text: string; message: RegExp; line: number; column: number; key?: string }[] = [
    { what: 'YAML syntax', text: edit('  - name: sr-b\n', '  - name: [sr-b\n'), message: /not valid YAML/, line: 18, column: 5 },
    { what: 'unknown key', text: edit('    background: 3.2', '    background: 3.2\n    n95_observd: 6.1'), message: /unknown key "n95_observd"/, line: 16, column: 5, key: 'regions[0].n95_observd' },
    { what: 'region without yields', text: edit('    observed: 1\n    background: 0.9\n    background_uncertainty: 0.4\n', ''), message: /missing required key, expected number/, line: 17, column: 5, key: 'regions[1].observed' },
    { what: 'negative background', text: edit('background: 3.2', 'background: -1.2'), message: /must be >= 0, got number -1.2/, line: 15, column: 17, key: 'regions[0].background' },
    { what: 'negative uncertainty', text: edit('background_uncertainty: 0.4', 'background_uncertainty: -0.4'), message: /must be >= 0, got number -0.4/, line: 21, column: 29, key: 'regions[1].background_uncertainty' },
    { what: 'fractional observed count', text: edit('observed: 4', 'observed: 4.5'), message: /expected int/, line: 14, column: 15, key: 'regions[0].observed' },
    { what: 'wrong type', text: edit('luminosity_ifb: 139', 'luminosity_ifb: lots'), message: /expected number, got string "lots"/, line: 4, column: 17, key: 'luminosity_ifb' },
    { what: 'non-positive luminosity', text: edit('luminosity_ifb: 139', 'luminosity_ifb: 0'), message: /must be > 0/, line: 4, column: 17, key: 'luminosity_ifb' },
    { what: 'cut syntax error', text: edit('cut: met > 50', 'cut: met > > 50'), message: /expected a variable or a number after '>', found '>' at column 7/, line: 10, column: 16, key: 'steps[1].cut' },
    { what: 'unknown variable', text: edit('cut: met > 50', 'cut: mett > 50'), message: /unknown variable "mett" at column 1/, line: 10, column: 10, key: 'steps[1].cut' },
    { what: 'unknown variable inside a region cut list', text: edit('[n_sfos == 0, met >= 100]', '[n_sfos == 0, 100 <= mets]'), message: /unknown variable "mets" at column 8/, line: 18, column: 32, key: 'regions[1].cuts[1]' },
    { what: 'empty range', text: edit('50 <= met < 100', '100 <= met < 50'), message: /the range at column 1 is empty/, line: 13, column: 25, key: 'regions[0].cuts[1]' },
    { what: 'duplicate region name', text: edit('  - name: sr-b\n', '  - name: sr-a\n'), message: /duplicate region name "sr-a" \(first used by regions\[0\] at line 12\)/, line: 17, column: 11, key: 'regions[1].name' },
    { what: 'duplicate step name', text: edit('name: missing momentum', 'name: three leptons'), message: /duplicate step name "three leptons"/, line: 9, column: 11, key: 'steps[1].name' },
    { what: 'region name with a space', text: edit('name: sr-b', 'name: sr b'), message: /region names use letters, digits/, line: 17, column: 11, key: 'regions[1].name' },
    { what: 'bad detector path', text: edit('detector: generic-13tev', 'detector: detectors/missing.yaml'), message: /detector profile not found: .*missing\.yaml/, line: 5, column: 11, key: 'detector' },
    { what: 'unknown detector name', text: edit('detector: generic-13tev', 'detector: generic-14tev'), message: /unknown detector profile "generic-14tev"/, line: 5, column: 11, key: 'detector' },
    { what: 'detector of another era', text: edit('detector: generic-13tev', 'detector: generic-8tev'), message: /detector profile "generic-8tev" is for 8 TeV but the analysis is at 13 TeV/, line: 5, column: 11, key: 'detector' },
    { what: 'correlation group naming an unknown region', text: edit('regions: [sr-a, sr-b]', 'regions: [sr-a, sr-c]'), message: /correlation group "fakes" names unknown region "sr-c"/, line: 24, column: 21, key: 'correlation_groups[0].regions[1]' },
    { what: 'empty region list', text: BASE.slice(0, BASE.indexOf('regions:\n  - name: sr-a')) + 'regions: []\n', message: /expected at least 1 entry, got 0/, line: 11, column: 10, key: 'regions' },
  ];
  for (const c of cases) {
    it(c.what, () => {
      const error = errorOf(c.text);
      expect(error.message).toMatch(c.message);
      expect({ file: error.file, line: error.line, column: error.column }).toEqual({ file, line: c.line, column: c.column });
      if (c.key !== undefined) expect(error.key).toBe(c.key);
    });
  }

  it('suggests the nearest allowed key for an unknown key', () => {
    expect(errorOf(edit('    background: 3.2', '    background: 3.2\n    n95_observd: 6.1')).suggestion).toMatch(/did you mean "n95_observed"\?/);
  });

  it('lists the known variables and the nearest one for an unknown variable', () => {
    const error = errorOf(edit('cut: met > 50', 'cut: mett > 50'));
    expect(error.suggestion).toMatch(/^did you mean "met"\? known variables: n_leptons, n_electrons/);
    expect(formatError(error)).toContain(`${file}:10:10: steps[1].cut: unknown variable "mett" at column 1 (hint: did you mean "met"?`);
  });

  it('points into a double-quoted cut at the offending character', () => {
    const error = errorOf(edit('cut: met > 50', 'cut: "met > 50 )"'));
    expect(error.message).toMatch(/unexpected '\)' at column 10/);
    expect([error.line, error.column]).toEqual([10, 20]);
  });

  it('refuses a region in two correlation groups', () => {
    const text = `${BASE}  - name: other\n    regions: [sr-b, sr-a]\n`;
    const error = errorOf(text);
    expect(error.message).toMatch(/region "sr-b" is already in correlation group "fakes"/);
    expect([error.line, error.key]).toEqual([26, 'correlation_groups[1].regions[0]']);
  });

  it('checks a reference cut-flow against the steps and the benchmark model path', () => {
    const withReference = (steps: string, model = 'missing.model.yaml') =>
      `${BASE}reference_cutflow:\n  model: ${model}\n  source: test\n  events_before_cuts: 100\n  steps:\n${steps}`;
    const unknown = errorOf(withReference('    - {step: three leptons, events: 50}\n    - {step: four leptons, events: 20}\n'));
    expect(unknown.message).toMatch(/reference cut-flow names unknown step "four leptons"/);
    expect(unknown.key).toBe('reference_cutflow.steps[1].step');
    const order = errorOf(withReference('    - {step: missing momentum, events: 50}\n    - {step: three leptons, events: 20}\n'));
    expect(order.message).toMatch(/out of order/);
    const model = errorOf(withReference('    - {step: three leptons, events: 50}\n'));
    expect(model.message).toMatch(/benchmark model file not found/);
    expect(model.key).toBe('reference_cutflow.model');
  });

  it('refuses two analyses with one id', () => {
    writeFileSync(join(folder, 'one.yaml'), BASE);
    writeFileSync(join(folder, 'two.yaml'), BASE);
    expect(() => loadAnalyses([join(folder, 'one.yaml'), join(folder, 'two.yaml')])).toThrow(/analysis id "test-analysis" is also used by/);
  });
});
