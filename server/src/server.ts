/**
 * Comove's language server: runs the core on open manuscripts and publishes what it finds as
 * LSP diagnostics, hovers, code actions, inlay hints, code lenses and symbols. It owns no
 * cosmology and no parsing; `convert.ts` turns core results into protocol types.
 * `main.ts` starts it on the transport named on the command line.
 */

import {
  CodeActionKind,
  DidChangeConfigurationNotification,
  TextDocuments,
  TextDocumentSyncKind,
  type CodeAction,
  type Connection,
  type InitializeResult,
  type Range,
  type GenericRequestHandler,
  type WorkspaceEdit,
} from 'vscode-languageserver/node';
import { TextDocument } from 'vscode-languageserver-textdocument';
import {
  chartData,
  checkProject,
  CosmologyCache,
  extractProject,
  formatOf,
  headline,
  lineColumn,
  lineStartsOf,
  locate,
  migrateFile,
  parseParameterText,
  PRESETS,
  ReadingMemory,
  SentenceCache,
  type FileExtraction,
  type LocatedCheck,
} from '../../shared/src/index.js';
import { claimActions, claimAt, codeLensesOf, diagnosticsOf, documentSymbolsOf, hoverAt, inlayHintsOf, type DiagnosticData } from './convert.js';
import { Projects } from './projects.js';
import type { DocumentClaimsParams, DocumentClaimsResult, MigrateResult } from './protocol.js';
import { DEFAULT_SETTINGS, defaultParameterInput, readSettings, type ComoveSettings } from './settings.js';

export const SERVER_VERSION = '0.1.0';
/** After this pause in typing, the document is checked in full (with the fit of the author's cosmology). */
const FULL_AFTER_IDLE_MS = 1500;

/** What the last analysis found for one file. */
interface FileResult {
  readonly located: LocatedCheck;
  /** Version of the open document it was computed from (null: read from disk). */
  readonly version: number | null;
  readonly root: string;
}

export function startServer(connection: Connection): void {
  const documents = new TextDocuments(TextDocument);
  const projects = new Projects((uri) => documents.get(uri)?.getText() ?? null);
  const results = new Map<string, FileResult>();
  const timers = new Map<string, NodeJS.Timeout>();
  const cache = new CosmologyCache(32);
  /** Sentence readings per file, so that an edit re-reads only the sentences it touched. */
  const sentenceCaches = new Map<string, SentenceCache>();
  /** Last readings of LaTeX files, patched after plain edits instead of read again. */
  const readingMemory = new ReadingMemory();
  const sentenceCache = (uri: string) => {
    let c = sentenceCaches.get(uri);
    if (!c) sentenceCaches.set(uri, (c = new SentenceCache()));
    return c;
  };
  let settings: ComoveSettings = DEFAULT_SETTINGS;
  let canPullConfiguration = false;

  const languageOf = (uri: string): string => documents.get(uri)?.languageId ?? ({ latex: 'latex', markdown: 'markdown', plaintext: 'plaintext' } as const)[formatOf(uri)];
  const watched = (uri: string) => settings.languages.includes(languageOf(uri));

  /**
   * Checks the project a file belongs to and publishes diagnostics for every file of it. The fit
   * of the author's cosmology (tens of milliseconds) runs only in a `full` analysis: on open, on
   * save, on a configuration change, and once typing has paused for FULL_AFTER_IDLE_MS.
   */
  const analyse = (root: string, full = true) => {
    try {
      analyseProject(root, full);
    } catch (e) {
      // A bug in the core must not take the server (and the user's session) down: report it on the file.
      connection.console.error(`comove: checking ${root} failed: ${(e as Error).stack ?? e}`);
      const doc = documents.get(root);
      void connection.sendDiagnostics({
        uri: root,
        version: doc?.version,
        diagnostics: [{ range: { start: { line: 0, character: 0 }, end: { line: 0, character: 0 } }, severity: 2, source: 'comove', message: `Comove could not check this file (internal error: ${(e as Error).message}); the text is untouched` }],
      });
    }
  };

  const analyseProject = (root: string, full: boolean) => {
    const text = projects.read(root);
    if (text === null) return;
    projects.forgetRoot(root);
    const fallback = defaultParameterInput(settings);
    const files = extractProject({ uri: root, text }, (from, path) => projects.resolve(from, path), { sentenceCache, readingMemory }).files;
    projects.learn(root, files.map((f) => f.uri));
    const checks = checkProject(files, { relativeFloor: settings.relativeFloor / 100, cache, fallback: fallback.input, fitAuthorCosmology: full });
    for (const check of checks) {
      const uri = check.extraction.uri;
      const doc = documents.get(uri);
      const version = doc ? doc.version : null;
      const located = locate(check);
      results.set(uri, { located, version, root });
      const diagnostics = diagnosticsOf(located, settings, uri, version);
      if (fallback.problem) diagnostics.push({ range: { start: { line: 0, character: 0 }, end: { line: 0, character: 0 } }, severity: 2, source: 'comove', message: fallback.problem });
      void connection.sendDiagnostics({ uri, version: version ?? undefined, diagnostics });
    }
  };

  const idleTimers = new Map<string, NodeJS.Timeout>();
  const schedule = (uri: string, delay = settings.debounceMs, full = false) => {
    const doc = documents.get(uri);
    if (!doc || !watched(uri)) return;
    const root = projects.rootOf(uri, doc.getText(), doc.languageId);
    for (const timersOf of [timers, idleTimers]) {
      const pending = timersOf.get(root);
      if (pending) clearTimeout(pending);
    }
    timers.set(
      root,
      setTimeout(() => {
        timers.delete(root);
        analyse(root, full);
      }, delay),
    );
    if (!full) {
      idleTimers.set(
        root,
        setTimeout(() => {
          idleTimers.delete(root);
          analyse(root, true);
        }, FULL_AFTER_IDLE_MS),
      );
    }
  };

  const recheckAll = () => {
    for (const doc of documents.all()) schedule(doc.uri, 0, true);
  };

  const fetchSettings = async () => {
    if (!canPullConfiguration) return;
    try {
      settings = readSettings(await connection.workspace.getConfiguration('comove'));
    } catch {
      settings = DEFAULT_SETTINGS;
    }
  };

  /** The current result for an open document, analysing it now if it is out of date. */
  const resultFor = (uri: string): FileResult | null => {
    const doc = documents.get(uri);
    let r = results.get(uri);
    if (doc && (!r || r.version !== doc.version)) {
      const root = projects.rootOf(uri, doc.getText(), doc.languageId);
      const pending = timers.get(root);
      if (pending) {
        clearTimeout(pending);
        timers.delete(root);
      }
      analyse(root, false);
      r = results.get(uri);
    }
    return r ?? null;
  };

  connection.onInitialize((params): InitializeResult => {
    canPullConfiguration = params.capabilities.workspace?.configuration === true;
    projects.setFolders((params.workspaceFolders ?? []).map((f) => f.uri).concat(params.rootUri ? [params.rootUri] : []));
    const init = params.initializationOptions as { settings?: unknown } | undefined;
    if (init?.settings) settings = readSettings(init.settings);
    return {
      capabilities: {
        textDocumentSync: { openClose: true, change: TextDocumentSyncKind.Incremental, save: { includeText: false } },
        hoverProvider: true,
        codeActionProvider: { codeActionKinds: [CodeActionKind.QuickFix, CodeActionKind.Refactor], resolveProvider: true },
        inlayHintProvider: true,
        codeLensProvider: { resolveProvider: false },
        documentSymbolProvider: true,
        workspace: { workspaceFolders: { supported: true, changeNotifications: true } },
      },
      serverInfo: { name: 'comove', version: SERVER_VERSION },
    };
  });

  connection.onInitialized(async () => {
    if (canPullConfiguration) {
      void connection.client.register(DidChangeConfigurationNotification.type, { section: 'comove' }).catch(() => undefined);
      await fetchSettings();
    }
    connection.workspace.onDidChangeWorkspaceFolders(() => {
      void connection.workspace.getWorkspaceFolders().then((folders) => projects.setFolders((folders ?? []).map((f) => f.uri)));
    });
  });

  connection.onDidChangeConfiguration(async (change) => {
    if (canPullConfiguration) await fetchSettings();
    else settings = readSettings((change.settings as { comove?: unknown } | undefined)?.comove);
    results.clear();
    recheckAll();
  });

  documents.onDidOpen((e) => schedule(e.document.uri, 0, true));
  documents.onDidChangeContent((e) => schedule(e.document.uri));
  documents.onDidSave((e) => schedule(e.document.uri, 0, true));
  documents.onDidClose((e) => {
    const r = results.get(e.document.uri);
    // A file of a project stays checked while its root is open; a file on its own is cleared.
    if (!r || r.root === e.document.uri || !documents.get(r.root)) {
      results.delete(e.document.uri);
      sentenceCaches.delete(e.document.uri);
      readingMemory.forget(e.document.uri);
      void connection.sendDiagnostics({ uri: e.document.uri, diagnostics: [] });
    }
  });

  connection.onHover((params, token) => {
    if (token.isCancellationRequested) return null;
    const r = resultFor(params.textDocument.uri);
    return r ? hoverAt(r.located, params.position) : null;
  });

  connection.languages.inlayHint.on((params, token) => {
    if (token.isCancellationRequested) return [];
    const r = resultFor(params.textDocument.uri);
    return r ? inlayHintsOf(r.located, settings, params.range) : [];
  });

  connection.onCodeLens((params) => {
    const r = resultFor(params.textDocument.uri);
    return r ? codeLensesOf(r.located) : [];
  });

  connection.onDocumentSymbol((params) => {
    const r = resultFor(params.textDocument.uri);
    return r ? documentSymbolsOf(r.located) : [];
  });

  connection.onCodeAction((params, token) => {
    if (token.isCancellationRequested) return [];
    const uri = params.textDocument.uri;
    const r = resultFor(uri);
    if (!r) return [];
    const languageId = languageOf(uri);
    const actions: CodeAction[] = [];
    // Quick fixes for the diagnostics in the range.
    for (const d of params.context.diagnostics) {
      if (d.source !== 'comove') continue;
      const data = d.data as DiagnosticData | undefined;
      if (data?.claimIndex === undefined) continue;
      // A diagnostic from an older version of the text: find its claim again by position.
      const index = data.version === r.version ? data.claimIndex : claimAt(r.located, d.range.start)?.index;
      if (index !== undefined) actions.push(...claimActions(r.located, index, uri, languageId, [d]));
    }
    const extraction = r.located.check.extraction;
    const start = params.range.start;
    // On a declaration: rewrite the manuscript for another set (resolved lazily: each is a whole migration).
    const onDeclaration = extraction.declarations.some((d) => {
      const range = d.sourceRange ? r.located.sourceRange(d.sourceRange.start, d.sourceRange.end) : r.located.range(d.start, Math.max(d.start, d.end));
      return start.line >= range.start.line && start.line <= range.end.line && d.role === 'document';
    });
    if (onDeclaration) {
      const targets = [...PRESETS.map((p) => p.name), ...(settings.defaultParameters.trim() ? [settings.defaultParameters.trim()] : [])];
      for (const to of [...new Set(targets)]) {
        if (to === r.located.check.parameters?.text) continue;
        actions.push({ title: `Rewrite the manuscript for the parameter set ${to}`, kind: CodeActionKind.Refactor, data: { migrate: { uri, to } } });
      }
    }
    // No declaration at all: offer to declare one.
    if (!r.located.check.parameters && extraction.claims.length > 0 && start.line === 0) {
      for (const set of [settings.defaultParameters.trim(), 'flat-70-0.3', 'planck-2018'].filter((s, i, all) => s && all.indexOf(s) === i)) {
        actions.push({ title: `Declare the parameter set ${set}`, kind: CodeActionKind.QuickFix, edit: declareEdit(uri, extraction, languageId, set) });
      }
    }
    return actions;
  });

  connection.onCodeActionResolve((action) => {
    const migrate = (action.data as { migrate?: { uri: string; to: string } } | undefined)?.migrate;
    if (!migrate) return action;
    const edit = migrationEdit(migrate.uri, migrate.to);
    return 'error' in edit ? { ...action, disabled: { reason: edit.error } } : { ...action, edit: edit.edit };
  });

  /** The workspace edit of a migration of the project `uri` belongs to. */
  const migrationEdit = (uri: string, to: string): MigrateResult => {
    const parsed = parseParameterText(to);
    if (parsed.problems.length) return { error: parsed.problems.map((p) => p.message).join('; ') };
    const r = resultFor(uri);
    if (!r) return { error: 'the document is not checked' };
    const text = projects.read(r.root);
    if (text === null) return { error: 'the project root cannot be read' };
    const files = extractProject({ uri: r.root, text }, (from, path) => projects.resolve(from, path)).files;
    const changes: Record<string, Array<{ range: Range; newText: string }>> = {};
    let notRewritten = 0;
    for (const f of files) {
      const m = migrateFile(f, parsed.input, { cache, relativeFloor: settings.relativeFloor / 100 });
      if ('error' in m) return { error: m.error };
      notRewritten += m.notRewritten.length;
      // Edits carry source offsets: positions need only the file's line starts.
      const starts = lineStartsOf(f.text);
      if (m.edits.length) changes[f.uri] = m.edits.map((e) => ({ range: { start: lineColumn(f.text, e.start, starts), end: lineColumn(f.text, e.end, starts) }, newText: e.newText }));
    }
    return { edit: { changes }, notRewritten };
  };

  connection.onRequest('comove/documentClaims', (params: DocumentClaimsParams): DocumentClaimsResult | null => {
    const r = resultFor(params.uri);
    if (!r) return null;
    const check = r.located.check;
    const set = check.parameters;
    const made = set && !set.incomplete && params.charts !== false ? cache.get(set.input) : null;
    const checks = check.checks;
    return {
      uri: params.uri,
      parameters: set ? { text: set.text, origin: set.origin } : null,
      counts: {
        claims: checks.length,
        checked: checks.filter((c) => c.status !== 'unchecked').length,
        inconsistent: checks.filter((c) => c.status === 'inconsistent').length,
      },
      // A long manuscript has thousands of claims: the status bar asks for the counts alone.
      claims: params.claims === false ? [] : checks.map((c) => ({
        range: r.located.claimRange(c),
        kind: c.claim.kind,
        title: headline(c),
        z: c.claim.z,
        stated: c.claim.value.text,
        unit: c.unitText,
        computed: c.computed,
        status: c.status,
        slip: c.slip?.description ?? null,
        reason: c.reason,
      })),
      charts: made && made.ok ? chartData(checks, made.cosmology, (c) => c.parameters === set) : [],
    };
  });

  // For the benchmark's memory check: heap in use after a full collection (the server must run with --expose-gc).
  connection.onRequest('comove/heapAfterCollection', (): number | null => {
    const gc = (globalThis as { gc?: () => void }).gc;
    if (!gc) return null;
    gc();
    return process.memoryUsage().heapUsed;
  });

  const migrateHandler: GenericRequestHandler<MigrateResult, void> = (params: { uri: string; to: string }) => migrationEdit(params.uri, params.to);
  connection.onRequest('comove/migrate', migrateHandler);

  documents.listen(connection);
  connection.listen();
}

/** The edit that declares a parameter set at the top of a manuscript (after \documentclass or the front matter). */
function declareEdit(uri: string, extraction: FileExtraction, languageId: string, set: string): WorkspaceEdit {
  const text = extraction.text;
  let line = 0;
  if (languageId === 'markdown') {
    const fm = /^---\r?\n[\s\S]*?\r?\n---\r?\n/.exec(text);
    if (fm) line = fm[0].split('\n').length - 1;
  } else {
    const dc = /^\\documentclass.*$/m.exec(text);
    if (dc) line = text.slice(0, dc.index).split('\n').length;
  }
  const directive = languageId === 'markdown' ? `<!-- comove: ${set} -->\n` : `% comove: ${set}\n`;
  return { changes: { [uri]: [{ range: { start: { line, character: 0 }, end: { line, character: 0 } }, newText: directive }] } };
}
