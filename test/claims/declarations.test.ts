/** Declarations: where and how manuscripts state the parameter set they adopt. */
import { describe, expect, it } from 'vitest';
import { findDeclarations, readLatex, readMarkdown, readPlainText } from '../../shared/src/index.js';

function declOf(src: string) {
  return findDeclarations(readLatex(src));
}

describe('declarations in prose', () => {
  it('reads the common sentence, with units, braces and flatness', () => {
    const d = declOf(String.raw`We adopt a flat $\Lambda$CDM cosmology with $H_0 = 70$\,km\,s$^{-1}$\,Mpc$^{-1}$, $\Omega_{\rm m} = 0.3$ and $\Omega_\Lambda = 0.7$.`).declarations;
    expect(d).toHaveLength(1);
    expect(d[0]).toMatchObject({ origin: 'prose', role: 'document', input: { H0: 70, Omega_m: 0.3, Omega_Lambda: 0.7, flat: true } });
    expect(d[0].stated).toEqual(['H0', 'Omega_m', 'Omega_Lambda', 'flat']);
  });
  it('reads tuples and h', () => {
    expect(declOf(String.raw`Throughout, we assume $(\Omega_{\rm m}, \Omega_\Lambda) = (0.3, 0.7)$ and $h = 0.7$.`).declarations[0].input).toEqual({ Omega_m: 0.3, Omega_Lambda: 0.7, h: 0.7 });
  });
  it('reads subscripts in text mode, lower-case λ, and braced Ω', () => {
    const src = 'H$_0$=70 km~s$^{-1}$Mpc$^{-1}$, ${\\Omega}_{\\rm m}$=0.3, ${\\Omega}_{\\rm \\lambda}$=0.7 are adopted.';
    expect(declOf(src).declarations[0].input).toEqual({ H0: 70, Omega_m: 0.3, Omega_Lambda: 0.7 });
  });
  it('takes lower-case ω as Ω when its size says so, and ΩΛ = 1 − Ωm as flatness', () => {
    expect(declOf(String.raw`We adopt $\omega_M = 0.27$, $\Omega_\Lambda = 1 - \Omega_{\rm m}$ and $H_0 = 71$.`).declarations[0].input).toEqual({ Omega_m: 0.27, H0: 71, flat: true });
    expect(declOf(String.raw`We adopt $\omega_b = 0.0224$ and $H_0 = 67$ with $\Omega_m = 0.31$.`).declarations[0].input).toMatchObject({ omega_b: 0.0224 });
  });
  it('reads "units with h = 1" and leaves H_0 = 100 h symbolic', () => {
    const d = declOf(String.raw`We work in units with $h = 1$, writing $H_0 = 100\,h$\,km\,s$^{-1}$\,Mpc$^{-1}$, and assume $\Omega_{\rm m} = 0.3$.`).declarations[0];
    expect(d.input).toEqual({ h: 1, Omega_m: 0.3 });
  });
  it('ignores measured values', () => {
    expect(declOf(String.raw`We measure $H_0 = 73.2 \pm 1.3$\,km\,s$^{-1}$\,Mpc$^{-1}$ and $\Omega_{\rm m} = 0.28$.`).declarations).toHaveLength(0);
  });
});

describe('named sets, directives and front matter', () => {
  it('maps named published sets and Planck citation keys to presets', () => {
    expect(declOf('We use the cosmological parameters of \\citet{planck2018vi}.').declarations[0]).toMatchObject({ origin: 'named-set', preset: 'planck-2018' });
    expect(declOf('Our results assume the Planck 2018 cosmology.').declarations[0].preset).toBe('planck-2018');
    expect(declOf('We adopt the WMAP9 cosmological parameters.').declarations[0].preset).toBe('wmap-9');
  });
  it('reports named sets it does not hold, and injected values, as incomplete', () => {
    expect(declOf('Our results are consistent with the WMAP seven-year results.').declarations[0].incomplete).toMatch(/not one Comove holds/);
    expect(declOf(String.raw`We adopt $H_0 = \variable{h0.txt}$\,km\,s$^{-1}$\,Mpc$^{-1}$.`).declarations[0].incomplete).toMatch(/injected at build time/);
  });
  it('reads directives with presets and overrides, and local overrides scoped to their section', () => {
    const d = declOf('% comove: planck-2018 H0=70\n\\section{A} Text.\n\\section{B}\n% comove: local H0=60 Omega_m=0.4\nMore.\n\\section{C} End.').declarations;
    expect(d[0]).toMatchObject({ origin: 'directive', role: 'document', preset: 'planck-2018' });
    expect(d[0].input.H0).toBe(70);
    expect(d[1]).toMatchObject({ origin: 'directive', role: 'local', input: { H0: 60, Omega_m: 0.4 } });
    const reading = readLatex('% comove: planck-2018 H0=70\n\\section{A} Text.\n\\section{B}\n% comove: local H0=60 Omega_m=0.4\nMore.\n\\section{C} End.');
    expect(reading.reading.text.slice(d[1].scopeStart, d[1].scopeEnd)).not.toContain('End');
  });
  it('reads skip directives as regions', () => {
    const r = readLatex('One. % comove: skip-next-line\nTwo is skipped.\n% comove: skip-begin\nThree.\n% comove: skip-end\nFour.');
    const skips = findDeclarations(r).skips.map((s) => r.reading.text.slice(s.start, s.end));
    expect(skips.some((s) => s.includes('Two is skipped.'))).toBe(true);
    expect(skips.some((s) => s.includes('Three.') && !s.includes('Four'))).toBe(true);
  });
  it('reads Markdown front matter, as a mapping or as declaration text', () => {
    const md = readMarkdown('---\ncosmology:\n  H0: 70\n  Omega_m: 0.3\n  flat: true\n---\n\nText.\n');
    expect(findDeclarations(md).declarations[0]).toMatchObject({ origin: 'front-matter', input: { H0: 70, Omega_m: 0.3, flat: true } });
    const md2 = readMarkdown('---\ncosmology: planck-2018\n---\n\nText.\n');
    expect(findDeclarations(md2).declarations[0].preset).toBe('planck-2018');
    expect(findDeclarations(readMarkdown('Text <!-- comove: H0=71 Omega_m=0.29 --> here.\n')).declarations[0].input).toEqual({ H0: 71, Omega_m: 0.29 });
  });
  it('scopes a simulation’s parameters to their own section', () => {
    const src = '% comove: planck-2018\n\\section{Results} Text at $z=1$.\n\\section{Simulation} The N-body simulation was run with $\\Omega_{\\rm m}=0.25$ and $h=0.73$.\n';
    const d = declOf(src).declarations;
    expect(d[1]).toMatchObject({ role: 'other-model', input: { Omega_m: 0.25, h: 0.73 } });
    expect(d[1].scopeStart).toBeGreaterThan(0);
  });
  it('reports conflicting document-wide declarations with both places', () => {
    const s = declOf('We adopt $H_0 = 70$ and $\\Omega_{\\rm m} = 0.3$.\n\nLater we assume a cosmology with $H_0 = 67.7$ and $\\Omega_{\\rm m} = 0.31$.');
    expect(s.problems.some((p) => /conflicting declarations: H0 = 70 and H0 = 67.7/.test(p.message) && p.ranges.length === 2)).toBe(true);
  });
  it('works on plain text with Unicode symbols', () => {
    expect(findDeclarations(readPlainText('We adopt H0 = 70 km s−1 Mpc−1 and Ωm = 0.3, ΩΛ = 0.7 (a flat ΛCDM model).')).declarations[0].input).toEqual({ H0: 70, Omega_m: 0.3, Omega_Lambda: 0.7, flat: true });
  });
});
