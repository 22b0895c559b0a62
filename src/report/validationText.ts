/** The terminal table of `tamis validate`. */
import type { Validation } from '../recast/validateAnalysis.js';
import { formatNumber, formatTable } from './terminalTable.js';

export function validationText(v: Validation): string {
  const head = `${v.analysis} at ${v.energyTeV} TeV against the reference cut-flow of ${v.modelFile}\nreference: ${v.source}\n${v.events} events generated, seed ${v.seed}; expected events normalised to the reference's ${formatNumber(v.eventsBeforeCuts, 5)} before cuts`;
  const table = formatTable(
    [{ header: '' }, { header: 'step or region' }, { header: 'reference', alignRight: true }, { header: 'tamis', alignRight: true }, { header: 'tamis / reference', alignRight: true }, { header: '' }],
    v.lines.map((l) => [l.kind, l.name, formatNumber(l.reference, 4), `${formatNumber(l.tamis, 4)} ± ${formatNumber(l.tamisError, 2)}`, formatNumber(l.ratio, 3), l.flagged ? `OUTSIDE ±${Math.round(v.tolerance * 100)}%` : 'ok']),
  );
  const verdict = v.agrees ? `every line within ±${Math.round(v.tolerance * 100)}% of the reference` : `${v.lines.filter((l) => l.flagged).length} line(s) outside ±${Math.round(v.tolerance * 100)}% of the reference`;
  return `${head}\n\n${table}\n\n${verdict}`;
}
