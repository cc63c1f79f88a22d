/**
 * Core results to LSP types: the only place that knows both. Pure functions of a located check
 * and the settings, so they are tested without a connection.
 */

import {
  CodeActionKind,
  DiagnosticSeverity,
  InlayHintKind,
  MarkupKind,
  SymbolKind,
  type CodeAction,
  type CodeLens,
  type Diagnostic,
  type DocumentSymbol,
  type Hover,
  type InlayHint,
  type Position,
  type Range,
  type TextEdit,
} from 'vscode-languageserver';
import {
  explain,
  formatParameterInput,
  kindTitle,
  ruleFor,
  significant,
  whereText,
  type ClaimCheck,
  type Declaration,
  type LocatedCheck,
  type RuleName,
} from '../../shared/src/index.js';
import type { ComoveSettings, SeverityName } from './settings.js';

export const SOURCE = 'comove';

const SEVERITY: Record<SeverityName, DiagnosticSeverity> = {
  error: DiagnosticSeverity.Error,
  warning: DiagnosticSeverity.Warning,
  information: DiagnosticSeverity.Information,
  hint: DiagnosticSeverity.Hint,
};

/** Data attached to a diagnostic so that code actions find their claim again. */
export interface DiagnosticData {
  readonly claimIndex?: number;
  readonly version?: number | null;
}

function enabled(check: ClaimCheck, settings: ComoveSettings): boolean {
  return settings.enabledKinds.length === 0 || settings.enabledKinds.includes(check.claim.kind);
}

function severityOf(check: ClaimCheck, settings: ComoveSettings): DiagnosticSeverity {
  if (settings.inconsistentSeverity !== 'byDistance') return SEVERITY[settings.inconsistentSeverity];
  return (check.tolerancesAway ?? Infinity) >= settings.errorTolerances ? DiagnosticSeverity.Error : DiagnosticSeverity.Warning;
}

/** Where the file's parameter set was declared, as a range in that file (same file only). */
function declarationRange(located: LocatedCheck, d: Declaration | undefined): Range | null {
  if (!d) return null;
  return d.sourceRange ? located.sourceRange(d.sourceRange.start, d.sourceRange.end) : located.range(d.start, Math.max(d.start, d.end));
}

function statedText(c: ClaimCheck): string {
  return `${c.claim.value.text}${c.unitText ? ` ${c.unitText}` : ''}`;
}

/** Diagnostics of one file: inconsistent claims, declaration problems, reading problems, and the no-declaration notice. */
export function diagnosticsOf(located: LocatedCheck, settings: ComoveSettings, uri: string, version: number | null): Diagnostic[] {
  const out: Diagnostic[] = [];
  const check = located.check;
  const code = (name: RuleName) => ruleFor(name).id;
  // The related information of a parameter set, made once for all the claims under it.
  const relatedOf = new Map<ClaimCheck['parameters'], Diagnostic['relatedInformation'] | null>();
  check.checks.forEach((c, claimIndex) => {
    if (c.status !== 'inconsistent' || !enabled(c, settings)) return;
    const computed = c.computed === null ? '' : significant(c.computed, c.claim.value.significantDigits + 1);
    let related = relatedOf.get(c.parameters);
    if (related === undefined) {
      const range = c.parameters && c.parameters.uri === uri ? declarationRange(located, c.parameters.declarations[0]) : null;
      related = range ? [{ location: { uri, range }, message: `parameter set: ${c.parameters!.text}` }] : null;
      relatedOf.set(c.parameters, related);
    }
    out.push({
      range: located.claimRange(c),
      severity: severityOf(c, settings),
      source: SOURCE,
      code: code('inconsistent-value'),
      message: `${kindTitle(c.claim.kind)}${whereText(c)}: ${statedText(c)} disagrees with the declared cosmology, which gives ${computed}${c.unitText ? ` ${c.unitText}` : ''}${c.slip ? ` — ${c.slip.description}` : ''}`,
      data: { claimIndex, version } satisfies DiagnosticData,
      ...(related ? { relatedInformation: related } : {}),
    });
  });
  for (const p of check.extraction.problems) {
    out.push({ range: located.sourceRange(p.sourceStart, p.sourceEnd), severity: p.severity === 'error' ? DiagnosticSeverity.Error : DiagnosticSeverity.Warning, source: SOURCE, code: code('reading-problem'), message: p.message });
  }
  for (const f of check.findings) {
    out.push({
      range: f.code === 'no-declaration' ? { start: { line: 0, character: 0 }, end: { line: 0, character: 0 } } : located.range(f.start, f.end),
      severity: f.severity === 'information' ? DiagnosticSeverity.Information : f.severity === 'error' ? DiagnosticSeverity.Error : DiagnosticSeverity.Warning,
      source: SOURCE,
      code: code(f.code),
      message: f.message,
      ...(f.related.length ? { relatedInformation: f.related.map((r) => ({ location: { uri, range: located.range(r.start, r.end) }, message: 'also here' })) } : {}),
    });
  }
  return out;
}

function contains(r: Range, p: Position): boolean {
  const before = (a: Position, b: Position) => a.line < b.line || (a.line === b.line && a.character <= b.character);
  return before(r.start, p) && before(p, r.end);
}

/** The claim whose number (and unit) holds the position, if any. */
export function claimAt(located: LocatedCheck, position: Position): { check: ClaimCheck; index: number; range: Range } | null {
  const checks = located.check.checks;
  for (let i = 0; i < checks.length; i++) {
    const range = located.claimRange(checks[i]);
    if (contains(range, position)) return { check: checks[i], index: i, range };
  }
  return null;
}

/** The declaration whose statement holds the position, if any. */
export function declarationAt(located: LocatedCheck, position: Position): { declaration: Declaration; range: Range } | null {
  for (const d of located.check.extraction.declarations) {
    const range = declarationRange(located, d)!;
    if (contains(range, position)) return { declaration: d, range };
  }
  return null;
}

/** The hover on a claim (its explanation) or on a declaration (the resolved set and the totals). */
export function hoverAt(located: LocatedCheck, position: Position): Hover | null {
  const claim = claimAt(located, position);
  if (claim) return { contents: { kind: MarkupKind.Markdown, value: explain(claim.check, (u, line) => `[line ${line + 1}](${u}#L${line + 1})`) }, range: claim.range };
  const decl = declarationAt(located, position);
  if (decl) {
    const d = decl.declaration;
    const checks = located.check.checks;
    const lines = [
      `**Comove: ${d.role === 'document' ? 'the parameter set of this manuscript' : d.role === 'local' ? 'a local parameter set (rest of the section)' : "another model's parameter set (this section only)"}**`,
      '',
      `\`${formatParameterInput(d.input) || '(nothing usable)'}\`${d.preset ? ` — preset ${d.preset}` : ''}`,
      '',
      `Stated: ${d.stated.join(', ') || 'nothing'}${d.incomplete ? `\n\nIncomplete: ${d.incomplete}` : ''}`,
      '',
      `${checks.filter((c) => c.status !== 'unchecked').length} numbers checked · ${checks.filter((c) => c.status === 'inconsistent').length} inconsistent · ${checks.filter((c) => c.status === 'unchecked').length} unchecked`,
    ];
    return { contents: { kind: MarkupKind.Markdown, value: lines.join('\n') }, range: decl.range };
  }
  return null;
}

/** Inlay hints: the recomputed value after stated ones (inconsistent only by default). */
export function inlayHintsOf(located: LocatedCheck, settings: ComoveSettings, range: Range | null): InlayHint[] {
  if (settings.inlayHints === 'off') return [];
  const out: InlayHint[] = [];
  for (const c of located.check.checks) {
    if (c.computed === null || !enabled(c, settings)) continue;
    if (c.status !== 'inconsistent' && settings.inlayHints !== 'all') continue;
    const r = located.claimRange(c);
    if (range && (r.end.line < range.start.line || r.start.line > range.end.line)) continue;
    out.push({
      position: hintPosition(located, c),
      label: ` ${c.status === 'inconsistent' ? '≠' : '='} ${significant(c.computed, c.claim.value.significantDigits + 1)}`,
      kind: InlayHintKind.Parameter,
      paddingLeft: true,
      tooltip: `recomputed under ${c.parameters?.text ?? 'the declared set'}`,
    });
  }
  return out;
}

/**
 * Where a claim's hint goes: after the number and unit, and after the braces and dollars that
 * close around them (`Mpc$^{-1}$`, `\SI{6.6}{Gpc}`), so that it never stands inside markup.
 */
function hintPosition(located: LocatedCheck, c: ClaimCheck): Position {
  const source = located.check.extraction.text;
  let end = located.check.extraction.reading.reading.sourceRange(c.claim.value.start, c.claim.end).end;
  while (end < source.length && (source[end] === '}' || source[end] === '$')) end++;
  return located.sourceRange(end, end).end;
}

/** The code lens on each document-wide declaration: the resolved set and the totals. */
export function codeLensesOf(located: LocatedCheck): CodeLens[] {
  const checks = located.check.checks;
  const checked = checks.filter((c) => c.status !== 'unchecked').length;
  const inconsistent = checks.filter((c) => c.status === 'inconsistent').length;
  const set = located.check.parameters;
  return located.check.extraction.declarations
    .filter((d) => d.role === 'document')
    .slice(0, 1)
    .map((d) => ({
      range: declarationRange(located, d)!,
      command: { title: `${set?.text || formatParameterInput(d.input) || 'no usable set'} · ${checked} numbers checked · ${inconsistent} inconsistent`, command: 'comove.showClaims', arguments: [] },
    }));
}

/** The claims as document symbols, grouped under their verdict. */
export function documentSymbolsOf(located: LocatedCheck): DocumentSymbol[] {
  return located.check.checks.map((c) => {
    const range = located.claimRange(c);
    return {
      name: `${kindTitle(c.claim.kind)}${whereText(c)}: ${statedText(c)}`,
      detail: c.status,
      kind: SymbolKind.Number,
      range,
      selectionRange: range,
    };
  });
}

/** The directive that silences a line, in the document's comment syntax. */
export function silenceDirective(languageId: string): string {
  return languageId === 'markdown' ? '<!-- comove: skip-next-line -->\n' : '% comove: skip-next-line\n';
}

/** Quick fixes for the claim at `index`: replace with the recomputed value; silence the line. */
export function claimActions(located: LocatedCheck, index: number, uri: string, languageId: string, diagnostics: Diagnostic[]): CodeAction[] {
  const c = located.check.checks[index];
  if (!c) return [];
  const actions: CodeAction[] = [];
  if (c.fix) {
    const edit: TextEdit = { range: located.sourceRange(c.fix.start, c.fix.end), newText: c.fix.newText };
    actions.push({ title: `Replace with the recomputed value ${c.fix.newText}`, kind: CodeActionKind.QuickFix, diagnostics, isPreferred: true, edit: { changes: { [uri]: [edit] } } });
  }
  const line = located.claimRange(c).start.line;
  actions.push({
    title: 'Silence Comove on this line',
    kind: CodeActionKind.QuickFix,
    diagnostics,
    edit: { changes: { [uri]: [{ range: { start: { line, character: 0 }, end: { line, character: 0 } }, newText: silenceDirective(languageId) }] } },
  });
  return actions;
}
