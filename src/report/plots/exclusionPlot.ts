/**
 * Exclusion plot: the excluded cross section (observed, and expected with its
 * ±1σ and ±2σ bands) against mass, with the model cross section and its scale
 * band, one panel per analysis (or analysis and energy). Log scale in sigma.
 */
import type { TopLevelSpec } from 'vega-lite';

export interface ExclusionPoint {
  mass: number;
  /** Observed excluded cross section, pb. */
  observedPb: number;
  expectedPb: number;
  minus2Pb: number;
  minus1Pb: number;
  plus1Pb: number;
  plus2Pb: number;
}

export interface ModelCrossSectionPoint {
  mass: number;
  sigmaPb: number;
  lowPb: number;
  highPb: number;
}

export interface ExclusionPanel {
  title: string;
  limits: readonly ExclusionPoint[];
  model: readonly ModelCrossSectionPoint[];
}

/** Series names as they appear in the legend (tests look for them in the SVG). */
export const EXCLUSION_SERIES = {
  observed: 'observed limit',
  expected: 'expected limit',
  band1: 'expected ±1σ',
  band2: 'expected ±2σ',
  model: 'model cross section',
  modelBand: 'model scale band',
} as const;

const finitePositive = (v: number): boolean => Number.isFinite(v) && v > 0;

/** The vega-lite specification of the exclusion plot (panels laid out in two columns). */
export function exclusionPlotSpec(panels: readonly ExclusionPanel[], options: { massLabel?: string } = {}): TopLevelSpec {
  const massTitle = options.massLabel ?? 'mass [GeV]';
  const colours = {
    domain: [EXCLUSION_SERIES.band2, EXCLUSION_SERIES.band1, EXCLUSION_SERIES.expected, EXCLUSION_SERIES.observed, EXCLUSION_SERIES.modelBand, EXCLUSION_SERIES.model],
    range: ['#f2d16b', '#6cc38a', '#333333', '#000000', '#f4b6b6', '#c0392b'],
  };
  const charts = panels.map((panel) => {
    const rows = panel.limits.filter((p) => finitePositive(p.expectedPb));
    const bandRows = (series: string, low: keyof ExclusionPoint, high: keyof ExclusionPoint) =>
      rows.filter((p) => finitePositive(p[low]) && finitePositive(p[high])).map((p) => ({ mass: p.mass, low: p[low], high: p[high], series }));
    const lineRows = (series: string, key: keyof ExclusionPoint) => rows.filter((p) => finitePositive(p[key])).map((p) => ({ mass: p.mass, value: p[key], series }));
    const modelRows = panel.model.filter((p) => finitePositive(p.sigmaPb));
    return {
      title: panel.title,
      width: 320,
      height: 240,
      layer: [
        { data: { values: bandRows(EXCLUSION_SERIES.band2, 'minus2Pb', 'plus2Pb') }, mark: { type: 'area', opacity: 0.9 }, encoding: bandEncoding(massTitle) },
        { data: { values: bandRows(EXCLUSION_SERIES.band1, 'minus1Pb', 'plus1Pb') }, mark: { type: 'area', opacity: 0.9 }, encoding: bandEncoding(massTitle) },
        {
          data: { values: modelRows.filter((p) => finitePositive(p.lowPb) && finitePositive(p.highPb)).map((p) => ({ mass: p.mass, low: p.lowPb, high: p.highPb, series: EXCLUSION_SERIES.modelBand })) },
          mark: { type: 'area', opacity: 0.5 },
          encoding: bandEncoding(massTitle),
        },
        { data: { values: lineRows(EXCLUSION_SERIES.expected, 'expectedPb') }, mark: { type: 'line', strokeDash: [6, 4] }, encoding: lineEncoding(massTitle) },
        { data: { values: lineRows(EXCLUSION_SERIES.observed, 'observedPb') }, mark: { type: 'line', point: true }, encoding: lineEncoding(massTitle) },
        { data: { values: modelRows.map((p) => ({ mass: p.mass, value: p.sigmaPb, series: EXCLUSION_SERIES.model })) }, mark: { type: 'line', strokeWidth: 2 }, encoding: lineEncoding(massTitle) },
      ],
    };
  });
  return {
    $schema: 'https://vega.github.io/schema/vega-lite/v6.json',
    config: { font: 'sans-serif', legend: { orient: 'bottom', columns: 3 } },
    resolve: { scale: { color: 'shared' } },
    concat: charts,
    columns: 2,
  } as unknown as TopLevelSpec;

  function bandEncoding(title: string) {
    return {
      x: { field: 'mass', type: 'quantitative', title },
      y: { field: 'low', type: 'quantitative', scale: { type: 'log' }, title: 'cross section [pb]' },
      y2: { field: 'high' },
      color: { field: 'series', type: 'nominal', scale: colours, title: null },
    };
  }
  function lineEncoding(title: string) {
    return {
      x: { field: 'mass', type: 'quantitative', title },
      y: { field: 'value', type: 'quantitative', scale: { type: 'log' }, title: 'cross section [pb]' },
      color: { field: 'series', type: 'nominal', scale: colours, title: null },
    };
  }
}
