/**
 * The `tamis` command: registers the subcommands and turns library errors into
 * one-line messages and exit codes. Each command lives in `commands/<name>.ts`,
 * parses its options, calls one library function and prints or writes.
 */
import { Command, CommanderError } from 'commander';
import { formatError, TamisError } from '../errors.js';
import { VERSION } from '../version.js';
import type { CommandModule } from './command.js';

/** Command modules, in the order `tamis --help` lists them. Imported lazily. */
const COMMANDS: readonly (() => Promise<CommandModule>)[] = [
  () => import('./commands/demo.js'),
  () => import('./commands/check.js'),
  () => import('./commands/cutflow.js'),
  () => import('./commands/newAnalysis.js'),
  () => import('./commands/variables.js'),
  () => import('./commands/pdf.js'),
  () => import('./commands/xsec.js'),
  () => import('./commands/generate.js'),
  () => import('./commands/limit.js'),
  () => import('./commands/recast.js'),
  () => import('./commands/scan.js'),
  () => import('./commands/merge.js'),
  () => import('./commands/compare.js'),
  () => import('./commands/validate.js'),
];

/** Builds the program with every command registered (exported for tests and docs). */
export async function buildProgram(): Promise<Command> {
  const program = new Command();
  program
    .name('tamis')
    .description('Pass a new-physics model through published multi-lepton searches and say what they exclude.')
    .version(VERSION, '-V, --version')
    .showHelpAfterError('(run with --help for usage)')
    .exitOverride();
  for (const load of COMMANDS) {
    const module = await load();
    module.register(program);
  }
  return program;
}

/** Runs the CLI on `argv` (as in `process.argv`) and returns the exit code. */
export async function main(argv: readonly string[]): Promise<number> {
  // A reader that stops early (`tamis ... | head`) is not an error.
  process.stdout.on('error', (error: NodeJS.ErrnoException) => {
    if (error.code === 'EPIPE') process.exit(0);
    throw error;
  });
  const program = await buildProgram();
  for (const command of program.commands) command.exitOverride();
  try {
    await program.parseAsync([...argv]);
    return typeof process.exitCode === 'number' ? process.exitCode : 0;
  } catch (error) {
    if (error instanceof CommanderError) {
      // Help and version requests end with code 0; usage errors were already printed.
      return error.exitCode === 0 ? 0 : 2;
    }
    process.stderr.write(`tamis: ${formatError(error)}\n`);
    if (!(error instanceof TamisError) && process.env['TAMIS_DEBUG'] && error instanceof Error) {
      process.stderr.write(`${error.stack ?? ''}\n`);
    }
    return error instanceof TamisError && error.code === 'bad_input' ? 2 : 1;
  }
}
