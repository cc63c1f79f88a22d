/** `comove check --format json`: one object per file with declarations, claims and problems; lines 0-based as in LSP. */

import type { Summary, LocatedCheck } from '../../../shared/src/index.js';

export function jsonReport(files: readonly LocatedCheck[], summary: Summary): Record<string, unknown> {
  return {
    files: files.map((f) => {
      const x = f.check.extraction;
      return {
        path: f.path,
        format: x.format,
        parameters: f.check.parameters ? { text: f.check.parameters.text, origin: f.check.parameters.origin, input: f.check.parameters.input } : null,
        declarations: x.declarations.map((d) => ({
          origin: d.origin,
          role: d.role,
          parameters: d.input,
          stated: d.stated,
          preset: d.preset,
          incomplete: d.incomplete,
          range: d.sourceRange ? f.sourceRange(d.sourceRange.start, d.sourceRange.end) : f.range(d.start, Math.max(d.start, d.end)),
        })),
        claims: f.check.checks.map((c) => ({
          range: f.claimRange(c),
          kind: c.claim.kind,
          z: c.claim.z,
          zRange: c.claim.zRange,
          stated: c.claim.value.value,
          statedText: c.claim.value.text,
          unit: c.unitText || null,
          interval: c.interval && { low: finite(c.interval.low), high: finite(c.interval.high) },
          computed: c.computed,
          status: c.status,
          relativeDifference: c.relativeDifference,
          tolerancesAway: c.tolerancesAway === null ? null : finite(c.tolerancesAway),
          onlyByFloor: c.onlyByFloor,
          slip: c.slip ? { id: c.slip.id, description: c.slip.description, value: c.slip.value } : null,
          fix: c.fix ? { range: f.sourceRange(c.fix.start, c.fix.end), newText: c.fix.newText } : null,
          message: f.explanation(c),
        })),
        problems: [
          ...x.problems.map((p) => ({ code: 'reading-problem', severity: p.severity, message: p.message, range: f.sourceRange(p.sourceStart, p.sourceEnd) })),
          ...f.check.findings.map((g) => ({ code: g.code, severity: g.severity, message: g.message, range: f.range(g.start, g.end), related: g.related.map((r) => f.range(r.start, r.end)) })),
        ],
      };
    }),
    summary,
  };
}

/** JSON has no infinity: an open end of an interval is null. */
function finite(v: number): number | null {
  return Number.isFinite(v) ? v : null;
}
