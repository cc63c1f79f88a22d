/**
 * Which parameter set a claim is checked under: a set given by the caller (`--params`, an editor
 * setting) overrides everything; otherwise a `local` directive or another model's declaration
 * whose scope holds the claim; otherwise the document's own declarations — directives first,
 * then prose and named sets, merged (the first statement of a key wins; conflicts are reported
 * by the reader); otherwise the set inherited from the root file of a LaTeX project.
 */

import type { Declaration } from '../claims/declarations.js';
import type { ParameterInput } from '../cosmology/parameters.js';
import { formatParameterInput } from '../cosmology/parameterText.js';

export type ChoiceOrigin = 'override' | 'declared' | 'local' | 'other-model' | 'inherited' | 'default';

export interface ParameterChoice {
  readonly input: ParameterInput;
  readonly origin: ChoiceOrigin;
  /** The declarations it was taken from (empty for an override). */
  readonly declarations: readonly Declaration[];
  /** The file those declarations are in. */
  readonly uri: string | null;
  /** Canonical declaration text (what `--params` accepts). */
  readonly text: string;
  /** Why the set cannot be used, if so (an injected value, an unknown named set). */
  readonly incomplete: string | null;
  /** 0-based line of the (first) declaration in its file, for links; null for an override. */
  readonly line?: number | null;
}

export function overrideChoice(input: ParameterInput, origin: 'override' | 'default' = 'override'): ParameterChoice {
  return { input, origin, declarations: [], uri: null, text: formatParameterInput(input), incomplete: null };
}

/** The document-wide set a file declares, or null if it declares none. */
export function documentChoice(declarations: readonly Declaration[], uri: string): ParameterChoice | null {
  const wide = declarations.filter((d) => d.role === 'document');
  if (wide.length === 0) return null;
  const directives = wide.filter((d) => d.origin === 'directive' || d.origin === 'front-matter');
  const used = directives.length ? directives : wide;
  const complete = used.filter((d) => !d.incomplete);
  if (complete.length === 0) {
    return { input: {}, origin: 'declared', declarations: used, uri, text: '', incomplete: used[0].incomplete };
  }
  const input: ParameterInput = {};
  for (const d of complete) {
    for (const [k, v] of Object.entries(d.input) as Array<[keyof ParameterInput, number | boolean]>) {
      if (input[k] === undefined) (input as Record<string, number | boolean>)[k] = v;
    }
  }
  return { input, origin: 'declared', declarations: complete, uri, text: formatParameterInput(input), incomplete: null };
}

/** The scoped declaration (local override or another model's set) that holds reading offset `at`, if any. */
export function scopedChoice(declarations: readonly Declaration[], at: number, uri: string): ParameterChoice | null {
  let best: Declaration | null = null;
  for (const d of declarations) {
    if (d.role === 'document' || at < d.scopeStart || at >= d.scopeEnd) continue;
    if (!best || d.scopeStart >= best.scopeStart) best = d;
  }
  if (!best) return null;
  return {
    input: best.input,
    origin: best.role === 'local' ? 'local' : 'other-model',
    declarations: [best],
    uri,
    text: formatParameterInput(best.input),
    incomplete: best.incomplete,
  };
}
