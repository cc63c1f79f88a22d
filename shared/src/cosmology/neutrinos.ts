/**
 * Energy density of the cosmic neutrino background, massless and massive species together.
 *
 * Method: the fitting function of Komatsu et al. 2011 (WMAP seven-year, ApJS 192, 18, eq. 26),
 * which interpolates the Fermi–Dirac phase-space integral between the relativistic and
 * non-relativistic limits: ρν(massive)/ρν(massless) = [1 + (k y)^p]^(1/p), with y = mν/(kB Tν),
 * k = 0.3173 and p = 1.83. Its stated accuracy is about 0.1 % (quoted from memory); k is the
 * exact non-relativistic limit 180ζ(3)/(7π⁴).
 *
 * Convention: N_eff is shared equally among floor(N_eff) species; Σmν sits in one massive
 * eigenstate and the other species are massless.
 */

import { BOLTZMANN_EV_K, NEUTRINO_PER_SPECIES_RATIO, NEUTRINO_TEMPERATURE_RATIO } from './constants.js';

/** Fitting constant k of Komatsu et al. 2011, eq. 26. */
export const KOMATSU_K = 0.3173;
/** Fitting exponent p of Komatsu et al. 2011, eq. 26. */
export const KOMATSU_P = 1.83;
const INV_P = 1 / KOMATSU_P;

/** The pieces needed to evaluate the neutrino density at any redshift. */
export interface NeutrinoModel {
  /** Ωγ × (7/8)(4/11)^(4/3) × N_eff / N_species: density of one species (relative to ρc0) if relativistic, at z = 0. */
  readonly perSpecies: number;
  /** Number of massless species (floor(N_eff) − number of massive ones), or N_species when all are massless. */
  readonly masslessCount: number;
  /** y = m / (kB Tν0) for each massive species. */
  readonly massiveY: readonly number[];
}

/** Number of species N_eff is shared among: floor(N_eff), at least 1 (Komatsu et al. 2011 convention). */
export function neutrinoSpeciesCount(nEff: number): number {
  return Math.max(1, Math.floor(nEff));
}

/**
 * Builds the neutrino model from the photon density parameter Ωγ, the CMB temperature (K),
 * N_eff and the list of massive-species masses (eV).
 */
export function createNeutrinoModel(omegaGamma: number, tCmbK: number, nEff: number, massesEv: readonly number[]): NeutrinoModel {
  if (nEff <= 0 || omegaGamma <= 0) return { perSpecies: 0, masslessCount: 0, massiveY: [] };
  const species = neutrinoSpeciesCount(nEff);
  const tNuK = NEUTRINO_TEMPERATURE_RATIO * tCmbK;
  const massive = massesEv.filter((m) => m > 0);
  return {
    perSpecies: (omegaGamma * NEUTRINO_PER_SPECIES_RATIO * nEff) / species,
    masslessCount: species - massive.length,
    massiveY: massive.map((m) => m / (BOLTZMANN_EV_K * tNuK)),
  };
}

/**
 * Komatsu et al. 2011 eq. 26 factor F(u) = [1 + (k u)^p]^(1/p) for u = y/(1+z), written with
 * exp and log (about twice as fast as Math.pow in V8).
 */
function komatsuFactor(u: number): number {
  return Math.exp(INV_P * Math.log1p(Math.exp(KOMATSU_P * Math.log(KOMATSU_K * u))));
}

/**
 * Neutrino density at redshift z in units of today's critical density, ρν(z)/ρc0,
 * for zp1 = 1 + z.
 */
export function neutrinoDensity(model: NeutrinoModel, zp1: number): number {
  if (model.perSpecies === 0) return 0;
  let sum = model.masslessCount;
  const ys = model.massiveY;
  for (let i = 0; i < ys.length; i++) sum += komatsuFactor(ys[i] / zp1);
  const zp1sq = zp1 * zp1;
  return model.perSpecies * zp1sq * zp1sq * sum;
}

/**
 * d[ρν/ρc0]/d ln(1+z) at zp1 = 1 + z, from the analytic derivative of the fit:
 * 4ρν minus the mass term u·F'(u) = (ku)^p [1 + (ku)^p]^(1/p − 1).
 */
export function neutrinoDensityLogDerivative(model: NeutrinoModel, zp1: number): number {
  if (model.perSpecies === 0) return 0;
  let sum = model.masslessCount;
  let massTerm = 0;
  const ys = model.massiveY;
  for (let i = 0; i < ys.length; i++) {
    const kuP = Math.exp(KOMATSU_P * Math.log((KOMATSU_K * ys[i]) / zp1));
    const factor = Math.exp(INV_P * Math.log1p(kuP));
    sum += factor;
    massTerm += (kuP * factor) / (1 + kuP);
  }
  const zp1sq = zp1 * zp1;
  return model.perSpecies * zp1sq * zp1sq * (4 * sum - massTerm);
}

/**
 * The part of today's neutrino density that behaves as radiation: massless species only.
 * In units of today's critical density.
 */
export function masslessNeutrinoDensityToday(model: NeutrinoModel): number {
  return model.perSpecies * model.masslessCount;
}
