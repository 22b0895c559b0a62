#!/usr/bin/env node
// Entry point of the `tamis` command: runs the compiled CLI from dist/.
import { existsSync } from 'node:fs';
import { fileURLToPath } from 'node:url';

const entry = new URL('../dist/src/cli/index.js', import.meta.url);
if (!existsSync(fileURLToPath(entry))) {
  process.stderr.write('tamis: the compiled program is missing; run `npm ci` (or `npm run build`) in the project folder first\n');
  process.exit(2);
}
const { main } = await import(entry.href);
process.exitCode = await main(process.argv);
