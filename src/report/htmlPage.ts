/**
 * One self-contained HTML page (no network access: styles inline, plots as
 * inline SVG). The recast, scan and comparison reports are built from these
 * pieces.
 */

/** Escapes text for HTML element content and attribute values. */
export function escapeHtml(text: string): string {
  return text.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/"/g, '&quot;').replace(/'/g, '&#39;');
}

export interface HtmlTableColumn {
  header: string;
  alignRight?: boolean;
}

/** An HTML table; cells are plain text (escaped here). `rowClasses` marks rows, e.g. "excluded". */
export function htmlTable(columns: readonly HtmlTableColumn[], rows: readonly (readonly string[])[], rowClasses: readonly (string | undefined)[] = []): string {
  const head = columns.map((c) => `<th${c.alignRight ? ' class="num"' : ''}>${escapeHtml(c.header)}</th>`).join('');
  const body = rows
    .map((row, i) => {
      const cls = rowClasses[i] ? ` class="${escapeHtml(rowClasses[i]!)}"` : '';
      return `<tr${cls}>${row.map((cell, j) => `<td${columns[j]?.alignRight ? ' class="num"' : ''}>${escapeHtml(cell)}</td>`).join('')}</tr>`;
    })
    .join('\n');
  return `<table>\n<thead><tr>${head}</tr></thead>\n<tbody>\n${body}\n</tbody>\n</table>`;
}

/** An inline SVG figure with a caption; the XML declaration is dropped (not allowed inside HTML). */
export function htmlFigure(svg: string, caption: string, id?: string): string {
  const inline = svg.replace(/^<\?xml[^>]*>\s*/, '');
  return `<figure${id ? ` id="${escapeHtml(id)}"` : ''}>\n${inline}\n<figcaption>${escapeHtml(caption)}</figcaption>\n</figure>`;
}

export interface HtmlSection {
  id: string;
  title: string;
  /** Trusted HTML built with the helpers above. */
  html: string;
}

export interface HtmlPageInput {
  title: string;
  /** One paragraph under the title (plain text). */
  lead: string;
  /** The caution box: approximate results, confirm with the experiments' tools (plain text paragraphs). */
  cautions: readonly string[];
  sections: readonly HtmlSection[];
  /** Key-value facts for the footer (versions, seeds, input hashes). */
  provenance: readonly (readonly [string, string])[];
}

const STYLE = `
body { font-family: system-ui, -apple-system, "Segoe UI", sans-serif; margin: 2rem auto; max-width: 1100px; padding: 0 1rem; color: #222; line-height: 1.45; }
h1 { font-size: 1.6rem; margin-bottom: 0.2rem; }
h2 { font-size: 1.25rem; margin-top: 2rem; border-bottom: 1px solid #ddd; padding-bottom: 0.2rem; }
h3 { font-size: 1.05rem; margin-top: 1.4rem; }
p.lead { color: #444; }
.caution { border-left: 4px solid #c0392b; background: #fdf2f0; padding: 0.6rem 1rem; margin: 1rem 0; }
.caution p { margin: 0.3rem 0; }
nav ul { columns: 2; padding-left: 1.2rem; }
table { border-collapse: collapse; margin: 0.6rem 0 1rem; font-size: 0.88rem; }
th, td { border-bottom: 1px solid #e4e4e4; padding: 0.25rem 0.6rem; text-align: left; vertical-align: top; }
th { background: #f5f5f5; }
td.num, th.num { text-align: right; font-variant-numeric: tabular-nums; }
tr.excluded td { background: #fbe9e7; }
tr.allowed td { background: #fff; }
figure { margin: 1rem 0; }
figure svg { max-width: 100%; height: auto; }
figcaption { font-size: 0.85rem; color: #555; }
footer { margin-top: 3rem; font-size: 0.8rem; color: #666; border-top: 1px solid #ddd; padding-top: 0.6rem; }
footer dt { font-weight: 600; float: left; clear: left; width: 14rem; }
footer dd { margin-left: 14.5rem; word-break: break-all; }
`;

/** The whole page. */
export function htmlPage(input: HtmlPageInput): string {
  const nav = input.sections.length > 1 ? `<nav><ul>${input.sections.map((s) => `<li><a href="#${escapeHtml(s.id)}">${escapeHtml(s.title)}</a></li>`).join('')}</ul></nav>` : '';
  const sections = input.sections.map((s) => `<section id="${escapeHtml(s.id)}">\n<h2>${escapeHtml(s.title)}</h2>\n${s.html}\n</section>`).join('\n');
  const provenance = input.provenance.map(([k, v]) => `<dt>${escapeHtml(k)}</dt><dd>${escapeHtml(v)}</dd>`).join('');
  return `<!DOCTYPE html>
<html lang="en">
<head>
<meta charset="utf-8">
<meta name="viewport" content="width=device-width, initial-scale=1">
<title>${escapeHtml(input.title)}</title>
<style>${STYLE}</style>
</head>
<body>
<h1>${escapeHtml(input.title)}</h1>
<p class="lead">${escapeHtml(input.lead)}</p>
<div class="caution">${input.cautions.map((c) => `<p>${escapeHtml(c)}</p>`).join('')}</div>
${nav}
${sections}
<footer><dl>${provenance}</dl></footer>
</body>
</html>
`;
}
