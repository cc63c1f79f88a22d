/**
 * `comove check PATH…`: the pre-submission sweep. Files or folders (LaTeX projects followed from
 * their root files); every claim recomputed and judged; a readable report, JSON, SARIF 2.1.0, and
 * optionally a self-contained HTML report. Exit code 0 when every checked number is consistent,
 * 1 when any is not, 2 for usage and input errors.
 */

import { parseArgs } from 'node:util';
import { checkProject, CosmologyCache, extractProject, formatOf, type FileCheck, type FileExtraction, type ParameterInput, summarize, locate } from '../../shared/src/index.js';
import { cosmologyFromText } from './calcCommand.js';
import { fileResolver } from './extractCommand.js';
import { EXIT, readingOnce, UsageError, type CliIo } from './io.js';
import { htmlReport } from './report/htmlReport.js';
import { jsonReport } from './report/jsonReport.js';
import { sarifReport } from './report/sarifReport.js';
import { textReport } from './report/textReport.js';

export const CHECK_HELP = `Usage: comove check PATH… [options]
       comove check --stdin [--as latex|markdown|text] [options]

Recomputes every cosmology-dependent number of the manuscripts under the parameter set they
declare and reports the ones that disagree. PATH is a file or a folder (searched for .tex, .md
and .txt files; LaTeX projects are followed from their root files).

  --params TEXT      use this parameter set instead of the manuscript's declarations
                     (a preset name and/or key=value pairs, e.g. "H0=70 Omega_m=0.3 flat")
  --format FORMAT    text (default), json, or sarif (SARIF 2.1.0, for code scanning)
  --report FILE      also write a self-contained HTML report with charts
  --floor PERCENT    relative tolerance added to every claim (default 0.5)
  --all              list consistent claims too in the text report
  --stdin            read one manuscript from standard input (e.g. text pulled from a PDF)
  --as FORMAT        the format of standard input: latex, markdown or text (default: guessed)

Exit code: 0 all consistent, 1 inconsistencies found, 2 usage or input error.
`;

const MANUSCRIPT = /\.(?:tex|ltx|md|markdown|txt)$/i;
const SKIPPED_FOLDERS = new Set(['node_modules', '.git', 'dist', 'build']);

/** Files under a folder, depth first, in name order. */
function filesUnder(io: CliIo, folder: string): string[] {
  const entries = io.listFolder?.(folder);
  if (!entries) return [];
  const out: string[] = [];
  for (const e of [...entries].sort((a, b) => a.name.localeCompare(b.name))) {
    const path = `${folder.replace(/\/$/, '')}/${e.name}`;
    if (e.folder) {
      if (!SKIPPED_FOLDERS.has(e.name) && !e.name.startsWith('.')) out.push(...filesUnder(io, path));
    } else if (MANUSCRIPT.test(e.name)) out.push(path);
  }
  return out;
}

export function runCheck(argv: string[], io: CliIo, version: string): number {
  const { values, positionals } = parseArgs({
    args: argv,
    options: {
      params: { type: 'string' },
      format: { type: 'string' },
      report: { type: 'string' },
      floor: { type: 'string' },
      all: { type: 'boolean' },
      stdin: { type: 'boolean' },
      as: { type: 'string' },
      help: { type: 'boolean', short: 'h' },
    },
    allowPositionals: true,
    strict: true,
  });
  if (values.help) {
    io.stdout(CHECK_HELP);
    return EXIT.ok;
  }
  const format = values.format ?? 'text';
  if (!['text', 'json', 'sarif'].includes(format)) throw new UsageError(`--format must be text, json or sarif, not '${format}'`);
  if (values.stdin && positionals.length) throw new UsageError('give either --stdin or paths, not both');
  if (!values.stdin && positionals.length === 0) throw new UsageError('check needs a file or folder (or --stdin)');
  if (values.as && !values.stdin) throw new UsageError('--as applies to --stdin only');
  let floor: number | undefined;
  if (values.floor !== undefined) {
    const f = Number(values.floor);
    if (!Number.isFinite(f) || f < 0 || f > 50) throw new UsageError(`--floor must be a percentage between 0 and 50, not '${values.floor}'`);
    floor = f / 100;
  }
  const override: ParameterInput | null = values.params !== undefined ? cosmologyFromText(values.params).input : null;
  if (values.report !== undefined && !values.report.trim()) throw new UsageError('--report needs a file name');

  const remembering = readingOnce(io);
  const read = (path: string): string => {
    try {
      return remembering.readFile(path);
    } catch (e) {
      throw new UsageError(`cannot read ${path}: ${(e as Error).message}`);
    }
  };

  // The projects to check: each named file is a root; in folders, LaTeX files with a
  // \documentclass are roots and the files they include are checked under them.
  const roots: Array<{ uri: string; text: string }> = [];
  const named = new Set<string>();
  if (values.stdin) {
    const text = read('-');
    const ext = values.as === undefined ? '' : ({ latex: '.tex', tex: '.tex', markdown: '.md', md: '.md', text: '.txt', plaintext: '.txt' } as Record<string, string>)[values.as];
    if (ext === undefined) throw new UsageError(`--as must be latex, markdown or text, not '${values.as}'`);
    const uri = `<stdin>${ext || { latex: '.tex', markdown: '.md', plaintext: '.txt' }[formatOf('', text)]}`;
    roots.push({ uri, text });
    named.add(uri);
  } else {
    const inFolders: string[] = [];
    for (const p of positionals) {
      const folder = io.listFolder?.(p);
      if (folder) inFolders.push(...filesUnder(io, p));
      else {
        roots.push({ uri: p, text: read(p) });
        named.add(p);
      }
    }
    // Root files first, so that the chapters they include are checked under them; chapters
    // that no root includes are checked on their own afterwards.
    const chapters: string[] = [];
    for (const path of inFolders) {
      const text = read(path);
      if (/\.(?:tex|ltx)$/i.test(path) && !/\\documentclass|\\begin\{document\}/.test(text)) chapters.push(path);
      else roots.push({ uri: path, text });
    }
    roots.push(...chapters.map((p) => ({ uri: p, text: read(p) })));
  }

  const cache = new CosmologyCache();
  const resolver = fileResolver(remembering);
  const checked: FileCheck[] = [];
  const seen = new Set<string>();
  const progress = io.stderrIsTerminal && roots.length > 3;
  roots.forEach((root, i) => {
    if (seen.has(root.uri)) return;
    if (progress) io.stderr(`\rcomove: checking ${i + 1}/${roots.length} ${root.uri.slice(-50).padEnd(50)}`);
    const files: FileExtraction[] = extractProject(root, resolver).files.filter((f) => !seen.has(f.uri));
    for (const f of files) seen.add(f.uri);
    checked.push(...checkProject(files, { override, relativeFloor: floor, cache }));
  });
  if (progress) io.stderr('\r' + ' '.repeat(72) + '\r');

  const swept = checked.map(locate);
  const summary = summarize(swept);
  if (format === 'json') io.stdout(JSON.stringify(jsonReport(swept, summary), null, 1) + '\n');
  else if (format === 'sarif') io.stdout(JSON.stringify(sarifReport(swept, version), null, 1) + '\n');
  else io.stdout(textReport(swept, summary, { showConsistent: values.all === true }));
  if (values.report !== undefined) {
    if (!io.writeFile) throw new UsageError('this environment cannot write files');
    try {
      io.writeFile(values.report, htmlReport(swept, summary, { version, generated: new Date().toISOString().slice(0, 16).replace('T', ' ') + ' UTC' }));
    } catch (e) {
      throw new UsageError(`cannot write ${values.report}: ${(e as Error).message}`);
    }
  }
  // A named file that could not be read at all (binary, too large) is an input error.
  const unread = checked.filter((c) => named.has(c.extraction.uri) && c.extraction.reading.unread);
  if (unread.length) {
    for (const u of unread) io.stderr(`comove: ${u.extraction.uri}: ${u.extraction.problems[0]?.message ?? 'cannot be read'}\n`);
    return EXIT.usage;
  }
  return summary.inconsistent > 0 ? EXIT.inconsistent : EXIT.ok;
}
