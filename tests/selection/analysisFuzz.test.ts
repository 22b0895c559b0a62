/**
 * Fuzzing of the analysis loader (issue requirement: at least 1 000 random
 * mutations of each demo analysis). Every mutated file must end in a clear
 * TamisError naming the file (with a line for schema and expression errors),
 * or in a valid analysis that then compiles and runs on test events without
 * error. A hang would exceed vitest's test timeout.
 */
import { readFileSync, readdirSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { TamisError, formatError } from '../../src/errors.js';
import { createSelection } from '../../src/selection/engine.js';
import { parseAnalysis } from '../../src/selection/loader.js';
import { RandomStream } from '../../src/physics/random.js';
import { makeEvent } from './recoEvents.js';

const MUTATIONS_PER_FILE = 1000;
const ANALYSES = new URL('../../analyses/', import.meta.url).pathname;
const FILES = readdirSync(ANALYSES).filter((f) => f.endsWith('.yaml')).sort();

const HUGE_NUMBERS = ['1e308', '1e400', '-1e300', '123456789012345678901234567890', '.inf', '-.inf', '.nan', '0x7fffffff', '1e-320', '-0'];
const WRONG_TYPES = ['abc', '[1, 2]', '{a: 1}', '~', 'true', '""', '[[0.5]]', '- x', '&a 1', '*a', '!!binary AAAA', '|\n  text'];
const CUT_NOISE = ['(', ')', ' and ', ' or ', ' not ', '<', '>=', '==', '=', '&&', '-', '1e', '.', 'x', ' 50 GeV', '"', "'", ':', '#', '[', ']'];

/** One random mutation of `text`. */
function mutate(text: string, rng: RandomStream): string {
  const lines = text.split('\n');
  const line = () => rng.integerBelow(lines.length);
  switch (rng.integerBelow(10)) {
    case 0: // delete a line
      lines.splice(line(), 1);
      return lines.join('\n');
    case 1: {
      // swap two lines
      const a = line();
      const b = line();
      [lines[a], lines[b]] = [lines[b]!, lines[a]!];
      return lines.join('\n');
    }
    case 2: // truncate
      return text.slice(0, rng.integerBelow(text.length));
    case 3: {
      // garbage characters (controls, NUL and lone surrogates included)
      const at = rng.integerBelow(text.length);
      let garbage = '';
      const n = 1 + rng.integerBelow(8);
      for (let k = 0; k < n; k++) garbage += String.fromCharCode(rng.integerBelow(65536));
      return text.slice(0, at) + garbage + text.slice(at);
    }
    case 4:
    case 5: {
      // a number replaced by a huge or odd number, or by a value of another type
      const numbers = [...text.matchAll(/-?\d+(\.\d+)?(e-?\d+)?/g)];
      if (numbers.length === 0) return text;
      const m = numbers[rng.integerBelow(numbers.length)]!;
      const pool = rng.integerBelow(2) === 0 ? HUGE_NUMBERS : WRONG_TYPES;
      return text.slice(0, m.index) + pool[rng.integerBelow(pool.length)]! + text.slice(m.index + m[0].length);
    }
    case 6: {
      // noise inside a cut expression
      const cuts = [...text.matchAll(/(cut: |cuts: \[)([^\n\]]+)/g)];
      if (cuts.length === 0) return text;
      const m = cuts[rng.integerBelow(cuts.length)]!;
      const at = m.index + m[1]!.length + rng.integerBelow(m[2]!.length + 1);
      return text.slice(0, at) + CUT_NOISE[rng.integerBelow(CUT_NOISE.length)]! + text.slice(at);
    }
    case 7: {
      // duplicate a line (duplicate keys, duplicate names)
      const a = line();
      lines.splice(a, 0, lines[a]!);
      return lines.join('\n');
    }
    case 8: {
      // change the indentation of a line
      const a = line();
      lines[a] = rng.integerBelow(2) === 0 ? `  ${lines[a]}` : lines[a]!.replace(/^ {1,2}/, '');
      return lines.join('\n');
    }
    default: {
      // rename a region to an existing name or a variable to a misspelt one
      const names = [...text.matchAll(/name: ([^\n]+)/g)].map((m) => m[1]!);
      if (names.length < 2 || rng.integerBelow(2) === 0) return text.replace(/\bmet\b/, 'mte');
      return text.replace(`name: ${names[rng.integerBelow(names.length)]}`, `name: ${names[rng.integerBelow(names.length)]}`);
    }
  }
}

const events = [
  makeEvent({ muons: [[50, 0, 0, 1], [40, 1, 2, -1]], electrons: [[30, -1, -2, 1]], jets: [[60, 2, 1, 1], [45, -2, -1, 0]], met: [70, 0.5] }),
  makeEvent({ electrons: [[40, 0.3, 0, 1], [25, -0.7, 2.5, 1]], jets: [[90, 1, -1, 0], [50, -1.5, 1.5, 1], [35, 0, -2.5, 0]], met: [30, 2] }),
];

describe('analysis loader fuzzing', () => {
  for (const [index, name] of FILES.entries()) {
    it(`${MUTATIONS_PER_FILE} seeded mutations of analyses/${name} end in a clear error or a working analysis`, () => {
      const original = readFileSync(join(ANALYSES, name), 'utf8');
      const file = join(ANALYSES, name); // so relative detector paths still resolve
      const rng = RandomStream.forStream(20240612, index);
      let refused = 0;
      for (let k = 0; k < MUTATIONS_PER_FILE; k++) {
        let text = mutate(original, rng);
        for (let extra = rng.integerBelow(3); extra > 0; extra--) text = mutate(text, rng);
        try {
          const analysis = parseAnalysis(text, file);
          const selection = createSelection([analysis]);
          for (const event of events) selection.process(event);
          const result = selection.results().analyses[0]!;
          expect(result.total.events).toBe(events.length);
        } catch (error) {
          if (!(error instanceof TamisError)) throw new Error(`mutation ${k} of ${name} threw ${String(error)}\n--- text ---\n${text}`);
          refused++;
          const message = formatError(error);
          expect(error.file, message).toBe(file);
          expect(message).not.toMatch(/undefined|\[object|internal error/);
          // Known gap of the shared YAML reader (io/yamlFile.ts, reported to the lead): an
          // unresolved alias is reported without its line.
          const aliasGap = /Unresolved alias/.test(error.message);
          if ((error.code === 'schema' || error.code === 'expression') && !aliasGap) expect(error.line ?? 0, message).toBeGreaterThan(0);
        }
      }
      // Most mutations break the file; some (a deleted comment, a harmless number) do not.
      expect(refused).toBeGreaterThan(MUTATIONS_PER_FILE * 0.3);
      expect(refused).toBeLessThan(MUTATIONS_PER_FILE);
    });
  }
});
