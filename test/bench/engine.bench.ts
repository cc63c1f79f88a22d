/**
 * Engine benchmark (`npm run bench`): set-up time per parameter set, cost per evaluation
 * over 10⁶ pseudo-random redshifts in [0, 20], agreement of the tables with direct
 * quadrature, and the cost of a 10⁵-redshift CSV table. Timing goals live here, never in
 * the unit tests. Figures are printed; nothing is asserted.
 */

import {
  age,
  comovingDistance,
  comovingIntegral,
  createCosmology,
  distanceModulus,
  evaluateColumns,
  findPreset,
  lookbackTime,
  luminosityDistance,
  QUANTITIES,
  redshiftAtLookbackTime,
  resolveParameters,
  Cosmology,
  type ParameterInput,
} from '../../shared/src/index.js';
import { toCsv } from '../../cli/src/calcCommand.js';

const N_EVAL = 1_000_000;
const Z_MAX = 20;

/** Deterministic uniform numbers in [0, 1) (a 32-bit linear congruential generator, Numerical Recipes constants). */
function uniformSequence(count: number, start = 12345): Float64Array {
  const out = new Float64Array(count);
  let state = start >>> 0;
  for (let i = 0; i < count; i++) {
    state = (Math.imul(state, 1664525) + 1013904223) >>> 0;
    out[i] = state / 4294967296;
  }
  return out;
}

function median(values: number[]): number {
  const s = [...values].sort((a, b) => a - b);
  return s[Math.floor(s.length / 2)];
}

function nsPerCall(label: string, count: number, run: () => number): void {
  run(); // warm-up: let the JIT compile the path
  const t0 = process.hrtime.bigint();
  const sink = run();
  const ns = Number(process.hrtime.bigint() - t0) / count;
  console.log(`  ${label.padEnd(46)} ${ns.toFixed(1).padStart(8)} ns   (checksum ${sink.toPrecision(6)})`);
}

function build(input: ParameterInput): Cosmology {
  const made = createCosmology(input);
  if (!made.ok) throw new Error(JSON.stringify(made.errors));
  return made.cosmology;
}

const planck = findPreset('planck-2018')!.input;
console.log('Comove engine benchmark');
console.log(`  node ${process.version}, ${process.arch}`);
console.log('  parameter set: planck-2018 (flat ΛCDM, T_CMB = 2.7255 K, N_eff = 3.046, Σmν = 0.06 eV)\n');

// Set-up: the first build in a fresh process (cold JIT), then the median of 50 distinct sets.
{
  let t0 = process.hrtime.bigint();
  build(planck);
  const cold = Number(process.hrtime.bigint() - t0) / 1e6;
  const resolveTimes: number[] = [];
  const buildTimes: number[] = [];
  for (let k = 0; k < 50; k++) {
    const input = { ...planck, H0: 67 + k * 0.01 };
    t0 = process.hrtime.bigint();
    const r = resolveParameters(input);
    const t1 = process.hrtime.bigint();
    if (!r.ok) throw new Error('bad set');
    new Cosmology(r.params, r.neutrinos);
    const t2 = process.hrtime.bigint();
    resolveTimes.push(Number(t1 - t0) / 1e6);
    buildTimes.push(Number(t2 - t1) / 1e6);
  }
  console.log('Set-up per parameter set');
  console.log(`  first set in a fresh process (includes JIT warm-up)   ${cold.toFixed(2)} ms`);
  console.log(`  median of 50 sets: validate ${median(resolveTimes).toFixed(3)} ms + tabulate ${median(buildTimes).toFixed(3)} ms = ${(median(resolveTimes) + median(buildTimes)).toFixed(3)} ms\n`);
}

const c = build(planck);
const u = uniformSequence(N_EVAL);
const zs = u.map((v) => v * Z_MAX);

console.log(`Cost per evaluation, ${N_EVAL.toExponential(0)} redshifts uniform in [0, ${Z_MAX}]`);
nsPerCall('comoving distance D_C', N_EVAL, () => {
  let s = 0;
  for (let i = 0; i < N_EVAL; i++) s += comovingDistance(c, zs[i]);
  return s;
});
nsPerCall('luminosity distance D_L', N_EVAL, () => {
  let s = 0;
  for (let i = 0; i < N_EVAL; i++) s += luminosityDistance(c, zs[i]);
  return s;
});
nsPerCall('distance modulus', N_EVAL, () => {
  let s = 0;
  for (let i = 1; i < N_EVAL; i++) s += distanceModulus(c, zs[i] + 1e-6);
  return s;
});
nsPerCall('age at z', N_EVAL, () => {
  let s = 0;
  for (let i = 0; i < N_EVAL; i++) s += age(c, zs[i]);
  return s;
});
{
  const tMax = lookbackTime(c, Z_MAX);
  const ts = u.map((v) => v * tMax);
  nsPerCall('inverse: z from lookback time', N_EVAL, () => {
    let s = 0;
    for (let i = 0; i < N_EVAL; i++) s += redshiftAtLookbackTime(c, ts[i]);
    return s;
  });
}

// Accuracy of the tables against direct adaptive quadrature (the goal: 1e-7 relative).
{
  let worst = 0;
  let worstZ = 0;
  const sample = uniformSequence(2000, 777);
  for (let i = 0; i < sample.length; i++) {
    const z = i % 2 ? sample[i] * Z_MAX : 10 ** (sample[i] * 7 - 4);
    const x = Math.log1p(z);
    const err = Math.abs(c.table.comovingAt(x) / comovingIntegral(c.expansion, 0, x) - 1);
    if (err > worst) {
      worst = err;
      worstZ = z;
    }
  }
  console.log(`\nTable versus direct quadrature (2000 redshifts, 1e-4 ≤ z ≤ 1000): worst relative difference ${worst.toExponential(2)} at z = ${worstZ.toPrecision(4)}`);
}

// A 10⁵-redshift table, as `comove calc --format csv` produces it.
{
  const n = 100_000;
  const redshifts = Array.from(uniformSequence(n, 99), (v) => v * Z_MAX);
  for (const [label, keys] of [
    ['all quantities', QUANTITIES.map((q) => q.key)],
    ['D_C, D_L and age', ['comovingDistance', 'luminosityDistance', 'age']],
  ] as const) {
    evaluateColumns(c, redshifts.slice(0, 1000), keys);
    const t0 = process.hrtime.bigint();
    const columns = evaluateColumns(c, redshifts, keys);
    const t1 = process.hrtime.bigint();
    const bytes = toCsv(keys, columns);
    const t2 = process.hrtime.bigint();
    console.log(
      `10⁵-redshift CSV, ${label} (${keys.length} columns): evaluate ${(Number(t1 - t0) / 1e6).toFixed(0)} ms, format ${(Number(t2 - t1) / 1e6).toFixed(0)} ms, ${(bytes.length / 1e6).toFixed(1)} MB`,
    );
  }
}
console.log(`\nPeak resident memory: ${(process.resourceUsage().maxRSS / 1024).toFixed(0)} MB`);
