/**
 * Checker benchmark (`npm run bench`): a full `check` of the 1 MB synthetic LaTeX manuscript
 * in process (read, extract, check, diagnose, fit the author's cosmology, build the text
 * report), median of several runs, with the time spent in each stage; then the command line end
 * to end in a child process, minus the start-up of Node itself; and peak resident memory.
 * Figures are printed; nothing is asserted.
 */

import { execFileSync, spawnSync } from 'node:child_process';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { checkProject, extractProject, readLatex, extractClaims, summarize, locate } from '../../shared/src/index.js';
import { textReport } from '../../cli/src/report/textReport.js';
import { consistentValues, syntheticLatexManuscript } from './syntheticManuscript.js';

const latex = syntheticLatexManuscript(1_000_000);
const typical = syntheticLatexManuscript(1_000_000, consistentValues());
const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)];
const time = (runs: number, work: () => unknown): number => {
  work();
  const t: number[] = [];
  for (let i = 0; i < runs; i++) {
    const t0 = performance.now();
    work();
    t.push(performance.now() - t0);
  }
  return median(t);
};

console.log('\nComove checker benchmark');
console.log(`  LaTeX manuscript ${(latex.length / 1e6).toFixed(2)} MB (synthetic, test/bench/syntheticManuscript.ts)\n`);
const project = extractProject({ uri: 'bench.tex', text: latex });
const claims = project.files[0].claims.length;
const read = time(9, () => readLatex(latex));
const extract = time(5, () => extractClaims(readLatex(latex)));
const check = time(5, () => checkProject(project.files));
const noFit = time(5, () => checkProject(project.files, { fitAuthorCosmology: false }));
const full = time(5, () => {
  const files = checkProject(extractProject({ uri: 'bench.tex', text: latex }).files).map(locate);
  return textReport(files, summarize(files), { showConsistent: false });
});
const checked = checkProject(project.files)[0];
console.log(`  claims: ${claims} (${checked.checks.filter((c) => c.status === 'inconsistent').length} inconsistent)`);
console.log(`  read (LaTeX scanner)                         ${read.toFixed(0).padStart(6)} ms`);
console.log(`  read + extract claims and declarations       ${extract.toFixed(0).padStart(6)} ms`);
console.log(`  check (recompute, judge, diagnose, fit)      ${check.toFixed(0).padStart(6)} ms   (without the fit: ${noFit.toFixed(0)} ms)`);
console.log(`  full check in process, text report included  ${full.toFixed(0).padStart(6)} ms   (goal ≤ 150 ms)`);
{
  const project = extractProject({ uri: 'typical.tex', text: typical });
  const checked = checkProject(project.files)[0];
  const t = time(5, () => {
    const files = checkProject(extractProject({ uri: 'typical.tex', text: typical }).files).map(locate);
    return textReport(files, summarize(files), { showConsistent: false });
  });
  console.log(`  typical manuscript (numbers computed for its declared set): ${checked.checks.length} claims, ${checked.checks.filter((c) => c.status === 'inconsistent').length} inconsistent`);
  console.log(`  full check in process, text report included  ${t.toFixed(0).padStart(6)} ms   (goal ≤ 150 ms)`);
}

const dir = mkdtempSync(join(tmpdir(), 'comove-bench-'));
const file = join(dir, 'manuscript.tex');
writeFileSync(file, latex);
const cli = new URL('../cli.js', import.meta.url).pathname;
const spawnMs = (args: string[]) => {
  const t0 = performance.now();
  try {
    execFileSync(process.execPath, args, { stdio: 'ignore' });
  } catch {
    // exit code 1: inconsistencies found
  }
  return performance.now() - t0;
};
const nodeAlone = median([0, 1, 2].map(() => spawnMs(['-e', '0'])));
const cliRuns = [0, 1, 2].map(() => spawnMs([cli, 'check', file]));
console.log(`  comove check on the file, end to end         ${median(cliRuns).toFixed(0).padStart(6)} ms   (Node start-up alone: ${nodeAlone.toFixed(0)} ms)`);
// Peak RSS of the command-line run, from GNU time where it is installed.
const timed = spawnSync('/usr/bin/time', ['-f', '%M', process.execPath, cli, 'check', file], { encoding: 'utf8', stdio: ['ignore', 'ignore', 'pipe'] });
const kb = timed.error ? NaN : Number(timed.stderr.trim().split('\n').pop());
console.log(`  peak resident memory of comove check         ${Number.isFinite(kb) ? `${(kb / 1024).toFixed(0).padStart(6)} MB   (goal ≤ 150 MB)` : '  (GNU time is not installed)'}`);
console.log(`  peak resident memory of this process: ${(process.resourceUsage().maxRSS / 1024).toFixed(0)} MB`);
