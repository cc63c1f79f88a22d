/**
 * `comove extract FILE… [--json]`: the declarations, claims and problems Comove reads in each
 * manuscript, with line:column ranges. LaTeX projects are followed from the root file through
 * \input, \include and \subfile.
 */

import { parseArgs } from 'node:util';
import {
  extractProject,
  formatParameterInput,
  lineColumn,
  lineStartsOf,
  type Claim,
  type FileExtraction,
  type IncludeResolver,
} from '../../shared/src/index.js';
import { alignColumns, formatNumber } from './format.js';
import { EXIT, readingOnce, UsageError, type CliIo } from './io.js';

export const EXTRACT_HELP = `Usage: comove extract FILE… [--json]

Prints what Comove reads in each manuscript (LaTeX, Markdown or plain text): the declared
parameter sets, every cosmology-dependent claim with its redshift, and reading problems.
LaTeX projects are followed from the root through \\input, \\include and \\subfile.

  --json    machine-readable output (lines and characters 0-based, as in LSP)
`;

/** Resolves an included path against the including file's folder, adding .tex when it has no extension. */
export function fileResolver(io: CliIo): IncludeResolver {
  return (fromUri, path) => {
    const dir = fromUri.includes('/') ? fromUri.slice(0, fromUri.lastIndexOf('/') + 1) : '';
    const candidates = /\.[A-Za-z]+$/.test(path) ? [path] : [`${path}.tex`, path];
    for (const c of candidates) {
      const full = c.startsWith('/') ? c : dir + c;
      try {
        return { uri: full, text: io.readFile(full) };
      } catch {
        // try the next spelling
      }
    }
    return null;
  };
}

export function runExtract(argv: string[], io: CliIo): number {
  const { values, positionals } = parseArgs({ args: argv, options: { json: { type: 'boolean' }, help: { type: 'boolean', short: 'h' } }, allowPositionals: true, strict: true });
  if (values.help) {
    io.stdout(EXTRACT_HELP);
    return EXIT.ok;
  }
  if (positionals.length === 0) throw new UsageError('extract needs at least one file');
  // Every file is read once; positions are counted in the text that was extracted (FileExtraction.text).
  const remembering = readingOnce(io);
  const resolver = fileResolver(remembering);
  const files: FileExtraction[] = [];
  for (const path of positionals) {
    let text: string;
    try {
      text = remembering.readFile(path);
    } catch (e) {
      throw new UsageError(`cannot read ${path}: ${(e as Error).message}`);
    }
    files.push(...extractProject({ uri: path, text }, resolver).files);
  }
  if (values.json) io.stdout(JSON.stringify({ files: files.map((f) => fileJson(f, f.text)) }, null, 1) + '\n');
  else io.stdout(files.map((f) => fileText(f, f.text)).join('\n'));
  return EXIT.ok;
}

type Position = { line: number; character: number };
type Range = { start: Position; end: Position };

function ranger(f: FileExtraction, source: string): { fromReading: (a: number, b: number) => Range; fromSource: (a: number, b: number) => Range } {
  const starts = lineStartsOf(source);
  const fromSource = (a: number, b: number): Range => ({ start: lineColumn(source, a, starts), end: lineColumn(source, b, starts) });
  return {
    fromSource,
    fromReading: (a, b) => {
      const r = f.reading.reading.sourceRange(a, b);
      return fromSource(r.start, r.end);
    },
  };
}

function claimJson(c: Claim, f: FileExtraction, fromReading: (a: number, b: number) => Range): Record<string, unknown> {
  const v = c.value;
  return {
    kind: c.kind,
    range: fromReading(c.start, c.end),
    text: f.reading.reading.text.slice(c.start, c.end),
    value: v.value,
    unit: v.unit ? v.unit.text.trim() : null,
    unitKnown: v.unit ? v.unit.unit !== null : null,
    qualifier: v.qualifier,
    relation: v.relation,
    significantDigits: v.significantDigits,
    resolution: v.resolution,
    uncertainty: v.uncertainty,
    valueRange: v.range,
    z: c.z,
    zRange: c.zRange,
    zSource: c.zSource,
    angleArcsec: c.angleArcsec,
    parameter: c.parameter,
    sinceEpoch: c.sinceEpoch,
    sentence: fromReading(c.sentenceStart, c.sentenceEnd),
    confidence: Number(c.confidence.toFixed(2)),
    unchecked: c.unchecked,
  };
}

export function fileJson(f: FileExtraction, source: string): Record<string, unknown> {
  const { fromReading, fromSource } = ranger(f, source);
  return {
    path: f.uri,
    format: f.format,
    declarations: f.declarations.map((d) => ({
      origin: d.origin,
      role: d.role,
      parameters: d.input,
      stated: d.stated,
      preset: d.preset,
      range: d.sourceRange ? fromSource(d.sourceRange.start, d.sourceRange.end) : fromReading(d.start, Math.max(d.start, d.end)),
      scope: { start: fromReading(d.scopeStart, d.scopeStart).start, end: fromReading(d.scopeEnd, d.scopeEnd).end },
      incomplete: d.incomplete,
    })),
    skips: f.skips.map((s) => fromReading(s.start, s.end)),
    claims: f.claims.map((c) => claimJson(c, f, fromReading)),
    problems: [
      ...f.problems.map((p) => ({ severity: p.severity, message: p.message, range: fromSource(p.sourceStart, p.sourceEnd) })),
      ...f.declarationProblems.map((p) => ({ severity: 'warning', message: p.message, range: fromReading(p.ranges[0].start, p.ranges[0].end), related: p.ranges.slice(1).map((r) => fromReading(r.start, r.end)) })),
    ],
  };
}

function pos(r: Range): string {
  return `${r.start.line + 1}:${r.start.character + 1}`;
}

/** The readable listing of one file. */
export function fileText(f: FileExtraction, source: string): string {
  const { fromReading, fromSource } = ranger(f, source);
  const out: string[] = [`${f.uri}  (${f.format})`];
  out.push(`  declared parameter sets: ${f.declarations.length || 'none'}`);
  for (const d of f.declarations) {
    out.push(`    ${pos(d.sourceRange ? fromSource(d.sourceRange.start, d.sourceRange.end) : fromReading(d.start, d.end))}  ${d.origin}, ${d.role}: ${formatParameterInput(d.input) || '(nothing usable)'}${d.incomplete ? `  — incomplete: ${d.incomplete}` : ''}`);
  }
  out.push(`  claims: ${f.claims.length}`);
  const rows = f.claims.map((c) => {
    const z = c.zRange ? `${c.zRange[0]} < z < ${c.zRange[1]}` : c.z !== null ? `z = ${formatNumber(c.z)}` : c.sinceEpoch ? `since ${c.sinceEpoch}` : '';
    return [`    ${pos(fromReading(c.start, c.end))}`, c.kind, f.reading.reading.text.slice(c.start, c.end), z, c.zSource ?? '', c.unchecked ? `unchecked: ${c.unchecked}` : ''];
  });
  if (rows.length) out.push(...alignColumns(rows, 'llllll'));
  const problems = [...f.problems.map((p) => `    ${pos(fromSource(p.sourceStart, p.sourceEnd))}  ${p.severity}: ${p.message}`), ...f.declarationProblems.map((p) => `    ${pos(fromReading(p.ranges[0].start, p.ranges[0].end))}  warning: ${p.message}`)];
  out.push(`  problems: ${problems.length || 'none'}`, ...problems);
  return out.join('\n') + '\n';
}
