/** Property tests (fast-check) over random parameter sets and redshifts. */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  age,
  angularDiameterDistance,
  comovingDistance,
  convert,
  createCosmology,
  distanceModulus,
  lightTravelDistance,
  lookbackTime,
  luminosityDistance,
  redshiftAtAge,
  redshiftAtComovingDistance,
  redshiftAtDistanceModulus,
  redshiftAtLookbackTime,
  redshiftAtLuminosityDistance,
  redshiftAtTransverseComovingDistance,
  redshiftsAtAngularDiameterDistance,
  transverseComovingDistance,
  comovingVolume,
  unit,
  type Cosmology,
  type ParameterInput,
} from '../../shared/src/index.js';
import { relativeError } from '../helpers/cosmology.js';

/** Plausible parameter sets: flat or curved, Λ or w0–wa, with or without radiation and neutrino mass. */
const parameterSet: fc.Arbitrary<ParameterInput> = fc
  .record({
    H0: fc.double({ min: 50, max: 90, noNaN: true }),
    Omega_m: fc.double({ min: 0.05, max: 0.6, noNaN: true }),
    Omega_Lambda: fc.option(fc.double({ min: 0, max: 0.9, noNaN: true }), { nil: undefined }),
    w0: fc.double({ min: -1.3, max: -0.7, noNaN: true }),
    wa: fc.double({ min: -0.5, max: 0.3, noNaN: true }),
    radiation: fc.boolean(),
    m_nu: fc.constantFrom(0, 0.06, 0.2),
  })
  .map(({ radiation, m_nu, Omega_Lambda, ...rest }) => {
    const input: ParameterInput = { ...rest, T_CMB: radiation ? 2.7255 : 0 };
    if (radiation) input.m_nu = m_nu;
    if (Omega_Lambda === undefined) input.flat = true;
    else input.Omega_Lambda = Omega_Lambda;
    return input;
  });

function make(input: ParameterInput): Cosmology | null {
  const made = createCosmology(input);
  return made.ok ? made.cosmology : null; // some random sets bounce; those are tested elsewhere
}

const redshift = fc.double({ min: 1e-4, max: 20, noNaN: true });
const RUNS = { numRuns: 60 };

describe('properties of the distance measures', () => {
  it('distances and lookback time increase with z; age decreases', () => {
    fc.assert(
      fc.property(parameterSet, redshift, redshift, (input, z1, z2) => {
        const c = make(input);
        if (!c || Math.abs(z1 - z2) < 1e-9 * Math.max(z1, z2)) return; // values one rounding apart are not ordered
        const [lo, hi] = z1 < z2 ? [z1, z2] : [z2, z1];
        expect(comovingDistance(c, hi)).toBeGreaterThan(comovingDistance(c, lo));
        expect(luminosityDistance(c, hi)).toBeGreaterThan(luminosityDistance(c, lo));
        expect(lookbackTime(c, hi)).toBeGreaterThan(lookbackTime(c, lo));
        expect(lightTravelDistance(c, hi)).toBeGreaterThan(lightTravelDistance(c, lo));
        expect(comovingVolume(c, hi)).toBeGreaterThan(comovingVolume(c, lo));
        expect(age(c, hi)).toBeLessThan(age(c, lo));
      }),
      RUNS,
    );
  });

  it('D_L = (1+z)² D_A (Etherington reciprocity; Hogg 1999, eqs. 18 and 21)', () => {
    fc.assert(
      fc.property(parameterSet, redshift, (input, z) => {
        const c = make(input);
        if (!c) return;
        expect(relativeError(luminosityDistance(c, z), (1 + z) ** 2 * angularDiameterDistance(c, z))).toBeLessThan(1e-13);
      }),
      RUNS,
    );
  });

  it('age today = age at z + lookback time to z', () => {
    fc.assert(
      fc.property(parameterSet, redshift, (input, z) => {
        const c = make(input);
        if (!c) return;
        expect(relativeError(age(c, z) + lookbackTime(c, z), age(c, 0))).toBeLessThan(1e-12);
      }),
      RUNS,
    );
  });

  it('inverse ∘ forward = identity for lookback time, age, D_C, D_M, D_L, distance modulus and D_A', () => {
    fc.assert(
      fc.property(parameterSet, redshift, (input, z) => {
        const c = make(input);
        if (!c) return;
        const tol = 1e-9;
        expect(relativeError(redshiftAtLookbackTime(c, lookbackTime(c, z)), z)).toBeLessThan(tol);
        expect(relativeError(redshiftAtAge(c, age(c, z)), z)).toBeLessThan(tol);
        expect(relativeError(redshiftAtComovingDistance(c, comovingDistance(c, z)), z)).toBeLessThan(tol);
        expect(relativeError(redshiftAtTransverseComovingDistance(c, transverseComovingDistance(c, z)), z)).toBeLessThan(tol);
        expect(relativeError(redshiftAtLuminosityDistance(c, luminosityDistance(c, z)), z)).toBeLessThan(tol);
        expect(relativeError(redshiftAtDistanceModulus(c, distanceModulus(c, z)), z)).toBeLessThan(tol);
        const roots = redshiftsAtAngularDiameterDistance(c, angularDiameterDistance(c, z));
        expect(roots.some((r) => relativeError(r, z) < 1e-7)).toBe(true);
      }),
      RUNS,
    );
  });
});

describe('properties of h-scaled units', () => {
  const pairs: Array<[string, string]> = [
    ['h^-1 Mpc', 'Mpc'],
    ['Mpc/h', 'Gpc'],
    ['h⁻³ Gpc³', 'Mpc^3'],
    ['h70^-1 kpc', 'kpc'],
    ['h^-1 Gyr', 'Myr'],
  ];
  it('converting to a plain unit and back returns the value', () => {
    fc.assert(
      fc.property(fc.double({ min: 1e-6, max: 1e9, noNaN: true }), fc.double({ min: 0.4, max: 1, noNaN: true }), fc.constantFrom(...pairs), (v, h, [a, b]) => {
        const ua = unit(a);
        const ub = unit(b);
        expect(relativeError(convert(convert(v, ua, ub, h), ub, ua, h), v)).toBeLessThan(1e-14);
      }),
    );
  });
  it('100 h⁻¹ Mpc is 100/h Mpc', () => {
    fc.assert(
      fc.property(fc.double({ min: 0.4, max: 1, noNaN: true }), (h) => {
        expect(relativeError(convert(100, unit('h^-1 Mpc'), unit('Mpc'), h), 100 / h)).toBeLessThan(1e-15);
      }),
    );
  });
});
