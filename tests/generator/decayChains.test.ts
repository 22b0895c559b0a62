import { describe, expect, it } from 'vitest';
import { M_H, M_TAU, M_TOP, M_W, M_Z } from '../../src/physics/constants.js';
import { RandomStream } from '../../src/physics/random.js';
import { EventRecord, STATUS_DECAYED, STATUS_FINAL } from '../../src/generator/eventRecord.js';
import { createDecayer } from '../../src/generator/decays/index.js';
import { TAU_A1_MASS_MIN, TAU_OTHER_MASS_MIN, TAU_RHO_MASS_MIN } from '../../src/generator/decays/tauHadrons.js';
import { CHARGED_SCALAR, COLOURED_SCALAR, HEAVY_LEPTON, TEST_TABLES, expectConsistentEvent, makePairEvent, testParticles } from './decayTestUtils.js';

const particles = testParticles();

/** What mass a particle of the decay chain must carry (pole mass, or inside its allowed range). */
function expectMassAllowed(record: EventRecord, i: number): void {
  const id = Math.abs(record.pdgId[i]!);
  const m = record.mass[i]!;
  const mother = record.mother1[i]!;
  const fromHiggs = mother >= 0 && record.pdgId[mother] === 25;
  let ok: boolean;
  if (id === 213 || id === 20213 || id === 98) {
    const low = id === 213 ? TAU_RHO_MASS_MIN : id === 20213 ? TAU_A1_MASS_MIN : TAU_OTHER_MASS_MIN;
    ok = m >= low && m <= M_TAU;
  } else if ((id === 23 || id === 24) && fromHiggs) {
    ok = m > 0 && m < M_H;
  } else {
    // Narrow-width approximation: everything else, t, W and Z included, sits at its table mass.
    ok = m === particles.get(id).mass;
  }
  if (!ok) expect.fail(`particle ${i} (id ${record.pdgId[i]}) has mass ${m}`);
}

describe('decay chains of hand-made events', () => {
  it('conserve energy-momentum at every vertex and overall (1e-9 relative), keep masses on shell and leave only stable particles', () => {
    const decayer = createDecayer(particles, TEST_TABLES);
    const rng = RandomStream.forStream(301);
    const record = new EventRecord();
    const pairs: [number, number, number][] = [
      [HEAVY_LEPTON.id, -HEAVY_LEPTON.id, 0],
      [CHARGED_SCALAR.id, -CHARGED_SCALAR.id, 0],
      [HEAVY_LEPTON.id, -CHARGED_SCALAR.id, 0],
      [COLOURED_SCALAR.id, -COLOURED_SCALAR.id, 501],
      [6, -6, 502],
      [25, 23, 0],
      [24, -24, 0],
      [15, -15, 0],
    ];
    const seen = new Set<number>();
    for (let k = 0; k < 20_000; k++) {
      const [a, b, colour] = pairs[k % pairs.length]!;
      makePairEvent(record, a, particles.get(a).mass, b, particles.get(b).mass, rng, colour);
      decayer.decayAll(record, rng);
      expectConsistentEvent(record);
      for (let i = 2; i < record.size; i++) {
        expectMassAllowed(record, i);
        const st = record.status[i]!;
        seen.add(Math.abs(record.pdgId[i]!));
        // Only stable particles stay final; everything with a table has decayed.
        if ((st === STATUS_FINAL) === decayer.decays(record.pdgId[i]!)) expect.fail(`particle ${i} (id ${record.pdgId[i]}) has status ${st}`);
      }
    }
    // The sample went through every kind of decay.
    for (const id of [5, 6, 11, 12, 13, 14, 15, 16, 21, 22, 23, 24, 25, 211, 213, 20213, 98]) expect(seen.has(id), `id ${id} seen`).toBe(true);
  });

  it('is deterministic: the same stream gives the same event', () => {
    const decayer = createDecayer(particles, TEST_TABLES);
    const a = new EventRecord();
    const b = new EventRecord();
    const r1 = RandomStream.forStream(302, 7);
    const r2 = RandomStream.forStream(302, 7);
    for (let k = 0; k < 200; k++) {
      makePairEvent(a, HEAVY_LEPTON.id, 600, -CHARGED_SCALAR.id, 800, r1);
      makePairEvent(b, HEAVY_LEPTON.id, 600, -CHARGED_SCALAR.id, 800, r2);
      decayer.decayAll(a, r1);
      decayer.decayAll(b, r2);
      expect(Array.from(a.momentum.subarray(0, 4 * a.size))).toEqual(Array.from(b.momentum.subarray(0, 4 * b.size)));
      expect(Array.from(a.pdgId.subarray(0, a.size))).toEqual(Array.from(b.pdgId.subarray(0, b.size)));
    }
  });

  it('decays antiparticles to the conjugate daughters', () => {
    const decayer = createDecayer(particles, TEST_TABLES, { stable: [24, 15] });
    const record = new EventRecord();
    const rng = RandomStream.forStream(303);
    for (let k = 0; k < 100; k++) {
      record.clear();
      record.add(-6, STATUS_FINAL, -1, -1, 0, 0, 0, M_TOP, M_TOP);
      decayer.decayAll(record, rng);
      const ids = Array.from(record.pdgId.subarray(1, record.size)).sort((x, y) => x - y);
      expect(ids.length).toBe(2);
      expect(ids[0]).toBe(-24);
      expect([-5, -3, -1]).toContain(ids[1]);
    }
  });

  it('keeps particles listed as stable', () => {
    const decayer = createDecayer(particles, TEST_TABLES, { stable: [-15, 25] });
    expect(decayer.decays(15)).toBe(false);
    expect(decayer.decays(-25)).toBe(false);
    expect(decayer.decays(24)).toBe(true);
  });

  it('the W of a top decay and the V of a Higgs decay carry the right masses', () => {
    const decayer = createDecayer(particles, []);
    const record = new EventRecord();
    const rng = RandomStream.forStream(304);
    record.add(6, STATUS_FINAL, -1, -1, 0, 0, 0, M_TOP, M_TOP);
    decayer.decayAll(record, rng);
    expect(record.pdgId[2]).toBe(24);
    expect(record.mass[2]).toBe(M_W);
    record.clear();
    record.add(23, STATUS_FINAL, -1, -1, 0, 0, 0, M_Z, M_Z);
    decayer.decayAll(record, rng);
    expect(record.status[0]).toBe(STATUS_DECAYED);
  });
});
