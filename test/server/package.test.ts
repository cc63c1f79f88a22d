/**
 * The installable extension: `npm run package` builds dist/comove-VERSION.vsix offline; the
 * server inside it starts and answers, and the manifest's commands, views and grammar exist.
 */
import { describe, expect, it } from 'vitest';
import { execFileSync } from 'node:child_process';
import { existsSync, readFileSync, statSync } from 'node:fs';
import { LspClient } from '../helpers/lspClient.js';

const ROOT = new URL('../../', import.meta.url).pathname;

describe('the .vsix package', () => {
  it('is built offline, small, and its server starts', async () => {
    execFileSync(process.execPath, ['scripts/package.mjs'], { cwd: ROOT, stdio: 'pipe' });
    const manifest = JSON.parse(readFileSync(ROOT + 'client/package.json', 'utf8'));
    const vsix = `${ROOT}dist/comove-${manifest.version}.vsix`;
    expect(existsSync(vsix)).toBe(true);
    const kb = statSync(vsix).size / 1024;
    console.log(`dist/comove-${manifest.version}.vsix: ${kb.toFixed(0)} kB`);
    expect(kb).toBeLessThan(1024);
    // Entry names are stored uncompressed in the zip's headers.
    const listing = readFileSync(vsix).toString('latin1');
    for (const f of ['extension/package.json', 'extension/dist/extension.cjs', 'extension/dist/server.mjs', 'extension/syntaxes/comove-directives.tmLanguage.json']) expect(listing).toContain(f);

    const client = new LspClient(`${ROOT}dist/vsix/dist/server.mjs`);
    const init = (await client.initialize(null)) as { serverInfo: { name: string } };
    expect(init.serverInfo.name).toBe('comove');
    expect(await client.shutdown()).toBe(0);
  }, 60_000);

  it("declares every command the extension registers, and its grammar file parses", () => {
    const manifest = JSON.parse(readFileSync(ROOT + 'client/package.json', 'utf8'));
    const source = readFileSync(ROOT + 'client/src/extension.ts', 'utf8');
    const registered = [...source.matchAll(/registerCommand\('([^']+)'/g)].map((m) => m[1]).sort();
    expect(manifest.contributes.commands.map((c: { command: string }) => c.command).sort()).toEqual(registered);
    expect(source).toContain(`createTreeView('${manifest.contributes.views.explorer[0].id}'`);
    const grammar = JSON.parse(readFileSync(ROOT + manifest.contributes.grammars[0].path.replace('./', ''), 'utf8'));
    expect(grammar.scopeName).toBe(manifest.contributes.grammars[0].scopeName);
    // The grammar's directive pattern matches our directive comments.
    const latex = new RegExp(grammar.repository['latex-directive'].match.replace(/\\\\/g, '\\'));
    expect(latex.test('% comove: H0=70 Omega_m=0.3 flat')).toBe(true);
    expect(latex.test('% a comment about comovement')).toBe(false);
  });
});
