/**
 * Mass reach of a two-parameter scan: the observed and expected mass limit of
 * each analysis against the second parameter.
 */
import type { TopLevelSpec } from 'vega-lite';

export interface ReachPoint {
  analysis: string;
  parameter: number;
  observed: number;
  expected: number;
}

export function reachPlotSpec(points: readonly ReachPoint[], labels: { parameter: string; mass: string }): TopLevelSpec {
  const values = points.flatMap((p) => [
    { analysis: p.analysis, parameter: p.parameter, limit: p.observed, kind: 'observed' },
    { analysis: p.analysis, parameter: p.parameter, limit: p.expected, kind: 'expected' },
  ]).filter((v) => Number.isFinite(v.limit));
  return {
    $schema: 'https://vega.github.io/schema/vega-lite/v6.json',
    title: 'mass limit against the second scan parameter',
    config: { font: 'sans-serif' },
    width: 480,
    height: 280,
    data: { values },
    mark: { type: 'line', point: true },
    encoding: {
      x: { field: 'parameter', type: 'quantitative', title: labels.parameter },
      y: { field: 'limit', type: 'quantitative', title: labels.mass },
      color: { field: 'analysis', type: 'nominal', title: 'analysis' },
      strokeDash: { field: 'kind', type: 'nominal', title: 'limit' },
    },
  } as unknown as TopLevelSpec;
}
