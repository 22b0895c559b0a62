/** What `tamis scan` prints: the mass limits per analysis, or the state of a shard. */
import { join } from 'node:path';
import { formatNumber, formatTable } from '../../report/terminalTable.js';
import { readCheckpoints } from './checkpoints.js';
import type { ScanRun } from './runScan.js';
import { scanReach } from './scanTables.js';
import type { Shard } from './shard.js';

export function massLimitTable(run: ScanRun, outFolder: string): string {
  const points = [...readCheckpoints(outFolder, run.scan.fingerprint).values()].sort((a, b) => a.index - b.index);
  const reach = scanReach(run.scan.axes, points);
  const unit = run.scan.axes[0]!.unit;
  const show = (l: { status: string; limit: number }) => (l.status === 'none' ? 'not excluded' : `${formatNumber(l.limit, 4)} ${unit}${l.status === 'beyond' ? '+' : ''}`);
  const second = run.scan.axes[1];
  return formatTable(
    [...(second ? [{ header: second.name, alignRight: true }] : []), { header: 'analysis' }, { header: 'TeV', alignRight: true }, { header: `observed ${run.scan.axes[0]!.name} limit`, alignRight: true }, { header: 'expected limit', alignRight: true }],
    reach.map((r) => [...(second ? [String(r.second)] : []), r.analysis, String(r.energyTeV), show(r.observed), show(r.expected)]),
  );
}

export function scanSummaryText(run: ScanRun, outFolder: string, shard: Shard | undefined): string {
  const head = `${run.scan.name}: ${run.scan.points.length} points x ${run.scan.energies.length} energies, ${run.scan.events} events each; ${run.computed} computed now, ${run.resumed} resumed from checkpoints`;
  if (!run.complete) {
    const where = shard ? `shard ${shard.index}/${shard.count} done` : 'scan incomplete';
    return `${head}\n${where}: checkpoints in ${join(outFolder, 'points')}; when every shard has run: tamis merge <folders> --out <folder>`;
  }
  return `${head}\n\n${massLimitTable(run, outFolder)}\n\n('+': excluded up to the end of the scan range)\nwrote ${run.files.join(', ')}\napproximate reinterpretation: confirm exclusions with the experiments\u2019 own tools before publishing`;
}
