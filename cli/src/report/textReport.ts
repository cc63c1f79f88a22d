/** The readable report of `comove check`: per file, each claim with line:column, stated → recomputed, verdict and slip; then the totals. */

import { kindTitle, significant, whereText, type ClaimCheck, type Summary, type LocatedCheck } from '../../../shared/src/index.js';
import { alignColumns } from '../format.js';

function at(r: { start: { line: number; character: number } }): string {
  return `${r.start.line + 1}:${r.start.character + 1}`;
}

function verdictText(c: ClaimCheck): string {
  if (c.status === 'consistent') return c.onlyByFloor ? 'consistent (within the floor)' : 'consistent';
  if (c.status === 'unchecked') return `unchecked: ${c.reason}`;
  const pct = c.relativeDifference === null ? '' : ` ${c.relativeDifference > 0 ? '+' : '−'}${significant(Math.abs(100 * c.relativeDifference), 2)} %`;
  return `INCONSISTENT${pct}${c.slip ? ` — ${c.slip.description}` : ''}`;
}

export function textReport(files: readonly LocatedCheck[], summary: Summary, options: { showConsistent: boolean }): string {
  const out: string[] = [];
  for (const f of files) {
    const set = f.check.parameters;
    out.push(`${f.path}`);
    out.push(`  parameter set: ${set ? `${set.text || '(unusable)'} (${set.origin}${set.line !== undefined && set.line !== null && set.origin !== 'override' ? `, line ${set.line + 1}` : ''})` : 'none declared'}`);
    const rows = f.check.checks
      .filter((c) => options.showConsistent || c.status !== 'consistent')
      .map((c) => {
        const stated = `${c.claim.value.text}${c.unitText ? ` ${c.unitText}` : ''}`;
        const computed = c.computed === null ? '' : `→ ${significant(c.computed, c.claim.value.significantDigits + 1)}${c.unitText ? ` ${c.unitText}` : ''}`;
        return [`  ${at(f.claimRange(c))}`, `${kindTitle(c.claim.kind)}${whereText(c)}`, stated, computed, verdictText(c)];
      });
    if (rows.length) out.push(...alignColumns(rows, 'lllll'));
    for (const p of f.check.extraction.problems) out.push(`  ${at(f.sourceRange(p.sourceStart, p.sourceEnd))}  ${p.severity}: ${p.message}`);
    for (const g of f.check.findings) out.push(`  ${at(f.range(g.start, g.end))}  ${g.severity}: ${g.message}`);
    const n = f.check.checks;
    out.push(`  ${n.length} claims: ${n.filter((c) => c.status === 'consistent').length} consistent, ${n.filter((c) => c.status === 'inconsistent').length} inconsistent, ${n.filter((c) => c.status === 'unchecked').length} unchecked`, '');
  }
  out.push(`checked ${summary.checked} of ${summary.claims} cosmology-dependent numbers in ${summary.files} file${summary.files === 1 ? '' : 's'}: ${summary.consistent} consistent, ${summary.inconsistent} inconsistent, ${summary.unchecked} unchecked`);
  return out.join('\n') + '\n';
}
