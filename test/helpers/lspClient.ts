/**
 * A real JSON-RPC client for the language server, over stdio, for end-to-end tests and the
 * benchmark: starts `node dist/server.js --stdio`, answers `workspace/configuration` with the
 * settings the test sets, and collects published diagnostics.
 */
import { spawn, type ChildProcess } from 'node:child_process';
import {
  ConfigurationRequest,
  createProtocolConnection,
  DidChangeConfigurationNotification,
  DidChangeTextDocumentNotification,
  DidOpenTextDocumentNotification,
  ExitNotification,
  InitializedNotification,
  InitializeRequest,
  PublishDiagnosticsNotification,
  RegistrationRequest,
  ShutdownRequest,
  StreamMessageReader,
  StreamMessageWriter,
  type Diagnostic,
  type ProtocolConnection,
  type PublishDiagnosticsParams,
  type TextDocumentContentChangeEvent,
} from 'vscode-languageserver-protocol/node';

const SERVER = new URL('../../dist/server.js', import.meta.url).pathname;

export class LspClient {
  readonly connection: ProtocolConnection;
  readonly process: ChildProcess;
  settings: Record<string, unknown> = {};
  private readonly latest = new Map<string, PublishDiagnosticsParams>();
  private readonly waiters: Array<{ uri: string; ok: (p: PublishDiagnosticsParams) => boolean; resolve: (p: PublishDiagnosticsParams) => void }> = [];
  private readonly versions = new Map<string, number>();
  /** Every publication, in order, with the time it arrived. */
  readonly published: Array<{ at: number; params: PublishDiagnosticsParams }> = [];

  constructor(server: string = SERVER, nodeOptions: readonly string[] = []) {
    this.process = spawn(process.execPath, [...nodeOptions, server, '--stdio'], { stdio: ['pipe', 'pipe', 'inherit'] });
    this.connection = createProtocolConnection(new StreamMessageReader(this.process.stdout!), new StreamMessageWriter(this.process.stdin!));
    this.connection.onNotification(PublishDiagnosticsNotification.type, (p) => {
      this.published.push({ at: performance.now(), params: p });
      this.latest.set(p.uri, p);
      for (let i = this.waiters.length - 1; i >= 0; i--) {
        const w = this.waiters[i];
        if (w.uri === p.uri && w.ok(p)) {
          this.waiters.splice(i, 1);
          w.resolve(p);
        }
      }
    });
    this.connection.onRequest(ConfigurationRequest.type, (params) => params.items.map(() => this.settings));
    this.connection.onRequest(RegistrationRequest.type, () => undefined);
    this.connection.listen();
  }

  async initialize(rootUri: string | null): Promise<Awaited<ReturnType<ProtocolConnection['sendRequest']>>> {
    const result = await this.connection.sendRequest(InitializeRequest.type, {
      processId: process.pid,
      rootUri,
      workspaceFolders: rootUri ? [{ uri: rootUri, name: 'workspace' }] : null,
      capabilities: { workspace: { configuration: true, didChangeConfiguration: { dynamicRegistration: true } }, textDocument: { codeAction: { resolveSupport: { properties: ['edit'] } } } },
    });
    await this.connection.sendNotification(InitializedNotification.type, {});
    return result;
  }

  /** Waits for the next diagnostics of `uri` that satisfy `ok` (or returns the latest if it already does and `fresh` is false). */
  diagnostics(uri: string, ok: (p: PublishDiagnosticsParams) => boolean = () => true, timeoutMs = 20_000, fresh = false): Promise<PublishDiagnosticsParams> {
    const have = this.latest.get(uri);
    if (!fresh && have && ok(have)) return Promise.resolve(have);
    return new Promise((resolve, reject) => {
      const timer = setTimeout(() => reject(new Error(`no matching diagnostics for ${uri} within ${timeoutMs} ms (latest: ${JSON.stringify(this.latest.get(uri)?.diagnostics.length)})`)), timeoutMs);
      this.waiters.push({ uri, ok, resolve: (p) => (clearTimeout(timer), resolve(p)) });
    });
  }

  async open(uri: string, languageId: string, text: string): Promise<void> {
    this.versions.set(uri, 1);
    await this.connection.sendNotification(DidOpenTextDocumentNotification.type, { textDocument: { uri, languageId, version: 1, text } });
  }

  /** Sends changes; returns the new version. */
  async change(uri: string, changes: TextDocumentContentChangeEvent[]): Promise<number> {
    const version = (this.versions.get(uri) ?? 0) + 1;
    this.versions.set(uri, version);
    await this.connection.sendNotification(DidChangeTextDocumentNotification.type, { textDocument: { uri, version }, contentChanges: changes });
    return version;
  }

  async changeConfiguration(settings: Record<string, unknown>): Promise<void> {
    this.settings = settings;
    await this.connection.sendNotification(DidChangeConfigurationNotification.type, { settings: { comove: settings } });
  }

  /** Shuts the server down; resolves with its exit code. */
  async shutdown(): Promise<number | null> {
    const exited = new Promise<number | null>((resolve) => this.process.once('exit', (code) => resolve(code)));
    await this.connection.sendRequest(ShutdownRequest.type);
    await this.connection.sendNotification(ExitNotification.type);
    const code = await exited;
    this.connection.dispose();
    return code;
  }
}

export function inconsistent(diagnostics: readonly Diagnostic[]): Diagnostic[] {
  return diagnostics.filter((d) => d.code === 'CMV101');
}
