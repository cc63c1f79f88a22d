/**
 * Checks against published values and closed forms. Each check names its source; values
 * quoted from memory (no copy of the paper at hand) say so, and their tolerances allow for
 * an error in the last digit.
 */
import { describe, expect, it } from 'vitest';
import {
  age,
  ageToday,
  angularDiameterDistance,
  angularDiameterDistanceMaximum,
  cmbTemperature,
  comovingDistance,
  epochs,
  findPreset,
  FIXSEN_2009_T_CMB_K,
  lookbackTime,
  luminosityDistance,
  soundHorizon,
  transverseComovingDistance,
  ACCURACY,
} from '../../shared/src/index.js';
import { build, preset, relativeError } from '../helpers/cosmology.js';

describe('Planck 2018 VI, Table 2, TT,TE,EE+lowE+lensing+BAO (quoted from memory)', () => {
  const c = preset('planck-2018');
  const e = epochs(c);
  const published = findPreset('planck-2018')!.published!;

  it('derived Ωm = 0.3111 ± 0.0056 from ωb, ωc, H0 and Σmν = 0.06 eV', () => {
    expect(Math.abs(c.params.Omega_m - published.Omega_m.value)).toBeLessThan(published.Omega_m.sigma);
  });
  it('age = 13.787 ± 0.020 Gyr', () => {
    expect(Math.abs(ageToday(c) - 13.787)).toBeLessThan(0.02);
  });
  it('z_eq = 3387 ± 21', () => {
    expect(Math.abs(e.matterRadiationEquality.value! - 3387)).toBeLessThan(21);
  });
  it('z* = 1089.80: the Hu & Sugiyama 1996 fit lands within its stated few tenths of a per cent', () => {
    const rel = relativeError(e.recombination.value!, 1089.8);
    expect(rel).toBeLessThan(0.003);
    expect(e.recombination.accuracy).toBe(ACCURACY.huSugiyama);
  });
  it('r* = 144.57 ± 0.22 Mpc, from the integral of c_s/H at the published z* = 1089.80', () => {
    expect(Math.abs(soundHorizon(c, 1089.8)! - 144.57)).toBeLessThan(0.22);
  });
  it('r* from the fitted z* stays within the published uncertainty', () => {
    expect(Math.abs(e.soundHorizonAtRecombination.value! - 144.57)).toBeLessThan(0.22);
  });
  it('100θ* = 1.04119 ± 0.00029 at the published z*; within the fit accuracy at the fitted z*', () => {
    const theta = (100 * soundHorizon(c, 1089.8)!) / transverseComovingDistance(c, 1089.8);
    expect(Math.abs(theta - 1.04119)).toBeLessThan(0.00029);
    expect(relativeError(e.acousticAngle100.value!, 1.04119)).toBeLessThan(0.003);
  });
  it('z_drag = 1060.01: the Eisenstein & Hu 1998 fit runs 2–5 % low, as documented', () => {
    const rel = (e.dragEpoch.value! - 1060.01) / 1060.01;
    expect(rel).toBeLessThan(-0.02);
    expect(rel).toBeGreaterThan(-0.05);
  });
  it('r_drag = 147.21 ± 0.23 Mpc: from the Aubourg et al. 2015 fit (the value used) and from the integral at the published z_drag', () => {
    expect(Math.abs(e.soundHorizonDrag.value! - 147.21)).toBeLessThan(0.23);
    expect(e.soundHorizonDrag.method).toMatch(/Aubourg/);
    expect(Math.abs(soundHorizon(c, 1060.01)! - 147.21)).toBeLessThan(0.23);
  });
  it('the integral to the fitted z_d is 2–3 % long, as its accuracy note says', () => {
    const rel = (e.soundHorizonDragIntegral.value! - 147.21) / 147.21;
    expect(rel).toBeGreaterThan(0.01);
    expect(rel).toBeLessThan(0.04);
  });
});

describe('Planck 2018 VI, Table 2, TT,TE,EE+lowE+lensing (quoted from memory)', () => {
  const c = preset('planck-2018-cmb');
  const e = epochs(c);
  it('Ωm = 0.3153 ± 0.0073, age = 13.797 ± 0.023 Gyr, z_eq = 3402 ± 26, r_drag = 147.09 ± 0.26 Mpc', () => {
    expect(Math.abs(c.params.Omega_m - 0.3153)).toBeLessThan(0.0073);
    expect(Math.abs(ageToday(c) - 13.797)).toBeLessThan(0.023);
    expect(Math.abs(e.matterRadiationEquality.value! - 3402)).toBeLessThan(26);
    expect(Math.abs(e.soundHorizonDrag.value! - 147.09)).toBeLessThan(0.26);
  });
  it('z* = 1089.92 within the Hu & Sugiyama fit accuracy', () => {
    expect(relativeError(e.recombination.value!, 1089.92)).toBeLessThan(0.003);
  });
});

describe('other published sets (quoted from memory)', () => {
  it('Planck 2015 XIII Table 4: Ωm = 0.3089 ± 0.0062, age = 13.799 ± 0.021 Gyr', () => {
    const c = preset('planck-2015');
    expect(Math.abs(c.params.Omega_m - 0.3089)).toBeLessThan(0.0062);
    expect(Math.abs(ageToday(c) - 13.799)).toBeLessThan(0.021);
  });
  it('WMAP nine-year (Hinshaw et al. 2013 Table 4): Ωm = 0.2865 ± 0.0097, age = 13.772 ± 0.059 Gyr', () => {
    const c = preset('wmap-9');
    expect(Math.abs(c.params.Omega_m - 0.2865)).toBeLessThan(0.0097);
    expect(Math.abs(ageToday(c) - 13.772)).toBeLessThan(0.059);
  });
});

describe('Fixsen 2009: T0 = 2.72548 ± 0.00057 K', () => {
  it('is the CMB temperature used when a parameter set has no radiation', () => {
    const c = build({ H0: 70, Omega_m: 0.3, flat: true });
    expect(cmbTemperature(c, 0)).toBe(2.72548);
    expect(FIXSEN_2009_T_CMB_K).toBe(2.72548);
  });
  it('scales as T0(1+z)', () => {
    const c = build({ H0: 70, Omega_m: 0.3, T_CMB: 2.7255, flat: true });
    expect(cmbTemperature(c, 1089)).toBeCloseTo(2.7255 * 1090, 10);
  });
});

describe('closed forms', () => {
  const eds = build({ H0: 70, Omega_m: 1, Omega_Lambda: 0, T_CMB: 0 });
  const dh = eds.hubbleDistanceMpc;
  const th = eds.hubbleTimeGyr;
  it('Einstein–de Sitter: t0 = 2/(3H0), t(z) = t0 (1+z)^(−3/2)', () => {
    expect(relativeError(ageToday(eds), (2 / 3) * th)).toBeLessThan(1e-12);
    for (const z of [0.1, 1, 10, 1000, 5e4]) expect(relativeError(age(eds, z), (2 / 3) * th * (1 + z) ** -1.5)).toBeLessThan(1e-10);
  });
  it('Einstein–de Sitter: D_C = (2c/H0)(1 − 1/√(1+z)) (Hogg 1999, §5)', () => {
    for (const z of [0.001, 0.5, 3, 100, 1100, 5e4]) expect(relativeError(comovingDistance(eds, z), 2 * dh * (1 - 1 / Math.sqrt(1 + z)))).toBeLessThan(1e-10);
  });
  it('Einstein–de Sitter: D_A peaks at z = 1.25 with D_A = (8/27) c/H0 (Hogg 1999, Fig. 2, solid curve; analytic)', () => {
    const peak = angularDiameterDistanceMaximum(eds);
    expect(peak.z).toBeCloseTo(1.25, 6);
    expect(relativeError(peak.distanceMpc, (8 / 27) * dh)).toBeLessThan(1e-10);
  });
  it('de Sitter (Ωm = 0, ΩΛ = 1): D_C = cz/H0, t_L = ln(1+z)/H0, no finite age', () => {
    const ds = build({ H0: 70, Omega_m: 0, flat: true });
    for (const z of [0.01, 1, 30, 1100]) {
      expect(relativeError(comovingDistance(ds, z), dh * z)).toBeLessThan(1e-10);
      expect(relativeError(lookbackTime(ds, z), th * Math.log1p(z))).toBeLessThan(1e-10);
    }
    expect(ageToday(ds)).toBe(Infinity);
  });
  it('empty universe (Ωk = 1): D_L = (c/H0) z (1 + z/2), t0 = 1/H0, t_L = (1/H0) z/(1+z)', () => {
    const empty = build({ H0: 70, Omega_m: 0, Omega_Lambda: 0 });
    expect(empty.params.Omega_k).toBe(1);
    for (const z of [0.01, 1, 7, 1100]) {
      expect(relativeError(luminosityDistance(empty, z), dh * z * (1 + z / 2))).toBeLessThan(1e-10);
      expect(relativeError(lookbackTime(empty, z), (th * z) / (1 + z))).toBeLessThan(1e-10);
    }
    expect(relativeError(ageToday(empty), th)).toBeLessThan(1e-10);
  });
  it('flat ΛCDM without radiation: acceleration begins at z = (2ΩΛ/Ωm)^(1/3) − 1 (q = 0)', () => {
    const c = build({ H0: 70, Omega_m: 0.3, flat: true });
    expect(epochs(c).accelerationOnset.value!).toBeCloseTo((2 * 0.7 / 0.3) ** (1 / 3) - 1, 10);
  });
  it('matter–radiation equality without massive neutrinos: 1 + z_eq = Ωm / (Ωγ + Ων)', () => {
    const c = build({ H0: 70, Omega_m: 0.3, T_CMB: 2.7255, N_eff: 3.046, flat: true });
    expect(relativeError(1 + epochs(c).matterRadiationEquality.value!, 0.3 / (c.params.Omega_gamma + c.params.Omega_nu))).toBeLessThan(1e-10);
  });
  it('D_A between z1 and z2 equals D_A(z2) when z1 = 0 (Hogg 1999, eq. 19)', () => {
    const c = build({ H0: 70, Omega_m: 0.3, Omega_Lambda: 0.6, T_CMB: 2.7255 });
    expect(relativeError(angularDiameterDistance(c, 2), transverseComovingDistance(c, 2) / 3)).toBeLessThan(1e-14);
  });
});

describe('facts of the trade (common practice, no source)', () => {
  const c = preset('planck-2018');
  const e = epochs(c);
  it('recombination happened near z ≈ 1100', () => {
    expect(relativeError(e.recombination.value!, 1100)).toBeLessThan(0.02);
  });
  it('when the universe was about 3000 K', () => {
    expect(relativeError(cmbTemperature(c, e.recombination.value!), 3000)).toBeLessThan(0.02);
  });
  it('and roughly 375 000 years old', () => {
    expect(relativeError(e.ageAtRecombination.value!, 375)).toBeLessThan(0.05);
  });
  it('the universe is about 13.8 Gyr old under Planck-like parameters', () => {
    expect(Math.abs(ageToday(c) - 13.8)).toBeLessThan(0.05);
  });
  it('in flat ΛCDM with Ωm ≈ 0.3 acceleration begins near z ≈ 0.67', () => {
    expect(epochs(build({ H0: 70, Omega_m: 0.3, T_CMB: 2.7255, flat: true })).accelerationOnset.value!).toBeCloseTo(0.67, 2);
  });
  it('the expansion since recombination is about a factor of 1000', () => {
    expect(1 + e.recombination.value!).toBeGreaterThan(1000);
    expect(1 + e.recombination.value!).toBeLessThan(1200);
  });
  it('epochs of a set without radiation use the measured T0 and say so', () => {
    const r = epochs(build({ H0: 70, Omega_m: 0.3, Omega_b: 0.045, flat: true }));
    expect(r.recombination.note).toMatch(/no radiation/);
    expect(relativeError(r.ageAtRecombination.value!, 375)).toBeLessThan(0.1);
  });
});
