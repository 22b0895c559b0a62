/**
 * Setting values inside a model file for a scan point. A path such as
 * `particles.S+.mass` walks the YAML document: mapping keys by name, list
 * entries by their `name` (or `particle`, for decay tables) or by position.
 * The document keeps its comments, so a point's model text reads like the
 * base file with a few numbers changed.
 */
import { Document, isMap, isScalar, isSeq, parseDocument } from 'yaml';
import { TamisError } from '../../errors.js';

export type ConcretePath = (string | number)[];

/** Names by which a list entry can be picked. */
const ENTRY_NAME_KEYS = ['name', 'particle'] as const;

function entryName(item: unknown): string | undefined {
  if (!isMap(item)) return undefined;
  for (const key of ENTRY_NAME_KEYS) {
    const v = item.get(key, true);
    if (isScalar(v) && (typeof v.value === 'string' || typeof v.value === 'number')) return String(v.value);
  }
  return undefined;
}

/**
 * Turns a dotted path into concrete keys of `doc`. Every key but the last must
 * exist; the last may be new only inside a mapping. Throws a `bad_input`
 * message that lists what exists at the step that failed.
 */
export function resolveModelPath(doc: Document, path: string): ConcretePath {
  const parts = path.split('.');
  const concrete: ConcretePath = [];
  let node: unknown = doc.contents;
  for (let i = 0; i < parts.length; i++) {
    const part = parts[i]!;
    const last = i === parts.length - 1;
    const where = concrete.length ? `at ${concrete.join('.')}` : 'at the top of the model';
    if (isMap(node)) {
      const keys = node.items.map((p) => (isScalar(p.key) ? String(p.key.value) : String(p.key)));
      if (!keys.includes(part) && !last) throw new TamisError('bad_input', `the model has no key "${part}" ${where} (keys: ${keys.join(', ')})`);
      concrete.push(part);
      node = node.get(part, true);
    } else if (isSeq(node)) {
      if (last) throw new TamisError('bad_input', `a path must end at a key of the model, not at a whole list entry (${path})`);
      const names = node.items.map(entryName);
      let index = names.indexOf(part);
      if (index < 0 && /^\d+$/.test(part)) index = Number(part);
      if (index < 0 || index >= node.items.length) {
        const known = names.filter((n) => n !== undefined);
        throw new TamisError('bad_input', `the model has no entry "${part}" ${where} (entries: ${known.length ? known.join(', ') : `0 to ${node.items.length - 1}`})`);
      }
      concrete.push(index);
      node = node.items[index];
    } else {
      throw new TamisError('bad_input', `cannot go into "${part}" ${where}: it holds a single value`);
    }
  }
  return concrete;
}

/** A parsed base model, ready to produce point texts. */
export class ModelTemplate {
  readonly text: string;
  private readonly doc: Document;

  constructor(text: string) {
    this.text = text;
    this.doc = parseDocument(text);
  }

  resolve(path: string): ConcretePath {
    return resolveModelPath(this.doc, path);
  }

  /** The model text with each concrete path set to its value. */
  withValues(assignments: readonly { path: ConcretePath; value: number }[]): string {
    const copy = this.doc.clone();
    for (const { path, value } of assignments) copy.setIn(path, value);
    return copy.toString({ lineWidth: 0 });
  }
}
