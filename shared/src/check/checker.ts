/**
 * The checker: every claim of a file recomputed under the parameter set that applies to it and
 * judged against what the author wrote, with the slip that explains an inconsistent value, the
 * replacement text, and document-level findings (no declaration, unusable declaration,
 * composition percentages that do not add up). Pure: extraction in, plain data out.
 */

import type { Claim } from '../claims/claimExtractor.js';
import type { Declaration } from '../claims/declarations.js';
import { lineColumn, lineStartsOf, type FileExtraction } from '../claims/extraction.js';
import { CosmologyCache, type Cosmology } from '../cosmology/cosmology.js';
import type { ParameterInput } from '../cosmology/parameters.js';
import { describeAuthorCosmology, fitAuthorCosmology } from './authorCosmology.js';
import { compositionSums, declaredDensity, declaredPercentage } from './densities.js';
import { restate, type SourceEdit } from './fixes.js';
import { documentChoice, overrideChoice, scopedChoice, type ParameterChoice } from './parameterChoice.js';
import { questionOf, recompute } from './recompute.js';
import { diagnose, presetSets, type Slip } from './slips.js';
import { DEFAULT_RELATIVE_FLOOR, floorFor, judge, statedInterval, type Interval } from './tolerance.js';

export type Verdict = 'consistent' | 'inconsistent' | 'unchecked';

export interface ClaimCheck {
  readonly claim: Claim;
  readonly status: Verdict;
  /** For unchecked claims: why. */
  readonly reason: string | null;
  readonly computed: number | null;
  /** Unit of `computed` as text ('' for pure numbers). */
  readonly unitText: string;
  /** What the statement admits, and with the floor and method accuracy. */
  readonly interval: Interval | null;
  readonly admitted: Interval | null;
  readonly relativeDifference: number | null;
  readonly tolerancesAway: number | null;
  /** Consistent only thanks to the relative floor or the method's accuracy. */
  readonly onlyByFloor: boolean;
  readonly formula: string | null;
  readonly source: string | null;
  readonly accuracy: string | null;
  readonly note: string | null;
  readonly slip: Slip | null;
  readonly parameters: ParameterChoice | null;
  /** The edit that restates the claim as recomputed (inconsistent claims), or why there is none. */
  readonly fix: SourceEdit | null;
  readonly fixUnavailable: string | null;
}

export type FindingCode = 'no-declaration' | 'declaration-unusable' | 'declaration-conflict' | 'composition-sum' | 'author-cosmology';

/** A document-level finding, at reading-text offsets. */
export interface Finding {
  readonly code: FindingCode;
  readonly severity: 'error' | 'warning' | 'information';
  readonly message: string;
  readonly start: number;
  readonly end: number;
  readonly related: ReadonlyArray<{ readonly start: number; readonly end: number }>;
}

export interface FileCheck {
  readonly extraction: FileExtraction;
  /** The document-wide parameter set (null: none declared or given). */
  readonly parameters: ParameterChoice | null;
  readonly checks: readonly ClaimCheck[];
  readonly findings: readonly Finding[];
}

export interface CheckOptions {
  /** Relative floor added to every tolerance (default 0.005). */
  readonly relativeFloor?: number;
  /** A parameter set that overrides the manuscript's declarations. */
  readonly override?: ParameterInput | null;
  /** A set inherited from the including file, used when the file declares none. */
  readonly inherited?: ParameterChoice | null;
  /** A set to use when a file declares none and inherits none (an editor's default setting). */
  readonly fallback?: ParameterInput | null;
  /** Built parameter sets, shared across files and calls (the caller owns it). */
  readonly cache?: CosmologyCache;
  /** Whether to look for slips (default true). */
  readonly diagnose?: boolean;
  /** Whether to fit the parameter set the numbers agree with best (default true). */
  readonly fitAuthorCosmology?: boolean;
}

function unchecked(claim: Claim, reason: string, parameters: ParameterChoice | null): ClaimCheck {
  return {
    claim, status: 'unchecked', reason, computed: null, unitText: claim.value.unit?.text.trim() ?? '', interval: null, admitted: null,
    relativeDifference: null, tolerancesAway: null, onlyByFloor: false, formula: null, source: null, accuracy: null, note: null, slip: null,
    parameters, fix: null, fixUnavailable: null,
  };
}

/** Checks the claims of one file. Never throws on user input. */
export function checkFile(file: FileExtraction, options: CheckOptions = {}): FileCheck {
  const cache = options.cache ?? new CosmologyCache();
  const floor = options.relativeFloor ?? DEFAULT_RELATIVE_FLOOR;
  const lineStarts = lineStartsOf(file.text);
  const withLine = (choice: ParameterChoice | null): ParameterChoice | null => {
    const d = choice?.declarations[0];
    if (!choice || !d || choice.origin === 'inherited') return choice;
    const at = d.sourceRange ? d.sourceRange.start : file.reading.reading.sourceStart(d.start);
    return { ...choice, line: lineColumn(file.text, at, lineStarts).line };
  };
  const own = withLine(documentChoice(file.declarations, file.uri));
  const documentSet = options.override ? overrideChoice(options.override) : own ?? options.inherited ?? (options.fallback ? overrideChoice(options.fallback, 'default') : null);
  const findings: Finding[] = [];

  const built = new Map<ParameterChoice, { cosmology: Cosmology } | { error: string }>();
  const build = (choice: ParameterChoice) => {
    let b = built.get(choice);
    if (!b) {
      if (choice.incomplete) b = { error: `the parameter set cannot be used: ${choice.incomplete}` };
      else {
        const made = cache.get(choice.input);
        b = made.ok ? { cosmology: made.cosmology } : { error: `the declared parameters are not a valid set: ${made.errors.map((e) => `${e.parameter}: ${e.message}`).join('; ')}` };
      }
      built.set(choice, b);
    }
    return b;
  };

  if (documentSet) {
    const b = build(documentSet);
    if ('error' in b) {
      const d = documentSet.declarations[0];
      findings.push({ code: 'declaration-unusable', severity: 'warning', message: b.error, start: d?.start ?? 0, end: d?.end ?? 0, related: [] });
    }
  }
  for (const p of file.declarationProblems) {
    findings.push({ code: 'declaration-conflict', severity: 'warning', message: p.message, start: p.ranges[0]?.start ?? 0, end: p.ranges[0]?.end ?? 0, related: p.ranges.slice(1) });
  }

  let presets: ReturnType<typeof presetSets> | null = null;
  const slipSearch = { presets: () => (presets ??= presetSets(cache)) };
  const checks: ClaimCheck[] = [];
  // One choice object per scoped declaration, so that sets are built once and claims under the same set share it.
  const scopedChoices = new Map<Declaration, ParameterChoice | null>();
  const scopedDeclarations = file.declarations.filter((d) => d.role !== 'document');
  const scopedFor = (at: number): ParameterChoice | null => {
    if (scopedDeclarations.length === 0) return null;
    const found = scopedChoice(scopedDeclarations, at, file.uri);
    const d = found?.declarations[0];
    if (!found || !d) return found;
    if (!scopedChoices.has(d)) scopedChoices.set(d, withLine(found));
    return scopedChoices.get(d)!;
  };
  for (const claim of file.claims) {
    const scoped = options.override ? null : scopedFor(claim.start);
    const choice = scoped ?? documentSet;
    if (claim.unchecked) {
      checks.push(unchecked(claim, claim.unchecked, choice));
      continue;
    }
    if (!choice) {
      checks.push(unchecked(claim, 'the manuscript declares no parameter set', null));
      continue;
    }
    const b = build(choice);
    if ('error' in b) {
      checks.push(unchecked(claim, b.error, choice));
      continue;
    }
    checks.push(checkClaim(claim, b.cosmology, choice, file, floor, options.diagnose !== false, slipSearch));
  }

  if (!documentSet && file.claims.some((c) => !c.unchecked)) {
    findings.push({
      code: 'no-declaration', severity: 'information', start: 0, end: 0, related: [],
      message: `${file.claims.length} cosmology-dependent number${file.claims.length === 1 ? '' : 's'} but no declared parameter set: add a directive such as "comove: H0=70 Omega_m=0.3 flat", or give one with --params`,
    });
  }
  for (const sum of compositionSums(file.claims)) {
    const first = sum.claims[0];
    findings.push({
      code: 'composition-sum', severity: 'warning', start: first.start, end: sum.claims[sum.claims.length - 1].end,
      related: sum.claims.slice(1).map((c) => ({ start: c.start, end: c.end })),
      message: `the shares of the energy budget in this sentence add up to ${+sum.total.toFixed(6)} %, not 100 % (their rounding admits ${+sum.low.toFixed(3)}–${+sum.high.toFixed(3)} %)`,
    });
  }
  if (options.fitAuthorCosmology !== false) {
    const documentWide = checks.filter((c) => c.status !== 'unchecked' && c.parameters === documentSet);
    const pool = documentSet ? documentWide.map((c) => c.claim) : file.claims;
    const declared = documentSet ? build(documentSet) : null;
    const fit = fitAuthorCosmology(pool, { cache, relativeFloor: floor, declared: declared && 'cosmology' in declared ? declared.cosmology : null });
    const message = fit ? describeAuthorCosmology(fit, documentSet && declared && 'cosmology' in declared ? documentSet.text : null) : null;
    if (message) findings.push({ code: 'author-cosmology', severity: 'information', message, start: documentSet?.declarations[0]?.start ?? 0, end: documentSet?.declarations[0]?.end ?? 0, related: [] });
  }
  return { extraction: file, parameters: documentSet, checks, findings };
}

/** Checks a LaTeX project (root first, as extractProject returns it): included files without a declaration of their own inherit the root's. */
export function checkProject(files: readonly FileExtraction[], options: CheckOptions = {}): FileCheck[] {
  const cache = options.cache ?? new CosmologyCache();
  const out: FileCheck[] = [];
  let inherited: ParameterChoice | null = options.inherited ?? null;
  for (const f of files) {
    const r = checkFile(f, { ...options, cache, inherited: documentChoice(f.declarations, f.uri) ? null : inherited });
    if (!inherited && r.parameters && r.parameters.origin !== 'override' && r.parameters.origin !== 'default') inherited = { ...r.parameters, origin: 'inherited' };
    out.push(r);
  }
  return out;
}

function checkClaim(
  claim: Claim, c: Cosmology, choice: ParameterChoice, file: FileExtraction, relativeFloor: number, withDiagnosis: boolean,
  slipSearch: { presets: () => ReturnType<typeof presetSets> },
): ClaimCheck {
  const n = claim.value;
  const unitText = n.unit?.text.trim() ?? '';
  let computed: number;
  let formula: string;
  let source: string;
  let methodRelative = 0;
  let accuracy: string | null = null;
  let note: string | null = null;
  const question = questionOf(claim);
  const algebraic = claim.kind === 'densityParameter' || claim.kind === 'compositionPercentage';
  if (algebraic) {
    const d = claim.kind === 'densityParameter' ? declaredDensity(c.params, claim.parameter ?? '') : declaredPercentage(c.params, claim.parameter ?? '');
    if (typeof d === 'string') return unchecked(claim, d, choice);
    computed = d.value;
    formula = d.formula;
    source = 'the declared parameter set';
  } else {
    const r = recompute(c, question);
    if (!r.ok) return unchecked(claim, r.reason, choice);
    computed = r.value;
    formula = r.formula;
    source = r.source;
    methodRelative = r.methodRelative;
    accuracy = r.accuracy;
    note = r.note;
  }
  const interval = statedInterval(n);
  const floorOf = floorFor(claim, relativeFloor);
  const j = judge(n, interval, computed, floorOf(computed), methodRelative * Math.abs(computed));
  let slip: Slip | null = null;
  let fix: SourceEdit | null = null;
  let fixUnavailable: string | null = null;
  if (!j.consistent) {
    if (withDiagnosis && !algebraic) {
      slip = diagnose({ cosmology: c, question, stated: n, interval, computed, floor: floorOf, neighbouringRedshifts: claim.sentenceRedshifts, presets: slipSearch.presets() });
    }
    const edit = restate(file.reading, file.text, n, computed);
    if (typeof edit === 'string') fixUnavailable = edit;
    else fix = edit;
  }
  return {
    claim, status: j.consistent ? 'consistent' : 'inconsistent', reason: null, computed, unitText, interval, admitted: j.admitted,
    relativeDifference: j.relativeDifference, tolerancesAway: j.consistent ? 0 : j.tolerancesAway, onlyByFloor: j.onlyByFloor,
    formula, source, accuracy, note, slip, parameters: choice, fix, fixUnavailable,
  };
}
