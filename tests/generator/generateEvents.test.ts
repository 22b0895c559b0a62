/**
 * Event generation end to end on the invented demo model: every event
 * conserves energy-momentum and keeps its masses, and the chunked random
 * streams make the sample independent of how chunks are split among workers.
 */
import { join } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { TamisError } from '../../src/errors.js';
import { STATUS_FINAL, type EventRecord } from '../../src/generator/eventRecord.js';
import { EVENTS_PER_CHUNK, generateEvents, prepareEventGeneration, type EventGenerator } from '../../src/generator/generateEvents.js';
import { formatLheEvent } from '../../src/generator/lhe/index.js';
import { loadModel } from '../../src/generator/model/index.js';
import type { Model } from '../../src/generator/model/types.js';
import { expectConsistentEvent } from './decayTestUtils.js';

const MODEL_FILE = join(import.meta.dirname, '..', '..', 'data-demo', 'benchmark.model.yaml');
let model: Model;
let generator: EventGenerator;

beforeAll(() => {
  model = loadModel(MODEL_FILE);
  generator = prepareEventGeneration(model, { energyTeV: 13, events: 2 * EVENTS_PER_CHUNK + 5000, seed: 21 });
});

describe('generateEvents', () => {
  it('plans fixed chunks, the last one short', () => {
    expect(generator.chunkCount).toBe(3);
    expect([0, 1, 2, 3].map((k) => generator.eventsInChunk(k))).toEqual([EVENTS_PER_CHUNK, EVENTS_PER_CHUNK, 5000, 0]);
  });

  it('every event of a 25 000-event sample conserves energy-momentum (1e-9) and keeps its masses; only stable particles are final', () => {
    let n = 0;
    const made = generator.generateChunks(0, generator.chunkCount, (record, index) => {
      if (index !== n) expect.fail(`event index ${index}, expected ${n}`);
      n++;
      expectConsistentEvent(record);
      for (let i = 2; i < record.size; i++) {
        if (record.status[i] === STATUS_FINAL && generator.decayer.decays(record.pdgId[i]!)) expect.fail(`undecayed ${record.pdgId[i]}`);
      }
      if (record.weight !== generator.sampler.crossSectionPb) expect.fail('event weight is not the cross section');
    });
    expect(made).toBe(2 * EVENTS_PER_CHUNK + 5000);
  });

  it('gives the same events whether chunks run in one worker or are split between two', () => {
    const text = (g: EventGenerator, first: number, end: number): string => {
      let out = '';
      g.generateChunks(first, end, (record: EventRecord) => (out += formatLheEvent(record)));
      return out;
    };
    const together = text(generator, 0, 2);
    // A second generator prepared from the same seed plays the other worker, doing the chunks in reverse order.
    const other = prepareEventGeneration(model, { energyTeV: 13, events: 2 * EVENTS_PER_CHUNK + 5000, seed: 21 });
    const second = text(other, 1, 2);
    const first = text(other, 0, 1);
    expect(first.length + second.length).toBe(together.length);
    expect(first + second === together).toBe(true);
    // Chunks draw from distinct streams.
    expect(generator.streamOf(0).nextUint32()).not.toBe(generator.streamOf(1).nextUint32());
  });

  it('generateEvents runs the whole sample and reports the cross section', () => {
    let count = 0;
    const summary = generateEvents(model, { energyTeV: 8, events: 1234, seed: 3 }, () => count++);
    expect(count).toBe(1234);
    expect(summary.events).toBe(1234);
    expect(summary.energyTeV).toBe(8);
    expect(summary.crossSectionPb).toBeGreaterThan(0);
  });

  it('rejects bad options with the option named', () => {
    for (const events of [-1, 1.5, Number.NaN]) {
      try {
        prepareEventGeneration(model, { energyTeV: 13, events, seed: 1 });
        expect.fail('accepted');
      } catch (error) {
        expect(error).toBeInstanceOf(TamisError);
        expect((error as TamisError).key).toBe('events');
      }
    }
    expect(() => generator.generateChunks(2, 4, () => {})).toThrow(/chunk range/);
  });
});
