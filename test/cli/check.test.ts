/** `comove check` and `comove migrate` end to end, in-process, on the example manuscripts. */
import { describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import Ajv from 'ajv-draft-04';
import { runWithFiles } from '../helpers/cli.js';

const ROOT = new URL('../../', import.meta.url).pathname;
const read = (p: string) => readFileSync(ROOT + p, 'utf8');
const EXAMPLES = { 'examples/kestrel-survey.tex': read('examples/kestrel-survey.tex'), 'examples/kestrel-proposal.md': read('examples/kestrel-proposal.md') };

describe('comove check', () => {
  it('reports inconsistencies with line:column, stated → recomputed and the slip, and exits 1', () => {
    const r = runWithFiles(['check', 'examples'], EXAMPLES);
    expect(r.code).toBe(1);
    expect(r.stdout).toContain('examples/kestrel-survey.tex');
    expect(r.stdout).toMatch(/24:77 +Angular-diameter distance at z = 1\.12 +7\.60 Gpc +→ 1\.691 Gpc +INCONSISTENT \+350 % — the stated value is the luminosity distance/);
    expect(r.stdout).toMatch(/checked 49 of 49 cosmology-dependent numbers in 2 files: 32 consistent, 17 inconsistent, 0 unchecked/);
  });

  it('exits 0 when every number agrees, and lists them with --all', () => {
    const text = '% comove: H0=70 Omega_m=0.3 flat\nAt $z = 0.48$ the luminosity distance is 2.70\\,Gpc.\n';
    const r = runWithFiles(['check', 'a.tex', '--all'], { 'a.tex': text });
    expect(r.code).toBe(0);
    expect(r.stdout).toMatch(/2:42 +Luminosity distance at z = 0\.48 +2\.70 Gpc +→ 2\.698 Gpc +consistent/);
  });

  it('--params overrides the declaration', () => {
    const r = runWithFiles(['check', 'examples/kestrel-survey.tex', '--params', 'planck-2018', '--format', 'json'], EXAMPLES);
    const out = JSON.parse(r.stdout);
    expect(out.files[0].parameters.origin).toBe('override');
    const dl = out.files[0].claims.find((c: { statedText: string; kind: string }) => c.statedText === '61.3');
    expect(dl.status).toBe('consistent');
  });

  it('--format json has the documented shape with 0-based LSP ranges', () => {
    const r = runWithFiles(['check', 'examples/kestrel-survey.tex', '--format', 'json'], EXAMPLES);
    const out = JSON.parse(r.stdout);
    expect(Object.keys(out)).toEqual(['files', 'summary']);
    const f = out.files[0];
    expect(f.path).toBe('examples/kestrel-survey.tex');
    const claim = f.claims.find((c: { statedText: string }) => c.statedText === '7.60');
    expect(claim).toMatchObject({ kind: 'angularDiameterDistance', z: 1.12, stated: 7.6, unit: 'Gpc', status: 'inconsistent', slip: { id: 'swapped-quantity' } });
    expect(claim.range.start).toEqual({ line: 23, character: 76 });
    expect(claim.computed).toBeCloseTo(1.6914385, 4); // astropy 5.2.1: D_A(1.12) = 1691.4385 Mpc for H0 = 70, Ωm = 0.3
    expect(claim.message).toContain('Hogg 1999, eq. 18');
    expect(claim.fix.newText).toBe('1.69');
    expect(out.summary).toEqual({ files: 1, claims: 31, checked: 31, consistent: 21, inconsistent: 10, unchecked: 0 });
  });

  it('--format sarif validates against the SARIF 2.1.0 schema (vendored, OASIS)', () => {
    const r = runWithFiles(['check', 'examples', '--format', 'sarif'], EXAMPLES);
    const sarif = JSON.parse(r.stdout);
    const schema = JSON.parse(read('test/vendor/sarif-schema-2.1.0.json'));
    const ajv = new Ajv({ allErrors: true, strict: false, unicodeRegExp: false });
    const validate = ajv.compile(schema);
    const ok = validate(sarif);
    expect(validate.errors ?? []).toEqual([]);
    expect(ok).toBe(true);
    const results = sarif.runs[0].results as Array<{ ruleId: string; level: string; locations: Array<{ physicalLocation: { region: { startLine: number } } }> }>;
    expect(results.filter((x) => x.ruleId === 'CMV101')).toHaveLength(17);
    expect(results.find((x) => x.ruleId === 'CMV101')!.locations[0].physicalLocation.region.startLine).toBeGreaterThan(0);
  });

  it('a schema violation is caught by the validator (the validation can fail)', () => {
    const schema = JSON.parse(read('test/vendor/sarif-schema-2.1.0.json'));
    const validate = new Ajv({ strict: false, unicodeRegExp: false }).compile(schema);
    expect(validate({ version: '2.1.0', runs: [{ tool: { driver: {} } }] })).toBe(false);
  });

  it('reads standard input with --stdin --as text', () => {
    const text = 'We adopt H0 = 70 km/s/Mpc, Omega_m = 0.3 and a flat universe. At z = 1.9 the luminosity distance is 14.6 Gpc.';
    const r = runWithFiles(['check', '--stdin', '--as', 'text', '--format', 'json'], { '-': text });
    const out = JSON.parse(r.stdout);
    expect(out.files[0].format).toBe('plaintext');
    expect(out.summary.consistent).toBe(1);
  });

  it('writes the HTML report with --report', () => {
    const r = runWithFiles(['check', 'examples', '--report', 'out.html'], EXAMPLES);
    const html = r.written['out.html'];
    expect(html).toMatch(/^<!DOCTYPE html>/);
    expect(html.match(/<tr class="claim-row /g)).toHaveLength(49);
    expect(html.match(/class="claim-point inconsistent"/g)!.length).toBeGreaterThan(5);
    expect(html).not.toMatch(/<script|https?:\/\/(?!www\.w3\.org\/2000\/svg)/);
  });

  it('input and usage errors exit 2 with a message', () => {
    expect(runWithFiles(['check', 'missing.tex']).code).toBe(2);
    expect(runWithFiles(['check']).code).toBe(2);
    expect(runWithFiles(['check', 'a.tex', '--format', 'xml'], { 'a.tex': '' }).code).toBe(2);
    expect(runWithFiles(['check', 'a.tex', '--floor', 'lots'], { 'a.tex': '' }).code).toBe(2);
    expect(runWithFiles(['check', 'a.tex', '--params', 'H0=-5'], { 'a.tex': '' }).code).toBe(2);
    const binary = runWithFiles(['check', 'b.tex'], { 'b.tex': 'PK\u0000\u0003binary' });
    expect(binary.code).toBe(2);
    expect(binary.stderr).toContain('binary');
  });

  it('shows progress on a terminal, and only there', () => {
    const files: Record<string, string> = {};
    for (let i = 0; i < 5; i++) files[`many/p${i}.md`] = `<!-- comove: flat-70-0.3 -->\n\nAt $z = 0.48$ the luminosity distance is 2.70 Gpc.\n`;
    expect(runWithFiles(['check', 'many'], files, { terminal: true }).stderr).toMatch(/checking 5\/5/);
    expect(runWithFiles(['check', 'many'], files).stderr).toBe('');
  });

  it('follows a LaTeX project from its root in a folder and checks the chapter under the root declaration', () => {
    const files = {
      'paper/main.tex': '\\documentclass{article}\n% comove: H0=70 Omega_m=0.3 flat\n\\begin{document}\n\\input{chapters/one}\n\\end{document}\n',
      'paper/chapters/one.tex': 'At $z = 0.48$ the luminosity distance is 2.70\\,Gpc.\n',
    };
    const out = JSON.parse(runWithFiles(['check', 'paper', '--format', 'json'], files).stdout);
    expect(out.files.map((f: { path: string }) => f.path)).toEqual(['paper/main.tex', 'paper/chapters/one.tex']);
    expect(out.files[1].parameters.origin).toBe('inherited');
    expect(out.files[1].claims[0].status).toBe('consistent');
  });
});

describe('comove migrate', () => {
  it('rewrites the declaration and every dependent number; the result checks clean under the new set', () => {
    const text = EXAMPLES['examples/kestrel-survey.tex'];
    const r = runWithFiles(['migrate', 'examples/kestrel-survey.tex', '--to', 'H0=68 Omega_m=0.31 flat', '--write'], EXAMPLES);
    expect(r.code).toBe(0);
    const migrated = r.written['examples/kestrel-survey.tex'];
    expect(migrated).toContain('% comove: H0=68 Omega_m=0.31 flat');
    expect(migrated).toContain('$H_0 = 68$');
    expect(migrated).toContain('$\\Omega_{\\rm m} = 0.31$');
    // astropy 5.2.1, FlatLambdaCDM(H0=68, Om0=0.31): D_L(0.48) = 2767.8 Mpc.
    expect(migrated).toContain('$D_L = 2.77$\\,Gpc');
    expect(migrated.length).toBeGreaterThan(text.length - 50);
    // The 21 numbers that agreed with the old set agree with the new one; the 10 that were
    // already wrong are listed, not carried over.
    type J = { claims: Array<{ range: { start: { line: number } }; status: string }> };
    const verdicts = (t: string) => (JSON.parse(runWithFiles(['check', 'm.tex', '--format', 'json'], { 'm.tex': t }).stdout).files[0] as J).claims.map((c) => `${c.range.start.line}:${c.status}`);
    const before = verdicts(text);
    const after = verdicts(migrated);
    const keptConsistent = before.filter((v) => v.endsWith(':consistent'));
    expect(keptConsistent).toHaveLength(21);
    for (const v of keptConsistent) expect(after).toContain(v);
    expect(r.stdout).toMatch(/not rewritten \(10\)/);
  });

  it('writes derived parameters to a sensible precision and the set’s own values as they are', () => {
    const r = runWithFiles(['migrate', 'examples/kestrel-survey.tex', '--to', 'planck-2018', '--write'], EXAMPLES);
    const migrated = r.written['examples/kestrel-survey.tex'];
    // planck-2018 states H0 = 67.66; Ω_m = (ω_b + ω_c + ω_ν)/h² = 0.31105 and Ω_Λ = 0.68886 are derived.
    expect(migrated).toContain('$H_0 = 67.66$');
    expect(migrated).toContain('$\\Omega_{\\rm m} = 0.311$');
    expect(migrated).toContain('$\\Omega_\\Lambda = 0.6889$');
  });

  it('lists what it cannot rewrite and does not write without --write', () => {
    const r = runWithFiles(['migrate', 'examples/kestrel-proposal.md', '--to', 'planck-2018'], EXAMPLES);
    expect(r.written).toEqual({});
    expect(r.stdout).toMatch(/not rewritten/);
    expect(r.stdout).toMatch(/front matter is rewritten by hand/);
  });
});
