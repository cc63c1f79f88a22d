/**
 * Reader benchmark (`npm run bench`): throughput of the LaTeX and Markdown readers on a 1 MB
 * synthetic manuscript, claim extraction on top, peak memory, and — side by side on the same
 * machine — the general-purpose LaTeX PEG parser from npm (latex-utensils), on a smaller input
 * because it is far slower. Figures are printed; nothing is asserted.
 */

import { latexParser } from 'latex-utensils';
import { extractClaims, readLatex, readMarkdown } from '../../shared/src/index.js';
import { syntheticLatexManuscript, syntheticMarkdownManuscript } from './syntheticManuscript.js';

function timeRuns(label: string, bytes: number, runs: number, work: () => unknown, warmUps = 5): number {
  for (let i = 0; i < warmUps; i++) work(); // let the JIT compile the path
  const times: number[] = [];
  for (let i = 0; i < runs; i++) {
    const t0 = process.hrtime.bigint();
    work();
    times.push(Number(process.hrtime.bigint() - t0) / 1e6);
  }
  times.sort((a, b) => a - b);
  const median = times[Math.floor(times.length / 2)];
  const mbPerS = bytes / 1e6 / (median / 1000);
  const best = bytes / 1e6 / (times[0] / 1000);
  // This machine's run-to-run spread is wide (±15 % and more), so the best run is shown as well.
  console.log(`  ${label.padEnd(52)} ${median.toFixed(1).padStart(8)} ms  ${mbPerS.toFixed(2).padStart(8)} MB/s  (median of ${runs}; best ${best.toFixed(2)} MB/s)`);
  return mbPerS;
}

const latex = syntheticLatexManuscript(1_000_000);
const markdown = syntheticMarkdownManuscript(1_000_000);
console.log('\nComove reader benchmark');
console.log(`  LaTeX manuscript ${(latex.length / 1e6).toFixed(2)} MB, Markdown manuscript ${(markdown.length / 1e6).toFixed(2)} MB (synthetic, test/bench/syntheticManuscript.ts)\n`);

const ours = timeRuns('LaTeX reader (readLatex)', latex.length, 30, () => readLatex(latex), 10);
timeRuns('LaTeX reader + claim extraction', latex.length, 10, () => extractClaims(readLatex(latex)));
{
  // Full collections around the reading (the benchmark runs with --expose-gc), so that garbage
  // from the runs above is not counted, nor the reading's own temporary garbage.
  const gc = (globalThis as { gc?: () => void }).gc ?? (() => undefined);
  gc();
  const before = process.memoryUsage().heapUsed;
  const kept = readLatex(latex);
  gc();
  const after = process.memoryUsage().heapUsed;
  console.log(`  heap held by one reading of the 1 MB LaTeX manuscript: about ${((after - before) / 1e6).toFixed(0)} MB (${kept.blocks.length} blocks)`);
  console.log(`  peak resident memory after the LaTeX runs: ${(process.resourceUsage().maxRSS / 1024).toFixed(0)} MB`);
}
// remark (micromark with the GFM extensions) is the limit here, at a fraction of a MB/s.
timeRuns('Markdown reader (remark + our walker)', markdown.length, 3, () => readMarkdown(markdown), 1);
timeRuns('Markdown reader + claim extraction', markdown.length, 1, () => extractClaims(readMarkdown(markdown)), 0);

// The general-purpose PEG parser, on 50 kB (it needs seconds per megabyte).
const small = syntheticLatexManuscript(50_000);
const peg = timeRuns('general-purpose LaTeX PEG parser (latex-utensils), 50 kB', small.length, 5, () => latexParser.parse(small));
const mid = syntheticLatexManuscript(1_000_000);
const pegMb = timeRuns('general-purpose LaTeX PEG parser (latex-utensils), 1 MB', mid.length, 2, () => latexParser.parse(mid), 1);
timeRuns('our LaTeX reader on the same 50 kB', small.length, 30, () => readLatex(small));
console.log(`\n  LaTeX reader speed-up over the general-purpose parser: ${(ours / pegMb).toFixed(0)}× on 1 MB, ${(ours / peg).toFixed(0)}× against its 50 kB rate`);
console.log(`  Peak resident memory of this process (remark on 1 MB of Markdown included): ${(process.resourceUsage().maxRSS / 1024).toFixed(0)} MB`);
