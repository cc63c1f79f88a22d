/**
 * The chart webview's page: the document's distance-, time- and scale-like claims drawn on the
 * model curves, as inline SVG, with a content security policy that allows no script and no
 * network. Pure: it takes the chart data the server returns.
 */

import type { Chart } from '../../../shared/src/check/chartData.js';
import { chartSvg, escapeHtml } from '../../../cli/src/report/chartSvg.js';

export function chartPage(title: string, parameters: string | null, charts: readonly Chart[], cspSource: string): string {
  const body = charts.length
    ? charts.map((c, i) => chartSvg(c, `chart-${i}`)).join('\n')
    : '<p>No distance, time or scale at a redshift was checked in this document.</p>';
  return `<!DOCTYPE html>
<html lang="en"><head><meta charset="utf-8">
<meta http-equiv="Content-Security-Policy" content="default-src 'none'; style-src ${cspSource} 'unsafe-inline'; img-src ${cspSource} data:;">
<meta name="viewport" content="width=device-width, initial-scale=1">
<title>${escapeHtml(title)}</title>
<style>
body{font:13px/1.4 var(--vscode-font-family, system-ui, sans-serif);color:var(--vscode-foreground, #222);background:var(--vscode-editor-background, #fff);padding:12px}
.chart{background:#fff;border:1px solid #ccd;margin:0 12px 12px 0}.charts{display:flex;flex-wrap:wrap}
.chart .grid{stroke:#eceef3}.chart .axis{stroke:#555}.chart .tick,.chart .legend{font-size:11px;fill:#444}.chart .label{font-size:12px;fill:#333}
.chart .chart-title{font-size:13px;font-weight:600;fill:#222}.chart .curve{fill:none;stroke-width:2}.chart .miss{stroke:#c0141e;stroke-dasharray:3 3}
</style></head><body>
<h2>${escapeHtml(title)}</h2>
<p>${parameters ? `Parameter set: <code>${escapeHtml(parameters)}</code>. ` : 'No parameter set. '}Dots: stated values that agree; red crosses: values that disagree, with a dotted line to the computed value.</p>
<div class="charts">${body}</div>
</body></html>`;
}
