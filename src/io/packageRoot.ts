/**
 * The folder of the tamis package (where package.json, analyses/ and
 * data-demo/ are), found from this module's own location so it works from
 * src/ (tests), from dist/ and when installed elsewhere.
 */
import { existsSync, readFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { TamisError } from '../errors.js';

let cached: string | undefined;

export function packageRoot(): string {
  if (cached !== undefined) return cached;
  let dir = dirname(fileURLToPath(import.meta.url));
  for (;;) {
    const manifest = join(dir, 'package.json');
    if (existsSync(manifest)) {
      try {
        if ((JSON.parse(readFileSync(manifest, 'utf8')) as { name?: string }).name === 'tamis') {
          cached = dir;
          return dir;
        }
      } catch {
        // not our manifest; keep walking up
      }
    }
    const parent = dirname(dir);
    if (parent === dir) throw new TamisError('internal', 'cannot find the tamis package folder');
    dir = parent;
  }
}
