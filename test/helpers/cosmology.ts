/** Test helpers: build a parameter set or fail loudly. */
import { createCosmology, findPreset, type Cosmology, type ParameterInput } from '../../shared/src/index.js';

export function build(input: ParameterInput): Cosmology {
  const made = createCosmology(input);
  if (!made.ok) throw new Error(`bad test parameters: ${JSON.stringify(made.errors)}`);
  return made.cosmology;
}

export function preset(name: string): Cosmology {
  const p = findPreset(name);
  if (!p) throw new Error(`no preset ${name}`);
  return build(p.input);
}

/** |a/b − 1|, or |a − b| when b is 0. */
export function relativeError(a: number, b: number): number {
  return b === 0 ? Math.abs(a - b) : Math.abs(a / b - 1);
}
