import { describe, expect, it } from 'vitest';
import { z } from 'zod';
import { TamisError, formatError } from '../../src/errors.js';
import { editDistance, formatKeyPath, parseYamlText } from '../../src/io/yamlFile.js';

const Region = z.strictObject({ name: z.string().min(1), observed: z.number().int().min(0), background: z.number().min(0), cut: z.string().optional() });
const File = z.strictObject({ id: z.string(), regions: z.array(Region).min(1), method: z.enum(['exact', 'toys']).default('exact') });

function errorOf(text: string): TamisError {
  try {
    parseYamlText(text, 'a.yaml', File);
  } catch (error) {
    if (error instanceof TamisError) return error;
    throw error;
  }
  throw new Error('expected an error');
}

describe('parseYamlText', () => {
  it('returns validated data with defaults applied', () => {
    const src = parseYamlText('id: x\nregions:\n  - {name: a, observed: 3, background: 1.5}\n', 'a.yaml', File);
    expect(src.data.method).toBe('exact');
    expect(src.data.regions[0]!.background).toBe(1.5);
  });

  it('names file, line, column and key of a value out of range', () => {
    const e = errorOf('id: x\nregions:\n  - name: a\n    observed: 3\n    background: -1.2\n');
    expect(e.file).toBe('a.yaml');
    expect(e.line).toBe(5);
    expect(e.column).toBe(17);
    expect(e.key).toBe('regions[0].background');
    expect(formatError(e)).toBe('a.yaml:5:17: regions[0].background: must be >= 0, got number -1.2');
  });

  it('points at an unknown key and suggests the nearest allowed one', () => {
    const e = errorOf('id: x\nregions:\n  - name: a\n    observed: 3\n    backgorund: 1\n    background: 1\n');
    expect(e.line).toBe(5);
    expect(e.message).toMatch(/unknown key "backgorund"/);
    expect(e.suggestion).toMatch(/did you mean "background"\?/);
  });

  it('reports a missing key at its parent', () => {
    const e = errorOf('id: x\nregions:\n  - name: a\n    observed: 3\n');
    expect(e.key).toBe('regions[0].background');
    expect(e.message).toMatch(/missing required key/);
    expect(e.line).toBe(3);
  });

  it('reports YAML syntax errors with their line', () => {
    const e = errorOf('id: x\nregions: [\n  {name: a\n');
    expect(e.message).toMatch(/not valid YAML/);
    expect(e.line).toBeGreaterThanOrEqual(2);
  });

  it('rejects duplicate keys, empty files, NUL bytes and wrong enum values', () => {
    expect(errorOf('id: x\nid: y\nregions: []\n').message).toMatch(/not valid YAML/);
    expect(errorOf('').message).toMatch(/empty/);
    expect(errorOf('id: x\u0000').message).toMatch(/NUL/);
    expect(errorOf('id: x\nmethod: fast\nregions:\n  - {name: a, observed: 1, background: 1}\n').message).toMatch(/expected one of "exact", "toys", got string "fast"/);
  });

  it('survives an alias bomb without hanging', () => {
    const bomb = 'a: &a [x, x, x, x, x, x, x, x, x]\nb: &b [*a, *a, *a, *a, *a, *a, *a, *a, *a]\nc: &c [*b, *b, *b, *b, *b, *b, *b, *b, *b]\nd: &d [*c, *c, *c, *c, *c, *c, *c, *c, *c]\ne: [*d, *d, *d, *d, *d, *d, *d, *d, *d]\n';
    expect(() => parseYamlText(bomb, 'bomb.yaml', File)).toThrow(TamisError);
  });

  it('locates a character inside a quoted scalar', () => {
    const src = parseYamlText('id: x\nregions:\n  - {name: a, observed: 1, background: 1, cut: "met > 5"}\n', 'a.yaml', File);
    const where = src.locate(['regions', 0, 'cut'], 4);
    expect(where.line).toBe(3);
    // the opening quote is at column 48, so offset 4 inside "met > 5" (the '>') is column 53
    expect(where.column).toBe(53);
  });
});

describe('helpers', () => {
  it('formatKeyPath writes regions[3].background', () => {
    expect(formatKeyPath(['regions', 3, 'background'])).toBe('regions[3].background');
  });
  it('editDistance("backgorund", "background") is 2', () => {
    expect(editDistance('backgorund', 'background')).toBe(2);
  });
});

describe('reporting of typical mistakes', () => {
  it('reports a misspelt required key as an unknown key at the key itself, with a suggestion', () => {
    try {
      parseYamlText('id: x\nregions:\n  - name: a\n    observed: 3\n    backgrund:\n      2\n', 'a.yaml', File);
      expect.fail('expected an error');
    } catch (error) {
      const e = error as TamisError;
      expect(e.message).toMatch(/unknown key "backgrund"/);
      expect(e.line).toBe(5);
      expect(e.column).toBe(5);
      expect(e.suggestion).toMatch(/did you mean "background"/);
    }
  });
  it('says "expected a finite number" for .inf', () => {
    expect(() => parseYamlText('id: x\nregions:\n  - {name: a, observed: 1, background: .inf}\n', 'a.yaml', File)).toThrow(/expected a finite number, got Infinity/);
  });
});

describe('aliases', () => {
  it('an alias to no anchor is reported at its line and column', () => {
    try {
      parseYamlText('id: x\nregions:\n  - {name: a, observed: *nothing, background: 1}\n', 'a.yaml', File);
      expect.fail('expected an error');
    } catch (error) {
      const e = error as TamisError;
      expect(e.message).toMatch(/not valid YAML/);
      expect(e.line).toBe(3);
      expect(e.column).toBe(25); // the "*" of *nothing
    }
  });
});
