/**
 * The tables of a recast in CSV form (`regions.csv`, `cutflow.csv`) and the
 * compact terminal table. Column names are documented in the README; a test
 * checks that the two agree.
 */
import type { PointResult } from '../recast/types.js';
import { csvText } from './csvText.js';
import { formatNumber, formatTable } from './terminalTable.js';

/** Columns of regions.csv, in order. */
export const REGIONS_CSV_COLUMNS = [
  'energy_tev',
  'analysis',
  'region',
  'observed',
  'background',
  'background_uncertainty',
  'efficiency',
  'efficiency_error',
  'selected_events',
  'signal_events',
  'n95_observed',
  'n95_expected',
  'n95_expected_minus1',
  'n95_expected_plus1',
  'n95_expected_minus2',
  'n95_expected_plus2',
  'sigma95_observed_pb',
  'sigma95_expected_pb',
  'r_observed',
  'r_expected',
  'limit_method',
  'best_region',
  'published_n95_observed',
  'tamis_over_published',
] as const;

/** Columns of cutflow.csv, in order. */
export const CUTFLOW_CSV_COLUMNS = ['energy_tev', 'analysis', 'step_index', 'step', 'cut', 'efficiency', 'efficiency_error', 'selected_events'] as const;

export async function regionsCsv(result: PointResult, extraColumns: Record<string, number> = {}): Promise<string> {
  const extraNames = Object.keys(extraColumns);
  const rows = result.analyses.flatMap((a) =>
    a.regions.map((r) => [
      ...extraNames.map((k) => extraColumns[k]),
      a.energyTeV,
      a.id,
      r.name,
      r.observed,
      r.background,
      r.backgroundUncertainty,
      r.efficiency,
      r.efficiencyError,
      r.selectedEvents,
      r.signal,
      r.n95Observed,
      r.n95Expected.median,
      r.n95Expected.minus1,
      r.n95Expected.plus1,
      r.n95Expected.minus2,
      r.n95Expected.plus2,
      r.sigma95ObservedPb,
      r.sigma95ExpectedPb.median,
      r.rObserved,
      r.rExpected,
      r.method,
      r.name === a.bestRegion ? 'yes' : 'no',
      r.publishedN95Observed,
      r.ratioToPublishedObserved,
    ]),
  );
  return csvText([...extraNames, ...REGIONS_CSV_COLUMNS], rows);
}

export async function cutflowCsv(result: PointResult): Promise<string> {
  const rows = result.analyses.flatMap((a) => a.steps.map((s, i) => [a.energyTeV, a.id, i + 1, s.name, s.cut, s.efficiency, s.efficiencyError, s.selectedEvents]));
  return csvText([...CUTFLOW_CSV_COLUMNS], rows);
}

/** The compact terminal table of a recast: one row per analysis. */
export function recastTerminalTable(result: PointResult): string {
  const sigmaAt = new Map(result.energies.map((e) => [e.energyTeV, e.sigmaPb]));
  const rows = result.analyses.map((a) => {
    const best = a.regions.find((r) => r.name === a.bestRegion);
    return [
      a.id,
      `${a.energyTeV}`,
      a.bestRegion ?? '-',
      best ? `${formatNumber(best.efficiency, 3)} ± ${formatNumber(best.efficiencyError, 2)}` : '0',
      best ? `${formatNumber(best.sigma95ObservedPb, 3)} / ${formatNumber(best.sigma95ExpectedPb.median, 3)}` : '-',
      formatNumber(sigmaAt.get(a.energyTeV) ?? Number.NaN, 3),
      best ? formatNumber(best.rObserved, 3) : '0',
      a.verdict,
    ];
  });
  const cl = `${Math.round(result.cl * 1000) / 10}%`;
  return formatTable(
    [
      { header: 'analysis' },
      { header: 'TeV', alignRight: true },
      { header: 'best region' },
      { header: 'efficiency', alignRight: true },
      { header: 'sigma95 obs / exp [pb]', alignRight: true },
      { header: 'sigma model [pb]', alignRight: true },
      { header: 'r', alignRight: true },
      { header: `verdict at ${cl} CL` },
    ],
    rows,
  );
}
