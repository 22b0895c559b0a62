/**
 * `tamis check FILE...`: validates analysis, detector-profile, model and scan files.
 * Prints `ok <file> (<kind>: <summary>)` per good file and the located error
 * per bad one; exits 1 when any file fails.
 */
import type { Command } from 'commander';
import { formatError, TamisError } from '../../errors.js';

export function register(program: Command): void {
  program
    .command('check')
    .description('validate analysis, detector-profile, model and scan files and say what each holds')
    .argument('<files...>', 'files to check (kind from the name: *.model.yaml is a model, *.scan.yaml a scan, files in a detectors/ folder are profiles, others analyses)')
    .action(async (files: string[]) => {
      const { checkAnyFile } = await import('../../recast/checkAnyFile.js');
      let failed = 0;
      for (const file of files) {
        try {
          const outcome = await checkAnyFile(file);
          process.stdout.write(`ok ${file} (${outcome.kind}: ${outcome.summary})\n`);
        } catch (error) {
          if (!(error instanceof TamisError)) throw error;
          failed++;
          process.stderr.write(`tamis: ${formatError(error.withLocation({ file }))}\n`);
        }
      }
      if (failed > 0) {
        process.stderr.write(`tamis: ${failed} of ${files.length} file${files.length === 1 ? '' : 's'} failed the check\n`);
        process.exitCode = 1;
      }
    });
}
