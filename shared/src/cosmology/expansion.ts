/**
 * The expansion rate E(z) = H(z)/H0 and the density of each component, for a resolved
 * parameter set.
 *
 * E²(z) = Ωcb(1+z)³ + Ωγ(1+z)⁴ + ρν(z)/ρc0 + Ωk(1+z)² + Ωde·f_de(z)   (Hogg 1999, eq. 14,
 * extended with massive neutrinos and evolving dark energy), with the dark-energy density of
 * the CPL equation of state w(a) = w0 + wa(1 − a):
 * f_de = (1+z)^(3(1+w0+wa)) · exp(−3 wa z/(1+z))   (Chevallier & Polarski 2001; Linder 2003).
 */

import type { CosmologyParameters } from './parameters.js';
import { neutrinoDensity, neutrinoDensityLogDerivative, type NeutrinoModel } from './neutrinos.js';

/** Fast evaluator of E(z) and its derivative for one parameter set. */
export class Expansion {
  readonly params: CosmologyParameters;
  readonly neutrinos: NeutrinoModel;
  private readonly deExponent: number;
  private readonly isLambda: boolean;
  private readonly hasNeutrinos: boolean;
  /** One-entry cache of the neutrino density: E², Ωm(z) and Ωr(z) at one redshift share it. */
  private lastNeutrinoZp1 = NaN;
  private lastNeutrinoDensity = 0;

  constructor(params: CosmologyParameters, neutrinos: NeutrinoModel) {
    this.params = params;
    this.neutrinos = neutrinos;
    this.deExponent = 3 * (1 + params.w0 + params.wa);
    this.isLambda = params.w0 === -1 && params.wa === 0;
    this.hasNeutrinos = neutrinos.perSpecies > 0;
  }

  /** ρν(z)/ρc0 (neutrinos.ts), remembered for the last redshift asked. */
  neutrinoDensity(zp1: number): number {
    if (!this.hasNeutrinos) return 0;
    if (zp1 !== this.lastNeutrinoZp1) {
      this.lastNeutrinoDensity = neutrinoDensity(this.neutrinos, zp1);
      this.lastNeutrinoZp1 = zp1;
    }
    return this.lastNeutrinoDensity;
  }

  /** Dark-energy density relative to its value today, f_de(z) (Linder 2003). */
  darkEnergyScale(zp1: number): number {
    if (this.isLambda) return 1;
    const wa = this.params.wa;
    const power = Math.pow(zp1, this.deExponent);
    return wa === 0 ? power : power * Math.exp(-3 * wa * (1 - 1 / zp1));
  }

  /**
   * E²(z) = H²(z)/H0² for zp1 = 1 + z. Components with zero density are left out, so that at
   * huge redshifts 0 × ∞ never turns the sum into NaN.
   */
  e2(zp1: number): number {
    const p = this.params;
    const zp1sq = zp1 * zp1;
    let s = p.Omega_cb === 0 ? 0 : p.Omega_cb * zp1sq * zp1;
    if (p.Omega_gamma !== 0) s += p.Omega_gamma * zp1sq * zp1sq;
    if (p.Omega_k !== 0) s += p.Omega_k * zp1sq;
    if (p.Omega_Lambda !== 0) s += p.Omega_Lambda * this.darkEnergyScale(zp1);
    if (this.hasNeutrinos) s += this.neutrinoDensity(zp1);
    return s;
  }

  /** E(z) for zp1 = 1 + z (Hogg 1999, eq. 14). */
  e(zp1: number): number {
    return Math.sqrt(this.e2(zp1));
  }

  /** dE²/d ln(1+z), analytic, for zp1 = 1 + z. */
  de2dx(zp1: number): number {
    const p = this.params;
    const zp1sq = zp1 * zp1;
    let s = p.Omega_cb === 0 ? 0 : 3 * p.Omega_cb * zp1sq * zp1;
    if (p.Omega_gamma !== 0) s += 4 * p.Omega_gamma * zp1sq * zp1sq;
    if (p.Omega_k !== 0) s += 2 * p.Omega_k * zp1sq;
    if (p.Omega_Lambda !== 0) {
      const w = p.w0 + p.wa * (1 - 1 / zp1);
      s += 3 * (1 + w) * p.Omega_Lambda * this.darkEnergyScale(zp1);
    }
    if (this.hasNeutrinos) s += neutrinoDensityLogDerivative(this.neutrinos, zp1);
    return s;
  }

  /**
   * Deceleration parameter q(z) = −ä a / ȧ² = (1/2) d ln E²/d ln(1+z) − 1
   * (e.g. Peebles 1993, eq. 5.36, written in terms of E).
   */
  deceleration(zp1: number): number {
    return (0.5 * this.de2dx(zp1)) / this.e2(zp1) - 1;
  }

  /**
   * Neutrino density split into a radiation-like part (each species as if massless) and the
   * excess of the massive species over it, which behaves as matter once they are non-relativistic.
   * Both relative to ρc0.
   */
  private neutrinoSplit(zp1: number): { relativistic: number; matterLike: number } {
    if (!this.hasNeutrinos) return { relativistic: 0, matterLike: 0 };
    const total = this.neutrinoDensity(zp1);
    const nu = this.neutrinos;
    const relativistic = Math.min(total, nu.perSpecies * (nu.masslessCount + nu.massiveY.length) * zp1 ** 4);
    return { relativistic, matterLike: total - relativistic };
  }

  /** Matter density (cold dark matter, baryons, non-relativistic excess of massive neutrinos) relative to ρc0. */
  matterDensity(zp1: number): number {
    return this.params.Omega_cb * zp1 ** 3 + this.neutrinoSplit(zp1).matterLike;
  }

  /** Radiation density (photons, and neutrinos as if massless) relative to ρc0. */
  radiationDensity(zp1: number): number {
    return this.params.Omega_gamma * zp1 ** 4 + this.neutrinoSplit(zp1).relativistic;
  }

  /** Dark-energy density relative to ρc0. */
  darkEnergyDensity(zp1: number): number {
    return this.params.Omega_Lambda === 0 ? 0 : this.params.Omega_Lambda * this.darkEnergyScale(zp1);
  }
}
