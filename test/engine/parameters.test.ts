/** Resolving, validating and parsing parameter sets. */
import { describe, expect, it } from 'vitest';
import { CosmologyCache, parseParameterText, resolveParameters, PRESETS, massiveNeutrinoDensityParameter } from '../../shared/src/index.js';

function errorsOf(input: Parameters<typeof resolveParameters>[0]) {
  const r = resolveParameters(input);
  return r.ok ? [] : r.errors;
}

describe('resolving a parameter set', () => {
  it('derives h, ΩΛ for a flat model, and records what was assumed', () => {
    const r = resolveParameters({ H0: 70, Omega_m: 0.3, flat: true });
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.params.h).toBe(0.7);
    expect(r.params.Omega_Lambda).toBeCloseTo(0.7, 15);
    expect(r.params.Omega_k).toBe(0);
    expect(r.params.assumed).toContain('T_CMB=0 (no radiation)');
    expect(r.params.stated).toEqual(['H0', 'Omega_m', 'flat']);
  });

  it('assumes flatness when neither flat, ΩΛ nor Ωk is stated, and says so', () => {
    const r = resolveParameters({ H0: 70, Omega_m: 0.3 });
    expect(r.ok && r.params.flat && r.params.assumed.includes('flat')).toBe(true);
  });

  it('derives Ωk from Ωm and ΩΛ, radiation included', () => {
    const r = resolveParameters({ H0: 70, Omega_m: 0.3, Omega_Lambda: 0.6, T_CMB: 2.7255 });
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.params.Omega_k).toBeCloseTo(0.1 - r.params.Omega_gamma - r.params.Omega_nu, 14);
    expect(r.params.N_eff).toBe(3.046);
  });

  it('counts massive neutrinos inside Ωm with Ων h² = Σmν / 93.14 eV (Planck 2018 VI convention)', () => {
    const r = resolveParameters({ H0: 67.66, Omega_m: 0.31, T_CMB: 2.7255, m_nu: 0.06, flat: true });
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.params.Omega_nu_mass).toBeCloseTo(0.06 / 93.14 / 0.6766 ** 2, 15);
    expect(r.params.Omega_cb).toBeCloseTo(0.31 - massiveNeutrinoDensityParameter(0.06, 0.6766), 15);
  });

  it('the Komatsu et al. 2011 fit at z = 0 gives Σmν/(Ων h²) = 92.6 eV, within 0.6 % of the 93.14 eV convention (as the README says)', () => {
    const r = resolveParameters({ H0: 67.66, Omega_m: 0.31, T_CMB: 2.7255, N_eff: 3.046, m_nu: 0.06, flat: true });
    if (!r.ok) throw new Error('bad set');
    const massive = r.params.Omega_nu - r.neutrinos.perSpecies * r.neutrinos.masslessCount;
    const evPerOmegaH2 = 0.06 / (massive * r.params.h ** 2);
    expect(evPerOmegaH2).toBeCloseTo(92.6, 1);
    expect(Math.abs(massive - r.params.Omega_nu_mass)).toBeLessThan(1e-5);
  });

  it('derives Ωm from ωb and ωc', () => {
    const r = resolveParameters({ H0: 70, omega_b: 0.0245, omega_c: 0.1225 });
    expect(r.ok && r.params.Omega_m).toBeCloseTo(0.3, 14);
  });

  it('names the parameter in every error', () => {
    expect(errorsOf({ H0: -70, Omega_m: 0.3 })[0].parameter).toBe('H0');
    expect(errorsOf({ h: 0, Omega_m: 0.3 })[0].parameter).toBe('h');
    expect(errorsOf({ Omega_m: 0.3 })[0]).toMatchObject({ parameter: 'H0', message: 'H0 (or h) is required' });
    expect(errorsOf({ H0: 70 })[0].parameter).toBe('Omega_m');
    expect(errorsOf({ H0: 70, Omega_m: -0.1 })[0].parameter).toBe('Omega_m');
    expect(errorsOf({ H0: 70, Omega_m: 0.3, T_CMB: -1 })[0].parameter).toBe('T_CMB');
    expect(errorsOf({ H0: 70, Omega_m: 0.3, m_nu: 0.1 })[0].parameter).toBe('m_nu');
    expect(errorsOf({ H0: 70, Omega_m: 0.001, T_CMB: 2.7255, m_nu: 1 })[0].parameter).toBe('m_nu');
    expect(errorsOf({ H0: 70, Omega_m: 0.3, Omega_b: 0.4 })[0].parameter).toBe('Omega_b');
    expect(errorsOf({ H0: 70, h: 0.6, Omega_m: 0.3 })[0].parameter).toBe('h');
    expect(errorsOf({ H0: 70, Omega_m: 0.3, Omega_Lambda: 0.5, flat: true })[0].parameter).toBe('Omega_Lambda');
    expect(errorsOf({ H0: 70, Omega_m: 0.3, Omega_b: 0.05, Omega_c: 0.4 })[0].parameter).toBe('Omega_m');
    expect(errorsOf({ H0: NaN, Omega_m: 0.3 })[0].parameter).toBe('H0');
  });

  it('rejects a model that bounces (E² ≤ 0 in the past) instead of returning NaN', () => {
    const errors = errorsOf({ H0: 70, Omega_m: 0.3, Omega_Lambda: 3 });
    expect(errors).toHaveLength(1);
    expect(errors[0].parameter).toBe('Omega_Lambda');
    expect(errors[0].message).toMatch(/no big bang/);
  });

  it('accepts every preset, and each names its source', () => {
    for (const p of PRESETS) {
      expect(resolveParameters(p.input).ok, p.name).toBe(true);
      expect(p.source.length).toBeGreaterThan(10);
    }
  });
});

describe('the declaration syntax', () => {
  it('reads key=value pairs, flat, units and Unicode symbols', () => {
    const r = parseParameterText('H0=70km/s/Mpc, Ωm = 0.3; ΩΛ=0.7 T_CMB=2.7255K m_nu=60meV');
    expect(r.problems).toEqual([]);
    expect(r.input).toEqual({ H0: 70, Omega_m: 0.3, Omega_Lambda: 0.7, T_CMB: 2.7255, m_nu: 0.06 });
  });

  it('attaches a unit written after a space', () => {
    expect(parseParameterText('H0=70 km/s/Mpc Omega_m=0.3 flat').input).toEqual({ H0: 70, Omega_m: 0.3, flat: true });
  });

  it('starts from a preset and lets explicit values override it', () => {
    const r = parseParameterText('planck-2018 H0=70');
    expect(r.preset?.name).toBe('planck-2018');
    expect(r.input.H0).toBe(70);
    expect(r.input.omega_b).toBe(0.02242);
    const m = parseParameterText('planck-2018 Omega_m=0.3');
    expect(m.input.omega_c).toBeUndefined();
    expect(resolveParameters(m.input).ok).toBe(true);
  });

  it('reports each token it does not understand with its offsets, and never throws', () => {
    const text = 'H0=70 Omega_q=1 Omega_m=abc OMEGA_B=0.05 nonsense';
    const r = parseParameterText(text);
    expect(r.problems.map((p) => p.key)).toEqual(['Omega_q', 'Omega_m', 'OMEGA_B', 'nonsense']);
    for (const p of r.problems) expect(text.slice(p.start, p.end).startsWith(p.key)).toBe(true);
    expect(r.input).toEqual({ H0: 70 });
  });

  it('reports an unknown unit for a key', () => {
    expect(parseParameterText('H0=70parsec').problems[0].message).toMatch(/unknown unit 'parsec' for H0/);
  });
});

describe('the cache of built parameter sets', () => {
  it('returns the same build for the same inputs and evicts the oldest beyond its capacity', () => {
    const cache = new CosmologyCache(2);
    const a = cache.get({ H0: 70, Omega_m: 0.3 });
    expect(cache.get({ Omega_m: 0.3, H0: 70 })).toBe(a);
    cache.get({ H0: 71, Omega_m: 0.3 });
    cache.get({ H0: 72, Omega_m: 0.3 });
    expect(cache.size).toBe(2);
    expect(cache.get({ H0: 70, Omega_m: 0.3 })).not.toBe(a);
  });
});
