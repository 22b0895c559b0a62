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
import { mutateYaml } from '../fuzzMutations.js';

const MUTATIONS_PER_FILE = 1000;

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
      const mutated = mutateYaml(text, rng);
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
