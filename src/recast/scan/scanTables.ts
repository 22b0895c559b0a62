/**
 * Tables of a finished scan: `scan.csv` (one row per point, energy and
 * analysis) and `mass_limits.csv` (the interpolated mass limit per analysis
 * and energy, observed and expected; per value of the second parameter in a
 * two-parameter scan). Columns are documented in the README.
 */
import { csvText } from '../../report/csvText.js';
import type { PointCheckpoint } from './checkpoints.js';
import type { ScanAxis } from './loadScan.js';
import { formatRanges, massLimit, type MassLimit } from './massLimits.js';

export const SCAN_CSV_COLUMNS = [
  'point',
  'energy_tev',
  'analysis',
  'sigma_pb',
  'sigma_scale_low_pb',
  'sigma_scale_high_pb',
  'best_region',
  'efficiency',
  'efficiency_error',
  'sigma95_observed_pb',
  'sigma95_expected_pb',
  'sigma95_expected_minus2_pb',
  'sigma95_expected_minus1_pb',
  'sigma95_expected_plus1_pb',
  'sigma95_expected_plus2_pb',
  'r_observed',
  'r_expected',
  'combined_r_observed',
  'combined_r_expected',
  'verdict',
] as const;

export const MASS_LIMIT_CSV_COLUMNS = ['analysis', 'energy_tev', 'observed_limit', 'observed_status', 'observed_excluded', 'expected_limit', 'expected_status', 'expected_excluded'] as const;

export async function scanCsv(axes: readonly ScanAxis[], points: readonly PointCheckpoint[]): Promise<string> {
  const rows = points.flatMap((p) => {
    const sigmaAt = new Map(p.result.energies.map((e) => [e.energyTeV, e]));
    return p.result.analyses.map((a) => {
      const xs = sigmaAt.get(a.energyTeV)!;
      const best = a.regions.find((r) => r.name === a.bestRegion);
      return [
        ...axes.map((ax) => p.parameters[ax.name]),
        p.index,
        a.energyTeV,
        a.id,
        xs.sigmaPb,
        xs.scaleBandPb[0],
        xs.scaleBandPb[1],
        a.bestRegion ?? '',
        best?.efficiency ?? 0,
        best?.efficiencyError ?? 0,
        best?.sigma95ObservedPb,
        best?.sigma95ExpectedPb.median,
        best?.sigma95ExpectedPb.minus2,
        best?.sigma95ExpectedPb.minus1,
        best?.sigma95ExpectedPb.plus1,
        best?.sigma95ExpectedPb.plus2,
        best?.rObserved ?? 0,
        best?.rExpected ?? 0,
        a.combined?.rObserved,
        a.combined?.rExpected,
        a.verdict,
      ];
    });
  });
  return csvText([...axes.map((a) => a.name), ...SCAN_CSV_COLUMNS], rows);
}

export interface AnalysisReach {
  analysis: string;
  energyTeV: number;
  /** Value of the second parameter (two-parameter scans), else undefined. */
  second?: number;
  observed: MassLimit;
  expected: MassLimit;
}

/** Mass limits along the first axis, per analysis (and per value of the second axis). */
export function scanReach(axes: readonly ScanAxis[], points: readonly PointCheckpoint[]): AnalysisReach[] {
  const first = axes[0]!.name;
  const second = axes[1]?.name;
  const slices = second === undefined ? [undefined] : axes[1]!.values;
  const analyses = [...new Map(points.flatMap((p) => p.result.analyses.map((a) => [`${a.id}@${a.energyTeV}`, { id: a.id, energyTeV: a.energyTeV }]))).values()];
  const out: AnalysisReach[] = [];
  for (const slice of slices) {
    const inSlice = points.filter((p) => second === undefined || p.parameters[second] === slice);
    for (const a of analyses) {
      const masses: number[] = [];
      const rObs: number[] = [];
      const rExp: number[] = [];
      for (const p of inSlice) {
        const outcome = p.result.analyses.find((o) => o.id === a.id && o.energyTeV === a.energyTeV);
        if (!outcome) continue;
        const best = outcome.regions.find((r) => r.name === outcome.bestRegion);
        masses.push(p.parameters[first]!);
        rObs.push(best?.rObserved ?? 0);
        rExp.push(best?.rExpected ?? 0);
      }
      if (masses.length === 0) continue;
      out.push({ analysis: a.id, energyTeV: a.energyTeV, ...(slice === undefined ? {} : { second: slice }), observed: massLimit(masses, rObs), expected: massLimit(masses, rExp) });
    }
  }
  return out;
}

export async function massLimitsCsv(axes: readonly ScanAxis[], reach: readonly AnalysisReach[]): Promise<string> {
  const second = axes[1]?.name;
  const rows = reach.map((r) => [
    ...(second === undefined ? [] : [r.second]),
    r.analysis,
    r.energyTeV,
    r.observed.limit,
    r.observed.status,
    formatRanges(r.observed.ranges),
    r.expected.limit,
    r.expected.status,
    formatRanges(r.expected.ranges),
  ]);
  return csvText([...(second === undefined ? [] : [second]), ...MASS_LIMIT_CSV_COLUMNS], rows);
}
