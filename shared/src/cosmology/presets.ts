/**
 * Published parameter sets, under names of our own. Each gives its source; values written
 * down from memory (no copy of the paper at hand) are marked `fromMemory` and the tests
 * that use them say so.
 *
 * Sets published as physical densities (ωb = Ωb h², ωc = Ωc h²) are stored that way, so that
 * the derived Ωm can be compared with the published one.
 */

import type { ParameterInput } from './parameters.js';

export interface Preset {
  readonly name: string;
  readonly title: string;
  readonly source: string;
  readonly fromMemory: boolean;
  readonly input: ParameterInput;
  /** Published derived values, for checks (same units as the engine's epoch quantities). */
  readonly published?: Readonly<Record<string, { value: number; sigma: number }>>;
}

export const PRESETS: readonly Preset[] = [
  {
    name: 'planck-2018',
    title: 'Planck 2018 base ΛCDM, TT,TE,EE+lowE+lensing+BAO',
    source: 'Planck Collaboration 2020, A&A 641, A6 (Planck 2018 results VI), Table 2, last column',
    fromMemory: true,
    input: { H0: 67.66, omega_b: 0.02242, omega_c: 0.11933, T_CMB: 2.7255, N_eff: 3.046, m_nu: 0.06, flat: true },
    published: {
      Omega_m: { value: 0.3111, sigma: 0.0056 },
      ageToday: { value: 13.787, sigma: 0.02 },
      recombination: { value: 1089.8, sigma: 0.21 },
      soundHorizonAtRecombination: { value: 144.57, sigma: 0.22 },
      dragEpoch: { value: 1060.01, sigma: 0.29 },
      soundHorizonDrag: { value: 147.21, sigma: 0.23 },
      matterRadiationEquality: { value: 3387, sigma: 21 },
    },
  },
  {
    name: 'planck-2018-cmb',
    title: 'Planck 2018 base ΛCDM, TT,TE,EE+lowE+lensing (no BAO)',
    source: 'Planck Collaboration 2020, A&A 641, A6 (Planck 2018 results VI), Table 2, TT,TE,EE+lowE+lensing column',
    fromMemory: true,
    input: { H0: 67.36, omega_b: 0.02237, omega_c: 0.12, T_CMB: 2.7255, N_eff: 3.046, m_nu: 0.06, flat: true },
    published: {
      Omega_m: { value: 0.3153, sigma: 0.0073 },
      ageToday: { value: 13.797, sigma: 0.023 },
      recombination: { value: 1089.92, sigma: 0.25 },
      soundHorizonDrag: { value: 147.09, sigma: 0.26 },
      matterRadiationEquality: { value: 3402, sigma: 26 },
    },
  },
  {
    name: 'planck-2015',
    title: 'Planck 2015 base ΛCDM, TT,TE,EE+lowP+lensing+ext',
    source: 'Planck Collaboration 2016, A&A 594, A13 (Planck 2015 results XIII), Table 4, last column',
    fromMemory: true,
    input: { H0: 67.74, omega_b: 0.0223, omega_c: 0.1188, T_CMB: 2.7255, N_eff: 3.046, m_nu: 0.06, flat: true },
    published: {
      Omega_m: { value: 0.3089, sigma: 0.0062 },
      ageToday: { value: 13.799, sigma: 0.021 },
    },
  },
  {
    name: 'wmap-9',
    title: 'WMAP nine-year ΛCDM, WMAP+eCMB+BAO+H0',
    source: 'Hinshaw et al. 2013, ApJS 208, 19, Table 4',
    fromMemory: true,
    input: { H0: 69.32, omega_b: 0.02266, omega_c: 0.1157, T_CMB: 2.7255, N_eff: 3.046, m_nu: 0, flat: true },
    published: {
      Omega_m: { value: 0.2865, sigma: 0.0097 },
      ageToday: { value: 13.772, sigma: 0.059 },
    },
  },
  {
    name: 'flat-70-0.3',
    title: 'The round flat set: H0 = 70 km/s/Mpc, Ωm = 0.3, ΩΛ = 0.7, no radiation',
    source: 'common practice, no source',
    fromMemory: false,
    input: { H0: 70, Omega_m: 0.3, T_CMB: 0, flat: true },
  },
];

/** The preset with this name (case-insensitive), or undefined. */
export function findPreset(name: string): Preset | undefined {
  const lower = name.toLowerCase();
  return PRESETS.find((p) => p.name === lower);
}
