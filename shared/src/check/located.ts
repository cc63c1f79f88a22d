/**
 * A file's check with source positions: 0-based lines and UTF-16 characters, as in LSP, for
 * the reports and the language server. Plain data; the callers convert it to their own types.
 */

import { lineColumn, lineStartsOf } from '../claims/extraction.js';
import type { ClaimCheck, FileCheck } from './checker.js';
import { explain } from './explain.js';

export type Position = { line: number; character: number };
export type Range = { start: Position; end: Position };

export interface LocatedCheck {
  readonly path: string;
  readonly check: FileCheck;
  /** Source range of a reading-text range. */
  readonly range: (readingStart: number, readingEnd: number) => Range;
  /** Source range of source offsets. */
  readonly sourceRange: (start: number, end: number) => Range;
  /** Range of a claim's number and unit. */
  readonly claimRange: (c: ClaimCheck) => Range;
  /** Source offset of a reading-text offset. */
  readonly sourceOffset: (readingOffset: number) => number;
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

export function locate(check: FileCheck): LocatedCheck {
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
    sourceOffset: (o) => reading.sourceStart(o),
    explanation: (c) => explain(c, (uri, line) => `[${uri}, line ${line + 1}](${uri}#L${line + 1})`),
  };
}

export function summarize(files: readonly LocatedCheck[]): Summary {
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
