/**
 * The HTML report of one recast: verdict table, cross sections, per analysis
 * the best regions, cut-flow and what each cut costs, with plots; cautions and
 * simplifications; inputs and seeds at the foot.
 */
import type { TopLevelSpec } from 'vega-lite';
import type { AnalysisOutcome, PointResult } from '../recast/types.js';
import { CAUTIONS, SIMPLIFICATIONS } from './cautions.js';
import { escapeHtml, htmlFigure, htmlPage, htmlTable, type HtmlSection } from './htmlPage.js';
import { cutBlamePlotSpec } from './plots/cutBlamePlot.js';
import { renderVegaLiteSvg } from './renderSvg.js';
import { formatNumber } from './terminalTable.js';

/** Regions listed per analysis in the report (the most sensitive first); regions.csv has all. */
const REGIONS_SHOWN = 12;

export function analysisLabel(a: { id: string; energyTeV: number }): string {
  return `${a.id} (${a.energyTeV} TeV)`;
}

/** A chart of sigma95 (observed and expected) against the model's cross section, one row per analysis. */
export function limitSummarySpec(result: PointResult): TopLevelSpec {
  const sigmaAt = new Map(result.energies.map((e) => [e.energyTeV, e.sigmaPb]));
  const values = result.analyses.flatMap((a) => {
    const best = a.regions.find((r) => r.name === a.bestRegion);
    const label = analysisLabel(a);
    const rows: { analysis: string; series: string; value: number }[] = [{ analysis: label, series: 'model cross section', value: sigmaAt.get(a.energyTeV) ?? Number.NaN }];
    if (best) {
      rows.push({ analysis: label, series: 'observed limit (best region)', value: best.sigma95ObservedPb });
      rows.push({ analysis: label, series: 'expected limit (best region)', value: best.sigma95ExpectedPb.median });
    }
    return rows.filter((r) => Number.isFinite(r.value) && r.value > 0);
  });
  return {
    $schema: 'https://vega.github.io/schema/vega-lite/v6.json',
    title: 'excluded cross section of the best region against the model',
    config: { font: 'sans-serif', legend: { orient: 'bottom', labelLimit: 260, columns: 3 }, axis: { labelLimit: 220 } },
    width: 520,
    data: { values },
    mark: { type: 'point', filled: true, size: 90 },
    encoding: {
      y: { field: 'analysis', type: 'nominal', title: null },
      x: { field: 'value', type: 'quantitative', scale: { type: 'log' }, title: 'cross section [pb]' },
      color: { field: 'series', type: 'nominal', title: null, scale: { range: ['#000000', '#777777', '#c0392b'] } },
      shape: { field: 'series', type: 'nominal', title: null },
    },
  } as unknown as TopLevelSpec;
}

function analysisSection(a: AnalysisOutcome, sigmaPb: number): string {
  const regions = [...a.regions].sort((x, y) => y.rExpected - x.rExpected).slice(0, REGIONS_SHOWN);
  const regionRows = regions.map((r) => [
    r.name + (r.name === a.bestRegion ? ' (best)' : ''),
    `${r.observed}`,
    `${formatNumber(r.background)} ± ${formatNumber(r.backgroundUncertainty)}`,
    `${formatNumber(r.efficiency, 3)} ± ${formatNumber(r.efficiencyError, 2)}`,
    formatNumber(r.signal, 3),
    `${formatNumber(r.n95Observed, 3)} / ${formatNumber(r.n95Expected.median, 3)}`,
    `${formatNumber(r.sigma95ObservedPb, 3)} / ${formatNumber(r.sigma95ExpectedPb.median, 3)}`,
    formatNumber(r.rObserved, 3),
    r.method,
    r.publishedN95Observed !== undefined ? `${formatNumber(r.publishedN95Observed, 3)} (ratio ${formatNumber(r.ratioToPublishedObserved ?? Number.NaN, 3)})` : '',
  ]);
  const regionTable = htmlTable(
    [
      { header: 'region' },
      { header: 'observed', alignRight: true },
      { header: 'background', alignRight: true },
      { header: 'efficiency', alignRight: true },
      { header: 'signal events', alignRight: true },
      { header: 'N95 obs / exp', alignRight: true },
      { header: 'sigma95 obs / exp [pb]', alignRight: true },
      { header: 'r', alignRight: true },
      { header: 'method' },
      { header: 'published N95' },
    ],
    regionRows,
    regions.map((r) => (r.rObserved >= 1 ? 'excluded' : undefined)),
  );
  const stepTable = htmlTable(
    [{ header: '#' , alignRight: true }, { header: 'step' }, { header: 'cut' }, { header: 'efficiency', alignRight: true }, { header: 'events', alignRight: true }],
    a.steps.map((s, i) => [`${i + 1}`, s.name, s.cut, `${formatNumber(s.efficiency, 3)} ± ${formatNumber(s.efficiencyError, 2)}`, `${s.selectedEvents}`]),
  );
  const costTable = a.cutCosts.length
    ? htmlTable(
        [{ header: 'cut' }, { header: 'kind' }, { header: 'efficiency without it', alignRight: true }, { header: 'gain factor', alignRight: true }],
        a.cutCosts.map((c) => [c.kind === 'step' ? `${c.name}: ${c.cut}` : c.cut, c.kind, formatNumber(c.efficiencyWithout, 3), formatNumber(c.gainFactor, 3)]),
      )
    : '<p>No cut costs: no region selects any signal.</p>';
  const requirements = a.requirementCosts.length
    ? `<p>What each requirement costs the signal regions as a whole (their efficiency with no condition at all on one variable, in steps and regions, relative to all conditions):</p>\n${htmlTable(
        [{ header: 'variable' }, { header: 'efficiency without it', alignRight: true }, { header: 'gain factor', alignRight: true }],
        a.requirementCosts.map((c) => [c.variable, formatNumber(c.efficiencyWithout, 3), formatNumber(c.gainFactor, 3)]),
      )}`
    : '';
  const combined = a.combined
    ? `<p>Combination of the ${a.regions.length} disjoint regions: sigma95 observed ${escapeHtml(formatNumber(a.combined.sigma95ObservedPb, 3))} pb, expected ${escapeHtml(formatNumber(a.combined.sigma95ExpectedPb.median, 3))} pb [${escapeHtml(formatNumber(a.combined.sigma95ExpectedPb.minus1, 3))}, ${escapeHtml(formatNumber(a.combined.sigma95ExpectedPb.plus1, 3))}] (±1σ); r = ${escapeHtml(formatNumber(a.combined.rObserved, 3))}.</p>`
    : '<p>No combination: the regions are not declared disjoint.</p>';
  const overlaps = a.overlaps.length
    ? `<p><strong>Overlapping regions</strong> (declared disjoint: ${a.overlaps.length} pair(s)): ${escapeHtml(a.overlaps.slice(0, 5).map((o) => `${o.first} & ${o.second} share ${o.events} events`).join('; '))}.</p>`
    : '';
  return `<h3>${escapeHtml(analysisLabel(a))}: ${escapeHtml(a.verdict)}</h3>
<p>${escapeHtml(a.summary)}${a.invented && !/invented/i.test(a.summary) ? ' <em>(invented demo analysis)</em>' : ''}. Luminosity ${escapeHtml(String(a.luminosityIfb))} fb<sup>-1</sup>, detector profile ${escapeHtml(a.detector)}, model cross section ${escapeHtml(formatNumber(sigmaPb, 4))} pb, ${a.events} events generated.</p>
${combined}${overlaps}
<p>Most sensitive regions (by expected r; all ${a.regions.length} regions are in regions.csv):</p>
${regionTable}
<p>Cut-flow (efficiency relative to all generated events):</p>
${stepTable}
<p>What each cut of the ${a.bestRegion ? `best region ${escapeHtml(a.bestRegion)}` : 'most promising region'} costs (efficiency if only that cut were dropped):</p>
${costTable}
${requirements}`;
}

export interface RecastReportInput {
  result: PointResult;
  provenance: readonly (readonly [string, string])[];
}

export async function recastReportHtml(input: RecastReportInput): Promise<string> {
  const { result } = input;
  const sigmaAt = new Map(result.energies.map((e) => [e.energyTeV, e.sigmaPb]));
  const verdictRows = result.analyses.map((a) => {
    const best = a.regions.find((r) => r.name === a.bestRegion);
    return [analysisLabel(a), a.bestRegion ?? '-', best ? formatNumber(best.efficiency, 3) : '0', best ? formatNumber(best.sigma95ObservedPb, 3) : '-', best ? formatNumber(best.sigma95ExpectedPb.median, 3) : '-', best ? formatNumber(best.rObserved, 3) : '0', a.combined ? formatNumber(a.combined.rObserved, 3) : '-', a.verdict];
  });
  const verdictTable = htmlTable(
    [{ header: 'analysis' }, { header: 'best region' }, { header: 'efficiency', alignRight: true }, { header: 'sigma95 obs [pb]', alignRight: true }, { header: 'sigma95 exp [pb]', alignRight: true }, { header: 'r (best region)', alignRight: true }, { header: 'r (combined)', alignRight: true }, { header: 'verdict' }],
    verdictRows,
    result.analyses.map((a) => (a.verdict === 'excluded' ? 'excluded' : 'allowed')),
  );
  const xsRows = result.energies.flatMap((e) => [
    ...e.channels.map((c) => [`${e.energyTeV}`, c.name, formatNumber(c.sigmaPb, 4), formatNumber(c.errorPb, 2), formatNumber(c.kFactor, 3)]),
    [`${e.energyTeV}`, 'total', formatNumber(e.sigmaPb, 4), formatNumber(e.errorPb, 2), `scale band ${formatNumber(e.scaleBandPb[0], 4)} – ${formatNumber(e.scaleBandPb[1], 4)}`],
  ]);
  const xsTable = htmlTable([{ header: 'TeV', alignRight: true }, { header: 'channel' }, { header: 'sigma [pb]', alignRight: true }, { header: 'MC error [pb]', alignRight: true }, { header: 'K-factor' }], xsRows);
  const blameBars = result.analyses.flatMap((a) => a.cutCosts.filter((c) => Number.isFinite(c.gainFactor) && c.gainFactor > 1).slice(0, 5).map((c) => ({ analysis: analysisLabel(a), cut: c.kind === 'step' ? c.cut : c.cut, gainFactor: c.gainFactor })));
  const sections: HtmlSection[] = [
    { id: 'verdicts', title: 'Verdicts', html: `<p>Verdict from the best-expected region of each analysis: excluded when sigma_model / sigma95 (observed) is at least 1 at ${Math.round(result.cl * 1000) / 10}% CL.</p>\n${verdictTable}\n${htmlFigure(await renderVegaLiteSvg(limitSummarySpec(result)), 'Excluded cross sections of each analysis\u2019s best region (observed and expected) and the model\u2019s cross section.', 'limit-summary')}` },
    { id: 'cross-sections', title: 'Model cross sections', html: `<p>Model ${escapeHtml(result.model.name)}${Object.keys(result.model.parameters).length ? ` at ${escapeHtml(Object.entries(result.model.parameters).map(([k, v]) => `${k} = ${v}`).join(', '))}` : ''}; leading order with the toy parton densities.</p>\n${xsTable}` },
    ...result.analyses.map((a) => ({ id: `analysis-${a.id}`, title: `Analysis ${analysisLabel(a)}`, html: analysisSection(a, sigmaAt.get(a.energyTeV) ?? Number.NaN) })),
  ];
  if (blameBars.length > 0) {
    sections.splice(2, 0, { id: 'cut-blame', title: 'Which cuts cost the signal', html: htmlFigure(await renderVegaLiteSvg(cutBlamePlotSpec(blameBars)), 'For the best region of each analysis: the efficiency with one cut dropped divided by the efficiency with every cut (the costliest cuts).', 'cut-blame-plot') });
  }
  sections.push({ id: 'simplifications', title: 'Simplifications', html: `<ul>${SIMPLIFICATIONS.map((s) => `<li>${escapeHtml(s)}</li>`).join('')}</ul>` });
  return htmlPage({
    title: `tamis recast of ${result.model.name}`,
    lead: `Which searches exclude ${result.model.name} at ${result.energies.map((e) => `${e.energyTeV} TeV`).join(' and ')}, and why the others miss it.`,
    cautions: CAUTIONS,
    sections,
    provenance: input.provenance,
  });
}
