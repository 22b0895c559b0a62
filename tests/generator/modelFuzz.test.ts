/**
 * Fuzzing the model loader: 1000 seeded random mutations of each demo model
 * file (deleted, duplicated and swapped lines, truncation, garbage bytes, huge
 * or odd numbers, values of the wrong type, names swapped) must each either
 * load or throw a TamisError with the file name — never another exception.
 */
import { describe, expect, it } from 'vitest';
import { readFileSync, readdirSync } from 'node:fs';
import { TamisError } from '../../src/errors.js';
import { parseModel } from '../../src/generator/model/index.js';
import { RandomStream } from '../../src/physics/random.js';

const ODD_NUMBERS = ['1e308', '-1e308', '1e-320', '0', '-0', '-1', '.nan', '.inf', '-.inf', '4e4', '99999999999999999999', '0.5', '3', '-0.5'];
const ODD_VALUES = ['"text"', '[]', '{}', '[1, 2, 3]', '{a: 1}', 'null', 'true', '~', "''", '&a x', '*a', '!!binary AAAA', '[S+, S+]', '{ratio: -1, of: S+}', '{ratio: 1e6, of: S0}', 'auto'];

function mutate(text: string, rng: RandomStream): string {
  let lines = text.split('\n');
  const pick = <T>(items: readonly T[]): T => items[rng.integerBelow(items.length)]!;
  const count = 1 + rng.integerBelow(3);
  for (let m = 0; m < count; m++) {
    const i = rng.integerBelow(lines.length);
    switch (rng.integerBelow(9)) {
      case 0:
        lines.splice(i, 1);
        break;
      case 1:
        lines.splice(i, 0, lines[i]!);
        break;
      case 2: {
        const j = rng.integerBelow(lines.length);
        [lines[i], lines[j]] = [lines[j]!, lines[i]!];
        break;
      }
      case 3: {
        const joined = lines.join('\n');
        lines = joined.slice(0, rng.integerBelow(joined.length + 1)).split('\n');
        break;
      }
      case 4: {
        const line = lines[i]!;
        const at = rng.integerBelow(line.length + 1);
        let garbage = '';
        for (let k = 0, n = 1 + rng.integerBelow(6); k < n; k++) garbage += String.fromCharCode(rng.integerBelow(0x3000));
        lines[i] = line.slice(0, at) + garbage + line.slice(at);
        break;
      }
      case 5:
        lines[i] = lines[i]!.replace(/-?\d+(\.\d+)?(e-?\d+)?/, pick(ODD_NUMBERS));
        break;
      case 6:
        lines[i] = lines[i]!.replace(/: .*$/, `: ${pick(ODD_VALUES)}`);
        break;
      case 7: {
        const names = ['S+', 'S-', 'S0', 'S0bar', 'V0', 'V+', 'E-', 'E+', 'N0', 'N0bar', 'photon', 'Z', 'W', 'tau+', 'nu_tau', 't', 'bbar', 'mu-', 'h'];
        lines[i] = lines[i]!.replace(/\b(S\+|S-|S0bar|S0|V0|V\+|E-|E\+|N0bar|N0|photon|Z|W|tau\+|tau-|nu_tau|bbar|b|t|h)\b/, pick(names));
        break;
      }
      default:
        lines[i] = ' '.repeat(rng.integerBelow(5)) + lines[i]!.trimStart();
    }
  }
  return lines.join('\n');
}

const folder = new URL('../../data-demo/', import.meta.url);
const files = readdirSync(folder).filter((f) => f.endsWith('.model.yaml'));

describe('model loader fuzz (1000 seeded mutations per demo file)', () => {
  for (const [fileIndex, file] of files.entries()) {
    it(`${file}: every mutation loads or gives a TamisError naming the file`, () => {
      const text = readFileSync(new URL(file, folder), 'utf8');
      const rng = RandomStream.forStream(2024, fileIndex);
      let loaded = 0;
      let rejected = 0;
      for (let n = 0; n < 1000; n++) {
        const mutated = mutate(text, rng);
        try {
          parseModel(mutated, file);
          loaded++;
        } catch (error) {
          if (!(error instanceof TamisError)) throw new Error(`mutation ${n} threw ${String(error)}:\n${mutated}`);
          expect(error.file).toBe(file);
          rejected++;
        }
      }
      // Most mutations break the file; some (whitespace, a swapped name that still makes sense) do not.
      expect(rejected).toBeGreaterThan(500);
      expect(loaded + rejected).toBe(1000);
    });
  }
});
