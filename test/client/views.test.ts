/**
 * The extension's code that needs no VS Code: the claims tree grouped by verdict, the status bar
 * text, and the chart page (rendered in headless Chromium for a screenshot at
 * test-output/chart-webview.png when Chromium is installed, as in CI).
 */
import { describe, expect, it } from 'vitest';
import { execFileSync } from 'node:child_process';
import { existsSync, mkdirSync, mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { groupClaims, statusText, type ClaimSummary } from '../../client/src/views/claimTree.js';
import { chartPage } from '../../client/src/views/chartPage.js';
import { chartData, checkFile, CosmologyCache, extractProject } from '../../shared/src/index.js';

const ROOT = new URL('../../', import.meta.url).pathname;

function claim(line: number, status: string, stated = '2.70', computed: number | null = 2.698): ClaimSummary {
  return { range: { start: { line, character: 4 }, end: { line, character: 9 } }, kind: 'luminosityDistance', title: `Luminosity distance at z = 0.48 — ${status}`, z: 0.48, stated, unit: 'Gpc', computed, status, slip: status === 'inconsistent' ? 'the stated value is the angular-diameter distance' : null, reason: status === 'unchecked' ? 'no redshift is stated for this number' : null };
}

describe('claims tree', () => {
  it('groups by verdict, inconsistent first, in document order, with the recomputed value', () => {
    const groups = groupClaims([claim(9, 'consistent'), claim(3, 'inconsistent', '1.65', 21.39), claim(1, 'inconsistent', '7.60', 1.6914), claim(5, 'unchecked', '3.1', null)]);
    expect(groups.map((g) => g.label)).toEqual(['Inconsistent (2)', 'Unchecked (1)', 'Consistent (1)']);
    expect(groups[0].items.map((i) => [i.line, i.label, i.description])).toEqual([
      [1, 'Luminosity distance at z = 0.48: 7.60 Gpc', '→ 1.691 Gpc'],
      [3, 'Luminosity distance at z = 0.48: 1.65 Gpc', '→ 21.39 Gpc'],
    ]);
    expect(groups[0].items[0].tooltip).toBe('the stated value is the angular-diameter distance');
    expect(groups[1].items[0].description).toBe('no redshift is stated for this number');
  });
  it('leaves out empty groups', () => expect(groupClaims([claim(1, 'consistent')]).map((g) => g.status)).toEqual(['consistent']));
});

describe('status bar', () => {
  it('shows the set and the number of inconsistencies', () => {
    const declared = statusText({ text: 'H0=70 Omega_m=0.3 flat', origin: 'declared' }, { claims: 3, checked: 2, inconsistent: 1 });
    expect(declared.text).toBe('$(telescope) H0=70 Omega_m=0.3 flat · 1 ✗');
    expect(declared.tooltip).toMatch(/2 numbers checked, 1 inconsistent/);
    expect(statusText(null, { claims: 1, checked: 0, inconsistent: 0 }).tooltip).toMatch(/^1 cosmology-dependent numbers, no declared parameter set: click to choose one/);
    expect(statusText({ text: 'H0=67.66 omega_b=0.02242 omega_c=0.11933 T_CMB=2.7255 flat', origin: 'declared' }, { claims: 0, checked: 0, inconsistent: 0 }).text).toBe('$(telescope) H0=67.66 omega_b=0.02242 omega_…');
  });
});

describe('chart page', () => {
  const text = readFileSync(ROOT + 'examples/kestrel-survey.tex', 'utf8');
  const f = checkFile(extractProject({ uri: 'kestrel-survey.tex', text }).files[0]);
  const made = new CosmologyCache().get(f.parameters!.input);
  if (!made.ok) throw new Error('set');
  const charts = chartData(f.checks, made.cosmology, (c) => c.parameters === f.parameters);
  const html = chartPage('Claims of kestrel-survey.tex', f.parameters!.text, charts, 'vscode-resource:');

  it('allows no script and no network, and draws every charted claim', () => {
    expect(html).toContain(`Content-Security-Policy" content="default-src 'none'`);
    expect(html).not.toMatch(/<script|https?:\/\/(?!www\.w3\.org\/2000\/svg)/);
    const points = charts.reduce((n, c) => n + c.points.length, 0);
    expect(html.match(/class="claim-point /g)).toHaveLength(points);
    expect(points).toBeGreaterThan(20);
  });

  it.skipIf(!existsSync('/usr/bin/chromium'))('renders in headless Chromium (screenshot in test-output/chart-webview.png)', () => {
    mkdirSync(ROOT + 'test-output', { recursive: true });
    const page = ROOT + 'test-output/chart-webview.html';
    writeFileSync(page, html);
    const profile = mkdtempSync(join(tmpdir(), 'comove-chromium-'));
    const flags = ['--headless', '--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync', `--user-data-dir=${profile}`];
    const dom = execFileSync('/usr/bin/chromium', [...flags, '--dump-dom', `file://${page}`], { encoding: 'utf8', stdio: ['ignore', 'pipe', 'ignore'], timeout: 60_000 });
    expect(dom.match(/<svg /g)).toHaveLength(charts.length);
    execFileSync('/usr/bin/chromium', [...flags, `--screenshot=${ROOT}test-output/chart-webview.png`, '--window-size=1000,1300', `file://${page}`], { stdio: 'ignore', timeout: 60_000 });
    expect(readFileSync(ROOT + 'test-output/chart-webview.png').subarray(1, 4).toString()).toBe('PNG');
  }, 120_000);
});
