/**
 * Reading user YAML files against a zod schema, with errors that name the
 * file, line, column and key.
 *
 * Every YAML format of tamis (model, analysis, detector profile, scan) goes
 * through `parseYamlText` / `readYamlFile`: one place decides how a bad file is
 * reported. Later checks that the schema cannot express (a cut expression that
 * does not parse, duplicate region names, ...) use the returned `locate` to
 * point at the right line.
 */
import { readFileSync } from 'node:fs';
import { LineCounter, isMap, isScalar, parseDocument, visit, type Document, type Node } from 'yaml';
import type { z } from 'zod';
import { TamisError, type SourceLocation } from '../errors.js';

/** A path into a parsed YAML document, e.g. `['regions', 3, 'background']`. */
export type KeyPath = readonly (string | number)[];

export interface YamlSource<T> {
  /** The validated data (schema defaults applied). */
  data: T;
  file: string;
  /**
   * Location of the node at `path` (or of its nearest existing ancestor).
   * `offset` is a character offset inside a scalar string, for errors inside
   * cut expressions; quotes around the scalar are accounted for.
   */
  locate(path: KeyPath, offset?: number): SourceLocation;
}

/** Formats a key path the way messages print it: `regions[3].background`. */
export function formatKeyPath(path: KeyPath): string {
  let out = '';
  for (const part of path) {
    if (typeof part === 'number') out += `[${part}]`;
    else out += out === '' ? part : `.${part}`;
  }
  return out;
}

/** Largest YAML file read, in bytes: guards against feeding a binary or a huge log by mistake. */
const MAX_FILE_BYTES = 64 * 1024 * 1024;

/** Reads a file as UTF-8 text, turning file-system errors into `TamisError`s. */
export function readTextFile(file: string): string {
  let buffer: Buffer;
  try {
    buffer = readFileSync(file);
  } catch (error) {
    const code = (error as NodeJS.ErrnoException).code;
    const why = code === 'ENOENT' ? 'file not found' : code === 'EISDIR' ? 'is a directory, expected a file' : `cannot read file (${code ?? String(error)})`;
    throw new TamisError('bad_file', why, { file });
  }
  if (buffer.length > MAX_FILE_BYTES) {
    throw new TamisError('bad_file', `file is ${buffer.length} bytes, larger than the ${MAX_FILE_BYTES}-byte limit for input files`, { file });
  }
  return buffer.toString('utf8');
}

/** Reads and validates a YAML file. Throws a located `TamisError` on any problem. */
export function readYamlFile<S extends z.ZodType>(file: string, schema: S): YamlSource<z.output<S>> {
  return parseYamlText(readTextFile(file), file, schema);
}

/** Parses and validates YAML text; `file` is only used in messages. */
export function parseYamlText<S extends z.ZodType>(text: string, file: string, schema: S): YamlSource<z.output<S>> {
  if (text.includes('\u0000')) {
    throw new TamisError('bad_file', 'file contains NUL bytes: it is not a YAML text file', { file, line: lineOfOffset(text, text.indexOf('\u0000')) });
  }
  const lineCounter = new LineCounter();
  const doc = parseDocument(text, { lineCounter, uniqueKeys: true, prettyErrors: false, strict: true });
  if (doc.errors.length > 0) {
    const first = doc.errors[0]!;
    const pos = lineCounter.linePos(first.pos[0]);
    throw new TamisError('schema', `not valid YAML: ${yamlMessage(first.message)}`, { file, line: pos.line, column: pos.col });
  }
  let raw: unknown;
  try {
    // maxAliasCount guards against alias bombs ("billion laughs").
    raw = doc.toJS({ maxAliasCount: 100 });
  } catch (error) {
    throw new TamisError('schema', `not valid YAML: ${yamlMessage((error as Error).message)}`, { file, ...aliasLocation(doc, lineCounter) });
  }
  const locate = (path: KeyPath, offset?: number): SourceLocation => locateInDocument(doc, lineCounter, file, path, offset);
  if (raw === null || raw === undefined) {
    throw new TamisError('schema', 'file is empty: expected a YAML mapping', { file, line: 1, column: 1 });
  }
  const result = schema.safeParse(raw);
  if (!result.success) {
    const issue = firstIssue(result.error.issues as unknown as ZodIssueLike[]);
    const unknownKey = issue.code === 'unrecognized_keys' ? issue.keys?.[0] : undefined;
    const where = unknownKey === undefined ? locate(issue.path, undefined) : locateKey(doc, lineCounter, file, issue.path, unknownKey);
    const more = result.error.issues.length > 1 ? ` (and ${result.error.issues.length - 1} more problem${result.error.issues.length > 2 ? 's' : ''})` : '';
    throw new TamisError('schema', describeIssue(issue, raw) + more, { ...where, suggestion: suggestionFor(issue, schema) });
  }
  return { data: result.data, file, locate };
}

function yamlMessage(message: string): string {
  const firstLine = message.split('\n')[0] ?? message;
  return firstLine.replace(/ at line \d+, column \d+.*$/, '').replace(/^./, (c) => c.toLowerCase());
}

/** Where the first alias that points to no anchor is (the usual reason `toJS` fails). */
function aliasLocation(doc: Document, lineCounter: LineCounter): { line?: number; column?: number } {
  let found: { line?: number; column?: number } = {};
  visit(doc, {
    Alias(_key, node) {
      if (node.resolve(doc) === undefined && node.range) {
        const pos = lineCounter.linePos(node.range[0]);
        found = { line: pos.line, column: pos.col };
        return visit.BREAK;
      }
      return undefined;
    },
  });
  return found;
}

function lineOfOffset(text: string, offset: number): number {
  let line = 1;
  for (let i = 0; i < offset && i < text.length; i++) if (text.charCodeAt(i) === 10) line++;
  return line;
}

/** Location of the key `key` itself (not its value) inside the mapping at `path`. */
function locateKey(doc: Document, lineCounter: LineCounter, file: string, path: KeyPath, key: string): SourceLocation {
  const parent = path.length === 0 ? doc.contents : doc.getIn(path, true);
  if (isMap(parent)) {
    for (const item of parent.items) {
      const k = item.key;
      if (isScalar(k) && String(k.value) === key && k.range) {
        const pos = lineCounter.linePos(k.range[0]);
        return { file, line: pos.line, column: pos.col, key: formatKeyPath([...path, key]) };
      }
    }
  }
  return locateInDocument(doc, lineCounter, file, [...path, key], undefined);
}

function locateInDocument(doc: Document, lineCounter: LineCounter, file: string, path: KeyPath, offset: number | undefined): SourceLocation {
  const key = formatKeyPath(path);
  for (let depth = path.length; depth >= 0; depth--) {
    const node = depth === 0 ? doc.contents : doc.getIn(path.slice(0, depth), true);
    if (node !== undefined && node !== null && typeof node === 'object' && 'range' in (node as object)) {
      const range = (node as Node).range;
      if (range) {
        let start = range[0];
        if (offset !== undefined && depth === path.length && isScalar(node)) {
          const quoted = node.type === 'QUOTE_DOUBLE' || node.type === 'QUOTE_SINGLE';
          start += offset + (quoted ? 1 : 0);
        }
        const pos = lineCounter.linePos(start);
        return { file, line: pos.line, column: pos.col, key };
      }
    }
  }
  return { file, key };
}

interface ZodIssueLike {
  code: string;
  path: (string | number)[];
  message: string;
  expected?: string;
  values?: unknown[];
  keys?: string[];
  minimum?: number | bigint;
  maximum?: number | bigint;
  inclusive?: boolean;
  origin?: string;
  errors?: ZodIssueLike[][];
}

/**
 * The issue to report: the first one, descending into unions to the branch that
 * got furthest; a missing key next to an unknown key is most likely a typo, so
 * the unknown key (which gets a "did you mean" hint) is reported instead.
 */
function firstIssue(issues: ZodIssueLike[]): ZodIssueLike {
  let issue = issues[0]!;
  if (issue.code === 'invalid_type' && issue.path.length > 0) {
    const parent = issue.path.slice(0, -1);
    const typo = issues.find((i) => i.code === 'unrecognized_keys' && i.path.length === parent.length && i.path.every((p, k) => p === parent[k]));
    if (typo) issue = typo;
  }
  if (issue.code === 'invalid_union' && issue.errors && issue.errors.length > 0) {
    // Prefer a branch whose problem lies deeper (the user chose that branch).
    let best: ZodIssueLike | undefined;
    for (const branch of issue.errors) {
      const candidate = branch[0];
      if (candidate && (best === undefined || candidate.path.length > best.path.length)) best = candidate;
    }
    if (best && best.path.length > 0) {
      return firstIssue([{ ...best, path: [...issue.path, ...best.path] }]);
    }
  }
  return issue;
}

function valueAt(root: unknown, path: readonly (string | number)[]): unknown {
  let v: unknown = root;
  for (const p of path) {
    if (v === null || typeof v !== 'object') return undefined;
    v = (v as Record<string | number, unknown>)[p];
  }
  return v;
}

/** A short description of a value for messages: `string "abc"`, `number -1.2`, `a list`. */
export function describeValue(value: unknown): string {
  if (value === undefined) return 'nothing';
  if (value === null) return 'an empty value';
  if (Array.isArray(value)) return 'a list';
  if (typeof value === 'object') return 'a mapping';
  if (typeof value === 'string') return `string "${value.length > 40 ? value.slice(0, 40) + '...' : value}"`;
  return `${typeof value} ${String(value)}`;
}

function describeIssue(issue: ZodIssueLike, raw: unknown): string {
  const value = valueAt(raw, issue.path);
  switch (issue.code) {
    case 'invalid_type':
      if (value === undefined) return `missing required key, expected ${issue.expected ?? 'a value'}`;
      if (issue.expected === 'number' && typeof value === 'number') return `expected a finite number, got ${value}`;
      return `expected ${issue.expected === 'object' ? 'a mapping' : issue.expected === 'array' ? 'a list' : issue.expected}, got ${describeValue(value)}`;
    case 'too_small':
      if (issue.origin === 'array') return `expected at least ${String(issue.minimum)} entr${issue.minimum === 1 ? 'y' : 'ies'}, got ${Array.isArray(value) ? value.length : 0}`;
      if (issue.origin === 'string') return `must not be empty`;
      return `must be ${issue.inclusive ? '>=' : '>'} ${String(issue.minimum)}, got ${describeValue(value)}`;
    case 'too_big':
      if (issue.origin === 'array') return `expected at most ${String(issue.maximum)} entries`;
      if (issue.origin === 'string') return `is longer than ${String(issue.maximum)} characters`;
      return `must be ${issue.inclusive ? '<=' : '<'} ${String(issue.maximum)}, got ${describeValue(value)}`;
    case 'invalid_value':
      return `expected one of ${(issue.values ?? []).map((v) => JSON.stringify(v)).join(', ')}, got ${describeValue(value)}`;
    case 'unrecognized_keys':
      return `unknown key${(issue.keys ?? []).length > 1 ? 's' : ''} ${(issue.keys ?? []).map((k) => `"${k}"`).join(', ')}`;
    case 'invalid_union':
      return `unexpected ${describeValue(value)}`;
    case 'invalid_format':
      return `${issue.message.replace(/^Invalid /, 'invalid ')}, got ${describeValue(value)}`;
    case 'not_multiple_of':
      return `${issue.message.toLowerCase()}, got ${describeValue(value)}`;
    default:
      // Custom refinements carry their own tamis-style message.
      return issue.message;
  }
}

/** For an unknown key: the nearest allowed key and the list of allowed keys, read off the schema. */
function suggestionFor(issue: ZodIssueLike, schema: z.ZodType): string | undefined {
  if (issue.code !== 'unrecognized_keys') return undefined;
  const known = knownKeysAt(schema, issue.path);
  const wrong = issue.keys?.[0];
  if (known === undefined || known.length === 0 || wrong === undefined) return 'check the spelling of the key';
  let best = known[0]!;
  let bestDistance = Infinity;
  for (const k of known) {
    const d = editDistance(wrong, k);
    if (d < bestDistance) {
      bestDistance = d;
      best = k;
    }
  }
  const nearest = bestDistance <= Math.max(2, Math.floor(wrong.length / 3)) ? `did you mean "${best}"? ` : '';
  return `${nearest}allowed keys: ${known.join(', ')}`;
}

/** Walks a zod schema along a data path (objects, arrays, records, optional/default wrappers). */
function knownKeysAt(schema: z.ZodType, path: readonly (string | number)[]): string[] | undefined {
  let node: unknown = schema;
  const unwrap = (n: unknown): unknown => {
    for (let guard = 0; guard < 20; guard++) {
      const def = (n as { _zod?: { def?: { type?: string; innerType?: unknown; in?: unknown; getter?: () => unknown } } })._zod?.def;
      if (def === undefined) return n;
      if ((def.type === 'optional' || def.type === 'default' || def.type === 'nullable' || def.type === 'prefault' || def.type === 'readonly') && def.innerType) n = def.innerType;
      else if (def.type === 'pipe' && def.in) n = def.in;
      else if (def.type === 'lazy' && def.getter) n = def.getter();
      else return n;
    }
    return n;
  };
  node = unwrap(node);
  for (const part of path) {
    const def = (node as { _zod?: { def?: { type?: string; shape?: Record<string, unknown>; element?: unknown; valueType?: unknown } } })._zod?.def;
    if (def === undefined) return undefined;
    if (def.type === 'object' && typeof part === 'string' && def.shape) node = def.shape[part];
    else if (def.type === 'array' && typeof part === 'number') node = def.element;
    else if (def.type === 'record') node = def.valueType;
    else return undefined;
    if (node === undefined) return undefined;
    node = unwrap(node);
  }
  const def = (node as { _zod?: { def?: { type?: string; shape?: Record<string, unknown> } } })._zod?.def;
  return def?.type === 'object' && def.shape ? Object.keys(def.shape) : undefined;
}

/** Levenshtein distance, for "did you mean" hints. */
export function editDistance(a: string, b: string): number {
  const row = new Array<number>(b.length + 1);
  for (let j = 0; j <= b.length; j++) row[j] = j;
  for (let i = 1; i <= a.length; i++) {
    let diagonal = row[0]!;
    row[0] = i;
    for (let j = 1; j <= b.length; j++) {
      const above = row[j]!;
      row[j] = Math.min(above + 1, row[j - 1]! + 1, diagonal + (a[i - 1] === b[j - 1] ? 0 : 1));
      diagonal = above;
    }
  }
  return row[b.length]!;
}
