/**
 * `comove check --report FILE.html`: one self-contained page (no scripts, no network): the
 * parameter set of each file, a table of every claim with its verdict, and SVG charts of each
 * distance-like, time-like and scale-like quantity against z with the stated values drawn on the
 * computed curves, inconsistent ones in a colour and shape of their own.
 */

import { chartData, CosmologyCache, kindTitle, significant, whereText, type Chart, type ClaimCheck, type Summary, type LocatedCheck } from '../../../shared/src/index.js';

function esc(s: string): string {
  return s.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/"/g, '&quot;');
}

const W = 720;
const H = 360;
const M = { left: 70, right: 230, top: 30, bottom: 45 };
const COLOURS = ['#1f5fa8', '#b35806', '#1b7837', '#762a83', '#8c510a'];

function ticks(low: number, high: number, n: number): number[] {
  const step = 10 ** Math.floor(Math.log10((high - low) / n));
  const nice = [1, 2, 5, 10].map((m) => m * step).find((s) => (high - low) / s <= n) ?? 10 * step;
  const out: number[] = [];
  for (let v = Math.ceil(low / nice) * nice; v <= high + 1e-9 * nice; v += nice) out.push(+v.toPrecision(12));
  return out;
}

/** One chart as SVG. */
export function chartSvg(chart: Chart, id: string): string {
  const all = [...chart.series.flatMap((s) => s.points.map((p) => p[1])), ...chart.points.map((p) => p.stated)].filter((v) => Number.isFinite(v) && (!chart.logarithmic || v > 0));
  let yLow = chart.logarithmic ? Math.log10(Math.min(...all)) : 0;
  let yHigh = chart.logarithmic ? Math.log10(Math.max(...all)) : Math.max(...all) * 1.05;
  if (chart.logarithmic) {
    // From a decade below the lowest stated or computed point: the curves start at z → 0.
    const pointValues = chart.points.flatMap((p) => [p.stated, p.computed]).filter((v) => v > 0);
    yLow = Math.max(Math.floor(yLow), Math.floor(Math.log10(Math.min(...pointValues))) - 1);
    yHigh = Math.ceil(yHigh);
  }
  const px = (z: number) => M.left + ((W - M.left - M.right) * z) / chart.zMax;
  const py = (v: number) => {
    const y = chart.logarithmic ? Math.log10(Math.max(v, 10 ** yLow)) : v;
    return H - M.bottom - ((H - M.top - M.bottom) * (y - yLow)) / (yHigh - yLow || 1);
  };
  const parts: string[] = [`<svg xmlns="http://www.w3.org/2000/svg" class="chart" id="${id}" viewBox="0 0 ${W} ${H}" width="${W}" height="${H}" role="img" aria-label="${esc(chart.title)} against redshift">`];
  parts.push(`<text x="${M.left}" y="18" class="chart-title">${esc(chart.title)} (${esc(chart.unit)})</text>`);
  // Axes and grid.
  for (const z of ticks(0, chart.zMax, 8)) {
    parts.push(`<line x1="${px(z)}" y1="${M.top}" x2="${px(z)}" y2="${H - M.bottom}" class="grid"/><text x="${px(z)}" y="${H - M.bottom + 16}" text-anchor="middle" class="tick">${z}</text>`);
  }
  const yTicks = chart.logarithmic ? Array.from({ length: yHigh - yLow + 1 }, (_, i) => 10 ** (yLow + i)) : ticks(0, yHigh, 6);
  for (const v of yTicks) parts.push(`<line x1="${M.left}" y1="${py(v)}" x2="${W - M.right}" y2="${py(v)}" class="grid"/><text x="${M.left - 6}" y="${py(v) + 4}" text-anchor="end" class="tick">${+v.toPrecision(6)}</text>`);
  parts.push(`<line x1="${M.left}" y1="${H - M.bottom}" x2="${W - M.right}" y2="${H - M.bottom}" class="axis"/><line x1="${M.left}" y1="${M.top}" x2="${M.left}" y2="${H - M.bottom}" class="axis"/>`);
  parts.push(`<text x="${(M.left + W - M.right) / 2}" y="${H - 8}" text-anchor="middle" class="label">redshift z</text>`);
  parts.push(`<clipPath id="${id}-area"><rect x="${M.left}" y="${M.top}" width="${W - M.left - M.right}" height="${H - M.top - M.bottom}"/></clipPath>`);
  chart.series.forEach((s, i) => {
    const colour = COLOURS[i % COLOURS.length];
    const d = s.points.filter((p) => Number.isFinite(p[1])).map((p, k) => `${k ? 'L' : 'M'}${px(p[0]).toFixed(1)},${py(p[1]).toFixed(1)}`).join('');
    parts.push(`<path d="${d}" class="curve" data-kind="${s.kind}" stroke="${colour}" clip-path="url(#${id}-area)"/>`);
    parts.push(`<line x1="${W - M.right + 12}" y1="${M.top + 14 + 18 * i}" x2="${W - M.right + 30}" y2="${M.top + 14 + 18 * i}" stroke="${colour}" stroke-width="2"/><text x="${W - M.right + 34}" y="${M.top + 18 + 18 * i}" class="legend">${esc(s.label)}</text>`);
  });
  for (const p of chart.points) {
    const colour = COLOURS[chart.series.findIndex((s) => s.kind === p.kind) % COLOURS.length];
    const x = px(p.z).toFixed(1);
    const y = py(p.stated).toFixed(1);
    const title = `<title>${esc(kindTitle(p.kind))} at z = ${p.z}: stated ${significant(p.stated, 4)} ${esc(chart.unit)}, computed ${significant(p.computed, 4)} ${esc(chart.unit)} (${p.status})</title>`;
    if (p.status === 'inconsistent') {
      // A red cross, with a dotted line to where the curve is.
      parts.push(`<line x1="${x}" y1="${y}" x2="${x}" y2="${py(p.computed).toFixed(1)}" class="miss"/>`);
      parts.push(`<g class="claim-point inconsistent" data-claim="${p.index}">${title}<path d="M${+x - 6},${+y - 6}L${+x + 6},${+y + 6}M${+x - 6},${+y + 6}L${+x + 6},${+y - 6}" stroke="#c0141e" stroke-width="3"/></g>`);
    } else {
      parts.push(`<g class="claim-point consistent" data-claim="${p.index}">${title}<circle cx="${x}" cy="${y}" r="5" fill="${colour}" stroke="#fff" stroke-width="1.5"/></g>`);
    }
  }
  parts.push('</svg>');
  return parts.join('');
}

function row(f: LocatedCheck, c: ClaimCheck, index: number): string {
  const r = f.claimRange(c);
  const stated = `${c.claim.value.text}${c.unitText ? ` ${c.unitText}` : ''}`;
  const computed = c.computed === null ? '—' : `${significant(c.computed, c.claim.value.significantDigits + 1)}${c.unitText ? ` ${c.unitText}` : ''}`;
  const detail = c.status === 'inconsistent' ? c.slip?.description ?? '' : c.status === 'unchecked' ? c.reason ?? '' : c.onlyByFloor ? 'within the relative floor only' : '';
  const diff = c.relativeDifference === null || c.status !== 'inconsistent' ? '' : `${c.relativeDifference > 0 ? '+' : '−'}${significant(Math.abs(100 * c.relativeDifference), 2)} %`;
  return `<tr class="claim-row ${c.status}" data-claim="${index}"><td>${r.start.line + 1}:${r.start.character + 1}</td><td>${esc(kindTitle(c.claim.kind))}${esc(whereText(c))}</td><td class="num">${esc(stated)}</td><td class="num">${esc(computed)}</td><td class="verdict">${c.status}</td><td class="num">${diff}</td><td>${esc(detail)}</td></tr>`;
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
      ...f.check.extraction.problems.map((p) => `${p.severity}: ${esc(p.message)}`),
      ...f.check.findings.map((g) => `${g.severity}: ${esc(g.message)}`),
    ];
    const n = f.check.checks;
    return `<section class="file"><h2>${esc(f.path)}</h2>
<p>Parameter set: ${set ? `<code>${esc(set.text || '(unusable)')}</code> (${set.origin}${set.line !== undefined && set.line !== null ? `, line ${set.line + 1}` : ''})` : '<strong>none declared</strong>'} · ${n.length} claims: ${n.filter((c) => c.status === 'consistent').length} consistent, ${n.filter((c) => c.status === 'inconsistent').length} inconsistent, ${n.filter((c) => c.status === 'unchecked').length} unchecked</p>
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
<p class="note">Generated ${esc(meta.generated)} by Comove ${esc(meta.version)}. Comove checks that the numbers agree with the parameter set the manuscript declares; it does not check that the parameters or the numbers are scientifically right.</p>
<p class="summary"><span>${summary.files} file${summary.files === 1 ? '' : 's'}</span><span>${summary.claims} claims</span><span class="good">${summary.consistent} consistent</span><span class="bad">${summary.inconsistent} inconsistent</span><span>${summary.unchecked} unchecked</span></p>
${sections.join('\n')}
</body></html>
`;
}
