/**
 * Language-server benchmark (`npm run bench`): start-up to first diagnostics; the time from a
 * keystroke-sized edit to the diagnostics of that version on a 200 kB manuscript (median and p95
 * over 200 edits, default debounce included); and resident memory of the server process before
 * and after a replay of 10 000 edits. Figures are printed; nothing is asserted.
 */

import { readFileSync } from 'node:fs';
import { TextDocument } from 'vscode-languageserver-textdocument';
import { LspClient } from '../helpers/lspClient.js';
import { syntheticLatexManuscript } from './syntheticManuscript.js';

const SERVER = new URL('../server.js', import.meta.url).pathname;

function rssMb(pid: number): number {
  const status = readFileSync(`/proc/${pid}/status`, 'utf8');
  return Number(/VmRSS:\s+(\d+)/.exec(status)![1]) / 1024;
}

const quantile = (xs: number[], q: number) => [...xs].sort((a, b) => a - b)[Math.min(xs.length - 1, Math.floor(q * xs.length))];

console.log('\nComove language-server benchmark');
{
  const t0 = performance.now();
  const client = new LspClient(SERVER);
  await client.initialize(null);
  const text = readFileSync(new URL('../../examples/kestrel-survey.tex', import.meta.url), 'utf8');
  await client.open('file:///bench/kestrel-survey.tex', 'latex', text);
  await client.diagnostics('file:///bench/kestrel-survey.tex');
  console.log(`  start-up to first diagnostics (examples/kestrel-survey.tex)   ${(performance.now() - t0).toFixed(0)} ms`);
  await client.shutdown();
}

const client = new LspClient(SERVER);
await client.initialize(null);
const uri = 'file:///bench/manuscript.tex';
let doc = TextDocument.create(uri, 'latex', 1, syntheticLatexManuscript(200_000));
await client.open(uri, 'latex', doc.getText());
await client.diagnostics(uri);
const pid = client.process.pid!;
console.log(`  manuscript: ${(doc.getText().length / 1000).toFixed(0)} kB (synthetic), default debounce 15 ms`);

// Keystrokes in the middle of the text: type a word, then delete it again.
const latencies: number[] = [];
const middle = doc.positionAt(Math.floor(doc.getText().length / 2));
const word = ' lens';
for (let i = 0; i < 200; i++) {
  const typing = i % 10 < 5;
  const at = doc.positionAt(doc.offsetAt(middle) + (typing ? i % 10 : 5 - (i % 10 - 5)));
  const change = typing ? { range: { start: at, end: at }, text: word[i % 5] } : { range: { start: doc.positionAt(doc.offsetAt(at) - 1), end: at }, text: '' };
  const t0 = performance.now();
  const version = await client.change(uri, [change]);
  doc = TextDocument.update(doc, [change], version);
  await client.diagnostics(uri, (p) => p.version === version);
  latencies.push(performance.now() - t0);
}
console.log(`  edit → diagnostics of that version: median ${quantile(latencies, 0.5).toFixed(0)} ms, p95 ${quantile(latencies, 0.95).toFixed(0)} ms (goal p95 ≤ 50 ms)`);

const before = rssMb(pid);
let version = 0;
for (let i = 0; i < 10_000; i++) {
  const at = doc.positionAt(doc.offsetAt(middle) + (i % 2));
  const change = i % 2 === 0 ? { range: { start: at, end: at }, text: 'x' } : { range: { start: doc.positionAt(doc.offsetAt(at) - 1), end: at }, text: '' };
  version = await client.change(uri, [change]);
  doc = TextDocument.update(doc, [change], version);
  if (i === 4999) await client.diagnostics(uri, (p) => p.version === version, 120_000);
}
const middleRss = rssMb(pid);
await client.diagnostics(uri, (p) => p.version === version, 120_000);
const after = rssMb(pid);
console.log(`  server RSS: ${before.toFixed(0)} MB before 10 000 edits, ${middleRss.toFixed(0)} MB after 5 000, ${after.toFixed(0)} MB after 10 000`);
await client.shutdown();
