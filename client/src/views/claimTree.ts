/**
 * The claims view: a document's claims grouped by verdict (inconsistent first), each with a
 * label, a description and the position to reveal. Pure: the extension turns it into tree items.
 */

import type { ClaimCounts, ClaimSummary } from '../../../server/src/protocol.js';

export type { ClaimCounts, ClaimSummary };

export interface ClaimGroup {
  readonly status: 'inconsistent' | 'unchecked' | 'consistent';
  readonly label: string;
  readonly items: ReadonlyArray<{ readonly label: string; readonly description: string; readonly tooltip: string; readonly line: number; readonly character: number }>;
}

const ORDER: ReadonlyArray<ClaimGroup['status']> = ['inconsistent', 'unchecked', 'consistent'];
const LABEL: Record<ClaimGroup['status'], string> = { inconsistent: 'Inconsistent', unchecked: 'Unchecked', consistent: 'Consistent' };

function digits(stated: string): number {
  return Math.max(1, stated.replace(/^[^\d]*/, '').replace(/[^\d]/g, '').replace(/^0+/, '').length);
}

/** Groups claims by verdict, in document order within a group; empty groups are left out. */
export function groupClaims(claims: readonly ClaimSummary[]): ClaimGroup[] {
  return ORDER.map((status) => {
    const items = claims
      .filter((c) => c.status === status)
      .sort((a, b) => a.range.start.line - b.range.start.line || a.range.start.character - b.range.start.character)
      .map((c) => {
        const stated = `${c.stated}${c.unit ? ` ${c.unit}` : ''}`;
        const computed = c.computed === null ? '' : ` → ${Number(c.computed.toPrecision(digits(c.stated) + 1))}${c.unit ? ` ${c.unit}` : ''}`;
        return {
          label: `${c.title.replace(/ — (?:consistent|inconsistent|unchecked)$/, '')}: ${stated}`,
          description: status === 'unchecked' ? c.reason ?? '' : `${computed.trim()}`,
          tooltip: c.slip ?? c.reason ?? `line ${c.range.start.line + 1}`,
          line: c.range.start.line,
          character: c.range.start.character,
        };
      });
    return { status, label: `${LABEL[status]} (${items.length})`, items };
  }).filter((g) => g.items.length > 0);
}

/** The status bar text for a document: its parameter set and how many numbers disagree. */
export function statusText(parameters: { text: string; origin: string } | null, counts: ClaimCounts): { text: string; tooltip: string } {
  const wrong = counts.inconsistent;
  if (!parameters) {
    return { text: '$(telescope) Comove: no parameter set', tooltip: counts.claims ? `${counts.claims} cosmology-dependent numbers, no declared parameter set: click to choose one` : 'Comove: click to choose a parameter set' };
  }
  const set = parameters.text.length > 32 ? `${parameters.text.slice(0, 31)}…` : parameters.text;
  return {
    text: `$(telescope) ${set}${wrong ? ` · ${wrong} ✗` : ''}`,
    tooltip: `Comove parameter set (${parameters.origin}): ${parameters.text}\n${counts.checked} numbers checked, ${wrong} inconsistent. Click to choose another set.`,
  };
}
