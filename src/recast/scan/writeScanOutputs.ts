/**
 * The files of a finished scan (or of merged shards): scan.csv,
 * mass_limits.csv, the plots (exclusion.svg or reach.svg, efficiency.svg,
 * cut_blame.svg) and report.html. Each is written atomically.
 */
import { join } from 'node:path';
import { writeFileAtomic } from '../../io/atomicWrite.js';
import { CAUTIONS, SIMPLIFICATIONS } from '../../report/cautions.js';
import { escapeHtml, htmlFigure, htmlPage, htmlTable, type HtmlSection } from '../../report/htmlPage.js';
import { cutBlamePlotSpec, type CutBlameBar } from '../../report/plots/cutBlamePlot.js';
import { efficiencyPlotSpec } from '../../report/plots/efficiencyPlot.js';
import { exclusionPlotSpec, type ExclusionPanel } from '../../report/plots/exclusionPlot.js';
import { reachPlotSpec } from '../../report/plots/reachPlot.js';
import { renderVegaLiteSvg } from '../../report/renderSvg.js';
import { formatNumber } from '../../report/terminalTable.js';
import { VERSION } from '../../version.js';
import type { PointCheckpoint } from './checkpoints.js';
import type { ScanAxis } from './loadScan.js';
import { formatRanges } from './massLimits.js';
import { massLimitsCsv, scanCsv, scanReach, type AnalysisReach } from './scanTables.js';

export interface ScanDescription {
  name: string;
  description: string;
  modelFile: string;
  axes: ScanAxis[];
  seed: number;
  events: number;
  fingerprint: string;
}

export const SCAN_OUTPUT_FILES = ['scan.csv', 'mass_limits.csv', 'efficiency.svg', 'cut_blame.svg', 'report.html'] as const;

const label = (a: { id?: string; analysis?: string; energyTeV: number }): string => `${a.id ?? a.analysis} (${a.energyTeV} TeV)`;

export function exclusionPanels(points: readonly PointCheckpoint[], axis: ScanAxis): ExclusionPanel[] {
  const keys = [...new Map(points.flatMap((p) => p.result.analyses.map((a) => [`${a.id}@${a.energyTeV}`, { id: a.id, energyTeV: a.energyTeV }]))).values()];
  return keys.map((k) => ({
    title: label(k),
    limits: points.flatMap((p) => {
      const a = p.result.analyses.find((o) => o.id === k.id && o.energyTeV === k.energyTeV);
      const best = a?.regions.find((r) => r.name === a.bestRegion);
      if (!best) return [];
      const e = best.sigma95ExpectedPb;
      return [{ mass: p.parameters[axis.name]!, observedPb: best.sigma95ObservedPb, expectedPb: e.median, minus2Pb: e.minus2, minus1Pb: e.minus1, plus1Pb: e.plus1, plus2Pb: e.plus2 }];
    }),
    model: points.map((p) => {
      const xs = p.result.energies.find((e) => e.energyTeV === k.energyTeV)!;
      return { mass: p.parameters[axis.name]!, sigmaPb: xs.sigmaPb, lowPb: xs.scaleBandPb[0], highPb: xs.scaleBandPb[1] };
    }),
  }));
}

/** Cut costs of each analysis at its most sensitive point (largest expected r). */
export function scanCutBlame(points: readonly PointCheckpoint[], axis: ScanAxis): CutBlameBar[] {
  const best = new Map<string, { r: number; bars: CutBlameBar[] }>();
  for (const p of points) {
    for (const a of p.result.analyses) {
      const region = a.regions.find((r) => r.name === a.bestRegion);
      const r = region?.rExpected ?? 0;
      const key = label(a);
      const seen = best.get(key);
      if (seen !== undefined && seen.r >= r) continue;
      const at = `${key}, ${axis.name} = ${p.parameters[axis.name]}`;
      best.set(key, { r, bars: a.cutCosts.filter((c) => Number.isFinite(c.gainFactor) && c.gainFactor > 1).slice(0, 5).map((c) => ({ analysis: at, cut: c.cut, gainFactor: c.gainFactor })) });
    }
  }
  return [...best.values()].flatMap((b) => b.bars);
}

function reachTable(axes: readonly ScanAxis[], reach: readonly AnalysisReach[]): string {
  const unit = axes[0]!.unit;
  const second = axes[1];
  const show = (l: AnalysisReach['observed']) => (l.status === 'none' ? 'not excluded' : `${formatNumber(l.limit, 4)} ${unit}${l.status === 'beyond' ? ' (edge of scan)' : ''}`);
  return htmlTable(
    [...(second ? [{ header: second.name }] : []), { header: 'analysis' }, { header: 'observed limit' }, { header: 'expected limit' }, { header: `excluded ${axes[0]!.name} ranges (observed)` }],
    reach.map((r) => [...(second ? [String(r.second)] : []), label(r), show(r.observed), show(r.expected), formatRanges(r.observed.ranges)]),
    reach.map((r) => (r.observed.status !== 'none' ? 'excluded' : undefined)),
  );
}

export async function writeScanOutputs(folder: string, scan: ScanDescription, points: readonly PointCheckpoint[]): Promise<string[]> {
  const axis = scan.axes[0]!;
  const reach = scanReach(scan.axes, points);
  const massLabel = `${axis.name} [${axis.unit}]`;
  // Two-parameter scans: efficiency and cut blame at the first value of the second parameter.
  const firstSlice = scan.axes[1] ? points.filter((p) => p.parameters[scan.axes[1]!.name] === scan.axes[1]!.values[0]) : points;
  const efficiencyPoints = firstSlice.flatMap((p) =>
    p.result.analyses.map((a) => ({ analysis: a.id, energyTeV: a.energyTeV, mass: p.parameters[axis.name]!, efficiency: a.signalRegionEfficiency.value, efficiencyError: a.signalRegionEfficiency.error })),
  );
  const files: [string, string][] = [
    ['scan.csv', await scanCsv(scan.axes, points)],
    ['mass_limits.csv', await massLimitsCsv(scan.axes, reach)],
  ];
  const plotSvg: [string, string, string][] = [];
  if (scan.axes.length === 1) {
    plotSvg.push(['exclusion.svg', await renderVegaLiteSvg(exclusionPlotSpec(exclusionPanels(points, axis), { massLabel })), 'Excluded cross section of the best-expected region (observed: solid; expected: dashed, with ±1σ and ±2σ bands) and the model\u2019s cross section with its scale band, per analysis.']);
  } else {
    const second = scan.axes[1]!;
    plotSvg.push(['reach.svg', await renderVegaLiteSvg(reachPlotSpec(reach.map((r) => ({ analysis: label(r), parameter: r.second!, observed: r.observed.limit, expected: r.expected.limit })), { parameter: `${second.name} [${second.unit}]`, mass: `${axis.name} limit [${axis.unit}]` })), 'Observed and expected mass limits against the second scan parameter.']);
  }
  plotSvg.push(['efficiency.svg', await renderVegaLiteSvg(efficiencyPlotSpec(efficiencyPoints, { massLabel, title: 'signal efficiency in the signal regions' })), 'Signal efficiency in the signal regions (their union when disjoint, else the best region) against mass, per analysis and collider energy (one dash pattern per energy).']);
  const blame = scanCutBlame(firstSlice, axis);
  if (blame.length > 0) plotSvg.push(['cut_blame.svg', await renderVegaLiteSvg(cutBlamePlotSpec(blame)), 'At each analysis\u2019s most sensitive point: the efficiency of its best region with one cut dropped, relative to all cuts.']);
  for (const [name, svg] of plotSvg) files.push([name, svg]);
  const verdictGrid = htmlTable(
    [...scan.axes.map((a) => ({ header: `${a.name} [${a.unit}]`, alignRight: true })), ...[...new Set(points.flatMap((p) => p.result.analyses.map((a) => label(a))))].map((h) => ({ header: h }))],
    points.map((p) => [...scan.axes.map((a) => String(p.parameters[a.name])), ...p.result.analyses.map((a) => `${a.verdict}${a.bestRegion ? ` (r ${formatNumber(a.regions.find((r) => r.name === a.bestRegion)!.rObserved, 3)})` : ''}`)]),
  );
  const sections: HtmlSection[] = [
    { id: 'limits', title: 'Mass limits', html: `<p>Where r = sigma_model / sigma95 of each analysis\u2019s best-expected region crosses 1 along ${escapeHtml(axis.name)} (log r interpolated linearly between scan points).</p>\n${reachTable(scan.axes, reach)}` },
    { id: 'plots', title: 'Plots', html: plotSvg.map(([name, svg, caption]) => htmlFigure(svg, `${caption} (${name})`, name.replace('.svg', ''))).join('\n') },
    { id: 'points', title: 'Verdict at each point', html: verdictGrid },
    { id: 'simplifications', title: 'Simplifications', html: `<ul>${SIMPLIFICATIONS.map((s) => `<li>${escapeHtml(s)}</li>`).join('')}</ul>` },
  ];
  files.push([
    'report.html',
    htmlPage({
      title: `tamis scan ${scan.name}`,
      lead: `${scan.description || `Scan of ${scan.modelFile}`}: ${points.length} points, ${scan.events} events per point and energy.`,
      cautions: CAUTIONS,
      sections,
      provenance: [
        ['tamis version', VERSION],
        ['base model', scan.modelFile],
        ['seed', String(scan.seed)],
        ['inputs fingerprint (sha256)', scan.fingerprint],
      ],
    }),
  ]);
  const written: string[] = [];
  for (const [name, text] of files) {
    writeFileAtomic(join(folder, name), text);
    written.push(join(folder, name));
  }
  return written;
}
