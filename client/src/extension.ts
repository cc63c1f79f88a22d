/**
 * Comove's VS Code extension: starts the language server and adds what a language server cannot
 * show — a status bar item with the document's parameter set, a tree of the document's claims
 * grouped by verdict, a chart of the claims against the model curves, and commands to check the
 * workspace, choose a parameter set and migrate a manuscript. No cosmology and no parsing here,
 * and no logic either: this file binds controller.ts to the VS Code API.
 */

import * as vscode from 'vscode';
import { LanguageClient, TransportKind, type LanguageClientOptions, type ServerOptions } from 'vscode-languageclient/node';
import type { DocumentClaimsParams, DocumentClaimsResult, MigrateResult } from '../../server/src/protocol.js';
import { ExtensionController, type EditorPort, type ServerPort } from './controller.js';
import type { ClaimGroup } from './views/claimTree.js';

let client: LanguageClient | undefined;

type Node = { group: ClaimGroup } | { item: ClaimGroup['items'][number]; uri: vscode.Uri };

class ClaimsView implements vscode.TreeDataProvider<Node> {
  private readonly changed = new vscode.EventEmitter<void>();
  readonly onDidChangeTreeData = this.changed.event;
  private groups: ClaimGroup[] = [];
  private uri: vscode.Uri | undefined;

  show(uri: string | undefined, groups: ClaimGroup[]): void {
    this.uri = uri === undefined ? undefined : vscode.Uri.parse(uri);
    this.groups = groups;
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
  const languageClient = new LanguageClient('comove', 'Comove', serverOptions, clientOptions);
  client = languageClient;
  await languageClient.start();

  const view = new ClaimsView();
  const tree = vscode.window.createTreeView('comove.claims', { treeDataProvider: view });
  context.subscriptions.push(tree);
  const status = vscode.window.createStatusBarItem(vscode.StatusBarAlignment.Left, 50);
  status.command = 'comove.chooseParameterSet';
  context.subscriptions.push(status);

  const server: ServerPort = {
    documentClaims: async (uri, want) => (await languageClient.sendRequest<DocumentClaimsResult | null>('comove/documentClaims', { uri, ...want } satisfies DocumentClaimsParams)) ?? null,
    migrate: (uri, to) => languageClient.sendRequest<MigrateResult>('comove/migrate', { uri, to }),
  };
  const editor: EditorPort = {
    activeDocument: () => {
      const doc = vscode.window.activeTextEditor?.document;
      return doc && { uri: doc.uri.toString(), languageId: doc.languageId, label: vscode.workspace.asRelativePath(doc.uri) };
    },
    setStatus: (s) => {
      if (!s) return status.hide();
      status.text = s.text;
      status.tooltip = s.tooltip;
      status.show();
    },
    showClaims: (uri, groups) => view.show(uri, groups),
    claimsVisible: () => tree.visible,
    pick: (items, placeHolder) => Promise.resolve(vscode.window.showQuickPick([...items], { placeHolder })),
    input: (prompt) => Promise.resolve(vscode.window.showInputBox({ prompt })),
    applyEdit: async (edit) => {
      const converted = await languageClient.protocol2CodeConverter.asWorkspaceEdit(edit);
      return converted ? vscode.workspace.applyEdit(converted) : false;
    },
    setDefaultParameters: (text) => Promise.resolve(vscode.workspace.getConfiguration('comove').update('defaultParameters', text, vscode.ConfigurationTarget.Workspace)),
    showPage: (title, html) => {
      const panel = vscode.window.createWebviewPanel('comove.chart', title, vscode.ViewColumn.Beside, { enableScripts: false, localResourceRoots: [] });
      panel.webview.html = html(panel.webview.cspSource);
    },
    info: (message) => void vscode.window.showInformationMessage(message),
    error: (message) => void vscode.window.showErrorMessage(message),
    findManuscripts: async (limit) => (await vscode.workspace.findFiles('**/*.{tex,md,markdown}', '**/node_modules/**', limit)).map((u) => u.toString()),
    openInBackground: async (uri) => void (await vscode.workspace.openTextDocument(vscode.Uri.parse(uri))),
    showProblems: () => void vscode.commands.executeCommand('workbench.actions.view.problems'),
  };
  const controller = new ExtensionController(server, editor);

  let pending: NodeJS.Timeout | undefined;
  const refreshSoon = () => {
    if (pending) clearTimeout(pending);
    pending = setTimeout(() => void controller.refresh(), 150);
  };
  context.subscriptions.push(
    vscode.window.onDidChangeActiveTextEditor(refreshSoon),
    vscode.languages.onDidChangeDiagnostics(refreshSoon),
    tree.onDidChangeVisibility(refreshSoon),
    vscode.commands.registerCommand('comove.showClaims', () => vscode.commands.executeCommand('comove.claims.focus')),
    vscode.commands.registerCommand('comove.checkWorkspace', () => controller.checkWorkspace()),
    vscode.commands.registerCommand('comove.showChart', () => controller.showChart()),
    vscode.commands.registerCommand('comove.chooseParameterSet', () => controller.chooseParameterSet()),
    vscode.commands.registerCommand('comove.migrate', () => controller.migrateManuscript()),
  );
  refreshSoon();
}

export async function deactivate(): Promise<void> {
  await client?.stop();
}
