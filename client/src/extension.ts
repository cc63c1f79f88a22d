/**
 * Comove's VS Code extension: starts the language server and adds what a language server cannot
 * show — a status bar item with the document's parameter set, a tree of the document's claims
 * grouped by verdict, a chart of the claims against the model curves, and commands to check the
 * workspace, choose a parameter set and migrate a manuscript. No cosmology and no parsing here.
 */

import * as vscode from 'vscode';
import { LanguageClient, TransportKind, type LanguageClientOptions, type ServerOptions } from 'vscode-languageclient/node';
import { chartPage } from './views/chartPage.js';
import type { DocumentClaimsResult as DocumentClaims, MigrateResult } from '../../server/src/protocol.js';
import { groupClaims, statusText, type ClaimGroup } from './views/claimTree.js';


const PRESET_NAMES = ['planck-2018', 'planck-2018-cmb', 'planck-2015', 'wmap-9', 'flat-70-0.3'];
let client: LanguageClient | undefined;

function manuscript(editor: vscode.TextEditor | undefined): vscode.TextDocument | undefined {
  const doc = editor?.document;
  return doc && ['latex', 'tex', 'markdown'].includes(doc.languageId) ? doc : undefined;
}

async function claimsOf(doc: vscode.TextDocument | undefined): Promise<DocumentClaims | null> {
  if (!doc || !client) return null;
  return (await client.sendRequest<DocumentClaims | null>('comove/documentClaims', { uri: doc.uri.toString() })) ?? null;
}

type Node = { group: ClaimGroup } | { item: ClaimGroup['items'][number]; uri: vscode.Uri };

class ClaimsView implements vscode.TreeDataProvider<Node> {
  private readonly changed = new vscode.EventEmitter<void>();
  readonly onDidChangeTreeData = this.changed.event;
  private groups: ClaimGroup[] = [];
  private uri: vscode.Uri | undefined;

  /** Shows the claims of `doc` (as the server returned them for the status bar: asked for once). */
  show(doc: vscode.TextDocument | undefined, claims: DocumentClaims | null): void {
    this.uri = doc?.uri;
    this.groups = claims ? groupClaims(claims.claims) : [];
    this.changed.fire();
  }

  getTreeItem(node: Node): vscode.TreeItem {
    if ('group' in node) {
      const item = new vscode.TreeItem(node.group.label, node.group.status === 'consistent' ? vscode.TreeItemCollapsibleState.Collapsed : vscode.TreeItemCollapsibleState.Expanded);
      item.iconPath = new vscode.ThemeIcon(node.group.status === 'inconsistent' ? 'error' : node.group.status === 'unchecked' ? 'question' : 'pass');
      return item;
    }
    const item = new vscode.TreeItem(node.item.label, vscode.TreeItemCollapsibleState.None);
    item.description = node.item.description;
    item.tooltip = node.item.tooltip;
    const position = new vscode.Position(node.item.line, node.item.character);
    item.command = { title: 'Reveal', command: 'vscode.open', arguments: [node.uri, { selection: new vscode.Range(position, position) }] };
    return item;
  }

  getChildren(node?: Node): Node[] {
    if (!node) return this.groups.map((group) => ({ group }));
    if ('group' in node && this.uri) return node.group.items.map((item) => ({ item, uri: this.uri! }));
    return [];
  }
}

export async function activate(context: vscode.ExtensionContext): Promise<void> {
  const serverModule = context.asAbsolutePath('dist/server.mjs');
  const serverOptions: ServerOptions = {
    run: { module: serverModule, transport: TransportKind.ipc },
    debug: { module: serverModule, transport: TransportKind.ipc },
  };
  const clientOptions: LanguageClientOptions = {
    documentSelector: [
      { scheme: 'file', language: 'latex' },
      { scheme: 'file', language: 'tex' },
      { scheme: 'file', language: 'markdown' },
      { scheme: 'untitled', language: 'latex' },
      { scheme: 'untitled', language: 'markdown' },
    ],
    synchronize: { configurationSection: 'comove' },
  };
  client = new LanguageClient('comove', 'Comove', serverOptions, clientOptions);
  await client.start();

  const view = new ClaimsView();
  context.subscriptions.push(vscode.window.registerTreeDataProvider('comove.claims', view));
  const status = vscode.window.createStatusBarItem(vscode.StatusBarAlignment.Left, 50);
  status.command = 'comove.chooseParameterSet';
  context.subscriptions.push(status);

  const refresh = async () => {
    const doc = manuscript(vscode.window.activeTextEditor);
    if (!doc) {
      status.hide();
      view.show(undefined, null);
      return;
    }
    const claims = await claimsOf(doc);
    const s = statusText(claims?.parameters ?? null, claims?.claims ?? []);
    status.text = s.text;
    status.tooltip = s.tooltip;
    status.show();
    view.show(doc, claims);
  };
  let pending: NodeJS.Timeout | undefined;
  const refreshSoon = () => {
    if (pending) clearTimeout(pending);
    pending = setTimeout(() => void refresh(), 150);
  };
  context.subscriptions.push(
    vscode.window.onDidChangeActiveTextEditor(refreshSoon),
    vscode.languages.onDidChangeDiagnostics(refreshSoon),
  );
  refreshSoon();

  const migrate = async (doc: vscode.TextDocument, to: string) => {
    const result = await client!.sendRequest<MigrateResult>('comove/migrate', { uri: doc.uri.toString(), to });
    if ('error' in result) {
      void vscode.window.showErrorMessage(`Comove: ${result.error}`);
      return;
    }
    const edit = await client!.protocol2CodeConverter.asWorkspaceEdit(result.edit);
    if (edit && (await vscode.workspace.applyEdit(edit))) {
      void vscode.window.showInformationMessage(`Comove: rewritten for ${to}${result.notRewritten ? `; ${result.notRewritten} numbers could not be rewritten (see comove migrate on the command line for the list)` : ''}.`);
    }
  };

  context.subscriptions.push(
    vscode.commands.registerCommand('comove.showClaims', () => vscode.commands.executeCommand('comove.claims.focus')),
    vscode.commands.registerCommand('comove.checkWorkspace', async () => {
      const files = await vscode.workspace.findFiles('**/*.{tex,md,markdown}', '**/node_modules/**', 500);
      // Opening a document (without an editor) is enough for the server to check it.
      for (const f of files) await vscode.workspace.openTextDocument(f);
      void vscode.commands.executeCommand('workbench.actions.view.problems');
    }),
    vscode.commands.registerCommand('comove.showChart', async () => {
      const doc = manuscript(vscode.window.activeTextEditor);
      const claims = await claimsOf(doc);
      if (!doc || !claims) {
        void vscode.window.showInformationMessage('Comove: open a LaTeX or Markdown manuscript first.');
        return;
      }
      const panel = vscode.window.createWebviewPanel('comove.chart', `Comove: ${vscode.workspace.asRelativePath(doc.uri)}`, vscode.ViewColumn.Beside, { enableScripts: false, localResourceRoots: [] });
      panel.webview.html = chartPage(`Claims of ${vscode.workspace.asRelativePath(doc.uri)}`, claims.parameters?.text ?? null, claims.charts, panel.webview.cspSource);
    }),
    vscode.commands.registerCommand('comove.chooseParameterSet', async () => {
      const doc = manuscript(vscode.window.activeTextEditor);
      const claims = await claimsOf(doc);
      const pick = await vscode.window.showQuickPick([...PRESET_NAMES, 'Other (type the parameters)…'], {
        placeHolder: claims?.parameters?.origin === 'declared' ? 'The manuscript declares its set: choosing another rewrites the manuscript for it' : 'Parameter set for manuscripts that declare none',
      });
      if (!pick) return;
      const to = pick.startsWith('Other') ? await vscode.window.showInputBox({ prompt: 'Parameters, e.g. H0=70 Omega_m=0.3 flat' }) : pick;
      if (!to) return;
      if (doc && claims?.parameters?.origin === 'declared') await migrate(doc, to);
      else await vscode.workspace.getConfiguration('comove').update('defaultParameters', to, vscode.ConfigurationTarget.Workspace);
    }),
    vscode.commands.registerCommand('comove.migrate', async () => {
      const doc = manuscript(vscode.window.activeTextEditor);
      if (!doc) return;
      const to = await vscode.window.showQuickPick(PRESET_NAMES, { placeHolder: 'Rewrite the manuscript for which parameter set?' });
      if (to) await migrate(doc, to);
    }),
  );
}

export async function deactivate(): Promise<void> {
  await client?.stop();
}
