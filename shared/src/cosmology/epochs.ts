/**
 * Epochs of the expansion history and the early-universe scales a manuscript may quote:
 * matter–radiation equality, matter–dark-energy equality, onset of acceleration,
 * recombination/decoupling z* (Hu & Sugiyama 1996 fit), drag epoch z_d (Eisenstein & Hu
 * 1998 fit), sound horizons by numerical integration, r_drag by the calibrated fit of
 * Aubourg et al. 2015, the acoustic angle θ*, and the age at recombination.
 *
 * Each result records its method, the method's known accuracy and its source, so that an
 * explanation can quote them. Epochs need radiation: when the parameter set has none
 * (T_CMB = 0), they are computed for the same set with T_CMB = 2.72548 K (Fixsen 2009) and
 * N_eff = 3.046, and the result says so.
 */

import { FIXSEN_2009_T_CMB_K, SPEED_OF_LIGHT_KM_S, STANDARD_N_EFF } from './constants.js';
import { Cosmology, createCosmology } from './cosmology.js';
import { transverseComovingDistance } from './distances.js';
import type { ParameterInput } from './parameters.js';
import { integrateAdaptive } from './quadrature.js';
import { brentRoot } from './rootFinding.js';
import { age, lookbackTime } from './times.js';

/** One epoch quantity: its value (null when undefined for this model) with how it was obtained. */
export interface EpochValue {
  readonly value: number | null;
  /** Unit of `value` ('' for redshifts and other pure numbers). */
  readonly unit: string;
  readonly method: string;
  /** Known accuracy of the method, for explanations. */
  readonly accuracy: string;
  readonly source: string;
  /** Why the value is null, or an assumption that was made. */
  readonly note?: string;
}

export interface Epochs {
  readonly ageToday: EpochValue;
  readonly hubbleTime: EpochValue;
  readonly hubbleDistance: EpochValue;
  readonly matterRadiationEquality: EpochValue;
  readonly matterDarkEnergyEquality: EpochValue;
  readonly accelerationOnset: EpochValue;
  readonly accelerationOnsetLookback: EpochValue;
  readonly recombination: EpochValue;
  readonly ageAtRecombination: EpochValue;
  readonly soundHorizonAtRecombination: EpochValue;
  /** 100 θ*: the acoustic angle r_s(z*)/D_M(z*), times 100 (rad). */
  readonly acousticAngle100: EpochValue;
  readonly dragEpoch: EpochValue;
  readonly soundHorizonDragFit: EpochValue;
  readonly soundHorizonDragIntegral: EpochValue;
  /** The r_drag used for checking: the fit where it is valid, otherwise the integral. */
  readonly soundHorizonDrag: EpochValue;
}

export const ACCURACY = {
  huSugiyama: 'fit to recombination codes good to a few tenths of a per cent (Hu & Sugiyama 1996); +0.18 % against Planck 2018 VI Table 2',
  eisensteinHu: 'fit that runs a few per cent low against full recombination codes (−3.7 % against Planck 2018 VI Table 2: 1020.8 vs 1060.0)',
  aubourg: 'calibrated fit, about 0.1 % against a Boltzmann code for standard neutrinos (N_eff = 3.046, Σmν ≲ 0.6 eV) (Aubourg et al. 2015)',
  integral: 'numerical integral of c_s/H, accurate to 1e-10; its uncertainty is that of the redshift it stops at',
  exact: 'exact for the model (numerical root or quadrature, better than 1e-10)',
} as const;

/** Parameter set used for the epochs: the declared one, with standard radiation added if it has none. */
function epochCosmology(c: Cosmology): { cosmology: Cosmology; note?: string } {
  const p = c.params;
  if (p.T_CMB > 0) return { cosmology: c };
  return c.memo('epochModel', () => {
    const input: ParameterInput = {
      H0: p.H0, Omega_m: p.Omega_m, w0: p.w0, wa: p.wa, T_CMB: FIXSEN_2009_T_CMB_K, N_eff: STANDARD_N_EFF, m_nu: 0,
      ...(p.Omega_b !== null ? { Omega_b: p.Omega_b } : {}),
      ...(p.flat ? { flat: true } : { Omega_Lambda: p.Omega_Lambda }),
    };
    const made = createCosmology(input);
    return made.ok
      ? { cosmology: made.cosmology, note: `the parameter set has no radiation; epochs use T_CMB = ${FIXSEN_2009_T_CMB_K} K (Fixsen 2009) and N_eff = ${STANDARD_N_EFF}` }
      : { cosmology: c, note: 'radiation could not be added to this parameter set' };
  });
}

/**
 * Redshift of decoupling z* from the fit of Hu & Sugiyama 1996 (ApJ 471, 542, eq. E1):
 * z* = 1048 [1 + 0.00124 ωb^−0.738] [1 + g1 ωm^g2], g1 = 0.0783 ωb^−0.238 / (1 + 39.5 ωb^0.763),
 * g2 = 0.560 / (1 + 21.1 ωb^1.81), with ω = Ω h². Coefficients quoted from memory.
 */
export function huSugiyamaDecoupling(omegaBh2: number, omegaMh2: number): number {
  const g1 = (0.0783 * omegaBh2 ** -0.238) / (1 + 39.5 * omegaBh2 ** 0.763);
  const g2 = 0.56 / (1 + 21.1 * omegaBh2 ** 1.81);
  return 1048 * (1 + 0.00124 * omegaBh2 ** -0.738) * (1 + g1 * omegaMh2 ** g2);
}

/**
 * Redshift of the drag epoch z_d from the fit of Eisenstein & Hu 1998 (ApJ 496, 605, eq. 4):
 * z_d = 1291 ωm^0.251 / (1 + 0.659 ωm^0.828) [1 + b1 ωb^b2], b1 = 0.313 ωm^−0.419 [1 + 0.607 ωm^0.674],
 * b2 = 0.238 ωm^0.223. Coefficients quoted from memory.
 */
export function eisensteinHuDragEpoch(omegaBh2: number, omegaMh2: number): number {
  const b1 = 0.313 * omegaMh2 ** -0.419 * (1 + 0.607 * omegaMh2 ** 0.674);
  const b2 = 0.238 * omegaMh2 ** 0.223;
  return ((1291 * omegaMh2 ** 0.251) / (1 + 0.659 * omegaMh2 ** 0.828)) * (1 + b1 * omegaBh2 ** b2);
}

/**
 * Sound horizon at the drag epoch from the calibrated fit of Aubourg et al. 2015
 * (Phys. Rev. D 92, 123516, eq. 16), Mpc:
 * r_d = 55.154 exp[−72.3 (ων + 0.0006)²] / (ωcb^0.25351 ωb^0.12807). Coefficients quoted from memory.
 */
export function aubourgDragSoundHorizon(omegaCbh2: number, omegaBh2: number, omegaNuh2: number): number {
  return (55.154 * Math.exp(-72.3 * (omegaNuh2 + 0.0006) ** 2)) / (omegaCbh2 ** 0.25351 * omegaBh2 ** 0.12807);
}

/**
 * Comoving sound horizon r_s(z) = ∫_z^∞ c_s dz'/H(z'), Mpc, with c_s = c/√(3(1+R)) and
 * R = 3ρb/(4ργ) = (3Ωb/4Ωγ)/(1+z) (e.g. Eisenstein & Hu 1998, eqs. 5–6). Integrated in the
 * scale factor, where the integrand c_s/(a²E) is finite at a = 0 when radiation is present.
 * Null without baryons or photons.
 */
export function soundHorizon(c: Cosmology, z: number): number | null {
  const p = c.params;
  if (p.Omega_b === null || p.Omega_gamma === 0) return null;
  const r0 = (3 * p.Omega_b) / (4 * p.Omega_gamma);
  const aMax = 1 / (1 + z);
  const integral = integrateAdaptive((a) => {
    // Gauss–Legendre nodes never fall on a = 0, where the integrand tends to 1/√(3Ωr).
    const e = c.expansion.e(1 / a);
    return 1 / (Math.sqrt(3 * (1 + r0 * a)) * a * a * e);
  }, 0, aMax, { relTol: 1e-12 });
  return (SPEED_OF_LIGHT_KM_S / p.H0) * integral;
}

function value(v: number | null, unit: string, method: string, accuracy: string, source: string, note?: string): EpochValue {
  return note === undefined ? { value: v, unit, method, accuracy, source } : { value: v, unit, method, accuracy, source, note };
}

/** Root of g in x = ln(1+z) over [0, xMax] by scanning for a sign change, then Brent's method. */
function firstRootInX(g: (x: number) => number, xMax: number, steps: number): number | null {
  let prevX = 0;
  let prev = g(0);
  for (let i = 1; i <= steps; i++) {
    const x = (xMax * i) / steps;
    const cur = g(x);
    if (prev === 0) return prevX;
    if (prev * cur < 0) return brentRoot(g, prevX, x, 1e-14);
    prevX = x;
    prev = cur;
  }
  return null;
}

/** All the epoch quantities of a parameter set (computed once, then cached on the Cosmology). */
export function epochs(c: Cosmology): Epochs {
  return c.memo('epochs', () => computeEpochs(c));
}

function computeEpochs(c: Cosmology): Epochs {
  const { cosmology: ec, note: radiationNote } = epochCosmology(c);
  const p = ec.params;
  const h2 = p.h * p.h;
  const e = ec.expansion;
  const hogg = 'Hogg 1999, eq. 30';

  // Matter–radiation equality: ρ_matter(z) = ρ_radiation(z), massive neutrinos counted as
  // radiation while relativistic.
  const xEq = p.Omega_gamma > 0 ? firstRootInX((x) => e.matterDensity(Math.exp(x)) - e.radiationDensity(Math.exp(x)), Math.log(1e8), 400) : null;
  const matterRadiationEquality = value(xEq === null ? null : Math.expm1(xEq), '', 'root of ρm(z) = ρr(z)', ACCURACY.exact, 'definition; Ωr from T_CMB and N_eff (Komatsu et al. 2011 eq. 26 for massive neutrinos)', radiationNote ?? (xEq === null ? 'no radiation' : undefined));

  // Matter–dark-energy equality, in the past only.
  const mde = c.params.Omega_Lambda > 0 ? firstRootInX((x) => c.expansion.matterDensity(Math.exp(x)) - c.expansion.darkEnergyDensity(Math.exp(x)), Math.log(1e4), 2000) : null;
  const matterDarkEnergyEquality = value(mde === null ? null : Math.expm1(mde), '', 'root of ρm(z) = ρde(z)', ACCURACY.exact, 'definition', mde === null ? 'matter and dark energy are not equal at any z ≥ 0 in this model' : undefined);

  // Onset of acceleration: q(z) = 0 with q < 0 today.
  const qRoot = c.expansion.deceleration(1) < 0 ? firstRootInX((x) => c.expansion.deceleration(Math.exp(x)), Math.log(1e4), 2000) : null;
  const zAcc = qRoot === null ? null : Math.expm1(qRoot);
  const accelerationOnset = value(zAcc, '', 'root of q(z) = 0', ACCURACY.exact, 'q(z) = (1/2) d ln E²/d ln(1+z) − 1', zAcc === null ? 'the expansion is not accelerating today in this model' : undefined);
  const accelerationOnsetLookback = value(zAcc === null ? null : lookbackTime(c, zAcc), 'Gyr', 'lookback time to the onset of acceleration', ACCURACY.exact, hogg, accelerationOnset.note);

  // Recombination / decoupling and the drag epoch (need baryons).
  const needsBaryons = 'needs Omega_b (or omega_b)';
  const ob = p.Omega_b;
  const obh2 = ob === null ? null : ob * h2;
  const ocbh2 = p.Omega_cb * h2;
  const zStar = obh2 === null ? null : huSugiyamaDecoupling(obh2, ocbh2);
  const recombination = value(zStar, '', 'fit of Hu & Sugiyama 1996', ACCURACY.huSugiyama, 'Hu & Sugiyama 1996, ApJ 471, 542, eq. E1', obh2 === null ? needsBaryons : radiationNote);
  const ageAtRecombination = value(zStar === null ? null : age(ec, zStar) * 1e6, 'kyr', 'age at the Hu & Sugiyama z*', ACCURACY.huSugiyama, `${hogg}; z* from Hu & Sugiyama 1996`, zStar === null ? needsBaryons : radiationNote);
  const rStar = zStar === null ? null : soundHorizon(ec, zStar);
  const soundHorizonAtRecombination = value(rStar, 'Mpc', 'integral of c_s/H to z* (Hu & Sugiyama 1996)', `${ACCURACY.integral}; z* from a fit (${ACCURACY.huSugiyama})`, 'Eisenstein & Hu 1998, eqs. 5–6; Hu & Sugiyama 1996', zStar === null ? needsBaryons : radiationNote);
  const theta = rStar === null || zStar === null ? null : (100 * rStar) / transverseComovingDistance(ec, zStar);
  const acousticAngle100 = value(theta, '', '100 r_s(z*)/D_M(z*)', `as r_s(z*) and z*`, 'Hogg 1999, eq. 16; Hu & Sugiyama 1996', zStar === null ? needsBaryons : radiationNote);

  const zDrag = obh2 === null ? null : eisensteinHuDragEpoch(obh2, ocbh2);
  const dragEpoch = value(zDrag, '', 'fit of Eisenstein & Hu 1998', ACCURACY.eisensteinHu, 'Eisenstein & Hu 1998, ApJ 496, 605, eq. 4', obh2 === null ? needsBaryons : radiationNote);
  const rDragIntegral = zDrag === null ? null : soundHorizon(ec, zDrag);
  const soundHorizonDragIntegral = value(rDragIntegral, 'Mpc', 'integral of c_s/H to the Eisenstein & Hu z_d', `${ACCURACY.integral}; the fitted z_d runs a few per cent low, which makes this r_drag about 2–3 % long`, 'Eisenstein & Hu 1998, eqs. 4–6', obh2 === null ? needsBaryons : radiationNote);
  const onh2 = p.Omega_nu_mass * h2;
  const rDragFit = obh2 === null ? null : aubourgDragSoundHorizon(ocbh2, obh2, onh2);
  const soundHorizonDragFit = value(rDragFit, 'Mpc', 'calibrated fit of Aubourg et al. 2015', ACCURACY.aubourg, 'Aubourg et al. 2015, Phys. Rev. D 92, 123516, eq. 16', obh2 === null ? needsBaryons : radiationNote);
  const fitValid = Math.abs(p.N_eff - STANDARD_N_EFF) <= 0.05 && p.m_nu <= 0.6;
  const soundHorizonDrag = obh2 === null
    ? value(null, 'Mpc', soundHorizonDragFit.method, ACCURACY.aubourg, soundHorizonDragFit.source, needsBaryons)
    : fitValid
    ? value(rDragFit, 'Mpc', soundHorizonDragFit.method, ACCURACY.aubourg, soundHorizonDragFit.source, `the fit is used: it is calibrated on full recombination codes for standard neutrinos${radiationNote ? `; ${radiationNote}` : ''}`)
    : value(rDragIntegral, 'Mpc', soundHorizonDragIntegral.method, soundHorizonDragIntegral.accuracy, soundHorizonDragIntegral.source, `the integral is used: the fit holds only for N_eff = ${STANDARD_N_EFF} and Σmν ≤ 0.6 eV (here N_eff = ${p.N_eff}, Σmν = ${p.m_nu} eV)`);

  return {
    ageToday: value(age(c, 0), 'Gyr', 'integral of dz/((1+z)E)', ACCURACY.exact, hogg, c.table.finiteAge ? undefined : 'this model has no beginning'),
    hubbleTime: value(c.hubbleTimeGyr, 'Gyr', '1/H0', 'exact', 'Hogg 1999, eq. 3'),
    hubbleDistance: value(c.hubbleDistanceMpc, 'Mpc', 'c/H0', 'exact', 'Hogg 1999, eq. 4'),
    matterRadiationEquality,
    matterDarkEnergyEquality,
    accelerationOnset,
    accelerationOnsetLookback,
    recombination,
    ageAtRecombination,
    soundHorizonAtRecombination,
    acousticAngle100,
    dragEpoch,
    soundHorizonDragFit,
    soundHorizonDragIntegral,
    soundHorizonDrag,
  };
}
