/**
 * Event generation end to end: unweighted hard events from the model's
 * production channels (hardSampler.ts) followed by the full decay chains
 * (decays/), handed one by one to a sink.
 *
 * Reproducibility for any number of workers: events are made in fixed chunks
 * of EVENTS_PER_CHUNK, and chunk k draws only from
 *   RandomStream.forStream(seed, ...pointId, round(1000 x energyTeV), STREAM_EVENTS, k),
 * so splitting the chunks [0, chunkCount) among workers in any way gives the
 * same events, byte for byte. The sampler itself is prepared deterministically
 * from the seed (the same grid in every worker).
 */
import { TamisError } from '../errors.js';
import type { PartonDensity } from '../physics/partonDensity.js';
import { lesHouchesToyDensities } from '../physics/pdf/index.js';
import { RandomStream } from '../physics/random.js';
import { createDecayer, type Decayer } from './decays/index.js';
import { EventRecord } from './eventRecord.js';
import { prepareHardSampler, type HardSampler } from './hardSampler.js';
import type { Model } from './model/types.js';

/** Events per chunk: the unit of random streams and of work splitting. Changing it changes every sample. */
export const EVENTS_PER_CHUNK = 10_000;
/** Stream tag of event generation, keeping these streams apart from the integration's. */
export const STREAM_EVENTS = 0x45564e54;
/** Largest sample one call generates (2^31 - 1 events: chunk ids stay small integers). */
export const MAX_EVENTS = 2_147_483_647;

export interface GenerationOptions {
  /** Collider energy sqrt(S), TeV. */
  energyTeV: number;
  /** Number of unweighted events. */
  events: number;
  /** Seed of the sampler preparation and of the event streams (integer >= 0). */
  seed: number;
  /** Ids of the model point in a scan, put in the stream path. @default [] */
  pointId?: readonly number[];
  /** Parton densities. @default the built-in LO toy densities */
  pdf?: PartonDensity;
  /** Particle ids left undecayed (for studies of the hard process). @default [] */
  stable?: readonly number[];
  /** Relative MC error the sampler's integration aims at. @default the cross-section default (0.5%) */
  targetRelativeError?: number;
}

/** Called with each finished event (the record is reused: copy it to keep it) and its index in the sample. */
export type EventSink = (record: EventRecord, eventIndex: number) => void;

export interface GenerationSummary {
  model: string;
  energyTeV: number;
  seed: number;
  events: number;
  /** Total cross section of the sample (the weight of every event), pb, and its MC error. */
  crossSectionPb: number;
  errorPb: number;
  /** Share of the cross section under-represented by points above the unweighting maximum. */
  overweightFraction: number;
}

/** A prepared generator: the hard sampler, the decayer and the chunk plan of one sample. */
export class EventGenerator {
  readonly model: Model;
  readonly options: Readonly<GenerationOptions>;
  readonly sampler: HardSampler;
  readonly decayer: Decayer;
  readonly chunkCount: number;
  private readonly record = new EventRecord(64);

  constructor(model: Model, options: GenerationOptions, sampler: HardSampler, decayer: Decayer) {
    this.model = model;
    this.options = options;
    this.sampler = sampler;
    this.decayer = decayer;
    this.chunkCount = Math.ceil(options.events / EVENTS_PER_CHUNK);
  }

  /** The random stream of chunk k. */
  streamOf(chunk: number): RandomStream {
    const energyCode = Math.round(1000 * this.options.energyTeV);
    return RandomStream.forStream(this.options.seed, ...(this.options.pointId ?? []), energyCode, STREAM_EVENTS, chunk);
  }

  /** Number of events in chunk k (the last one may be short). */
  eventsInChunk(chunk: number): number {
    return Math.max(0, Math.min(EVENTS_PER_CHUNK, this.options.events - chunk * EVENTS_PER_CHUNK));
  }

  /**
   * Generates the events of chunks [first, end) in order and passes each to
   * `sink` with its index in the whole sample; returns the number generated.
   */
  generateChunks(first: number, end: number, sink: EventSink): number {
    if (!(Number.isInteger(first) && Number.isInteger(end) && first >= 0 && first <= end && end <= this.chunkCount)) {
      throw new TamisError('bad_input', `chunk range [${first}, ${end}) is not inside [0, ${this.chunkCount})`);
    }
    const record = this.record;
    let made = 0;
    for (let chunk = first; chunk < end; chunk++) {
      const rng = this.streamOf(chunk);
      const n = this.eventsInChunk(chunk);
      const offset = chunk * EVENTS_PER_CHUNK;
      for (let k = 0; k < n; k++) {
        this.sampler.fill(record, rng);
        this.decayer.decayAll(record, rng);
        sink(record, offset + k);
      }
      made += n;
    }
    return made;
  }

  summary(events: number): GenerationSummary {
    return {
      model: this.model.name,
      energyTeV: this.options.energyTeV,
      seed: this.options.seed,
      events,
      crossSectionPb: this.sampler.crossSectionPb,
      errorPb: this.sampler.errorPb,
      overweightFraction: this.sampler.overweightFraction,
    };
  }
}

/**
 * Prepares the generator of a sample: checks the options, integrates the
 * model's channels and builds the unweighting (deterministic from the seed),
 * and compiles the decay tables. Throws `bad_input` TamisErrors naming the
 * option, and the errors of the sampler and decay tables.
 */
export function prepareEventGeneration(model: Model, options: GenerationOptions): EventGenerator {
  if (!(Number.isInteger(options.events) && options.events >= 0 && options.events <= MAX_EVENTS)) {
    throw new TamisError('bad_input', `number of events must be a whole number from 0 to ${MAX_EVENTS}, got ${options.events}`, { key: 'events' });
  }
  for (const id of options.pointId ?? []) {
    if (!(Number.isSafeInteger(id) && id >= 0)) throw new TamisError('bad_input', `point ids must be whole numbers >= 0, got ${id}`, { key: 'pointId' });
  }
  const sampler = prepareHardSampler(model, {
    energyTeV: options.energyTeV,
    seed: options.seed,
    pdf: options.pdf ?? lesHouchesToyDensities(),
    ...(options.targetRelativeError === undefined ? {} : { targetRelativeError: options.targetRelativeError }),
  });
  const decayer = createDecayer(model.particles, model.decayTables, { stable: options.stable ?? [] });
  return new EventGenerator(model, options, sampler, decayer);
}

/**
 * Generates `options.events` unweighted events of `model` with full decay
 * chains and passes each to `sink`; returns the cross section and counts.
 *
 * @example
 * const summary = generateEvents(loadModel('data-demo/benchmark.model.yaml'), { energyTeV: 13, events: 1000, seed: 1 }, (record) => {});
 * summary.events // 1000
 */
export function generateEvents(model: Model, options: GenerationOptions, sink: EventSink): GenerationSummary {
  const generator = prepareEventGeneration(model, options);
  const made = generator.generateChunks(0, generator.chunkCount, sink);
  return generator.summary(made);
}
