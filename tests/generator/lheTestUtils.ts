/** Fixtures of the LHE tests: decayed hand-made events and an init block. */
import { RandomStream } from '../../src/physics/random.js';
import { EventRecord } from '../../src/generator/eventRecord.js';
import { createDecayer } from '../../src/generator/decays/index.js';
import type { LheInit } from '../../src/generator/lhe/index.js';
import { CHARGED_SCALAR, HEAVY_LEPTON, TEST_TABLES, makePairEvent, testParticles } from './decayTestUtils.js';

/** `n` decayed events (pairs of the invented test particles), each a separate record. */
export function sampleEvents(n: number, seed: number): EventRecord[] {
  const particles = testParticles();
  const decayer = createDecayer(particles, TEST_TABLES);
  const rng = RandomStream.forStream(seed);
  const record = new EventRecord();
  const out: EventRecord[] = [];
  for (let k = 0; k < n; k++) {
    const [a, b] = k % 2 === 0 ? [HEAVY_LEPTON.id, -HEAVY_LEPTON.id] : [CHARGED_SCALAR.id, -HEAVY_LEPTON.id];
    makePairEvent(record, a, particles.get(a).mass, b, particles.get(b).mass, rng, 501);
    decayer.decayAll(record, rng);
    record.processId = k % 2;
    record.weight = 0.123456789;
    record.scale = 700 + rng.uniform();
    record.alphaQed = 1 / 127.93;
    record.alphaQcd = 0.1;
    record.spin[2] = k % 3 === 0 ? -1 : 9;
    out.push(record.copy());
  }
  return out;
}

export const SAMPLE_INIT: LheInit = {
  beamIds: [2212, 2212],
  beamEnergies: [6500, 6500],
  pdfGroups: [-1, -1],
  pdfSets: [-1, -1],
  weighting: 3,
  processes: [
    { processId: 0, crossSectionPb: 0.0812, errorPb: 0.0004, maxWeight: 0.123456789 },
    { processId: 1, crossSectionPb: 0.0422, errorPb: 0.0002, maxWeight: 0.123456789 },
  ],
};
