/**
 * `comove migrate FILE --to PARAMS [--write]`: every edit that moves a manuscript to another
 * parameter set — the declaration and each dependent number, in the author's notation — and the
 * list of what could not be rewritten. Without --write the edits are only shown.
 */

import { parseArgs } from 'node:util';
import { applyEdits, CosmologyCache, extractProject, lineColumn, lineStartsOf, migrateFile } from '../../shared/src/index.js';
import { cosmologyFromText } from './calcCommand.js';
import { fileResolver } from './extractCommand.js';
import { alignColumns } from './format.js';
import { EXIT, UsageError, type CliIo } from './io.js';

export const MIGRATE_HELP = `Usage: comove migrate FILE --to PARAMS [--write]

Rewrites a manuscript for another parameter set: the declaration and every number that depends
on it, keeping the notation, unit and precision of each. Lists what it cannot rewrite. LaTeX
projects are followed from FILE through \\input and \\include.

  --to PARAMS   the new parameter set (a preset name and/or key=value pairs)
  --write       apply the edits to the files (otherwise they are only listed)
`;

export function runMigrate(argv: string[], io: CliIo): number {
  const { values, positionals } = parseArgs({ args: argv, options: { to: { type: 'string' }, write: { type: 'boolean' }, help: { type: 'boolean', short: 'h' } }, allowPositionals: true, strict: true });
  if (values.help) {
    io.stdout(MIGRATE_HELP);
    return EXIT.ok;
  }
  if (positionals.length !== 1) throw new UsageError('migrate needs exactly one manuscript');
  if (values.to === undefined) throw new UsageError('migrate needs --to PARAMS (e.g. --to planck-2018)');
  const to = cosmologyFromText(values.to).input;
  const path = positionals[0];
  let text: string;
  try {
    text = io.readFile(path);
  } catch (e) {
    throw new UsageError(`cannot read ${path}: ${(e as Error).message}`);
  }
  const cache = new CosmologyCache();
  const files = extractProject({ uri: path, text }, fileResolver(io)).files;
  if (files[0]?.reading.unread) throw new UsageError(`${path}: ${files[0].problems[0]?.message}`);
  const out: string[] = [];
  let total = 0;
  const writes: Array<{ path: string; text: string }> = [];
  for (const f of files) {
    const m = migrateFile(f, to, { cache });
    if ('error' in m) throw new UsageError(`${f.uri}: ${m.error}`);
    const starts = lineStartsOf(f.text);
    const at = (offset: number) => {
      const p = lineColumn(f.text, offset, starts);
      return `${p.line + 1}:${p.character + 1}`;
    };
    const readingAt = (offset: number) => at(f.reading.reading.sourceStart(offset));
    out.push(`${f.uri}: ${m.edits.length} edit${m.edits.length === 1 ? '' : 's'}`);
    if (m.edits.length) out.push(...alignColumns(m.edits.map((e) => [`  ${at(e.start)}`, e.what, e.oldText, '→', e.newText]), 'lllll'));
    if (m.notRewritten.length) {
      out.push(`  not rewritten (${m.notRewritten.length}):`);
      out.push(...alignColumns(m.notRewritten.map((n) => [`    ${readingAt(n.start)}`, n.what, n.reason]), 'lll'));
    }
    total += m.edits.length;
    if (m.edits.length) writes.push({ path: f.uri, text: applyEdits(f.text, m.edits) });
  }
  if (values.write) {
    if (!io.writeFile) throw new UsageError('this environment cannot write files');
    for (const w of writes) {
      try {
        io.writeFile(w.path, w.text);
      } catch (e) {
        throw new UsageError(`cannot write ${w.path}: ${(e as Error).message}`);
      }
    }
    out.push(`${total} edit${total === 1 ? '' : 's'} written to ${writes.length} file${writes.length === 1 ? '' : 's'}`);
  } else out.push(`${total} edit${total === 1 ? '' : 's'} (not written: add --write to apply them)`);
  io.stdout(out.join('\n') + '\n');
  return EXIT.ok;
}
