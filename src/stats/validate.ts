/**
 * Checks of the statistics inputs and options. Every problem is a `bad_input`
 * TamisError naming the parameter ("background must be >= 0, got -1.2").
 */
import { TamisError } from '../errors.js';
import { RandomStream } from '../physics/random.js';
import type { CountingRegion, LimitMethod, LimitOptions, UncertaintyModel } from './types.js';

export const LIMIT_METHODS: readonly LimitMethod[] = ['exact', 'toys', 'asymptotic', 'auto'];
export const UNCERTAINTY_MODELS: readonly UncertaintyModel[] = ['lognormal', 'gaussian'];

/** Options with every default filled in. */
export interface ResolvedOptions {
  cl: number;
  method: LimitMethod;
  uncertaintyModel: UncertaintyModel;
  rng: RandomStream;
  toyTolerance: number;
  minToys: number;
  maxToys: number;
}

/** A region with every optional field resolved. */
export interface ResolvedRegion {
  observed: number;
  background: number;
  backgroundUncertainty: number;
  signalUncertainty: number;
}

function fail(key: string, message: string, where: string): never {
  throw new TamisError('bad_input', `${message}${where}`, { key });
}

/** Throws unless `value` is a finite number >= 0 (and a whole number when asked). */
export function requireCount(value: unknown, key: string, where = '', whole = false): number {
  if (typeof value !== 'number' || !Number.isFinite(value)) fail(key, `${lastPart(key)} must be a finite number, got ${String(value)}`, where);
  if (value < 0) fail(key, `${lastPart(key)} must be >= 0, got ${value}`, where);
  if (whole && !Number.isInteger(value)) fail(key, `${lastPart(key)} must be a whole number of events, got ${value}`, where);
  return value;
}

function lastPart(key: string): string {
  const dot = key.lastIndexOf('.');
  return dot >= 0 ? key.slice(dot + 1) : key;
}

/**
 * A checked copy of one region; `prefix` (e.g. `regions[3].`) and `where`
 * (e.g. ` (region "SR3")`) locate errors.
 */
export function resolveRegion(region: CountingRegion, prefix = '', where = ''): ResolvedRegion {
  if (typeof region !== 'object' || region === null) fail(prefix || 'region', 'expected a region object', where);
  return {
    observed: requireCount(region.observed, `${prefix}observed`, where, true),
    background: requireCount(region.background, `${prefix}background`, where),
    backgroundUncertainty: requireCount(region.backgroundUncertainty ?? 0, `${prefix}backgroundUncertainty`, where),
    signalUncertainty: requireCount(region.signalUncertainty ?? 0, `${prefix}signalUncertainty`, where),
  };
}

/** Options with defaults (see `LimitOptions`), checked. */
export function resolveOptions(options: LimitOptions = {}, combination = false): ResolvedOptions {
  const cl = options.cl ?? 0.95;
  if (typeof cl !== 'number' || !(cl > 0 && cl < 1)) fail('cl', `cl must be strictly between 0 and 1, got ${String(cl)}`, '');
  const method = options.method ?? 'auto';
  if (!LIMIT_METHODS.includes(method)) fail('method', `method must be one of ${LIMIT_METHODS.join(', ')}, got "${String(method)}"`, '');
  const uncertaintyModel = options.uncertaintyModel ?? 'lognormal';
  if (!UNCERTAINTY_MODELS.includes(uncertaintyModel)) {
    fail('uncertaintyModel', `uncertaintyModel must be one of ${UNCERTAINTY_MODELS.join(', ')}, got "${String(uncertaintyModel)}"`, '');
  }
  let rng = options.rng;
  if (rng === undefined) {
    const seed = options.seed ?? 1;
    if (!Number.isInteger(seed) || seed < 0 || seed > Number.MAX_SAFE_INTEGER) fail('seed', `seed must be a whole number in [0, 2^53), got ${String(seed)}`, '');
    rng = RandomStream.forStream(seed);
  }
  const toyTolerance = options.toyTolerance ?? 0.05 * (1 - cl);
  if (!(toyTolerance > 0) || !Number.isFinite(toyTolerance)) fail('toyTolerance', `toyTolerance must be > 0, got ${String(toyTolerance)}`, '');
  const minToys = options.minToys ?? 1000;
  if (!Number.isInteger(minToys) || minToys < 2) fail('minToys', `minToys must be a whole number >= 2, got ${String(minToys)}`, '');
  const maxToys = options.maxToys ?? (combination ? 200_000 : 1_000_000);
  if (!Number.isInteger(maxToys) || maxToys < minToys) fail('maxToys', `maxToys must be a whole number >= minToys (${minToys}), got ${String(maxToys)}`, '');
  return { cl, method, uncertaintyModel, rng, toyTolerance, minToys, maxToys };
}
