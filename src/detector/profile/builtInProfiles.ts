/**
 * The detector profiles shipped with tamis in `analyses/detectors/`, found by
 * name (`generic-8tev`) so analysis files can refer to them without a path.
 */
import { existsSync, readdirSync } from 'node:fs';
import { dirname, isAbsolute, join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { TamisError } from '../../errors.js';
import type { DetectorProfile } from './detectorProfile.js';
import { loadDetectorProfile } from './loader.js';

let cachedFolder: string | undefined;

/** Folder holding the shipped profiles: `<package root>/analyses/detectors` (works from src/ and from dist/). */
export function builtInDetectorFolder(): string {
  if (cachedFolder !== undefined) return cachedFolder;
  let dir = dirname(fileURLToPath(import.meta.url));
  for (let up = 0; up < 8; up++) {
    const candidate = join(dir, 'analyses', 'detectors');
    if (existsSync(join(dir, 'package.json')) && existsSync(candidate)) {
      cachedFolder = candidate;
      return candidate;
    }
    dir = dirname(dir);
  }
  throw new TamisError('internal', 'cannot find the analyses/detectors folder of the tamis installation');
}

/** Names of the shipped profiles, sorted (file names without `.yaml`). */
export function builtInDetectorProfileNames(): string[] {
  return readdirSync(builtInDetectorFolder())
    .filter((f) => f.endsWith('.yaml'))
    .map((f) => f.slice(0, -'.yaml'.length))
    .sort();
}

/**
 * Finds a profile from a reference as written in an analysis file: a path
 * ending in `.yaml`/`.yml` (relative to `relativeTo`, a folder) or the name of
 * a shipped profile.
 *
 * @throws TamisError (`bad_input`) for an unknown name, listing the shipped ones; file errors as in `loadDetectorProfile`
 * @example
 * findDetectorProfile('generic-8tev').name // 'generic-8tev'
 */
export function findDetectorProfile(reference: string, relativeTo = process.cwd()): DetectorProfile {
  if (/\.ya?ml$/.test(reference)) {
    return loadDetectorProfile(isAbsolute(reference) ? reference : resolve(relativeTo, reference));
  }
  const names = builtInDetectorProfileNames();
  if (!names.includes(reference)) {
    throw new TamisError('bad_input', `unknown detector profile "${reference}"`, { suggestion: `shipped profiles: ${names.join(', ')}; or give a path to a .yaml file` });
  }
  return loadDetectorProfile(join(builtInDetectorFolder(), `${reference}.yaml`));
}
