/**
 * Random mutations of YAML input files for the loader fuzz tests: deleted,
 * swapped and duplicated lines, truncation, garbage characters (controls, NUL
 * and lone surrogates included), huge or odd numbers, values of the wrong
 * type, re-indented lines, flow lists losing or gaining an entry, plus any
 * mutations particular to one format.
 */
import type { RandomStream } from '../src/physics/random.js';

export const HUGE_NUMBERS = ['1e308', '1e400', '-1e300', '123456789012345678901234567890', '.inf', '-.inf', '.nan', '0x7fffffff', '1e-320', '-0'];
export const WRONG_TYPES = ['abc', '[1, 2]', '{a: 1}', '~', 'true', '""', '[[0.5]]', '- x', '&a 1', '*a', '!!binary AAAA', '|\n  text'];

export type Mutation = (text: string, rng: RandomStream) => string;

const withLines = (text: string, change: (lines: string[]) => void): string => {
  const lines = text.split('\n');
  change(lines);
  return lines.join('\n');
};

/** The mutations every YAML format gets. */
export const COMMON_MUTATIONS: readonly Mutation[] = [
  (text, rng) => withLines(text, (lines) => lines.splice(rng.integerBelow(lines.length), 1)),
  (text, rng) =>
    withLines(text, (lines) => {
      const a = rng.integerBelow(lines.length);
      const b = rng.integerBelow(lines.length);
      [lines[a], lines[b]] = [lines[b]!, lines[a]!];
    }),
  (text, rng) => text.slice(0, rng.integerBelow(text.length)),
  (text, rng) => {
    const at = rng.integerBelow(text.length);
    let garbage = '';
    const n = 1 + rng.integerBelow(8);
    for (let k = 0; k < n; k++) garbage += String.fromCharCode(rng.integerBelow(65536));
    return text.slice(0, at) + garbage + text.slice(at);
  },
  (text, rng) => {
    const numbers = [...text.matchAll(/-?\d+(\.\d+)?(e-?\d+)?/g)];
    if (numbers.length === 0) return text;
    const m = numbers[rng.integerBelow(numbers.length)]!;
    const pool = rng.integerBelow(2) === 0 ? HUGE_NUMBERS : WRONG_TYPES;
    return text.slice(0, m.index) + pool[rng.integerBelow(pool.length)]! + text.slice(m.index + m[0].length);
  },
  (text, rng) =>
    withLines(text, (lines) => {
      const i = rng.integerBelow(lines.length);
      lines[i] = rng.integerBelow(2) === 0 ? `  ${lines[i]}` : lines[i]!.replace(/^ {1,2}/, '');
    }),
  (text, rng) =>
    withLines(text, (lines) => {
      const i = rng.integerBelow(lines.length);
      lines.splice(i, 0, lines[i]!);
    }),
  (text, rng) => {
    const lists = [...text.matchAll(/\[[^[\]\n]*\]/g)];
    if (lists.length === 0) return text;
    const m = lists[rng.integerBelow(lists.length)]!;
    const inner = m[0].slice(1, -1);
    const changed = rng.integerBelow(2) === 0 ? inner.replace(/,[^,]*$/, '') : `${inner}, ${inner.split(',')[0]}`;
    return text.slice(0, m.index) + `[${changed}]` + text.slice(m.index + m[0].length);
  },
];

/** One to three random mutations of `text`, drawn from the common ones and `extra`. */
export function mutateYaml(text: string, rng: RandomStream, extra: readonly Mutation[] = []): string {
  const all = [...COMMON_MUTATIONS, ...extra];
  let out = text;
  for (let n = 1 + rng.integerBelow(3); n > 0; n--) out = all[rng.integerBelow(all.length)]!(out, rng);
  return out;
}
