import { readLatex } from '../../shared/src/index.js';
import { OutputStore } from '../../shared/src/reader/sourceMap.js';
import { syntheticLatexManuscript } from './syntheticManuscript.js';
const doc = syntheticLatexManuscript(1_000_000);
let asmT = 0;
const orig = OutputStore.prototype.assemble;
OutputStore.prototype.assemble = function (d, sep) { const t0 = performance.now(); const r = orig.call(this, d, sep); asmT += performance.now() - t0; return r; };
const times: number[] = [];
const asm: number[] = [];
for (let i = 0; i < 40; i++) { asmT = 0; const t0 = performance.now(); readLatex(doc); times.push(performance.now() - t0); asm.push(asmT); }
const s = times.slice(10).sort((a, b) => a - b); const a = asm.slice(10).sort((x, y) => x - y);
console.log('median total', s[15].toFixed(1), 'median assemble', a[15].toFixed(1));
