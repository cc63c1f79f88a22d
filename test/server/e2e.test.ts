/**
 * The language server end to end, over stdio, with a real JSON-RPC client: diagnostics at the
 * expected ranges, hover, a quick fix applied and its diagnostic gone, a declaration edited and
 * the verdicts changed, an included file checked under its root's declaration, a configuration
 * change, hundreds of rapid edits ending with diagnostics that match the final text, and a
 * clean shutdown.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { cpSync, mkdirSync, mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';
import {
  CodeActionRequest,
  CodeActionResolveRequest,
  CodeLensRequest,
  DocumentSymbolRequest,
  HoverRequest,
  InlayHintRequest,
  type CodeAction,
  type MarkupContent,
  type TextEdit,
} from 'vscode-languageserver-protocol/node';
import { TextDocument } from 'vscode-languageserver-textdocument';
import { inconsistent, LspClient } from '../helpers/lspClient.js';
import { checkProject, extractProject } from '../../shared/src/index.js';

const ROOT = new URL('../../', import.meta.url).pathname;
let dir: string;
let client: LspClient;
const uriOf = (name: string) => pathToFileURL(join(dir, name)).href;
const survey = readFileSync(ROOT + 'examples/kestrel-survey.tex', 'utf8');

beforeAll(async () => {
  dir = mkdtempSync(join(tmpdir(), 'comove-lsp-'));
  cpSync(ROOT + 'examples/kestrel-survey.tex', join(dir, 'kestrel-survey.tex'));
  mkdirSync(join(dir, 'thesis/chapters'), { recursive: true });
  writeFileSync(join(dir, 'thesis/main.tex'), '\\documentclass{report}\n% comove: H0=70 Omega_m=0.3 flat\n\\begin{document}\n\\input{chapters/distances}\n\\end{document}\n');
  writeFileSync(join(dir, 'thesis/chapters/distances.tex'), 'At $z = 0.48$ the luminosity distance is 2.70\\,Gpc.\nAt $z = 1.12$ the angular-diameter distance is 7.60\\,Gpc.\n');
  client = new LspClient();
  const init = (await client.initialize(pathToFileURL(dir).href)) as { capabilities: Record<string, unknown>; serverInfo: { name: string } };
  expect(init.serverInfo.name).toBe('comove');
  expect(init.capabilities).toMatchObject({ hoverProvider: true, inlayHintProvider: true, documentSymbolProvider: true });
}, 30_000);

afterAll(async () => {
  if (client.process.exitCode === null) client.process.kill();
});

describe('language server over stdio', () => {
  it('publishes one diagnostic per inconsistent claim, at the claim, with our code and the declaration as related information', async () => {
    await client.open(uriOf('kestrel-survey.tex'), 'latex', survey);
    const p = await client.diagnostics(uriOf('kestrel-survey.tex'), (x) => x.diagnostics.length > 0);
    const wrong = inconsistent(p.diagnostics);
    expect(wrong).toHaveLength(10);
    const da = wrong.find((d) => d.range.start.line === 23)!;
    expect(da.range).toEqual({ start: { line: 23, character: 76 }, end: { line: 23, character: 86 } }); // 7.60$\,Gpc: the number and its unit
    expect(da.source).toBe('comove');
    expect(da.message).toMatch(/Angular-diameter distance at z = 1\.12: 7\.60 Gpc disagrees .* 1\.691 Gpc — the stated value is the luminosity distance/);
    expect(da.relatedInformation?.[0].location.range.start.line).toBe(13);
  });

  it('hovers on a claim with the explanation, and on the declaration with the set', async () => {
    const hover = await client.connection.sendRequest(HoverRequest.type, { textDocument: { uri: uriOf('kestrel-survey.tex') }, position: { line: 23, character: 78 } });
    const md = (hover!.contents as MarkupContent).value;
    expect(md).toContain('**Angular-diameter distance** at z = 1.12 — **inconsistent**');
    expect(md).toContain('Hogg 1999, eq. 18');
    const onDeclaration = await client.connection.sendRequest(HoverRequest.type, { textDocument: { uri: uriOf('kestrel-survey.tex') }, position: { line: 13, character: 12 } });
    expect((onDeclaration!.contents as MarkupContent).value).toMatch(/H0=70 Omega_m=0\.3 flat[\s\S]*31 numbers checked · 10 inconsistent/);
  });

  it('offers inlay hints, a code lens and document symbols', async () => {
    const uri = uriOf('kestrel-survey.tex');
    const hints = await client.connection.sendRequest(InlayHintRequest.type, { textDocument: { uri }, range: { start: { line: 0, character: 0 }, end: { line: 60, character: 0 } } });
    expect(hints).toHaveLength(10);
    // A hint stands after the markup that closes around the unit, never inside it: after the
    // `}$` of "17.4\,kpc\,arcsec$^{-1}$" (line 26), right after "7.60$\,Gpc" (line 24).
    const lineText = (n: number) => survey.split('\n')[n];
    const at = (line: number) => hints!.find((h) => h.position.line === line)!.position.character;
    expect(lineText(25).slice(0, at(25))).toMatch(/17\.4\\,kpc\\,arcsec\$\^\{-1\}\$$/);
    expect(lineText(23).slice(0, at(23))).toMatch(/7\.60\$\\,Gpc$/);
    const lenses = await client.connection.sendRequest(CodeLensRequest.type, { textDocument: { uri } });
    expect(lenses?.[0].command?.title).toBe('H0=70 Omega_m=0.3 flat · 31 numbers checked · 10 inconsistent');
    const symbols = (await client.connection.sendRequest(DocumentSymbolRequest.type, { textDocument: { uri } })) as Array<{ name: string }>;
    expect(symbols).toHaveLength(31);
    const claims = (await client.connection.sendRequest('comove/documentClaims', { uri })) as { claims: unknown[]; charts: Array<{ title: string }> };
    expect(claims.claims).toHaveLength(31);
    expect(claims.charts.map((c) => c.title)).toEqual(['Distances', 'Times', 'Angular scales']);
    // The status bar's request: counts only.
    const light = (await client.connection.sendRequest('comove/documentClaims', { uri, claims: false, charts: false })) as { counts: unknown; claims: unknown[]; charts: unknown[] };
    expect(light).toMatchObject({ counts: { claims: 31, checked: 31, inconsistent: 10 }, claims: [], charts: [] });
  });

  it('applies the quick fix and the diagnostic disappears', async () => {
    const uri = uriOf('kestrel-survey.tex');
    const before = inconsistent((await client.diagnostics(uri)).diagnostics);
    const target = before.find((d) => d.range.start.line === 23)!;
    const actions = (await client.connection.sendRequest(CodeActionRequest.type, { textDocument: { uri }, range: target.range, context: { diagnostics: [target] } })) as CodeAction[];
    expect(actions.map((a) => a.title)).toEqual(['Replace with the recomputed value 1.69', 'Silence Comove on this line']);
    const edit = actions[0].edit!.changes![uri][0] as TextEdit;
    expect(edit).toEqual({ range: { start: { line: 23, character: 76 }, end: { line: 23, character: 80 } }, newText: '1.69' });
    const version = await client.change(uri, [{ range: edit.range, text: edit.newText }]);
    const after = await client.diagnostics(uri, (p) => p.version === version);
    expect(inconsistent(after.diagnostics)).toHaveLength(9);
    expect(inconsistent(after.diagnostics).some((d) => d.range.start.line === 23)).toBe(false);
  });

  it('silences a line with the directive it inserts', async () => {
    const uri = uriOf('kestrel-survey.tex');
    const target = inconsistent((await client.diagnostics(uri)).diagnostics).find((d) => d.range.start.line === 46)!;
    const actions = (await client.connection.sendRequest(CodeActionRequest.type, { textDocument: { uri }, range: target.range, context: { diagnostics: [target] } })) as CodeAction[];
    const silence = actions.find((a) => a.title === 'Silence Comove on this line')!;
    const edit = silence.edit!.changes![uri][0] as TextEdit;
    expect(edit.newText).toBe('% comove: skip-next-line\n');
    let version = await client.change(uri, [{ range: edit.range, text: edit.newText }]);
    const after = await client.diagnostics(uri, (p) => p.version === version);
    expect(inconsistent(after.diagnostics)).toHaveLength(8);
    expect(inconsistent(after.diagnostics).some((d) => d.range.start.line === 47)).toBe(false);
    // Take the directive out again for the next tests.
    version = await client.change(uri, [{ range: { start: { line: 46, character: 0 }, end: { line: 47, character: 0 } }, text: '' }]);
    expect(inconsistent((await client.diagnostics(uri, (p) => p.version === version)).diagnostics)).toHaveLength(9);
  });

  it('changes verdicts when the declaration is edited', async () => {
    const uri = uriOf('kestrel-survey.tex');
    const line = 13; // % comove: H0=70 Omega_m=0.3 flat
    const old = '% comove: H0=70 Omega_m=0.3 flat';
    const version = await client.change(uri, [{ range: { start: { line, character: 0 }, end: { line, character: old.length } }, text: '% comove: planck-2018' }]);
    const p = await client.diagnostics(uri, (x) => x.version === version);
    expect(inconsistent(p.diagnostics).some((d) => d.range.start.line === 40)).toBe(false);
    // The numbers that were computed with the Planck 2018 set now agree; the others do not.
    expect(inconsistent(p.diagnostics).some((d) => d.range.start.line === 26)).toBe(false);
    expect(inconsistent(p.diagnostics).length).toBeGreaterThan(9);
    const lens = await client.connection.sendRequest(CodeLensRequest.type, { textDocument: { uri } });
    expect(lens?.[0].command?.title).toMatch(/^H0=67\.66 omega_b=0\.02242/);
  });

  it('offers a migration on the declaration, resolved into a workspace edit', async () => {
    const uri = uriOf('kestrel-survey.tex');
    const actions = (await client.connection.sendRequest(CodeActionRequest.type, { textDocument: { uri }, range: { start: { line: 13, character: 3 }, end: { line: 13, character: 3 } }, context: { diagnostics: [] } })) as CodeAction[];
    const migrate = actions.find((a) => a.title === 'Rewrite the manuscript for the parameter set flat-70-0.3')!;
    expect(migrate).toBeDefined();
    const resolved = await client.connection.sendRequest(CodeActionResolveRequest.type, migrate);
    const edits = resolved.edit!.changes![uri];
    expect(edits.find((e) => e.range.start.line === 13)?.newText).toMatch(/^ H0=70 Omega_m=0\.3 .*flat$/);
  });

  it('checks an included file under its root declaration when opened on its own', async () => {
    const uri = uriOf('thesis/chapters/distances.tex');
    await client.open(uri, 'latex', readFileSync(join(dir, 'thesis/chapters/distances.tex'), 'utf8'));
    const p = await client.diagnostics(uri, (x) => x.diagnostics.length > 0);
    expect(p.diagnostics.map((d) => [d.code, d.range.start.line])).toEqual([['CMV101', 1]]);
  });

  it('re-checks the children when the root is edited', async () => {
    const root = uriOf('thesis/main.tex');
    const child = uriOf('thesis/chapters/distances.tex');
    await client.open(root, 'latex', readFileSync(join(dir, 'thesis/main.tex'), 'utf8'));
    await client.diagnostics(root);
    // Declare the Planck 2018 set instead: the chapter's 2.70 Gpc at z = 0.48 no longer agrees.
    await client.change(root, [{ range: { start: { line: 1, character: 0 }, end: { line: 1, character: 32 } }, text: '% comove: planck-2018' }]);
    const p = await client.diagnostics(child, (x) => x.diagnostics.some((d) => d.range.start.line === 0), 20_000, true);
    expect(p.diagnostics.map((d) => d.range.start.line).sort()).toEqual([0, 1]);
    await client.change(root, [{ range: { start: { line: 1, character: 0 }, end: { line: 1, character: 21 } }, text: '% comove: H0=70 Omega_m=0.3 flat' }]);
    await client.diagnostics(child, (x) => x.diagnostics.length === 1, 20_000, true);
  });

  it('never reads an included file outside the workspace folders', async () => {
    const outside = mkdtempSync(join(tmpdir(), 'comove-outside-'));
    writeFileSync(join(outside, 'secret.tex'), 'At $z = 0.48$ the luminosity distance is 9.99\\,Gpc.\n');
    const uri = uriOf('escape.tex');
    const relative = join('..', outside.split('/').pop()!, 'secret');
    await client.open(uri, 'latex', `\\documentclass{article}\n% comove: flat-70-0.3\n\\begin{document}\n\\input{${relative}}\n\\end{document}\n`);
    const p = await client.diagnostics(uri, (x) => x.diagnostics.length > 0);
    expect(p.diagnostics.map((d) => d.message)).toEqual([`\\input{${relative}}: the file cannot be found`]);
  });

  it('says once, at the top, when a manuscript with claims declares no parameter set', async () => {
    const uri = uriOf('undeclared.md');
    await client.open(uri, 'markdown', '# Notes\n\nAt $z = 1.9$ the luminosity distance is 14.6 Gpc and the lookback time 10.1 Gyr.\n');
    const p = await client.diagnostics(uri, (x) => x.diagnostics.length > 0);
    expect(p.diagnostics.map((d) => [d.code, d.severity, d.range.start.line])).toEqual([['CMV201', 3, 0]]);
    const actions = (await client.connection.sendRequest(CodeActionRequest.type, { textDocument: { uri }, range: { start: { line: 0, character: 0 }, end: { line: 0, character: 0 } }, context: { diagnostics: p.diagnostics } })) as CodeAction[];
    expect(actions.map((a) => a.title)).toEqual(['Declare the parameter set flat-70-0.3', 'Declare the parameter set planck-2018']);
    expect((actions[0].edit!.changes![uri][0] as TextEdit).newText).toBe('<!-- comove: flat-70-0.3 -->\n');
  });

  it('re-checks open documents when the configuration changes', async () => {
    const uri = uriOf('thesis/chapters/distances.tex');
    await client.changeConfiguration({ inconsistentSeverity: 'information' });
    const p = await client.diagnostics(uri, (x) => x.diagnostics.length === 1 && x.diagnostics[0].severity === 3, 20_000, true);
    expect(p.diagnostics[0].severity).toBe(3);
    await client.changeConfiguration({});
    await client.diagnostics(uri, (x) => x.diagnostics.length === 1 && x.diagnostics[0].severity === 1, 20_000, true);
  });

  it('ends hundreds of rapid edits with diagnostics that match the final text', async () => {
    const uri = uriOf('rapid.tex');
    let text = '% comove: H0=70 Omega_m=0.3 flat\nAt $z = 0.48$ the luminosity distance is 2.70\\,Gpc.\n';
    await client.open(uri, 'latex', text);
    await client.diagnostics(uri);
    let doc = TextDocument.create(uri, 'latex', 1, text);
    const sentence = 'At $z = 1.12$ the angular-diameter distance is 7.60\\,Gpc. ';
    let version = 1;
    for (let i = 0; i < 300; i++) {
      // Type a sentence character by character at the end, with a few deletions on the way.
      const ch = sentence[i % sentence.length];
      const end = doc.positionAt(doc.getText().length);
      const change = i % 37 === 36 ? { range: { start: doc.positionAt(doc.getText().length - 1), end }, text: '' } : { range: { start: end, end }, text: ch };
      version = await client.change(uri, [change]);
      doc = TextDocument.update(doc, [change], version);
    }
    text = doc.getText();
    const expected = checkProject(extractProject({ uri, text }).files)[0].checks.filter((c) => c.status === 'inconsistent').length;
    const final = await client.diagnostics(uri, (p) => p.version === version, 20_000);
    expect(inconsistent(final.diagnostics)).toHaveLength(expected);
    expect(expected).toBeGreaterThan(0);
    // Nothing older is published after the final version.
    const last = client.published.filter((x) => x.params.uri === uri).pop()!;
    expect(last.params.version).toBe(version);
  }, 60_000);

  it('survives bad input: binary text, unbalanced math and braces, a huge line', async () => {
    const binary = uriOf('binary.tex');
    await client.open(binary, 'latex', 'PK\u0003\u0004\u0000\u0000garbage\u0000');
    expect((await client.diagnostics(binary, (p) => p.diagnostics.length > 0)).diagnostics[0].message).toMatch(/binary file/);
    const broken = uriOf('broken.tex');
    await client.open(broken, 'latex', '% comove: flat-70-0.3\nAt $z = 0.48 the luminosity distance is {2.70\\,Gpc.\n\n' + 'x'.repeat(200_000) + '\n');
    const p = await client.diagnostics(broken, (x) => x.diagnostics.length > 0);
    expect(p.diagnostics.some((d) => /unbalanced|not closed/.test(typeof d.message === 'string' ? d.message : d.message.value))).toBe(true);
    // The server still answers.
    const hover = await client.connection.sendRequest(HoverRequest.type, { textDocument: { uri: broken }, position: { line: 1, character: 3 } });
    expect(hover === null || typeof hover === 'object').toBe(true);
  });

  it('shuts down cleanly', async () => {
    expect(await client.shutdown()).toBe(0);
  });
});
