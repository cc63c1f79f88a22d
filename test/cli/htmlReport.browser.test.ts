/**
 * The HTML report rendered by a real browser (Debian's chromium, headless; .ci/run installs it):
 * the DOM after rendering has a table row per claim and a chart point per charted claim, and a
 * PNG screenshot is saved for humans at test-output/report.png.
 */
import { describe, expect, it } from 'vitest';
import { execFileSync } from 'node:child_process';
import { existsSync, mkdirSync, mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { runWithFiles } from '../helpers/cli.js';

const ROOT = new URL('../../', import.meta.url).pathname;
const CHROMIUM = '/usr/bin/chromium';
const required = process.env.COMOVE_REQUIRE_BROWSER === '1';
const available = existsSync(CHROMIUM);

function chromium(args: string[]): string {
  const profile = mkdtempSync(join(tmpdir(), 'comove-chromium-'));
  return execFileSync(
    CHROMIUM,
    ['--headless', '--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync', `--user-data-dir=${profile}`, ...args],
    { encoding: 'utf8', stdio: ['ignore', 'pipe', 'ignore'], timeout: 60_000 },
  );
}

describe('HTML report in headless Chromium', () => {
  it('is required where CI says so', () => {
    if (required) expect(available, `${CHROMIUM} is missing: .ci/run installs Debian's chromium`).toBe(true);
  });

  it.skipIf(!available)('renders every claim row and chart point, and saves a screenshot', () => {
    const files = {
      'examples/kestrel-survey.tex': readFileSync(ROOT + 'examples/kestrel-survey.tex', 'utf8'),
      'examples/kestrel-proposal.md': readFileSync(ROOT + 'examples/kestrel-proposal.md', 'utf8'),
    };
    const html = runWithFiles(['check', 'examples', '--report', 'report.html'], files).written['report.html'];
    mkdirSync(ROOT + 'test-output', { recursive: true });
    const page = ROOT + 'test-output/report.html';
    writeFileSync(page, html);
    const dom = chromium(['--dump-dom', `file://${page}`]);
    expect(dom.match(/<tr class="claim-row (?:consistent|inconsistent|unchecked)"/g)).toHaveLength(49);
    expect(dom.match(/<tr class="claim-row inconsistent"/g)).toHaveLength(17);
    const points = dom.match(/<g class="claim-point (?:consistent|inconsistent)"/g) ?? [];
    // Distances, times and scales at a redshift are charted (angle-to-size claims and others are not).
    expect(points.length).toBeGreaterThanOrEqual(35);
    expect(dom).toContain('<svg');
    chromium(['--screenshot=' + ROOT + 'test-output/report.png', '--window-size=1200,2400', `file://${page}`]);
    expect(readFileSync(ROOT + 'test-output/report.png').subarray(1, 4).toString()).toBe('PNG');
  }, 120_000);
});
