/**
 * Renders a vega-lite specification to an SVG string in Node (no browser, no
 * canvas): vega-lite compiles to vega, and a headless vega View serialises the
 * scene graph to SVG. Text widths are estimated, which is fine for plots.
 */
import * as vega from 'vega';
import * as vegaLite from 'vega-lite';
import type { TopLevelSpec } from 'vega-lite';

/** SVG text of a vega-lite specification. */
export async function renderVegaLiteSvg(spec: TopLevelSpec): Promise<string> {
  const compiled = vegaLite.compile(spec).spec;
  const view = new vega.View(vega.parse(compiled), { renderer: 'none' });
  try {
    const svg = await view.toSVG();
    // Vega writes no XML declaration; make the file standalone for editors and browsers.
    return svg.startsWith('<?xml') ? svg : `<?xml version="1.0" encoding="UTF-8"?>\n${svg}\n`;
  } finally {
    view.finalize();
  }
}
