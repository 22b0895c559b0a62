/**
 * Fuzzing the scan-file loader: seeded random mutations of a scan file must
 * each end in a TamisError naming a file, or in a valid scan whose every point
 * holds a valid model. A hang would exceed vitest's test timeout.
 */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { TamisError } from '../../src/errors.js';
import { RandomStream } from '../../src/physics/random.js';
import { parseScan } from '../../src/recast/scan/loadScan.js';
import { mutateYaml, type Mutation } from '../fuzzMutations.js';

const FILE = join(import.meta.dirname, '..', 'fixtures', 'small.scan.yaml');
const MUTATIONS = 1000;

/** Mutations particular to scan files: broken model paths and formulas. */
const SCAN_MUTATIONS: readonly Mutation[] = [
  (text, rng) => text.replace('particles.S+.mass', ['particles.S+', 'particles.X.mass', 'particles.S+.mass.more', 'resonances.0.mass', 'decays.S+.modes.9.branching', '.', ''][rng.integerBelow(7)]!),
  (text, rng) => text.replace('mass / ratio', ['mass /', 'mass / 0', 'sqrt(-mass)', 'ratio * (mass', 'mass ^ 400', 'mass / ratio2', 'min(mass)', '1e400'][rng.integerBelow(8)]!),
];

describe('scan loader fuzzing', () => {
  it(`${MUTATIONS} seeded mutations of a scan file end in a clear error or a valid scan`, () => {
    const original = readFileSync(FILE, 'utf8');
    const rng = RandomStream.forStream(20261201, 1);
    let valid = 0;
    for (let k = 0; k < MUTATIONS; k++) {
      const text = mutateYaml(original, rng, SCAN_MUTATIONS);
      try {
        const scan = parseScan(text, FILE);
        expect(scan.points.length).toBeGreaterThan(0);
        valid++;
      } catch (error) {
        if (!(error instanceof TamisError)) throw new Error(`mutation ${k} threw ${String(error)}\n--- text ---\n${text}`);
        expect(error.file, error.message).toBeDefined();
      }
    }
    expect(valid).toBeGreaterThan(0);
  }, 120_000);
});
