/**
 * `comove check --report FILE.html`: one self-contained page (no scripts, no network): the
 * parameter set of each file, a table of every claim with its verdict, and SVG charts of each
 * distance-like, time-like and scale-like quantity against z with the stated values drawn on the
 * computed curves, inconsistent ones in a colour and shape of their own.
 */

import { chartData, CosmologyCache, kindTitle, significant, whereText, type ClaimCheck, type Summary, type LocatedCheck } from '../../../shared/src/index.js';
import { chartSvg, escapeHtml } from './chartSvg.js';

function row(f: LocatedCheck, c: ClaimCheck, index: number): string {
  const r = f.claimRange(c);
  const stated = `${c.claim.value.text}${c.unitText ? ` ${c.unitText}` : ''}`;
  const computed = c.computed === null ? '—' : `${significant(c.computed, c.claim.value.significantDigits + 1)}${c.unitText ? ` ${c.unitText}` : ''}`;
  const detail = c.status === 'inconsistent' ? c.slip?.description ?? '' : c.status === 'unchecked' ? c.reason ?? '' : c.onlyByFloor ? 'within the relative floor only' : '';
  const diff = c.relativeDifference === null || c.status !== 'inconsistent' ? '' : `${c.relativeDifference > 0 ? '+' : '−'}${significant(Math.abs(100 * c.relativeDifference), 2)} %`;
  return `<tr class="claim-row ${c.status}" data-claim="${index}"><td>${r.start.line + 1}:${r.start.character + 1}</td><td>${escapeHtml(kindTitle(c.claim.kind))}${escapeHtml(whereText(c))}</td><td class="num">${escapeHtml(stated)}</td><td class="num">${escapeHtml(computed)}</td><td class="verdict">${c.status}</td><td class="num">${diff}</td><td>${escapeHtml(detail)}</td></tr>`;
}

const STYLE = `
body{font:14px/1.45 system-ui,sans-serif;margin:24px auto;max-width:1100px;color:#1d2125;padding:0 16px}
h1{font-size:22px;margin:0 0 4px}h2{font-size:18px;margin:28px 0 6px;border-bottom:1px solid #ccd;padding-bottom:4px}
.note{color:#555;font-size:13px}.summary span{display:inline-block;margin-right:14px;padding:2px 8px;border-radius:4px;background:#eef}
.summary .bad{background:#fbe3e4;color:#8f0d14}.summary .good{background:#e3f4e6;color:#14622a}
table{border-collapse:collapse;width:100%;margin:8px 0}td,th{border-bottom:1px solid #e2e4ea;padding:4px 6px;text-align:left;vertical-align:top}
th{background:#f4f5f8;font-weight:600}td.num{text-align:right;white-space:nowrap;font-variant-numeric:tabular-nums}
tr.inconsistent{background:#fdeeee}tr.inconsistent td.verdict{color:#b3121c;font-weight:700}tr.unchecked td{color:#666}
tr.consistent td.verdict{color:#1b7332}code{background:#f2f3f6;padding:1px 4px;border-radius:3px}
.charts{display:flex;flex-wrap:wrap;gap:12px}.chart{border:1px solid #dde;background:#fff}
.chart .grid{stroke:#eceef3}.chart .axis{stroke:#555}.chart .tick,.chart .legend{font-size:11px;fill:#444}.chart .label{font-size:12px;fill:#333}
.chart .chart-title{font-size:13px;font-weight:600;fill:#222}.chart .curve{fill:none;stroke-width:2}.chart .miss{stroke:#c0141e;stroke-dasharray:3 3}
ul.findings li{margin:2px 0}`;

export function htmlReport(files: readonly LocatedCheck[], summary: Summary, meta: { version: string; generated: string }): string {
  const cache = new CosmologyCache();
  const sections = files.map((f, fi) => {
    const set = f.check.parameters;
    const made = set && !set.incomplete ? cache.get(set.input) : null;
    const charts = made && made.ok ? chartData(f.check.checks, made.cosmology, (c) => c.parameters === set) : [];
    const svg = charts.map((ch, i) => chartSvg(ch, `chart-${fi}-${i}`)).join('');
    const findings = [
      ...f.check.extraction.problems.map((p) => `${p.severity}: ${escapeHtml(p.message)}`),
      ...f.check.findings.map((g) => `${g.severity}: ${escapeHtml(g.message)}`),
    ];
    const n = f.check.checks;
    return `<section class="file"><h2>${escapeHtml(f.path)}</h2>
<p>Parameter set: ${set ? `<code>${escapeHtml(set.text || '(unusable)')}</code> (${set.origin}${set.line !== undefined && set.line !== null ? `, line ${set.line + 1}` : ''})` : '<strong>none declared</strong>'} · ${n.length} claims: ${n.filter((c) => c.status === 'consistent').length} consistent, ${n.filter((c) => c.status === 'inconsistent').length} inconsistent, ${n.filter((c) => c.status === 'unchecked').length} unchecked</p>
${findings.length ? `<ul class="findings">${findings.map((x) => `<li>${x}</li>`).join('')}</ul>` : ''}
${svg ? `<div class="charts">${svg}</div><p class="note">Curves: the quantity computed under the parameter set. Dots: stated values that agree; red crosses: stated values that disagree, with a dotted line to the computed value.</p>` : ''}
<table><thead><tr><th>Line</th><th>Quantity</th><th>Stated</th><th>Recomputed</th><th>Verdict</th><th>Difference</th><th>Slip or reason</th></tr></thead><tbody>
${n.map((c, i) => row(f, c, i)).join('\n')}
</tbody></table></section>`;
  });
  return `<!DOCTYPE html>
<html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width, initial-scale=1">
<meta http-equiv="Content-Security-Policy" content="default-src 'none'; style-src 'unsafe-inline'; img-src data:">
<title>Comove report</title><style>${STYLE}</style></head><body>
<h1>Comove consistency report</h1>
<p class="note">Generated ${escapeHtml(meta.generated)} by Comove ${escapeHtml(meta.version)}. Comove checks that the numbers agree with the parameter set the manuscript declares; it does not check that the parameters or the numbers are scientifically right.</p>
<p class="summary"><span>${summary.files} file${summary.files === 1 ? '' : 's'}</span><span>${summary.claims} claims</span><span class="good">${summary.consistent} consistent</span><span class="bad">${summary.inconsistent} inconsistent</span><span>${summary.unchecked} unchecked</span></p>
${sections.join('\n')}
</body></html>
`;
}
