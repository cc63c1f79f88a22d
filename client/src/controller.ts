/**
 * What the extension does, without VS Code: keeping the status bar and the claims tree in step
 * with the active manuscript, choosing a parameter set (a default for manuscripts that declare
 * none, a migration for those that do), migrating, opening the chart and checking the workspace.
 * It talks to the language server through `ServerPort` and to the editor through `EditorPort`;
 * extension.ts binds both to VS Code, and the tests bind them to a real server and a recording
 * editor.
 */

import type { DocumentClaimsResult, MigrateResult } from '../../server/src/protocol.js';
import { chartPage } from './views/chartPage.js';
import { groupClaims, statusText, type ClaimGroup } from './views/claimTree.js';

/** The parameter sets offered by name (the presets the core holds). */
export const PRESET_NAMES = ['planck-2018', 'planck-2018-cmb', 'planck-2015', 'wmap-9', 'flat-70-0.3'];
export const OTHER_SET = 'Other (type the parameters)…';
const MANUSCRIPT_LANGUAGES = ['latex', 'tex', 'markdown'];

/** A document as the controller needs it. */
export interface DocumentRef {
  readonly uri: string;
  readonly languageId: string;
  /** The path shown to the user (relative to the workspace). */
  readonly label: string;
}

export type WorkspaceEdit = Extract<MigrateResult, { edit: unknown }>['edit'];

/** The language server's own requests. */
export interface ServerPort {
  /** The document's counts and set; its claims and charts only when asked for. */
  documentClaims(uri: string, want: { claims: boolean; charts: boolean }): Promise<DocumentClaimsResult | null>;
  migrate(uri: string, to: string): Promise<MigrateResult>;
}

/** What the controller asks of the editor. */
export interface EditorPort {
  activeDocument(): DocumentRef | undefined;
  setStatus(status: { text: string; tooltip: string } | null): void;
  showClaims(uri: string | undefined, groups: ClaimGroup[]): void;
  /** Whether the claims view is on screen (when it is not, the claims are not fetched). */
  claimsVisible(): boolean;
  pick(items: readonly string[], placeHolder: string): Promise<string | undefined>;
  input(prompt: string): Promise<string | undefined>;
  applyEdit(edit: WorkspaceEdit): Promise<boolean>;
  /** Stores the default parameter set in the workspace settings. */
  setDefaultParameters(text: string): Promise<void>;
  /** Opens a page beside the editor; `html` is given the webview's CSP source. */
  showPage(title: string, html: (cspSource: string) => string): void;
  info(message: string): void;
  error(message: string): void;
  /** Manuscripts in the workspace (at most `limit`). */
  findManuscripts(limit: number): Promise<string[]>;
  /** Opens a document without showing it (the server then checks it). */
  openInBackground(uri: string): Promise<void>;
  showProblems(): void;
}

export class ExtensionController {
  constructor(
    private readonly server: ServerPort,
    private readonly editor: EditorPort,
  ) {}

  /** The active document if it is a manuscript. */
  private manuscript(): DocumentRef | undefined {
    const doc = this.editor.activeDocument();
    return doc && MANUSCRIPT_LANGUAGES.includes(doc.languageId) ? doc : undefined;
  }

  /**
   * Updates the status bar and, when it is on screen, the claims tree for the active document
   * (one request for both; the claims themselves — thousands in a long manuscript — only for the tree).
   */
  async refresh(): Promise<void> {
    const doc = this.manuscript();
    if (!doc) {
      this.editor.setStatus(null);
      this.editor.showClaims(undefined, []);
      return;
    }
    const withClaims = this.editor.claimsVisible();
    const result = await this.server.documentClaims(doc.uri, { claims: withClaims, charts: false });
    this.editor.setStatus(statusText(result?.parameters ?? null, result?.counts ?? { claims: 0, checked: 0, inconsistent: 0 }));
    if (withClaims) this.editor.showClaims(doc.uri, result ? groupClaims(result.claims) : []);
  }

  /**
   * Choosing a set: a manuscript that declares its own is rewritten for the new one (the
   * migration); for one that declares none, the choice becomes the workspace default.
   */
  async chooseParameterSet(): Promise<void> {
    const doc = this.manuscript();
    const claims = doc ? await this.server.documentClaims(doc.uri, { claims: false, charts: false }) : null;
    const declared = claims?.parameters?.origin === 'declared';
    const pick = await this.editor.pick([...PRESET_NAMES, OTHER_SET], declared ? 'The manuscript declares its set: choosing another rewrites the manuscript for it' : 'Parameter set for manuscripts that declare none');
    if (!pick) return;
    const to = pick === OTHER_SET ? await this.editor.input('Parameters, e.g. H0=70 Omega_m=0.3 flat') : pick;
    if (!to) return;
    if (doc && declared) await this.migrateTo(doc, to);
    else await this.editor.setDefaultParameters(to);
  }

  async migrateManuscript(): Promise<void> {
    const doc = this.manuscript();
    if (!doc) {
      this.editor.info('Comove: open a LaTeX or Markdown manuscript first.');
      return;
    }
    const to = await this.editor.pick(PRESET_NAMES, 'Rewrite the manuscript for which parameter set?');
    if (to) await this.migrateTo(doc, to);
  }

  private async migrateTo(doc: DocumentRef, to: string): Promise<void> {
    const result = await this.server.migrate(doc.uri, to);
    if ('error' in result) {
      this.editor.error(`Comove: ${result.error}`);
      return;
    }
    if (await this.editor.applyEdit(result.edit)) {
      this.editor.info(`Comove: rewritten for ${to}${result.notRewritten ? `; ${result.notRewritten} numbers could not be rewritten (see comove migrate on the command line for the list)` : ''}.`);
    }
  }

  async showChart(): Promise<void> {
    const doc = this.manuscript();
    const claims = doc ? await this.server.documentClaims(doc.uri, { claims: false, charts: true }) : null;
    if (!doc || !claims) {
      this.editor.info('Comove: open a LaTeX or Markdown manuscript first.');
      return;
    }
    const title = `Claims of ${doc.label}`;
    this.editor.showPage(`Comove: ${doc.label}`, (csp) => chartPage(title, claims.parameters?.text ?? null, claims.charts, csp));
  }

  /** Opens every manuscript of the workspace (up to 500) so that the server checks it, then shows the problems. */
  async checkWorkspace(): Promise<number> {
    const files = await this.editor.findManuscripts(500);
    for (const f of files) await this.editor.openInBackground(f);
    this.editor.showProblems();
    return files.length;
  }
}
