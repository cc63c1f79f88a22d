import { readLatex } from '../../shared/src/index.js';
import { syntheticLatexManuscript } from './syntheticManuscript.js';
const doc = syntheticLatexManuscript(1_000_000);
const times: number[] = [];
for (let i = 0; i < 40; i++) { const t0 = performance.now(); readLatex(doc); times.push(performance.now() - t0); }
const s = times.slice(10).sort((a, b) => a - b); console.log('median', s[15].toFixed(1), 'best', s[0].toFixed(1));
