/**
 * Shared helpers of the model resolver: located errors and mass resolution.
 */
import { TamisError } from '../../errors.js';
import type { KeyPath, YamlSource } from '../../io/yamlFile.js';
import { MAX_MASS_GEV, type MassSpec, type ModelFile } from './schema.js';

/** Throws model errors at a key path of the file being resolved. */
export class ResolveContext {
  constructor(private readonly source: Pick<YamlSource<ModelFile>, 'file' | 'locate'>) {}

  get file(): string {
    return this.source.file;
  }

  /** Throws a `schema` TamisError located at `path`. */
  fail(path: KeyPath, message: string, suggestion?: string): never {
    throw new TamisError('schema', message, { ...this.source.locate(path), suggestion });
  }
}

/** One state with a mass entry in the file: a new particle or a resonance. */
interface MassEntry {
  spec: MassSpec;
  path: KeyPath;
}

/**
 * Resolves every mass of the file to GeV: numbers as written, {ratio, of}
 * entries by following the chain of references (cycles and unknown names are
 * errors at the offending `mass` key).
 */
export function resolveMasses(file: ModelFile, context: ResolveContext): Map<string, number> {
  const entries = new Map<string, MassEntry>();
  file.particles.forEach((p, i) => entries.set(p.name, { spec: p.mass, path: ['particles', i, 'mass'] }));
  file.resonances.forEach((r, i) => {
    if (!entries.has(r.name)) entries.set(r.name, { spec: r.mass, path: ['resonances', i, 'mass'] });
  });
  const masses = new Map<string, number>();
  const visiting = new Set<string>();
  const massOf = (name: string): number => {
    const known = masses.get(name);
    if (known !== undefined) return known;
    const entry = entries.get(name)!;
    if (typeof entry.spec === 'number') {
      masses.set(name, entry.spec);
      return entry.spec;
    }
    const target = entry.spec.of;
    if (!entries.has(target)) {
      context.fail([...entry.path, 'of'], `unknown state "${target}": a mass ratio must refer to a new particle or resonance of this file`, `known: ${[...entries.keys()].join(', ')}`);
    }
    if (visiting.has(name)) context.fail(entry.path, `mass ratios form a cycle through "${name}"`);
    visiting.add(name);
    const value = entry.spec.ratio * massOf(target);
    visiting.delete(name);
    if (!(value <= MAX_MASS_GEV)) context.fail(entry.path, `mass ${value} GeV is above the ${MAX_MASS_GEV} GeV limit`);
    masses.set(name, value);
    return value;
  };
  for (const name of entries.keys()) massOf(name);
  return masses;
}
