/**
 * Rewrites the variable table of analyses/README.md from the code
 * (`node dist/src/tools/writeVariableDocs.js`); a test fails when it is stale.
 */
import { readFileSync } from 'node:fs';
import { writeFileAtomic } from '../io/atomicWrite.js';
import { withVariableTable } from '../selection/variableDocs.js';

if (import.meta.url === `file://${process.argv[1]}`) {
  const file = process.argv[2] ?? 'analyses/README.md';
  writeFileAtomic(file, withVariableTable(readFileSync(file, 'utf8')));
  process.stdout.write(`wrote the variable table into ${file}\n`);
}
