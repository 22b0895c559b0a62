/**
 * Outputs of `tamis compare`: the terminal view, comparison.csv (one row per
 * energy, analysis and region) and comparison.html with the efficiency and
 * cut-cost charts.
 */
import type { TopLevelSpec } from 'vega-lite';
import type { EnergyComparison } from '../recast/compareEnergies.js';
import { CAUTIONS, SIMPLIFICATIONS } from './cautions.js';
import { csvText } from './csvText.js';
import { escapeHtml, htmlFigure, htmlPage, htmlTable } from './htmlPage.js';
import { cutBlamePlotSpec } from './plots/cutBlamePlot.js';
import { renderVegaLiteSvg } from './renderSvg.js';
import { formatNumber, formatTable } from './terminalTable.js';
import { VERSION } from '../version.js';

export const COMPARISON_CSV_COLUMNS = ['energy_tev', 'analysis', 'region', 'efficiency', 'efficiency_error', 'selected_events'] as const;

/** Regions listed per analysis in the terminal (the most efficient first). */
const REGIONS_PRINTED = 6;


export function comparisonText(c: EnergyComparison): string {
  const head = `${c.modelName}: ${c.energies.map((e) => `${e.energyTeV} TeV ${formatNumber(e.sigmaPb, 4)} pb`).join(', ')}; ${c.events} events per energy, seed ${c.seed}`;
  const summary = formatTable(
    [
      { header: 'analysis' },
      { header: 'TeV', alignRight: true },
      { header: 'efficiency in signal regions', alignRight: true },
      { header: 'signal events', alignRight: true },
      { header: 'costliest requirement' },
      { header: 'efficiency without it', alignRight: true },
      { header: 'gain', alignRight: true },
    ],
    [...c.analyses]
      .sort((a, b) => a.energyTeV - b.energyTeV || a.id.localeCompare(b.id))
      .map((a) => {
        const top = a.requirementCosts[0];
        return [
          a.id,
          String(a.energyTeV),
          `${formatNumber(a.signalRegionEfficiency.value, 3)} ± ${formatNumber(a.signalRegionEfficiency.error, 2)}`,
          formatNumber(a.signalEvents, 3),
          top ? top.variable : '-',
          top ? formatNumber(top.efficiencyWithout, 3) : '-',
          top ? `x${formatNumber(top.gainFactor, 3)}` : '-',
        ];
      }),
  );
  const blocks = [...c.analyses]
    .sort((a, b) => a.energyTeV - b.energyTeV || a.id.localeCompare(b.id))
    .map((a) => {
      const regions = [...a.regions].filter((r) => r.efficiency > 0).sort((x, y) => y.efficiency - x.efficiency).slice(0, REGIONS_PRINTED);
      const table = regions.length
        ? formatTable([{ header: 'region' }, { header: 'efficiency', alignRight: true }, { header: 'events', alignRight: true }], regions.map((r) => [r.name, `${formatNumber(r.efficiency, 3)} ± ${formatNumber(r.efficiencyError, 2)}`, String(r.selectedEvents)]))
        : '(no region selects any signal event)';
      const costs = a.requirementCosts.slice(0, 4).map((x) => `${x.variable} x${formatNumber(x.gainFactor, 3)}`).join(', ');
      return `${a.id} at ${a.energyTeV} TeV (${a.regions.length} regions)\n${table}\nsignal in the regions with no condition on a variable, relative to all conditions: ${costs || '-'}`;
    });
  return `${head}\n\n${summary}\n\n${blocks.join('\n\n')}`;
}

export async function comparisonCsv(c: EnergyComparison): Promise<string> {
  return csvText([...COMPARISON_CSV_COLUMNS], c.analyses.flatMap((a) => a.regions.map((r) => [a.energyTeV, a.id, r.name, r.efficiency, r.efficiencyError, r.selectedEvents])));
}

function efficiencyBarsSpec(c: EnergyComparison): TopLevelSpec {
  return {
    $schema: 'https://vega.github.io/schema/vega-lite/v6.json',
    title: 'signal efficiency in the signal regions by collider energy',
    config: { font: 'sans-serif', axis: { labelLimit: 240 } },
    width: 420,
    data: { values: c.analyses.map((a) => ({ analysis: a.id, energy: `${a.energyTeV} TeV`, efficiency: a.signalRegionEfficiency.value })) },
    mark: 'bar',
    encoding: {
      y: { field: 'analysis', type: 'nominal', title: null },
      x: { field: 'efficiency', type: 'quantitative', title: 'efficiency' },
      color: { field: 'energy', type: 'nominal', title: 'energy' },
    },
  } as unknown as TopLevelSpec;
}

export async function comparisonHtml(c: EnergyComparison, command: string): Promise<string> {
  const rows = [...c.analyses].sort((a, b) => a.energyTeV - b.energyTeV).map((a) => [a.id, String(a.energyTeV), formatNumber(a.signalRegionEfficiency.value, 3), formatNumber(a.signalEvents, 3), a.requirementCosts[0]?.variable ?? '-', a.requirementCosts[0] ? formatNumber(a.requirementCosts[0].gainFactor, 3) : '-']);
  const bars = c.analyses.flatMap((a) => a.requirementCosts.filter((x) => Number.isFinite(x.gainFactor) && x.gainFactor > 1).slice(0, 4).map((x) => ({ analysis: `${a.id} (${a.energyTeV} TeV)`, cut: x.variable, gainFactor: x.gainFactor })));
  const figures = [htmlFigure(await renderVegaLiteSvg(efficiencyBarsSpec(c)), 'Efficiency of each analysis\u2019s signal regions for the same model at each collider energy.', 'efficiency-bars')];
  if (bars.length) figures.push(htmlFigure(await renderVegaLiteSvg(cutBlamePlotSpec(bars, { title: 'signal kept with no condition on one variable', axisTitle: 'efficiency of the signal regions with no condition on the variable / with all' })), 'The requirements that cost each analysis the most signal: efficiency of its signal regions with no condition on one variable, relative to all conditions.', 'cut-costs'));
  return htmlPage({
    title: `tamis energy comparison of ${c.modelName}`,
    lead: `The same model through the analyses at ${c.energies.map((e) => `${e.energyTeV} TeV`).join(' and ')}: efficiencies and the cuts that cost the signal.`,
    cautions: CAUTIONS,
    sections: [
      {
        id: 'summary',
        title: 'Efficiencies side by side',
        html: htmlTable([{ header: 'analysis' }, { header: 'TeV', alignRight: true }, { header: 'efficiency in signal regions', alignRight: true }, { header: 'signal events', alignRight: true }, { header: 'costliest requirement (variable)' }, { header: 'gain without it', alignRight: true }], rows) + figures.join('\n'),
      },
      { id: 'simplifications', title: 'Simplifications', html: `<ul>${SIMPLIFICATIONS.map((s) => `<li>${escapeHtml(s)}</li>`).join('')}</ul>` },
    ],
    provenance: [
      ['tamis version', VERSION],
      ['command', command],
      ['seed', String(c.seed)],
      ['events per energy', String(c.events)],
    ],
  });
}
