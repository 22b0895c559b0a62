/**
 * Fuzzing of the detector-profile loader (issue requirement: at least 1 000
 * random mutations of each shipped profile). Every mutated file must end in a
 * clear TamisError that names the file, or in a valid profile that then runs
 * the detector on a test event without error. A hang would exceed vitest's
 * test timeout.
 */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { createDetector } from '../../src/detector/detector.js';
import { builtInDetectorFolder, builtInDetectorProfileNames } from '../../src/detector/profile/builtInProfiles.js';
import { parseDetectorProfile } from '../../src/detector/profile/loader.js';
import { RecoEvent } from '../../src/detector/recoEvent.js';
import { TamisError } from '../../src/errors.js';
import { EventRecord, STATUS_DECAYED, STATUS_FINAL } from '../../src/generator/eventRecord.js';
import { RandomStream } from '../../src/physics/random.js';
import { addBeams, addHadronicTau, addParticle, zToLeptons } from './eventBuilders.js';

const MUTATIONS_PER_FILE = 1000;

const HUGE_NUMBERS = ['1e308', '1e400', '-1e300', '123456789012345678901234567890', '.inf', '-.inf', '.nan', '0x7fffffff', '1e-320', '-0'];
const WRONG_TYPES = ['abc', '[1, 2]', '{a: 1}', '~', 'true', '""', '[[0.5]]', '- x', '&a 1', '*a', '!!binary AAAA'];

function randomLine(lines: string[], rng: RandomStream): number {
  return rng.integerBelow(lines.length);
}

/** One random mutation of `text`. */
function mutate(text: string, rng: RandomStream): string {
  const lines = text.split('\n');
  switch (rng.integerBelow(9)) {
    case 0: // delete a line
      lines.splice(randomLine(lines, rng), 1);
      return lines.join('\n');
    case 1: {
      // swap two lines
      const a = randomLine(lines, rng);
      const b = randomLine(lines, rng);
      [lines[a], lines[b]] = [lines[b]!, lines[a]!];
      return lines.join('\n');
    }
    case 2: // truncate
      return text.slice(0, rng.integerBelow(text.length));
    case 3: {
      // garbage bytes (any code unit, control characters and lone surrogates included)
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
      const replacement = pool[rng.integerBelow(pool.length)]!;
      return text.slice(0, m.index) + replacement + text.slice(m.index! + m[0].length);
    }
    case 6: {
      // re-indent a line
      const i = randomLine(lines, rng);
      lines[i] = rng.integerBelow(2) === 0 ? ` ${lines[i]}` : lines[i]!.replace(/^ {1,2}/, '');
      return lines.join('\n');
    }
    case 7: {
      // duplicate a line
      const i = randomLine(lines, rng);
      lines.splice(i, 0, lines[i]!);
      return lines.join('\n');
    }
    default: {
      // a flow list loses or gains an entry
      const lists = [...text.matchAll(/\[[^\[\]\n]*\]/g)];
      if (lists.length === 0) return text;
      const m = lists[rng.integerBelow(lists.length)]!;
      const inner = m[0].slice(1, -1);
      const changed = rng.integerBelow(2) === 0 ? inner.replace(/,[^,]*$/, '') : `${inner}, ${inner.split(',')[0]}`;
      return text.slice(0, m.index) + `[${changed}]` + text.slice(m.index! + m[0].length);
    }
  }
}

/** A busy test event: Z -> e e, a b quark, a light quark, a hadronic tau, a muon and a neutrino. */
function busyEvent(): EventRecord {
  const record = new EventRecord(32);
  zToLeptons(record, 11);
  addParticle(record, 5, STATUS_FINAL, 0, 120, 1.1, 2.0, 4.7);
  addParticle(record, 1, STATUS_FINAL, 0, 18, 3.9, -2.0);
  addHadronicTau(record, -15, 45, -1.9, 2.9, 213);
  const w = addParticle(record, -24, STATUS_DECAYED, 0, 30, 0, 0, 80.4);
  addParticle(record, 13, STATUS_FINAL, w, 35, 2.3, -0.4);
  addParticle(record, -14, STATUS_FINAL, w, 20, 0.1, 2.4);
  addBeams(record);
  return record;
}

describe.each(builtInDetectorProfileNames())('fuzzing the %s profile through the loader', (name) => {
  it(`${MUTATIONS_PER_FILE} seeded mutations each end in a clear error or a working profile`, () => {
    const text = readFileSync(join(builtInDetectorFolder(), `${name}.yaml`), 'utf8');
    const rng = RandomStream.forStream(20240601, name.length);
    const record = busyEvent();
    const out = new RecoEvent();
    let valid = 0;
    let rejected = 0;
    for (let k = 0; k < MUTATIONS_PER_FILE; k++) {
      let mutated = mutate(text, rng);
      const extra = rng.integerBelow(3);
      for (let x = 0; x < extra; x++) mutated = mutate(mutated, rng);
      let profile;
      try {
        profile = parseDetectorProfile(mutated, 'fuzz.yaml');
      } catch (error) {
        if (!(error instanceof TamisError)) throw new Error(`mutation ${k} raised a non-tamis error: ${String(error)}\n--- file ---\n${mutated}`);
        expect(error.file).toBe('fuzz.yaml');
        expect(error.message.length).toBeGreaterThan(0);
        rejected++;
        continue;
      }
      valid++;
      const detector = createDetector(profile);
      const eventRng = RandomStream.forStream(7, k);
      for (let n = 0; n < 20; n++) {
        detector.reconstruct(record, eventRng, out);
        expect(Number.isFinite(out.metX) && Number.isFinite(out.metY)).toBe(true);
      }
    }
    // Both outcomes occur: the mutations are neither all harmless nor all fatal.
    expect(valid).toBeGreaterThan(20);
    expect(rejected).toBeGreaterThan(MUTATIONS_PER_FILE / 2);
  });
});
