/**
 * One chart of quantity against redshift as inline SVG (no script): model curves, stated values
 * that agree as dots, values that disagree as red crosses with a dotted line to the curve. Used
 * by the HTML report and by the editor's chart view.
 */

import type { Chart } from '../../../shared/src/check/chartData.js';
import { kindTitle, significant } from '../../../shared/src/check/explain.js';

/** Text for HTML and SVG, with &, <, > and " escaped. */
export function escapeHtml(s: string): string {
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
  const parts: string[] = [`<svg xmlns="http://www.w3.org/2000/svg" class="chart" id="${id}" viewBox="0 0 ${W} ${H}" width="${W}" height="${H}" role="img" aria-label="${escapeHtml(chart.title)} against redshift">`];
  parts.push(`<text x="${M.left}" y="18" class="chart-title">${escapeHtml(chart.title)} (${escapeHtml(chart.unit)})</text>`);
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
    parts.push(`<line x1="${W - M.right + 12}" y1="${M.top + 14 + 18 * i}" x2="${W - M.right + 30}" y2="${M.top + 14 + 18 * i}" stroke="${colour}" stroke-width="2"/><text x="${W - M.right + 34}" y="${M.top + 18 + 18 * i}" class="legend">${escapeHtml(s.label)}</text>`);
  });
  for (const p of chart.points) {
    const colour = COLOURS[chart.series.findIndex((s) => s.kind === p.kind) % COLOURS.length];
    const x = px(p.z).toFixed(1);
    const y = py(p.stated).toFixed(1);
    const title = `<title>${escapeHtml(kindTitle(p.kind))} at z = ${p.z}: stated ${significant(p.stated, 4)} ${escapeHtml(chart.unit)}, computed ${significant(p.computed, 4)} ${escapeHtml(chart.unit)} (${p.status})</title>`;
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

