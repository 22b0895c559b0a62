/** `tamis merge DIR... --out DIR`: assemble the shards of one scan and write its outputs. */
import type { Command } from 'commander';

export function register(program: Command): void {
  program
    .command('merge')
    .description('merge the output folders of scan shards (--shard k/N) into one scan with tables, plots and report')
    .argument('<folders...>', 'folders written by tamis scan --shard')
    .option('--out <folder>', 'folder for the merged scan', 'tamis-scan')
    .action(async (folders: string[], options: { out: string }) => {
      const { mergeScans } = await import('../../recast/scan/mergeScans.js');
      const merged = await mergeScans(folders, options.out);
      process.stdout.write(`merged ${merged.points} points from ${folders.length} folder(s)\nwrote ${merged.files.join(', ')}\n`);
    });
}
