/**
 * The result of a sweep over manuscripts, shaped for the reports: each file's check with its
 * source positions (0-based lines and UTF-16 characters, as in LSP) and the totals.
 */

import { explain, lineColumn, lineStartsOf, type ClaimCheck, type FileCheck } from '../../../shared/src/index.js';

export type Position = { line: number; character: number };
export type Range = { start: Position; end: Position };

export interface SweptFile {
  readonly path: string;
  readonly check: FileCheck;
  /** Source range of a reading-text range. */
  readonly range: (readingStart: number, readingEnd: number) => Range;
  /** Source range of source offsets. */
  readonly sourceRange: (start: number, end: number) => Range;
  /** Range of a claim's number and unit. */
  readonly claimRange: (c: ClaimCheck) => Range;
  readonly explanation: (c: ClaimCheck) => string;
}

export interface Summary {
  files: number;
  claims: number;
  checked: number;
  consistent: number;
  inconsistent: number;
  unchecked: number;
}

export function sweptFile(check: FileCheck): SweptFile {
  const source = check.extraction.text;
  const reading = check.extraction.reading.reading;
  const starts = lineStartsOf(source);
  const sourceRange = (a: number, b: number): Range => ({ start: lineColumn(source, a, starts), end: lineColumn(source, b, starts) });
  const range = (a: number, b: number): Range => {
    const r = reading.sourceRange(a, b);
    return sourceRange(r.start, r.end);
  };
  return {
    path: check.extraction.uri,
    check,
    range,
    sourceRange,
    claimRange: (c) => range(c.claim.value.start, c.claim.end),
    explanation: (c) => explain(c, (uri, line) => `[${uri}, line ${line + 1}](${uri}#L${line + 1})`),
  };
}

export function summarize(files: readonly SweptFile[]): Summary {
  const s: Summary = { files: files.length, claims: 0, checked: 0, consistent: 0, inconsistent: 0, unchecked: 0 };
  for (const f of files) {
    for (const c of f.check.checks) {
      s.claims++;
      s[c.status]++;
      if (c.status !== 'unchecked') s.checked++;
    }
  }
  return s;
}
