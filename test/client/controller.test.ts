/**
 * The extension's logic (client/src/controller.ts) against the real language server over stdio,
 * with a recording editor in place of VS Code: the editor keeps documents in memory, sends every
 * change to the server as VS Code would, and records what the extension shows. Only the binding
 * of the two ports to the VS Code API (client/src/extension.ts) is not run here.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';
import { TextDocument } from 'vscode-languageserver-textdocument';
import { ExtensionController, OTHER_SET, type DocumentRef, type EditorPort, type ServerPort, type WorkspaceEdit } from '../../client/src/controller.js';
import type { ClaimGroup } from '../../client/src/views/claimTree.js';
import type { DocumentClaimsResult, MigrateResult } from '../../server/src/protocol.js';
import { inconsistent, LspClient } from '../helpers/lspClient.js';

const ROOT = new URL('../../', import.meta.url).pathname;

/** An editor that records what the extension does and answers its questions from a script. */
class RecordingEditor implements EditorPort {
  readonly docs = new Map<string, TextDocument>();
  active: string | undefined;
  status: { text: string; tooltip: string } | null = null;
  claims: { uri: string | undefined; groups: ClaimGroup[] } | null = null;
  readonly messages: string[] = [];
  readonly pages: Array<{ title: string; html: string }> = [];
  readonly defaults: string[] = [];
  answers: Array<string | undefined> = [];
  problemsShown = 0;
  treeVisible = true;
  /** The claims each documentClaims request asked for. */
  readonly requests: Array<{ claims: boolean; charts: boolean }> = [];

  constructor(private readonly client: LspClient, private readonly folder: string) {}

  async open(uri: string, text: string, show = true): Promise<void> {
    const languageId = uri.endsWith('.md') ? 'markdown' : uri.endsWith('.tex') ? 'latex' : 'plaintext';
    this.docs.set(uri, TextDocument.create(uri, languageId, 1, text));
    await this.client.open(uri, languageId, text);
    if (show) this.active = uri;
  }

  activeDocument(): DocumentRef | undefined {
    const doc = this.active ? this.docs.get(this.active) : undefined;
    return doc && { uri: doc.uri, languageId: doc.languageId, label: doc.uri.slice(doc.uri.lastIndexOf('/') + 1) };
  }
  setStatus(s: { text: string; tooltip: string } | null): void {
    this.status = s;
  }
  showClaims(uri: string | undefined, groups: ClaimGroup[]): void {
    this.claims = { uri, groups };
  }
  claimsVisible(): boolean {
    return this.treeVisible;
  }
  pick(items: readonly string[]): Promise<string | undefined> {
    const answer = this.answers.shift();
    if (answer !== undefined && !items.includes(answer)) throw new Error(`${answer} is not offered`);
    return Promise.resolve(answer);
  }
  input(): Promise<string | undefined> {
    return Promise.resolve(this.answers.shift());
  }
  async applyEdit(edit: WorkspaceEdit): Promise<boolean> {
    for (const [uri, edits] of Object.entries(edit.changes)) {
      const doc = this.docs.get(uri);
      if (!doc) return false;
      const text = TextDocument.applyEdits(doc, edits);
      const version = await this.client.change(uri, [{ text }]);
      this.docs.set(uri, TextDocument.create(uri, doc.languageId, version, text));
    }
    return true;
  }
  setDefaultParameters(text: string): Promise<void> {
    this.defaults.push(text);
    return Promise.resolve();
  }
  showPage(title: string, html: (cspSource: string) => string): void {
    this.pages.push({ title, html: html('vscode-resource:') });
  }
  info(message: string): void {
    this.messages.push(message);
  }
  error(message: string): void {
    this.messages.push(`error: ${message}`);
  }
  findManuscripts(): Promise<string[]> {
    return Promise.resolve(['kestrel-survey.tex', 'kestrel-proposal.md'].map((f) => pathToFileURL(join(this.folder, f)).href));
  }
  async openInBackground(uri: string): Promise<void> {
    if (!this.docs.has(uri)) await this.open(uri, readFileSync(new URL(uri), 'utf8'), false);
  }
  showProblems(): void {
    this.problemsShown++;
  }
}

let client: LspClient;
let editor: RecordingEditor;
let controller: ExtensionController;
let folder: string;

beforeAll(async () => {
  folder = mkdtempSync(join(tmpdir(), 'comove-extension-'));
  for (const f of ['kestrel-survey.tex', 'kestrel-proposal.md']) writeFileSync(join(folder, f), readFileSync(join(ROOT, 'examples', f)));
  writeFileSync(join(folder, 'undeclared.tex'), '\\documentclass{article}\n\\begin{document}\nThe pair KDF-7 lies at $z = 0.73$, where the luminosity distance is 4.5\\,Gpc.\n\\end{document}\n');
  client = new LspClient();
  await client.initialize(pathToFileURL(folder).href);
  editor = new RecordingEditor(client, folder);
  const server: ServerPort = {
    documentClaims: (uri, want) => {
      editor.requests.push(want);
      return client.connection.sendRequest<DocumentClaimsResult | null>('comove/documentClaims', { uri, ...want });
    },
    migrate: (uri, to) => client.connection.sendRequest<MigrateResult>('comove/migrate', { uri, to }),
  };
  controller = new ExtensionController(server, editor);
});

afterAll(async () => {
  await client.shutdown();
});

const uriOf = (f: string) => pathToFileURL(join(folder, f)).href;

describe('the extension against the language server', () => {
  it('shows the active manuscript’s set in the status bar and its claims grouped by verdict', async () => {
    await editor.open(uriOf('kestrel-survey.tex'), readFileSync(join(folder, 'kestrel-survey.tex'), 'utf8'));
    const published = await client.diagnostics(uriOf('kestrel-survey.tex'));
    await controller.refresh();
    const wrong = inconsistent(published.diagnostics).length;
    expect(wrong).toBeGreaterThan(0);
    expect(editor.status?.text).toBe(`$(telescope) H0=70 Omega_m=0.3 flat · ${wrong} ✗`);
    expect(editor.claims?.uri).toBe(uriOf('kestrel-survey.tex'));
    expect(editor.claims?.groups[0].label).toBe(`Inconsistent (${wrong})`);
    // Each inconsistent item sits where its diagnostic is.
    expect(editor.claims?.groups[0].items.map((i) => i.line).sort((a, b) => a - b)).toEqual(inconsistent(published.diagnostics).map((d) => d.range.start.line).sort((a, b) => a - b));
  });

  it('while the claims view is hidden, refreshing asks for the counts alone and leaves the tree as it is', async () => {
    editor.treeVisible = false;
    editor.claims = null;
    await controller.refresh();
    expect(editor.requests.at(-1)).toEqual({ claims: false, charts: false });
    expect(editor.status?.text).toMatch(/· 10 ✗$/);
    expect(editor.claims).toBeNull();
    editor.treeVisible = true;
    await controller.refresh();
    expect(editor.requests.at(-1)).toEqual({ claims: true, charts: false });
    expect((editor.claims as { groups: ClaimGroup[] } | null)?.groups[0].label).toBe('Inconsistent (10)');
  });

  it('hides the status bar and empties the tree for a document that is not a manuscript', async () => {
    const uri = uriOf('notes.txt');
    editor.docs.set(uri, TextDocument.create(uri, 'plaintext', 1, 'shopping list'));
    editor.active = uri;
    await controller.refresh();
    expect(editor.status).toBeNull();
    expect(editor.claims).toEqual({ uri: undefined, groups: [] });
    editor.active = uriOf('kestrel-survey.tex');
  });

  it('opens the chart of the active manuscript with a page that allows no script', async () => {
    await controller.showChart();
    const page = editor.pages.at(-1)!;
    expect(page.title).toBe('Comove: kestrel-survey.tex');
    expect(page.html).toContain("default-src 'none'");
    expect(page.html).not.toMatch(/<script/i);
    expect(page.html.match(/<svg/g)?.length ?? 0).toBeGreaterThan(0);
  });

  it('choosing another set for a manuscript that declares one rewrites the manuscript, keeping its consistent numbers consistent', async () => {
    const uri = uriOf('kestrel-survey.tex');
    const before = (await client.connection.sendRequest<DocumentClaimsResult>('comove/documentClaims', { uri })).claims;
    editor.answers = ['planck-2018'];
    await controller.chooseParameterSet();
    expect(editor.messages.at(-1)).toMatch(/^Comove: rewritten for planck-2018/);
    const text = editor.docs.get(uri)!.getText();
    expect(text).toContain('% comove: H0=67.66 ');
    const after = await client.connection.sendRequest<DocumentClaimsResult>('comove/documentClaims', { uri });
    expect(after.parameters?.text).toMatch(/H0=67\.66/);
    // Rewritten numbers keep their lines (no edit breaks a line): a claim is known by line, kind and redshift.
    const id = (c: DocumentClaimsResult['claims'][number]) => `${c.range.start.line}|${c.kind}|${c.z}`;
    const consistentAfter = new Set(after.claims.filter((c) => c.status === 'consistent').map(id));
    const consistentBefore = before.filter((c) => c.status === 'consistent').map(id);
    expect(consistentBefore.length).toBeGreaterThan(10);
    expect(consistentBefore.filter((c) => !consistentAfter.has(c))).toEqual([]);
    expect(editor.defaults).toEqual([]);
  });

  it('a migration the server refuses is reported, and nothing is edited', async () => {
    const uri = uriOf('kestrel-survey.tex');
    const text = editor.docs.get(uri)!.getText();
    editor.answers = [OTHER_SET, 'H0=-5 Omega_m=0.3'];
    await controller.chooseParameterSet();
    expect(editor.messages.at(-1)).toMatch(/^error: Comove: /);
    expect(editor.docs.get(uri)!.getText()).toBe(text);
  });

  it('for a manuscript that declares no set, the choice becomes the default, and the server checks with it', async () => {
    const uri = uriOf('undeclared.tex');
    await editor.open(uri, readFileSync(join(folder, 'undeclared.tex'), 'utf8'));
    await client.diagnostics(uri);
    await controller.refresh();
    expect(editor.status?.text).toBe('$(telescope) Comove: no parameter set');
    editor.answers = ['flat-70-0.3'];
    await controller.chooseParameterSet();
    expect(editor.defaults).toEqual(['flat-70-0.3']);
    // VS Code passes the setting on; the server re-checks with it.
    await client.changeConfiguration({ defaultParameters: editor.defaults[0] });
    await client.diagnostics(uri, (p) => !p.diagnostics.some((d) => d.code === 'CMV201'), 20_000, true);
    await controller.refresh();
    expect(editor.status?.text).toMatch(/^\$\(telescope\) H0=70 Omega_m=0\.3/);
    expect(editor.claims?.groups.map((g) => g.status)).toEqual(['consistent']);
  });

  it('checking the workspace opens each manuscript, and the server checks every one', async () => {
    const opened = await controller.checkWorkspace();
    expect(opened).toBe(2);
    expect(editor.problemsShown).toBe(1);
    const proposal = await client.diagnostics(uriOf('kestrel-proposal.md'));
    expect(inconsistent(proposal.diagnostics).length).toBeGreaterThan(0);
  });

  it('migrating with no manuscript open says so', async () => {
    editor.active = undefined;
    await controller.migrateManuscript();
    expect(editor.messages.at(-1)).toBe('Comove: open a LaTeX or Markdown manuscript first.');
  });
});
