import type { Command } from 'commander';

/** What every file in `src/cli/commands/` exports. */
export interface CommandModule {
  register(program: Command): void;
}
