/**
 * `comove check --format sarif`: SARIF 2.1.0 (OASIS Static Analysis Results Interchange
 * Format), so that code-scanning services show the findings on pull requests. Regions are
 * 1-based lines and columns in UTF-16 code units (the SARIF default column kind).
 */

import { RULES, ruleFor, type RuleName, type Range, type LocatedCheck } from '../../../shared/src/index.js';

export const SARIF_SCHEMA = 'https://docs.oasis-open.org/sarif/sarif/v2.1.0/errata01/os/schemas/sarif-schema-2.1.0.json';

type Level = 'error' | 'warning' | 'note';

function region(r: Range): Record<string, number> {
  return { startLine: r.start.line + 1, startColumn: r.start.character + 1, endLine: r.end.line + 1, endColumn: r.end.character + 1 };
}

function location(path: string, r: Range): Record<string, unknown> {
  return { physicalLocation: { artifactLocation: { uri: encodeURI(path.replace(/\\/g, '/')) }, region: region(r) } };
}

export function sarifReport(files: readonly LocatedCheck[], version: string): Record<string, unknown> {
  const ruleIndex = new Map(RULES.map((r, i) => [r.name, i]));
  const results: Array<Record<string, unknown>> = [];
  const add = (name: RuleName, level: Level, message: string, path: string, r: Range, related: Range[] = [], markdown?: string) => {
    const rule = ruleFor(name);
    results.push({
      ruleId: rule.id,
      ruleIndex: ruleIndex.get(name),
      level,
      message: markdown ? { text: message, markdown } : { text: message },
      locations: [location(path, r)],
      ...(related.length ? { relatedLocations: related.map((x, i) => ({ id: i, ...location(path, x) })) } : {}),
    });
  };
  for (const f of files) {
    for (const c of f.check.checks) {
      if (c.status === 'consistent') continue;
      const text = c.status === 'inconsistent'
        ? `${c.claim.value.text}${c.unitText ? ` ${c.unitText}` : ''} disagrees with the declared cosmology (recomputed ${c.computed?.toPrecision(c.claim.value.significantDigits + 1)})${c.slip ? `: ${c.slip.description}` : ''}`
        : `not checked: ${c.reason}`;
      add(c.status === 'inconsistent' ? 'inconsistent-value' : 'unchecked-claim', c.status === 'inconsistent' ? 'error' : 'note', text, f.path, f.claimRange(c), [], f.explanation(c));
    }
    for (const p of f.check.extraction.problems) add('reading-problem', p.severity === 'error' ? 'error' : 'warning', p.message, f.path, f.sourceRange(p.sourceStart, p.sourceEnd));
    for (const g of f.check.findings) {
      add(g.code, g.severity === 'information' ? 'note' : g.severity, g.message, f.path, f.range(g.start, g.end), g.related.map((r) => f.range(r.start, r.end)));
    }
  }
  return {
    $schema: SARIF_SCHEMA,
    version: '2.1.0',
    runs: [
      {
        tool: {
          driver: {
            name: 'Comove',
            version,
            rules: RULES.map((r) => ({ id: r.id, name: r.name, shortDescription: { text: r.summary }, fullDescription: { text: r.description } })),
          },
        },
        columnKind: 'utf16CodeUnits',
        results,
      },
    ],
  };
}
