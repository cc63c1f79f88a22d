/**
 * Language-server benchmark (`npm run bench`): start-up to first diagnostics; the time from a
 * keystroke-sized edit to the diagnostics of that version on a 200 kB manuscript (median and p95
 * over 200 edits, default debounce included); and resident memory of the server process before
 * and after a replay of 10 000 edits. Figures are printed; nothing is asserted.
 */

import { readFileSync } from 'node:fs';
import { TextDocument } from 'vscode-languageserver-textdocument';
import { LspClient } from '../helpers/lspClient.js';
import { consistentValues, syntheticLatexManuscript, syntheticMarkdownManuscript } from './syntheticManuscript.js';

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

/**
 * Median and p95 of edit → diagnostics of that version, over 200 keystrokes in the middle of the
 * text: a word typed and deleted in a prose sentence (the last reading is patched), or line breaks
 * typed and deleted (the file is read again in full).
 */
async function keystrokes(client: LspClient, uri: string, start: TextDocument, word = ' lens'): Promise<{ median: number; p95: number; doc: TextDocument; diagnostics: number }> {
  let doc = start;
  const latencies: number[] = [];
  // In a prose word in the middle of the manuscript.
  const middle = doc.positionAt(doc.getText().indexOf(' the ', Math.floor(doc.getText().length / 2)) + 3);
  let diagnostics = 0;
  for (let i = 0; i < 200; i++) {
    // Type a word, then delete it again.
    const typing = i % 10 < 5;
    const at = doc.positionAt(doc.offsetAt(middle) + (typing ? i % 10 : 5 - (i % 10 - 5)));
    const change = typing ? { range: { start: at, end: at }, text: word[i % word.length] } : { range: { start: doc.positionAt(doc.offsetAt(at) - 1), end: at }, text: '' };
    const t0 = performance.now();
    const version = await client.change(uri, [change]);
    doc = TextDocument.update(doc, [change], version);
    diagnostics = (await client.diagnostics(uri, (p) => p.version === version)).diagnostics.length;
    latencies.push(performance.now() - t0);
  }
  return { median: quantile(latencies, 0.5), p95: quantile(latencies, 0.95), doc, diagnostics };
}

const client = new LspClient(SERVER, ['--expose-gc']);
await client.initialize(null);
const pid = client.process.pid!;
const heapMb = async () => ((await client.connection.sendRequest('comove/heapAfterCollection')) as number) / 1e6;
let doc!: TextDocument;
let uri = '';
for (const [label, values] of [['typical: numbers computed for the declared set', consistentValues()], ['worst case: nearly every number inconsistent', undefined]] as const) {
  uri = `file:///bench/${label.split(':')[0]}.tex`;
  const text = syntheticLatexManuscript(200_000, values);
  await client.open(uri, 'latex', text);
  await client.diagnostics(uri);
  const r = await keystrokes(client, uri, TextDocument.create(uri, 'latex', 1, text));
  doc = r.doc;
  console.log(`  200 kB manuscript, ${label} (${r.diagnostics} diagnostics):`);
  console.log(`    edit → diagnostics of that version, typing in a sentence: median ${r.median.toFixed(0)} ms, p95 ${r.p95.toFixed(0)} ms (goal p95 ≤ 50 ms; debounce 5 ms included)`);
  if (values) {
    const lines = await keystrokes(client, uri, doc, '\n');
    doc = lines.doc;
    console.log(`    the same, typing line breaks (the file is read again in full): median ${lines.median.toFixed(0)} ms, p95 ${lines.p95.toFixed(0)} ms`);
  }
}
{
  // Markdown: no patched reading, but only the piece of the source an edit touched is parsed again.
  const mdUri = 'file:///bench/typical.md';
  const md = syntheticMarkdownManuscript(200_000);
  await client.open(mdUri, 'markdown', md);
  await client.diagnostics(mdUri, () => true, 120_000);
  const r = await keystrokes(client, mdUri, TextDocument.create(mdUri, 'markdown', 1, md));
  console.log(`  200 kB Markdown manuscript (${r.diagnostics} diagnostics):`);
  console.log(`    edit → diagnostics of that version, typing in a sentence: median ${r.median.toFixed(0)} ms, p95 ${r.p95.toFixed(0)} ms`);
}
const middle = doc.positionAt(Math.floor(doc.getText().length / 2));

const before = rssMb(pid);
const heapBefore = await heapMb();
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
const heapAfter = await heapMb();
console.log(`  server RSS: ${before.toFixed(0)} MB before 10 000 edits, ${middleRss.toFixed(0)} MB after 5 000, ${after.toFixed(0)} MB after 10 000`);
console.log(`  server heap in use after a full collection: ${heapBefore.toFixed(1)} MB before, ${heapAfter.toFixed(1)} MB after the 10 000 edits`);
await client.shutdown();
