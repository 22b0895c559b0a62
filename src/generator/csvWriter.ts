/**
 * CSV of the final-state particles of generated events, for inspection in a
 * spreadsheet or a data-frame library. Rows are formatted by fast-csv and the
 * file is written atomically (it appears under its name only on `close()`).
 *
 * Columns (one row per status-1 particle):
 *
 * | column        | meaning                                                        |
 * |---------------|----------------------------------------------------------------|
 * | event         | event number in the sample, from 0                             |
 * | index         | position of the particle in the full event record, from 0      |
 * | pdg_id        | PDG id (98 = the lumped hadronic tau system, see decays/)      |
 * | mother        | position of its mother in the event record (-1 for none)       |
 * | mother_pdg_id | PDG id of the mother (0 for none)                              |
 * | px, py, pz, e | four-momentum, GeV                                             |
 * | mass          | generated mass, GeV                                            |
 * | pt, eta, phi  | transverse momentum (GeV), pseudorapidity, azimuth in (-pi, pi] |
 *
 * Reals carry ten significant digits.
 */
import { format, type CsvFormatterStream } from 'fast-csv';
import { TamisError } from '../errors.js';
import { AtomicFileWriter } from '../io/atomicWrite.js';
import { eta, phi, pt } from '../physics/fourVector.js';
import { STATUS_FINAL, type EventRecord } from './eventRecord.js';

export const CSV_COLUMNS = ['event', 'index', 'pdg_id', 'mother', 'mother_pdg_id', 'px', 'py', 'pz', 'e', 'mass', 'pt', 'eta', 'phi'] as const;

/** Text handed to the file once the buffer passes this many characters. */
const FLUSH_CHARACTERS = 1 << 20;

/**
 * A real with ten significant digits in its shortest form ("inf"/"-inf" for
 * infinite pseudorapidities of particles along the beam).
 *
 * @example
 * formatCsvReal(1 / 3) // '0.3333333333'
 */
export function formatCsvReal(x: number): string {
  if (x === Infinity) return 'inf';
  if (x === -Infinity) return '-inf';
  return String(Number(x.toPrecision(10)));
}

type Row = (string | number)[];

/**
 * Streams final-state particles to a CSV file.
 *
 * @example
 * const csv = new CsvEventWriter('out/events.csv');
 * // for each event: csv.writeEvent(record, index)
 * await csv.close(); // the file appears now
 */
export class CsvEventWriter {
  readonly file: string;
  private readonly out: AtomicFileWriter;
  private readonly stream: CsvFormatterStream<Row, Row>;
  private text = '';
  private failure: Error | null = null;
  private rows = 0;

  constructor(file: string) {
    this.file = file;
    this.out = new AtomicFileWriter(file);
    this.stream = format<Row, Row>({ headers: [...CSV_COLUMNS], writeHeaders: true, alwaysWriteHeaders: true });
    // With a data listener the formatter hands rows over synchronously, so memory stays flat.
    this.stream.on('data', (chunk: Buffer) => {
      this.text += chunk.toString('utf8');
      if (this.text.length > FLUSH_CHARACTERS) this.flush();
    });
    this.stream.on('error', (error: Error) => {
      this.failure = error;
    });
  }

  /** Rows written so far (final-state particles). */
  get rowCount(): number {
    return this.rows;
  }

  /** Appends one row per final-state particle of `record`. */
  writeEvent(record: EventRecord, eventIndex: number): void {
    if (this.failure !== null) throw this.fail(this.failure);
    const p = record.momentum;
    for (let i = 0; i < record.size; i++) {
      if (record.status[i] !== STATUS_FINAL) continue;
      const mother = record.mother1[i]!;
      const o = 4 * i;
      this.stream.write([
        eventIndex,
        i,
        record.pdgId[i]!,
        mother,
        mother >= 0 ? record.pdgId[mother]! : 0,
        formatCsvReal(p[o]!),
        formatCsvReal(p[o + 1]!),
        formatCsvReal(p[o + 2]!),
        formatCsvReal(p[o + 3]!),
        formatCsvReal(record.mass[i]!),
        formatCsvReal(pt(p, i)),
        formatCsvReal(eta(p, i)),
        formatCsvReal(phi(p, i)),
      ]);
      this.rows++;
    }
  }

  /** Finishes the formatter and moves the file into place. */
  async close(): Promise<void> {
    const ended = new Promise<void>((resolve, reject) => {
      this.stream.once('end', resolve);
      this.stream.once('error', reject);
    });
    this.stream.end();
    try {
      await ended;
    } catch (error) {
      throw this.fail(error as Error);
    }
    if (this.failure !== null) throw this.fail(this.failure);
    this.flush();
    this.out.commit();
  }

  /** Drops the partial file. */
  abort(): void {
    this.text = '';
    this.stream.destroy();
    this.out.abort();
  }

  private flush(): void {
    if (this.text === '') return;
    this.out.write(this.text);
    this.text = '';
  }

  private fail(error: Error): TamisError {
    this.abort();
    return new TamisError('io', `cannot write CSV: ${error.message}`, { file: this.file });
  }
}
