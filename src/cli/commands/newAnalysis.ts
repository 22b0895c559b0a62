/** `tamis new-analysis ID`: writes a commented starting analysis file that passes `tamis check`. */
import type { Command } from 'commander';
import { TamisError } from '../../errors.js';

export function register(program: Command): void {
  program
    .command('new-analysis')
    .description('write a commented starting analysis file (never overwrites)')
    .argument('<id>', 'analysis id: lower-case letters, digits, _ and -')
    .option('--out <file>', 'file to write (default: <id>.yaml in the current folder)')
    .option('--energy <tev>', 'collider energy of the starting example: 8 or 13', '13')
    .action(async (id: string, options: { out?: string; energy: string }) => {
      if (options.energy !== '8' && options.energy !== '13') {
        throw new TamisError('bad_input', `expected 8 or 13, got "${options.energy}"`, { key: '--energy' });
      }
      const { analysisTemplate, writeNewAnalysis } = await import('../../selection/template.js');
      const file = options.out ?? `${id}.yaml`;
      writeNewAnalysis(file, analysisTemplate(id, options.energy === '8' ? 8 : 13));
      process.stdout.write(`wrote ${file}: edit it, then run tamis check ${file}\n`);
    });
}
