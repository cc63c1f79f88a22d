/**
 * Multi-file LaTeX projects in the workspace: which root file includes which file, and reading
 * files that are not open — only inside the workspace folders, never outside.
 */

import { readdirSync, readFileSync, statSync } from 'node:fs';
import { fileURLToPath, pathToFileURL } from 'node:url';

const TEX_ROOT = /^%\s*!\s*TEX\s+root\s*=\s*(.+?)\s*$/im;
const INCLUDE = /\\(?:input|include|subfile|subfileinclude)\s*\{([^}]+)\}/g;
const MAX_SCANNED_FILES = 2000;
const MAX_FILE_BYTES = 16 * 1024 * 1024;

export class Projects {
  private folders: string[] = [];
  /** child URI → root URI, learnt from analyses and from scanning the workspace. */
  private readonly includedBy = new Map<string, string>();
  private scanned = false;

  constructor(private readonly openText: (uri: string) => string | null) {}

  setFolders(uris: readonly string[]): void {
    this.folders = uris.filter((u) => u.startsWith('file:')).map((u) => fileURLToPath(u).replace(/\/?$/, '/'));
    this.scanned = false;
  }

  /** Whether a file URI lies inside a workspace folder. */
  inWorkspace(uri: string): boolean {
    if (!uri.startsWith('file:')) return false;
    const path = fileURLToPath(uri);
    return this.folders.some((f) => path.startsWith(f));
  }

  /** The text of a file: the open document, else the file on disk if it is inside the workspace. */
  read(uri: string): string | null {
    const open = this.openText(uri);
    if (open !== null) return open;
    if (!this.inWorkspace(uri)) return null;
    try {
      const path = fileURLToPath(uri);
      if (statSync(path).size > MAX_FILE_BYTES) return null;
      return readFileSync(path, 'utf8');
    } catch {
      return null;
    }
  }

  /** Resolves `\input{path}` from the file `fromUri` to a URI (adding .tex when there is no extension). */
  resolve(fromUri: string, path: string): { uri: string; text: string } | null {
    const candidates = /\.[A-Za-z]+$/.test(path) ? [path] : [`${path}.tex`, path];
    for (const c of candidates) {
      let uri: string;
      try {
        uri = new URL(c, fromUri).href;
      } catch {
        continue;
      }
      const text = this.read(uri);
      if (text !== null) return { uri, text };
    }
    return null;
  }

  /** Records that `root` includes each of `files`. */
  learn(root: string, files: readonly string[]): void {
    for (const f of files) if (f !== root) this.includedBy.set(f, root);
  }

  /** Forgets what a root was known to include (before it is analysed again). */
  forgetRoot(root: string): void {
    for (const [child, r] of this.includedBy) if (r === root) this.includedBy.delete(child);
  }

  /** The root file a LaTeX file belongs to: its `% !TEX root`, a root known to include it, or itself. */
  rootOf(uri: string, text: string, languageId: string): string {
    if (languageId !== 'latex' && languageId !== 'tex') return uri;
    const magic = TEX_ROOT.exec(text.slice(0, 4096));
    if (magic) {
      try {
        const root = new URL(magic[1], uri).href;
        if (this.read(root) !== null) return root;
      } catch {
        // fall through
      }
    }
    if (/\\documentclass/.test(text)) return uri;
    let root = this.includedBy.get(uri);
    if (!root && !this.scanned) {
      this.scanWorkspace();
      root = this.includedBy.get(uri);
    }
    // Follow chains (a chapter included by a part included by the root).
    const seen = new Set<string>([uri]);
    while (root && this.includedBy.has(root) && !seen.has(root)) {
      seen.add(root);
      root = this.includedBy.get(root)!;
    }
    return root ?? uri;
  }

  /** Reads the .tex files of the workspace once for \input and \include, to know the roots of files opened on their own. */
  private scanWorkspace(): void {
    this.scanned = true;
    let budget = MAX_SCANNED_FILES;
    const visit = (dir: string, depth: number) => {
      if (depth > 6 || budget <= 0) return;
      let entries: Array<{ name: string; isDirectory(): boolean; isFile(): boolean }>;
      try {
        entries = readdirSync(dir, { withFileTypes: true });
      } catch {
        return;
      }
      for (const e of entries) {
        if (budget <= 0) return;
        if (e.name.startsWith('.') || e.name === 'node_modules') continue;
        const path = `${dir}${e.name}`;
        if (e.isDirectory()) visit(`${path}/`, depth + 1);
        else if (e.isFile() && /\.tex$/i.test(e.name)) {
          budget--;
          const uri = pathToFileURL(path).href;
          const text = this.read(uri);
          if (!text || !/\\documentclass/.test(text)) continue;
          for (const m of text.matchAll(INCLUDE)) {
            const child = this.resolve(uri, m[1].trim());
            if (child && !this.includedBy.has(child.uri)) this.includedBy.set(child.uri, uri);
          }
        }
      }
    };
    for (const f of this.folders) visit(f, 0);
  }
}
