/**
 * Generates a sample and writes it to an event file: Les Houches Events
 * (.lhe, the whole decay chain) or CSV of final-state particles (.csv).
 * Chunk by chunk, yielding to the event loop between chunks so a progress
 * display and an interruption (AbortSignal) are served; an interrupted or
 * failed run leaves no file.
 */
import { TamisError } from '../errors.js';
import { lesHouchesToyDensities } from '../physics/pdf/index.js';
import { CsvEventWriter } from './csvWriter.js';
import { EVENTS_PER_CHUNK, prepareEventGeneration, type EventGenerator, type GenerationOptions, type GenerationSummary } from './generateEvents.js';
import { LheWriter } from './lhe/lheWriter.js';
import type { LheInit } from './lhe/lheFormat.js';
import type { Model } from './model/types.js';
import type { EventRecord } from './eventRecord.js';

export type EventFileFormat = 'lhe' | 'csv';

/** The format an output file name asks for, from its extension; null if tamis does not write it. */
export function eventFileFormat(file: string): EventFileFormat | null {
  const lower = file.toLowerCase();
  if (lower.endsWith('.lhe')) return 'lhe';
  if (lower.endsWith('.csv')) return 'csv';
  return null;
}

/** Proton beam id (PDG) written in the init block. */
const PROTON = 2212;
/** IDWTUP = 3: unweighted events, all with the same weight (hep-ph/0109068). */
const UNWEIGHTED = 3;

/**
 * The LHE init block of a prepared sample: two proton beams of sqrt(S)/2,
 * PDFGUP = PDFSUP = -1 (tamis's own densities belong to no registry), IDWTUP = 3
 * and one process per open production channel (LPRUP = the channel index, the
 * event's IDPRUP). Every event carries the total cross section as its weight,
 * so XMAXUP is that total.
 */
export function lheInitOf(generator: EventGenerator): LheInit {
  const beam = 500 * generator.options.energyTeV;
  const sampler = generator.sampler;
  return {
    beamIds: [PROTON, PROTON],
    beamEnergies: [beam, beam],
    pdfGroups: [-1, -1],
    pdfSets: [-1, -1],
    weighting: UNWEIGHTED,
    processes: sampler.channels.map((c) => ({ processId: c.index, crossSectionPb: c.sigmaPb, errorPb: c.errorPb, maxWeight: sampler.crossSectionPb })),
  };
}

export interface WriteEventFileOptions {
  /** Called after each chunk with the events written so far. */
  onProgress?: (eventsDone: number, eventsTotal: number) => void;
  /** Stops between chunks; the partial file is removed and a TamisError thrown. */
  signal?: AbortSignal;
}

interface EventFileWriter {
  writeEvent(record: EventRecord, index: number): void;
  close(): Promise<void> | void;
  abort(): void;
}

/**
 * Generates `options.events` events of `model` with full decay chains and
 * writes them to `file` (.lhe or .csv). Resolves with the generation summary.
 * Throws `bad_input` for an unsupported extension, `io` when interrupted or
 * when writing fails; no partial file is left in either case.
 */
export async function writeEventFile(model: Model, options: GenerationOptions, file: string, control: WriteEventFileOptions = {}): Promise<GenerationSummary> {
  const kind = eventFileFormat(file);
  if (kind === null) throw new TamisError('bad_input', `event files end in .lhe or .csv, got "${file}"`);
  const generator = prepareEventGeneration(model, options);
  const writer: EventFileWriter =
    kind === 'lhe'
      ? new LheWriter(file, lheInitOf(generator), {
          model: model.name,
          settings: {
            energy_tev: options.energyTeV,
            events: options.events,
            seed: options.seed,
            point_id: (options.pointId ?? []).join(' '),
            events_per_chunk: EVENTS_PER_CHUNK,
            parton_densities: (options.pdf ?? lesHouchesToyDensities()).name,
            cross_section_pb: generator.sampler.crossSectionPb,
            cross_section_error_pb: generator.sampler.errorPb,
            event_weight: 'every event carries the total cross section in pb',
          },
        })
      : new CsvEventWriter(file);
  const sink = (record: EventRecord, index: number): void => writer.writeEvent(record, index);
  let done = 0;
  try {
    for (let chunk = 0; chunk < generator.chunkCount; chunk++) {
      done += generator.generateChunks(chunk, chunk + 1, sink);
      control.onProgress?.(done, options.events);
      await new Promise<void>((resolve) => setImmediate(resolve));
      if (control.signal?.aborted) throw new TamisError('io', `interrupted after ${done} of ${options.events} events: no file written`, { file });
    }
    await writer.close();
  } catch (error) {
    writer.abort();
    throw error;
  }
  return generator.summary(done);
}
