/** Inverse problems: clear errors out of range, and both branches of the angular-diameter distance. */
import { describe, expect, it } from 'vitest';
import {
  angularDiameterDistance,
  angularDiameterDistanceMaximum,
  comovingDistance,
  CosmologyRangeError,
  redshiftAtAge,
  redshiftAtComovingDistance,
  redshiftAtLightTravelDistance,
  redshiftAtLookbackTime,
  redshiftAtLuminosityDistance,
  redshiftAtTransverseComovingDistance,
  redshiftsAtAngularDiameterDistance,
  lookbackTime,
  age,
  luminosityDistance,
  lightTravelDistance,
} from '../../shared/src/index.js';
import { build, preset, relativeError } from '../helpers/cosmology.js';

describe('inverse problems', () => {
  const c = preset('planck-2018');

  it('finds the redshift for a lookback time, age or distance, also beyond the table (z > 2×10⁴)', () => {
    for (const z of [0.3, 1100, 5e4]) {
      expect(relativeError(redshiftAtLookbackTime(c, lookbackTime(c, z)), z)).toBeLessThan(z > 1e4 ? 1e-5 : 1e-9);
      expect(relativeError(redshiftAtAge(c, age(c, z)), z)).toBeLessThan(1e-8);
      expect(relativeError(redshiftAtComovingDistance(c, comovingDistance(c, z)), z)).toBeLessThan(1e-8);
      expect(relativeError(redshiftAtLuminosityDistance(c, luminosityDistance(c, z)), z)).toBeLessThan(1e-8);
    }
    expect(relativeError(redshiftAtLightTravelDistance(c, lightTravelDistance(c, 2)), 2)).toBeLessThan(1e-9);
  });

  it('says why a lookback time or age is out of range', () => {
    expect(() => redshiftAtLookbackTime(c, 14)).toThrow(/not shorter than the age of the universe \(13\.787 Gyr\)/);
    expect(() => redshiftAtAge(c, 20)).toThrow(/exceeds the age of the universe today/);
    expect(() => redshiftAtLookbackTime(c, -1)).toThrow(CosmologyRangeError);
    expect(() => redshiftAtComovingDistance(c, 1e6)).toThrow(/no redshift below/);
  });

  it('gives both redshifts of an angular-diameter distance below the maximum, and says the maximum above it', () => {
    const peak = angularDiameterDistanceMaximum(c);
    expect(peak.z).toBeGreaterThan(1.4);
    expect(peak.z).toBeLessThan(1.8);
    const d = angularDiameterDistance(c, 0.8);
    const roots = redshiftsAtAngularDiameterDistance(c, d);
    expect(roots).toHaveLength(2);
    expect(relativeError(roots[0], 0.8)).toBeLessThan(1e-9);
    expect(relativeError(angularDiameterDistance(c, roots[1]), d)).toBeLessThan(1e-9);
    expect(roots[1]).toBeGreaterThan(peak.z);
    expect(() => redshiftsAtAngularDiameterDistance(c, peak.distanceMpc * 1.01)).toThrow(/never exceeds/);
  });

  it('refuses a transverse distance beyond the largest one of a closed universe', () => {
    const closed = build({ H0: 70, Omega_m: 0.6, Omega_Lambda: 0.7, T_CMB: 2.7255 });
    expect(() => redshiftAtTransverseComovingDistance(closed, 1e6)).toThrow(/closed model/);
  });

  it('rejects negative and non-finite redshifts with a message', () => {
    expect(() => comovingDistance(c, -0.1)).toThrow(/redshift must be a finite number ≥ 0/);
    expect(() => comovingDistance(c, NaN)).toThrow(CosmologyRangeError);
  });
});
