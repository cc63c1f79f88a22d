/** Unit parsing and conversion (constants: SI 2019, IAU 2012 B2, IAU 2015 B2, Julian year). */
import { describe, expect, it } from 'vitest';
import { convert, parseUnit, unit, sameDimension, PARSEC_M, LIGHT_YEAR_M, GYR_S } from '../../shared/src/index.js';
import { relativeError } from '../helpers/cosmology.js';

describe('units', () => {
  it('parsec is (648 000/π) au with the IAU 2012 au (IAU 2015 Resolution B2)', () => {
    expect(PARSEC_M).toBeCloseTo(3.0856775814913673e16, 0);
  });
  it('light-year is c × Julian year; Gyr is 10⁹ Julian years', () => {
    expect(LIGHT_YEAR_M).toBe(299792458 * 365.25 * 86400);
    expect(GYR_S).toBe(1e9 * 365.25 * 86400);
  });
  it('converts lengths, times, angles and volumes', () => {
    expect(convert(1, unit('Gpc'), unit('Mpc'), 0.7)).toBe(1000);
    expect(relativeError(convert(1, unit('Mpc'), unit('Mly'), 0.7), 3.2615637771674337)).toBeLessThan(1e-12);
    expect(relativeError(convert(1, unit('Gyr'), unit('s'), 0.7), 3.15576e16)).toBeLessThan(1e-15);
    expect(relativeError(convert(1, unit('deg'), unit('arcsec'), 0.7), 3600)).toBeLessThan(1e-15);
    expect(relativeError(convert(1, unit('Gpc^3'), unit('Mpc³'), 0.7), 1e9)).toBeLessThan(1e-15);
    expect(relativeError(convert(1, unit('kpc/arcsec'), unit('kpc/arcmin'), 0.7), 60)).toBeLessThan(1e-15);
  });
  it('reads the H0 unit in its usual spellings', () => {
    for (const t of ['km/s/Mpc', 'km s^-1 Mpc^-1', 'km s⁻¹ Mpc⁻¹', 'km s-1 Mpc-1']) {
      expect(relativeError(convert(70, unit(t), unit('km/s/Mpc'), 0.7), 70)).toBeLessThan(1e-15);
      expect(sameDimension(unit(t), unit('Gyr^-1'))).toBe(true);
    }
  });
  it('h-scaled units use the parameter set h: 100 h⁻¹ Mpc = 142.857 Mpc at h = 0.7', () => {
    for (const t of ['h^-1 Mpc', 'Mpc/h', 'h⁻¹ Mpc', 'h-1 Mpc', 'Mpc h^{-1}']) {
      expect(relativeError(convert(100, unit(t), unit('Mpc'), 0.7), 100 / 0.7)).toBeLessThan(1e-15);
    }
    expect(relativeError(convert(1, unit('h^-3 Gpc^3'), unit('Gpc^3'), 0.7), 1 / 0.343)).toBeLessThan(1e-14);
    expect(relativeError(convert(1, unit('h70^-1 Mpc'), unit('Mpc'), 0.7), 1)).toBeLessThan(1e-15);
    expect(relativeError(convert(1, unit('h_70^-1 Mpc'), unit('Mpc'), 0.77), 0.7 / 0.77)).toBeLessThan(1e-15);
  });
  it('rejects unknown units and mixed dimensions with a message, never throwing from parseUnit', () => {
    const bad = parseUnit('furlong');
    expect(bad.ok).toBe(false);
    expect(!bad.ok && bad.message).toMatch(/unknown unit/);
    expect(parseUnit('').ok).toBe(false);
    expect(parseUnit('mag^2').ok).toBe(false);
    expect(() => convert(1, unit('Mpc'), unit('Gyr'), 0.7)).toThrow(/cannot convert length/);
  });
});
