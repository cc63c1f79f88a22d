/**
 * One parameter set, ready to evaluate: the resolved parameters, the expansion rate and the
 * background tables. Build it once per parameter set (about a millisecond) and evaluate
 * quantities with the functions of distances.ts, times.ts, inverse.ts, epochs.ts and growth.ts.
 */

import { BackgroundTable } from './backgroundTable.js';
import { hubbleDistanceMpc, hubbleTimeGyr } from './constants.js';
import { Expansion } from './expansion.js';
import { resolveParameters, type CosmologyParameters, type ParameterError, type ParameterInput } from './parameters.js';
import type { NeutrinoModel } from './neutrinos.js';

export class Cosmology {
  readonly params: CosmologyParameters;
  readonly expansion: Expansion;
  readonly table: BackgroundTable;
  /** c/H0 in Mpc (Hogg 1999, eq. 4). */
  readonly hubbleDistanceMpc: number;
  /** 1/H0 in Gyr (Hogg 1999, eq. 3). */
  readonly hubbleTimeGyr: number;
  /** Per-set results computed on first use (growth table, epochs), keyed by name. */
  private readonly lazy = new Map<string, unknown>();

  constructor(params: CosmologyParameters, neutrinos: NeutrinoModel) {
    this.params = params;
    this.expansion = new Expansion(params, neutrinos);
    this.table = new BackgroundTable(this.expansion);
    this.hubbleDistanceMpc = hubbleDistanceMpc(params.H0);
    this.hubbleTimeGyr = hubbleTimeGyr(params.H0);
  }

  /** Returns the value cached under `key`, computing it on first use. */
  memo<T>(key: string, compute: () => T): T {
    if (this.lazy.has(key)) return this.lazy.get(key) as T;
    const value = compute();
    this.lazy.set(key, value);
    return value;
  }
}

export type CreateResult = { readonly ok: true; readonly cosmology: Cosmology } | { readonly ok: false; readonly errors: readonly ParameterError[] };

/** Resolves, validates and builds a parameter set. Never throws on user input. */
export function createCosmology(input: ParameterInput): CreateResult {
  const resolved = resolveParameters(input);
  if (!resolved.ok) return resolved;
  return { ok: true, cosmology: new Cosmology(resolved.params, resolved.neutrinos) };
}

/**
 * A cache of built parameter sets, keyed by the canonical text of their inputs, owned by the
 * caller (the core keeps no global state). Least-recently-used entries beyond `capacity` go.
 */
export class CosmologyCache {
  private readonly entries = new Map<string, CreateResult>();
  constructor(private readonly capacity = 16) {}

  get(input: ParameterInput): CreateResult {
    const key = canonicalKey(input);
    const hit = this.entries.get(key);
    if (hit) {
      this.entries.delete(key);
      this.entries.set(key, hit);
      return hit;
    }
    const made = createCosmology(input);
    this.entries.set(key, made);
    if (this.entries.size > this.capacity) this.entries.delete(this.entries.keys().next().value as string);
    return made;
  }

  get size(): number {
    return this.entries.size;
  }
}

/** Canonical text of an input: sorted key=value pairs with full-precision numbers. */
export function canonicalKey(input: ParameterInput): string {
  return Object.keys(input)
    .filter((k) => input[k as keyof ParameterInput] !== undefined)
    .sort()
    .map((k) => `${k}=${String(input[k as keyof ParameterInput])}`)
    .join(' ');
}
