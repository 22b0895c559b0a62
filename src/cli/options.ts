/**
 * Parsing of CLI option values into checked numbers and lists. Every error is
 * a `bad_input` TamisError naming the option, so the CLI prints one clear line.
 */
import { existsSync } from 'node:fs';
import { TamisError } from '../errors.js';

/** A finite number, optionally bounded. */
export function parseNumberOption(option: string, text: string, bounds: { min?: number; max?: number; integer?: boolean } = {}): number {
  const trimmed = text.trim();
  const value = trimmed === '' ? Number.NaN : Number(trimmed);
  if (!Number.isFinite(value)) throw new TamisError('bad_input', `expected a number, got "${text}"`, { key: option });
  if (bounds.integer && !Number.isInteger(value)) throw new TamisError('bad_input', `expected a whole number, got "${text}"`, { key: option });
  if (bounds.min !== undefined && value < bounds.min) throw new TamisError('bad_input', `must be >= ${bounds.min}, got ${value}`, { key: option });
  if (bounds.max !== undefined && value > bounds.max) throw new TamisError('bad_input', `must be <= ${bounds.max}, got ${value}`, { key: option });
  return value;
}

/** A comma-separated list of numbers, e.g. `--x 1e-4,0.01,0.1`. */
export function parseNumberListOption(option: string, text: string, bounds: { min?: number; max?: number; integer?: boolean } = {}): number[] {
  const parts = text.split(',').map((p) => p.trim()).filter((p) => p !== '');
  if (parts.length === 0) throw new TamisError('bad_input', `expected a comma-separated list of numbers, got "${text}"`, { key: option });
  return parts.map((p) => parseNumberOption(option, p, bounds));
}

/** A comma-separated list of words (file paths, names). */
export function parseListOption(option: string, text: string): string[] {
  const parts = text.split(',').map((p) => p.trim()).filter((p) => p !== '');
  if (parts.length === 0) throw new TamisError('bad_input', `expected a comma-separated list, got "${text}"`, { key: option });
  return parts;
}

/** An option that takes a count or an event file (`--events`): a file when not a number and it exists or ends like one. */
export function looksLikeEventFile(value: string): boolean {
  if (/^\s*[-+0-9.e]+\s*$/i.test(value)) return false;
  return existsSync(value) || /\.(lhe|lhe\.gz|gz)$/i.test(value);
}
