/**
 * Cut blame bars: for each analysis (and energy), the signal efficiency the
 * best region would have if a single cut were dropped, relative to the
 * efficiency with every cut; the longest bar is the cut that costs most.
 */
import type { TopLevelSpec } from 'vega-lite';

export interface CutBlameBar {
  /** Panel label, e.g. "three-lepton 13 TeV". */
  analysis: string;
  /** The cut as written in the analysis file. */
  cut: string;
  /** Efficiency without this cut divided by the efficiency with all cuts (>= 1). */
  gainFactor: number;
}

export function cutBlamePlotSpec(bars: readonly CutBlameBar[], options: { title?: string; axisTitle?: string } = {}): TopLevelSpec {
  const values = bars.filter((b) => Number.isFinite(b.gainFactor)).map((b) => ({ ...b, label: b.cut.length > 48 ? `${b.cut.slice(0, 45)}...` : b.cut }));
  return {
    $schema: 'https://vega.github.io/schema/vega-lite/v6.json',
    title: options.title ?? 'signal gained by dropping one cut',
    config: { font: 'sans-serif', axis: { labelLimit: 320 } },
    data: { values },
    facet: { row: { field: 'analysis', type: 'nominal', title: null, header: { labelAngle: 0, labelAlign: 'left' } } },
    resolve: { scale: { y: 'independent' } },
    spec: {
      width: 360,
      mark: 'bar',
      encoding: {
        y: { field: 'label', type: 'nominal', sort: '-x', title: null },
        // Bars start at 1 (no gain) on a log axis.
        x: { field: 'gainFactor', type: 'quantitative', scale: { type: 'log', domainMin: 1 }, title: options.axisTitle ?? 'efficiency without the cut / with all cuts' },
        x2: { datum: 1 },
        color: { value: '#4c78a8' },
        tooltip: [{ field: 'cut' }, { field: 'gainFactor', format: '.3g' }],
      },
    },
  } as unknown as TopLevelSpec;
}
