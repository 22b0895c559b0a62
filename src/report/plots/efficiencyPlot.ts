/**
 * Signal efficiency (best region, or total after the last common step) against
 * mass, one line per analysis, dashed or solid by collider energy: the plot
 * that shows how selections at different energies treat the same model.
 */
import type { TopLevelSpec } from 'vega-lite';

export interface EfficiencyPoint {
  analysis: string;
  energyTeV: number;
  mass: number;
  efficiency: number;
  efficiencyError: number;
}

export function efficiencyPlotSpec(points: readonly EfficiencyPoint[], options: { massLabel?: string; title?: string } = {}): TopLevelSpec {
  const values = points
    .filter((p) => Number.isFinite(p.efficiency))
    .map((p) => ({
      analysis: `${p.analysis} (${p.energyTeV} TeV)`,
      energy: `${p.energyTeV} TeV`,
      mass: p.mass,
      efficiency: p.efficiency,
      low: Math.max(0, p.efficiency - p.efficiencyError),
      high: p.efficiency + p.efficiencyError,
    }));
  return {
    $schema: 'https://vega.github.io/schema/vega-lite/v6.json',
    title: options.title ?? 'signal efficiency of the best region',
    // Opaque legend symbols (the error bands are translucent).
    config: { font: 'sans-serif', legend: { orient: 'right', symbolOpacity: 1, labelLimit: 320 } },
    width: 480,
    height: 280,
    data: { values },
    layer: [
      {
        mark: { type: 'errorband', opacity: 0.25 },
        encoding: {
          x: { field: 'mass', type: 'quantitative', title: options.massLabel ?? 'mass [GeV]' },
          y: { field: 'low', type: 'quantitative', title: 'efficiency' },
          y2: { field: 'high' },
          color: { field: 'analysis', type: 'nominal', title: 'analysis' },
          detail: { field: 'energy' },
        },
      },
      {
        mark: { type: 'line', point: true },
        encoding: {
          x: { field: 'mass', type: 'quantitative' },
          y: { field: 'efficiency', type: 'quantitative' },
          color: { field: 'analysis', type: 'nominal', title: 'analysis' },
          // Dashes tell the energies apart; the legend names them in the analysis labels.
          strokeDash: { field: 'energy', type: 'nominal', legend: null },
        },
      },
    ],
  } as unknown as TopLevelSpec;
}
