/**
 * The terminal text of `tamis cutflow`: per analysis, the cut-flow table,
 * the region table with Monte Carlo errors and the costliest cut of each
 * region, and the overlap report.
 */
import type { AnalysisResult, RegionResult, WeightedCount } from './results.js';

/** A number with 4 significant digits, exponent form outside [1e-3, 1e5). */
function figure(value: number): string {
  if (value === 0) return '0';
  const magnitude = Math.abs(value);
  if (magnitude >= 1e5 || magnitude < 1e-3) return value.toExponential(3).replace(/\.?0+e/, 'e').replace('e+', 'e');
  return String(Number(value.toPrecision(4)));
}

/** Columns padded to their widest cell; `right` marks right-aligned columns. */
function alignColumns(rows: string[][], right: readonly boolean[]): string {
  const widths = rows[0]!.map((_, j) => Math.max(...rows.map((r) => r[j]!.length)));
  return rows.map((r) => r.map((cell, j) => (right[j] ? cell.padStart(widths[j]!) : cell.padEnd(widths[j]!))).join('  ').trimEnd()).join('\n');
}

const efficiencyCells = (c: WeightedCount): string[] => [String(c.events), figure(c.efficiency), figure(c.efficiencyError)];

/** The cut whose removal would add the most signal to a region, as `cut (+efficiency)`. */
function costliestCut(region: RegionResult): string {
  let best: RegionResult['blame'][number] | undefined;
  for (const b of region.blame) if (b.gained.weight > 0 && (best === undefined || b.gained.weight > best.gained.weight)) best = b;
  return best === undefined ? '-' : `${best.kind === 'step' ? `step "${best.name}"` : best.cut} (+${figure(best.gained.efficiency)})`;
}

/**
 * The text block of one analysis.
 *
 * @example
 * formatCutflow(results.analyses[0]).split('\n')[0] // 'three-lepton-8tev (8 TeV, 20.3 fb^-1): 10000 events'
 */
export function formatCutflow(result: AnalysisResult): string {
  const out: string[] = [`${result.id} (${result.energyTev} TeV, ${result.luminosityIfb} fb^-1): ${result.total.events} events`, ''];
  const steps = [['step', 'events', 'efficiency', 'mc error', 'of previous']];
  steps.push(['all events', String(result.total.events), '1', '0', '']);
  let previous = result.total.weight;
  for (const s of result.steps) {
    steps.push([s.name, ...efficiencyCells(s), previous !== 0 ? figure(s.weight / previous) : '-']);
    previous = s.weight;
  }
  out.push(alignColumns(steps, [false, true, true, true, true]), '');
  const regions = [['region', 'events', 'efficiency', 'mc error', 'costliest cut (efficiency gained without it)']];
  for (const r of result.regions) regions.push([r.name, ...efficiencyCells(r), r.blame.length > 0 ? costliestCut(r) : '']);
  out.push(alignColumns(regions, [false, true, true, true, false]), '');
  if (result.overlaps.length === 0) out.push('region overlaps: none');
  else {
    const verdict = result.regionsDisjoint ? 'regions declared disjoint share events' : 'overlapping regions (allowed: regions_disjoint is false)';
    out.push(`${verdict}:`);
    // Example indices count from 0 in the results; people count events in a file from 1.
    for (const o of result.overlaps) out.push(`  ${o.first} & ${o.second}: ${o.events} event${o.events === 1 ? '' : 's'} (no. ${o.exampleEvents.map((i) => i + 1).join(', ')} of the file)`);
  }
  return out.join('\n');
}
