/** `comove extract`: text and JSON output, multi-file projects, bad input. */
import { describe, expect, it } from 'vitest';
import { runWithFiles } from '../helpers/cli.js';

const run = runWithFiles;

const ROOT = '% comove: H0=70 Omega_m=0.3 flat\n\\begin{document}\nAt $z = 1$ the luminosity distance is $D_L = 6.6$\\,Gpc.\n\\input{sec/two}\n\\input{missing}\n\\end{document}\n';
const CHILD = 'At $z = 2$ the universe was 3.2\\,Gyr old.\n';

describe('comove extract', () => {
  it('lists declarations, claims with line:column and problems, following \\input', () => {
    const r = run(['extract', 'paper/main.tex'], { 'paper/main.tex': ROOT, 'paper/sec/two.tex': CHILD });
    expect(r.code).toBe(0);
    expect(r.stdout).toContain('paper/main.tex  (latex)');
    expect(r.stdout).toMatch(/directive, document: H0=70 Omega_m=0.3 flat/);
    expect(r.stdout).toMatch(/3:46 +luminosityDistance +6\.6 Gpc +z = 1 +sentence/);
    expect(r.stdout).toMatch(/1:1 +directive, document/);
    expect(r.stdout).toContain('paper/sec/two.tex  (latex)');
    expect(r.stdout).toMatch(/age +3\.2 Gyr +z = 2/);
    expect(r.stdout).toMatch(/\\input\{missing\}: the file cannot be found/);
  });
  it('prints JSON with 0-based LSP ranges', () => {
    const r = run(['extract', 'main.tex', '--json'], { 'main.tex': ROOT });
    const out = JSON.parse(r.stdout);
    const claim = out.files[0].claims[0];
    expect(claim).toMatchObject({ kind: 'luminosityDistance', text: '6.6 Gpc', value: 6.6, unit: 'Gpc', z: 1, significantDigits: 2, resolution: 0.1 });
    expect(claim.range).toEqual({ start: { line: 2, character: 45 }, end: { line: 2, character: 54 } });
    expect(out.files[0].declarations[0].range.start).toEqual({ line: 0, character: 0 });
    expect(out.files[0].declarations[0]).toMatchObject({ origin: 'directive', parameters: { H0: 70, Omega_m: 0.3, flat: true } });
  });
  it('reads Markdown and plain text by their extension', () => {
    expect(run(['extract', 'p.md'], { 'p.md': '---\ncosmology: planck-2018\n---\n\nAt $z=1$ the age was 5.9 Gyr.\n' }).stdout).toMatch(/\(markdown\)[\s\S]*front-matter[\s\S]*age +5\.9 Gyr +z = 1/);
    expect(run(['extract', 'p.txt'], { 'p.txt': 'At z = 1 the lookback time is 7.9 Gyr.' }).stdout).toMatch(/\(plaintext\)[\s\S]*lookbackTime +7\.9 Gyr/);
  });
  it('reports binary files as a problem and unreadable ones with exit code 2', () => {
    expect(run(['extract', 'x.tex'], { 'x.tex': 'abc\u0000def' }).stdout).toMatch(/binary file/);
    const missing = run(['extract', 'nope.tex'], {});
    expect(missing.code).toBe(2);
    expect(missing.stderr).toMatch(/cannot read nope.tex/);
    expect(run(['extract'], {}).code).toBe(2);
  });
});
