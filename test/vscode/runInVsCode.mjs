/**
 * The packaged extension inside real VS Code (code-server 4.100.3 = VS Code 1.100, installed by
 * scripts/install-code-server.sh), driven through headless Chromium: `npm run test:vscode`.
 * Installs dist/comove-0.1.0.vsix into a fresh profile, opens the example manuscripts in a
 * scratch workspace, and checks what an author sees — the status bar, the problem count, the
 * code lens, the hover, the quick fix and its effect, the claims view, the chart — saving a
 * screenshot of each step in test-output/vscode-*.png. Exits 1 if any check fails.
 *
 * Not part of `npm test`: the editor takes minutes to install. Run it after changing client/ or
 * the server's protocol.
 */
import { spawn, spawnSync } from 'node:child_process';
import { cpSync, mkdirSync, mkdtempSync } from 'node:fs';
import { createRequire } from 'node:module';
import { createServer } from 'node:net';
import { tmpdir } from 'node:os';
import { join } from 'node:path';

const ROOT = new URL('../../', import.meta.url).pathname;
const TOOLS = join(ROOT, '.vscode-test');
const CODE_SERVER = join(TOOLS, 'node_modules/.bin/code-server');
const VSIX = join(ROOT, 'dist/comove-0.1.0.vsix');
const OUT = join(ROOT, 'test-output');
const { chromium } = createRequire(join(TOOLS, 'package.json'))('playwright-core');

const results = [];
function check(name, ok, detail = '') {
  results.push({ name, ok });
  console.log(`${ok ? '  ok  ' : '  FAIL'} ${name}${detail ? ` — ${detail}` : ''}`);
}

const freePort = () =>
  new Promise((resolve) => {
    const s = createServer();
    s.listen(0, '127.0.0.1', () => {
      const { port } = s.address();
      s.close(() => resolve(port));
    });
  });

const scratch = mkdtempSync(join(tmpdir(), 'comove-vscode-'));
const profile = join(scratch, 'profile');
const extensions = join(scratch, 'extensions');
const workspace = join(scratch, 'workspace');
mkdirSync(workspace);
mkdirSync(OUT, { recursive: true });
for (const f of ['kestrel-survey.tex', 'kestrel-proposal.md']) cpSync(join(ROOT, 'examples', f), join(workspace, f));

const install = spawnSync(CODE_SERVER, ['--user-data-dir', profile, '--extensions-dir', extensions, '--install-extension', VSIX], { encoding: 'utf8' });
check('the .vsix installs into VS Code', install.status === 0 && /successfully installed/.test(install.stdout), install.stdout.trim().split('\n').pop());

const port = await freePort();
const server = spawn(CODE_SERVER, ['--auth', 'none', '--bind-addr', `127.0.0.1:${port}`, '--user-data-dir', profile, '--extensions-dir', extensions, '--disable-telemetry', '--disable-workspace-trust', workspace], { stdio: 'ignore' });
const browser = await chromium.launch({ executablePath: '/usr/bin/chromium', args: ['--no-sandbox'] });
try {
  const page = await browser.newPage({ viewport: { width: 1500, height: 950 } });
  const shot = (name) => page.screenshot({ path: join(OUT, `vscode-${name}.png`) });
  const text = async (locator) => ((await locator.first().innerText({ timeout: 5000 }).catch(() => '')) ?? '').replace(/\s+/g, ' ').trim();
  const command = async (title) => {
    await page.keyboard.press('Control+Shift+P');
    await page.waitForTimeout(600);
    await page.keyboard.type(title);
    await page.waitForTimeout(900);
    await page.keyboard.press('Enter');
  };
  for (let i = 0; i < 60; i++) {
    try {
      await page.goto(`http://127.0.0.1:${port}/?folder=${workspace}`);
      break;
    } catch {
      await new Promise((r) => setTimeout(r, 500));
    }
  }
  await page.waitForSelector('.monaco-workbench', { timeout: 60_000 });
  await page.waitForTimeout(3000);

  // The LaTeX example: its declared set, ten inconsistent numbers (nine errors, one warning).
  await page.locator('.monaco-list-row', { hasText: 'kestrel-survey.tex' }).first().click();
  const status = page.locator('.statusbar-item', { hasText: 'Omega_m' });
  await status.first().waitFor({ timeout: 60_000 }).catch(() => undefined);
  await page.waitForTimeout(1500);
  check('status bar shows the declared set and the count', (await text(status)).includes('H0=70 Omega_m=0.3 flat · 10 ✗'), await text(status));
  const problems = await text(page.locator('[id="status.problems"]'));
  check('ten problems (nine errors, one warning)', problems === '9 1', problems);
  const lens = await text(page.locator('.contentWidgets .codelens-decoration, .codelens-decoration'));
  check('code lens on the declaration', lens.includes('31 numbers checked · 10 inconsistent'), lens);
  await shot('1-opened');

  // Hover and quick fix on the angular-diameter distance that is really a luminosity distance.
  const number = page.locator('.view-line span', { hasText: /^7\.60$/ }).first();
  await number.click();
  await page.keyboard.press('Control+K');
  await page.keyboard.press('Control+I');
  await page.waitForTimeout(1500);
  const hover = (await page.locator('.monaco-hover').allInnerTexts()).join(' ').replace(/\s+/g, ' ');
  check('hover explains the number', /Hogg 1999, eq\. 18/.test(hover) && /Likely slip: the stated value is the luminosity distance/.test(hover), hover.slice(0, 120));
  await shot('2-hover');
  await page.keyboard.press('Escape');
  await number.click();
  await page.keyboard.press('Control+.');
  await page.waitForTimeout(1500);
  const actions = await text(page.locator('.action-widget'));
  check('quick fixes offered', actions.includes('Replace with the recomputed value 1.69') && actions.includes('Silence Comove on this line'), actions);
  await shot('3-quick-fix');
  // The preferred fix is the first and focused one.
  await page.keyboard.press('Enter');
  await page.locator('.statusbar-item', { hasText: '· 9 ✗' }).first().waitFor({ timeout: 20_000 }).catch(() => undefined);
  check('the fix is applied and the count drops to nine', (await text(status)).includes('· 9 ✗'), await text(status));

  // The claims view.
  await command('Comove: Show the claims of this manuscript');
  const claimRows = page.locator('.pane', { has: page.locator('.pane-header', { hasText: 'Comove claims' }) }).locator('.monaco-list-row');
  await claimRows.first().waitFor({ timeout: 10_000 }).catch(() => undefined);
  const rows = await claimRows.allInnerTexts();
  check('claims view groups by verdict', rows[0]?.includes('Inconsistent (9)') ?? false, rows.slice(0, 2).join(' | ').replace(/\s+/g, ' '));
  await shot('4-claims');

  // The chart, in a webview (nested frames).
  await command("Comove: Show the chart of this manuscript's claims");
  await page.waitForTimeout(4000);
  let chart = '';
  for (const frame of page.frames()) {
    const html = await frame.content().catch(() => '');
    if (html.includes('Claims of kestrel-survey.tex')) chart = html;
  }
  check('chart webview shows the claims on the model curves', chart.includes('<svg') && chart.includes("default-src 'none'"), `${(chart.match(/<svg/g) ?? []).length} charts`);
  await shot('5-chart');

  // The Markdown example: its front matter declares the set.
  await page.locator('.monaco-list-row', { hasText: 'kestrel-proposal.md' }).first().click();
  await page.waitForTimeout(3000);
  const mdStatus = await text(page.locator('.statusbar-item', { hasText: '$(telescope)' }).or(page.locator('.statusbar-item', { hasText: 'H0=' })));
  check('Markdown manuscript checked too', /H0=/.test(mdStatus) && /✗/.test(mdStatus), mdStatus);
  await shot('6-markdown');
} catch (e) {
  check('the run finished', false, String(e).split('\n')[0]);
} finally {
  await browser.close();
  server.kill();
}
const failed = results.filter((r) => !r.ok).length;
console.log(`vscode: ${results.length - failed} passed, ${failed} failed (screenshots in test-output/vscode-*.png)`);
process.exit(failed ? 1 : 0);
