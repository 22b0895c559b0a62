/**
 * Fuzzing the LHE reader: 2000 seeded random mutations of a valid file
 * (deleted, duplicated and swapped lines, garbage bytes, truncations, huge and
 * odd numbers, removed or doubled blanks). Every outcome must be a clean read
 * or a `bad_file` TamisError with a line number; never another exception,
 * never a hang (the parser is a single pass over the lines).
 */
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { gzipSync } from 'node:zlib';
import { afterAll, describe, expect, it } from 'vitest';
import { TamisError } from '../../src/errors.js';
import { RandomStream } from '../../src/physics/random.js';
import { formatLheEvent, formatLheStart, LHE_END, parseLheText, readLheFile } from '../../src/generator/lhe/index.js';
import { SAMPLE_INIT, sampleEvents } from './lheTestUtils.js';

const dir = mkdtempSync(join(tmpdir(), 'tamis-lhe-fuzz-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

const events = sampleEvents(3, 1001);
const validText = formatLheStart(SAMPLE_INIT, { model: 'fuzz' }) + events.map(formatLheEvent).join('') + LHE_END;

const ODD_TOKENS = ['1e400', '-1e400', '99999999999999999999', 'NaN', 'Infinity', '0x1F', '1.0D+03', '', '-', '+', '.', 'e5', '1e', '--1', '<', '>', '</event>', '<event>', '#', '\u0000', '\uFFFD', '9'.repeat(40)];

function mutate(text: string, rng: RandomStream): string {
  const lines = text.split('\n');
  const pick = (): number => rng.integerBelow(lines.length);
  const rounds = 1 + rng.integerBelow(3);
  for (let r = 0; r < rounds; r++) {
    switch (rng.integerBelow(9)) {
      case 0:
        lines.splice(pick(), 1); // delete a line
        break;
      case 1: {
        const k = pick();
        lines.splice(k, 0, lines[k]!); // duplicate a line
        break;
      }
      case 2: {
        const a = pick();
        const b = pick();
        [lines[a], lines[b]] = [lines[b]!, lines[a]!]; // swap two lines
        break;
      }
      case 3: {
        // garbage bytes inside a line
        const k = pick();
        const s = lines[k]!;
        const at = rng.integerBelow(s.length + 1);
        let junk = '';
        for (let j = 0, n = 1 + rng.integerBelow(8); j < n; j++) junk += String.fromCharCode(rng.integerBelow(256));
        lines[k] = s.slice(0, at) + junk + s.slice(at);
        break;
      }
      case 4:
        return lines.join('\n').slice(0, rng.integerBelow(text.length)); // truncation
      case 5: {
        // replace one field by an odd token
        const k = pick();
        const fields = lines[k]!.trim().split(/\s+/);
        fields[rng.integerBelow(fields.length)] = ODD_TOKENS[rng.integerBelow(ODD_TOKENS.length)]!;
        lines[k] = fields.join(' ');
        break;
      }
      case 6: {
        // a huge number in a numeric field
        const k = pick();
        const fields = lines[k]!.trim().split(/\s+/);
        fields[rng.integerBelow(fields.length)] = (rng.uniform() < 0.5 ? '-' : '') + `${rng.uniform()}e${rng.integerBelow(700)}`;
        lines[k] = fields.join(' ');
        break;
      }
      case 7: {
        // drop or add a column
        const k = pick();
        const fields = lines[k]!.trim().split(/\s+/);
        if (rng.uniform() < 0.5) fields.splice(rng.integerBelow(fields.length), 1);
        else fields.push(String(rng.integerBelow(100)));
        lines[k] = fields.join(' ');
        break;
      }
      default:
        lines[pick()] = ''; // blank a line
    }
  }
  return lines.join('\n');
}

describe('LHE reader under 2000 random mutations', () => {
  it('returns a valid read or a bad_file TamisError with a line, nothing else', () => {
    const rng = RandomStream.forStream(1002);
    let rejected = 0;
    let accepted = 0;
    for (let k = 0; k < 2000; k++) {
      const text = mutate(validText, rng);
      try {
        const result = parseLheText(text, (record) => {
          // Accepted events must be internally consistent.
          for (let i = 0; i < record.size; i++) if (record.mother1[i]! >= record.size || record.mother2[i]! >= record.size) expect.fail('mother outside the event');
        });
        expect(result.events).toBeLessThanOrEqual(6);
        accepted++;
      } catch (error) {
        if (!(error instanceof TamisError) || error.code !== 'bad_file' || !(error.line! >= 1)) {
          expect.fail(`mutation ${k} raised ${String(error)}\n--- input ---\n${text.slice(0, 2000)}`);
        }
        rejected++;
      }
    }
    // The mutations are mostly fatal but some are harmless (a blank line, a changed momentum).
    expect(rejected).toBeGreaterThan(1000);
    expect(accepted).toBeGreaterThan(50);
  });

  it('the file reader behaves the same on mutated files, plain and gzip-compressed', async () => {
    const rng = RandomStream.forStream(1003);
    for (let k = 0; k < 60; k++) {
      const text = mutate(validText, rng);
      const file = join(dir, `m${k}.lhe${k % 2 === 0 ? '.gz' : ''}`);
      const bytes = Buffer.from(text, 'latin1');
      writeFileSync(file, k % 2 === 0 ? gzipSync(bytes).subarray(0, k % 4 === 0 ? undefined : 40 + rng.integerBelow(200)) : bytes);
      try {
        await readLheFile(file, () => {});
      } catch (error) {
        if (!(error instanceof TamisError) || error.code !== 'bad_file' || error.file !== file) expect.fail(`file ${k} raised ${String(error)}`);
      }
    }
  });
});
