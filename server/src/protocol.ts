/**
 * The server's own requests, shared by the server and the VS Code client: `comove/documentClaims`
 * (a document's claim counts, and on request its claims and chart data, for the views) and `comove/migrate` (the workspace edit
 * that moves a manuscript to another parameter set). Types only.
 */

import type { Chart } from '../../shared/src/check/chartData.js';

type Position = { line: number; character: number };

/** One claim as the views show it. */
export interface ClaimSummary {
  readonly range: { start: Position; end: Position };
  readonly kind: string;
  /** The first line of the explanation: quantity, redshift and verdict. */
  readonly title: string;
  readonly z: number | null;
  readonly stated: string;
  readonly unit: string;
  readonly computed: number | null;
  readonly status: string;
  readonly slip: string | null;
  readonly reason: string | null;
}

/** How many claims a document has, how many were checked and how many disagree. */
export interface ClaimCounts {
  readonly claims: number;
  readonly checked: number;
  readonly inconsistent: number;
}

/** Parameters of `comove/documentClaims`: the parts left out (`claims: false`, `charts: false`) are sent empty. */
export interface DocumentClaimsParams {
  readonly uri: string;
  readonly claims?: boolean;
  readonly charts?: boolean;
}

export interface DocumentClaimsResult {
  readonly uri: string;
  readonly parameters: { readonly text: string; readonly origin: string } | null;
  readonly counts: ClaimCounts;
  readonly claims: readonly ClaimSummary[];
  readonly charts: readonly Chart[];
}

/** A migration: the edit (LSP WorkspaceEdit) and how many numbers it could not rewrite, or why there is none. */
export type MigrateResult = { readonly edit: { changes: Record<string, Array<{ range: { start: Position; end: Position }; newText: string }>> }; readonly notRewritten: number } | { readonly error: string };
