/** `tamis variables`: the event variables cut expressions may use, with units and definitions. */
import type { Command } from 'commander';

export function register(program: Command): void {
  program
    .command('variables')
    .description('list the event variables of cut expressions')
    .option('--markdown', 'print a Markdown table (as in analyses/README.md)')
    .action(async (options: { markdown?: boolean }) => {
      const { variableTableMarkdown, variableTableText } = await import('../../selection/variableDocs.js');
      process.stdout.write(`${options.markdown ? variableTableMarkdown() : variableTableText()}\n`);
    });
}
