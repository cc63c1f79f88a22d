/** Document-level findings: the author's real cosmology, composition sums, missing declarations; and the explanation text. */
import { describe, expect, it } from 'vitest';
import { checkFile, explain, extractProject, type FileCheck } from '../../shared/src/index.js';

function check(uri: string, text: string): FileCheck {
  return checkFile(extractProject({ uri, text }).files[0]);
}

describe("which cosmology the author really used", () => {
  // Numbers computed with astropy 5.2.1, FlatLambdaCDM(H0=68, Om0=0.31) (test/fixtures/check/reference_values.py),
  // in a manuscript that declares H0 = 70, Ωm = 0.3.
  const text = [
    'We adopt a flat cosmology with $H_0 = 70$ and $\\Omega_m = 0.3$.',
    'At $z = 0.25$ the luminosity distance is 1295 Mpc.',
    'At $z = 0.48$ the angular-diameter distance is 1264 Mpc.',
    'At $z = 0.75$ the lookback time is 6.74 Gyr.',
    'At $z = 1.12$ the universe was 5.38 Gyr old.',
    'At $z = 1.9$ the luminosity distance is 14.90 Gpc.',
    'At $z = 2.6$ the comoving distance is 6.06 Gpc.',
    'At $z = 4.7$ the lookback time is 12.47 Gyr.',
    'At $z = 6.2$ the luminosity distance is 61.05 Gpc.',
  ].join('\n');

  it('finds the set the numbers were computed with, and says the manuscript declares another', () => {
    const f = check('paper.tex', text);
    expect(f.checks.filter((c) => c.status === 'inconsistent').length).toBeGreaterThanOrEqual(6);
    const finding = f.findings.find((x) => x.code === 'author-cosmology');
    expect(finding).toBeDefined();
    const m = /agree with H0 = ([\d.]+), Ωm = ([\d.]+)/.exec(finding!.message)!;
    expect(Number(m[1])).toBeCloseTo(68, 0);
    expect(Math.abs(Number(m[2]) - 0.31)).toBeLessThanOrEqual(0.02);
    expect(finding!.message).toMatch(/^8 of 8 .* the manuscript declares H0=70 Omega_m=0.3 flat \(\d of 8 agree\)/);
  });

  it('says nothing when the declared set is the one used', () => {
    const f = check('paper.tex', text.replace('$H_0 = 70$', '$H_0 = 68$').replace('0.3$', '0.31$'));
    expect(f.checks.every((c) => c.status === 'consistent')).toBe(true);
    expect(f.findings.filter((x) => x.code === 'author-cosmology')).toEqual([]);
  });
});

describe('composition of the energy budget', () => {
  const text = '<!-- comove: H0=70 Omega_m=0.3 Omega_b=0.05 flat -->\n\nToday the universe is made of 5% baryons, 25% dark matter and 75% dark energy.\n';
  it('judges each share against 100 Ω and the sentence against 100 %', () => {
    const f = check('a.md', text);
    const byComponent = Object.fromEntries(f.checks.map((c) => [c.claim.parameter, c.status]));
    expect(byComponent).toEqual({ baryon: 'consistent', 'dark matter': 'consistent', 'dark energy': 'inconsistent' });
    const sum = f.findings.find((x) => x.code === 'composition-sum');
    expect(sum?.message).toMatch(/add up to 105 %/);
  });
  it('accepts shares that add up within their rounding', () => {
    const f = check('a.md', text.replace('75%', '70%'));
    expect(f.findings.filter((x) => x.code === 'composition-sum')).toEqual([]);
    expect(f.checks.every((c) => c.status === 'consistent')).toBe(true);
  });
});

describe('declarations', () => {
  it('claims without a declaration are unchecked, with one information finding', () => {
    const f = check('a.md', 'At $z = 1.9$ the luminosity distance is 14.6 Gpc.\n');
    expect(f.checks.map((c) => c.status)).toEqual(['unchecked']);
    expect(f.findings.map((x) => [x.code, x.severity])).toEqual([['no-declaration', 'information']]);
  });
  it('an invalid declared set is reported once and leaves the claims unchecked', () => {
    const f = check('a.tex', '% comove: H0=70 Omega_m=1.4 Omega_Lambda=0.7 flat\nAt $z = 1.9$ the luminosity distance is 14.6 Gpc.\n');
    expect(f.findings.map((x) => x.code)).toContain('declaration-unusable');
    expect(f.checks[0].status).toBe('unchecked');
  });
  it("a simulation's set in an appendix never judges the paper's claims", () => {
    const text = [
      '\\section{Results}',
      '% comove: H0=70 Omega_m=0.3 flat',
      'At $z = 1.9$ the luminosity distance is 14.6\\,Gpc.',
      '\\section{Simulation}',
      'The N-body simulation was run with $H_0 = 67.74$, $\\Omega_m = 0.3089$ and $\\Omega_\\Lambda = 0.6911$.',
      'In the simulation the luminosity distance at $z = 1.9$ is 14.9\\,Gpc.',
    ].join('\n');
    const f = check('a.tex', text);
    expect(f.checks.map((c) => [c.claim.value.text, c.status, c.parameters?.origin])).toEqual([
      ['14.6', 'consistent', 'declared'],
      ['14.9', 'consistent', 'other-model'],
    ]);
  });
});

describe('explanations', () => {
  it('give the stated value and interval, the recomputed value to one more digit, the formula and source, the parameters and the slip', () => {
    const f = check('a.tex', '% comove: H0=70 Omega_m=0.3 flat\nAt $z = 1.12$ the angular-diameter distance is $D_A = 7.60$\\,Gpc.\n');
    const md = explain(f.checks[0]);
    expect(md).toContain('**Angular-diameter distance** at z = 1.12 — **inconsistent**');
    expect(md).toContain('Stated: 7.60 Gpc (admits 7.595 – 7.605 Gpc)');
    expect(md).toContain('Recomputed: 1.691 Gpc');
    expect(md).toContain('Hogg 1999, eq. 18');
    expect(md).toContain('`H0=70 Omega_m=0.3 flat`, declared in a.tex, line 1');
    expect(md).toContain('Likely slip: the stated value is the luminosity distance');
    expect(md).toContain('Fix: write 1.69 instead');
  });
  it('name the method accuracy of fitted epochs', () => {
    const f = check('a.tex', '% comove: planck-2018\nThe drag epoch is at $z_{\\rm drag} = 1060$.\n');
    expect(f.checks[0].status).toBe('consistent');
    expect(f.checks[0].onlyByFloor).toBe(true);
    expect(explain(f.checks[0])).toMatch(/Method accuracy: fit that runs a few per cent low/);
  });
});
