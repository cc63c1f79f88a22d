/**
 * `comove calc`: every redshift-dependent quantity of a parameter set at the given redshifts,
 * as a readable table, JSON or CSV, plus the parameter set's epochs.
 */

import { parseArgs } from 'node:util';
import {
  createCosmology,
  epochs,
  evaluateColumns,
  evaluateQuantities,
  formatParameterInput,
  parseParameterText,
  findQuantity,
  QUANTITIES,
  type Cosmology,
  type Epochs,
  type ParameterInput,
  type QuantityColumns,
  type QuantityRow,
} from '../../shared/src/index.js';
import { columnsToCsv } from './csvWriter.js';
import { alignColumns, formatNumber } from './format.js';
import { EXIT, UsageError, type CliIo } from './io.js';

export const CALC_HELP = `Usage: comove calc --params TEXT --z LIST [options]

Computes every redshift-dependent quantity of a parameter set at the given redshifts.

  --params TEXT       the parameter set: a preset name and/or key=value pairs, e.g.
                      "H0=70 Omega_m=0.3 flat" or "planck-2018" (see 'comove presets')
  --z LIST            redshifts separated by commas or spaces, or @FILE with one per line
                      (@- reads them from standard input)
  --quantities KEYS   only these quantities (comma-separated keys; see --list)
  --format FORMAT     text (default), json or csv
  --json              same as --format json
  --no-epochs         leave out the epochs (text and json)
  --list              list the quantity keys with their units and exit
`;

const TEXT_DIGITS = 6;
const TEXT_COLUMNS_PER_BLOCK = 6;

const REDSHIFT_TOKEN = /^[+]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/;

/**
 * Parses a list of redshifts separated by commas, semicolons, spaces or newlines, with `#`
 * comments; throws UsageError naming the bad entry and its line.
 */
export function parseRedshiftList(text: string, where: string): number[] {
  const out: number[] = [];
  const token = /#[^\n]*|[^\s,;#]+/g;
  for (let m = token.exec(text); m !== null; m = token.exec(text)) {
    const item = m[0];
    if (item.charCodeAt(0) === 35) continue; // '#': a comment
    const z = Number(item);
    if (!(z >= 0) || !Number.isFinite(z) || !REDSHIFT_TOKEN.test(item)) {
      const line = text.slice(0, m.index).split('\n').length;
      throw new UsageError(`${where}${text.includes('\n') ? ` line ${line}` : ''}: '${item}' is not a redshift (a number ≥ 0)`);
    }
    out.push(z);
  }
  if (out.length === 0) throw new UsageError(`${where}: no redshifts given`);
  return out;
}

/** Builds the cosmology from --params text; throws UsageError with every problem, each naming its key. */
export function cosmologyFromText(text: string): { cosmology: Cosmology; presetName: string | null; input: ParameterInput } {
  const parsed = parseParameterText(text);
  if (parsed.problems.length) throw new UsageError(parsed.problems.map((p) => `--params: ${p.message}`).join('\n'));
  const made = createCosmology(parsed.input);
  if (!made.ok) throw new UsageError(made.errors.map((e) => `--params: ${e.parameter}: ${e.message}`).join('\n'));
  return { cosmology: made.cosmology, presetName: parsed.preset?.name ?? null, input: parsed.input };
}

export function runCalc(argv: string[], io: CliIo): number {
  const { values } = parseArgs({
    args: argv,
    options: {
      params: { type: 'string' },
      z: { type: 'string' },
      quantities: { type: 'string' },
      format: { type: 'string' },
      json: { type: 'boolean' },
      'no-epochs': { type: 'boolean' },
      list: { type: 'boolean' },
      help: { type: 'boolean', short: 'h' },
    },
    strict: true,
    allowPositionals: false,
  });
  if (values.help) {
    io.stdout(CALC_HELP);
    return EXIT.ok;
  }
  if (values.list) {
    io.stdout(alignColumns([['key', 'unit', 'quantity'], ...QUANTITIES.map((q) => [q.key, q.unit || '—', q.label])]).join('\n') + '\n');
    return EXIT.ok;
  }
  if (values.params === undefined) throw new UsageError('calc needs --params (e.g. --params "H0=70 Omega_m=0.3 flat")');
  if (values.z === undefined) throw new UsageError('calc needs --z (e.g. --z 0.5,1,2 or --z @redshifts.txt)');
  const format = values.json ? 'json' : (values.format ?? 'text');
  if (!['text', 'json', 'csv'].includes(format)) throw new UsageError(`--format must be text, json or csv, not '${format}'`);

  const { cosmology, presetName } = cosmologyFromText(values.params);
  const zText = values.z.startsWith('@') ? readList(io, values.z.slice(1)) : values.z;
  const redshifts = parseRedshiftList(zText, values.z.startsWith('@') ? values.z.slice(1) : '--z');
  const keys = values.quantities ? values.quantities.split(',').map((k) => k.trim()).filter(Boolean) : QUANTITIES.map((q) => q.key);
  for (const k of keys) {
    if (!findQuantity(k)) throw new UsageError(`--quantities: unknown quantity '${k}' (see 'comove calc --list')`);
  }
  const withEpochs = !values['no-epochs'];
  if (format === 'csv') {
    io.stdout(toCsv(keys, evaluateColumns(cosmology, redshifts, keys)));
    return EXIT.ok;
  }
  const rows = evaluateQuantities(cosmology, redshifts, keys);
  if (format === 'json') io.stdout(JSON.stringify(toJson(cosmology, keys, rows, withEpochs, presetName), null, 1) + '\n');
  else io.stdout(toText(cosmology, keys, rows, withEpochs, presetName));
  return EXIT.ok;
}

function readList(io: CliIo, path: string): string {
  try {
    return io.readFile(path);
  } catch (e) {
    throw new UsageError(`cannot read ${path}: ${(e as Error).message}`);
  }
}

function unitOf(key: string): string {
  return findQuantity(key)?.unit ?? '';
}

/** CSV: a header of keys with units in brackets, then one line per redshift (12 significant digits). */
export function toCsv(keys: readonly string[], data: QuantityColumns): Uint8Array {
  const header = ['z', ...keys.map((k) => (unitOf(k) ? `${k} [${unitOf(k)}]` : k))].join(',');
  return columnsToCsv(header, [data.redshifts, ...keys.map((k) => data.columns.get(k)!)]);
}

/** The resolved parameter set as JSON (h, Ωk, Ωr and the other derived values included). */
function paramsJson(c: Cosmology): Record<string, unknown> {
  const { stated, assumed, ...rest } = c.params;
  return { ...rest, stated, assumed };
}

function epochsJson(e: Epochs): Record<string, unknown> {
  return Object.fromEntries(Object.entries(e).map(([k, v]) => [k, { ...v, value: v.value !== null && Number.isFinite(v.value) ? v.value : null }]));
}

export function toJson(c: Cosmology, keys: readonly string[], rows: readonly QuantityRow[], withEpochs: boolean, presetName: string | null = null): Record<string, unknown> {
  const units: Record<string, string> = { z: '' };
  for (const k of keys) units[k] = unitOf(k);
  return {
    params: paramsJson(c),
    preset: presetName,
    units,
    rows,
    ...(withEpochs ? { epochs: epochsJson(epochs(c)) } : {}),
  };
}

const EPOCH_LABELS: Readonly<Record<keyof Epochs, string>> = {
  ageToday: 'age today',
  hubbleTime: 'Hubble time 1/H0',
  hubbleDistance: 'Hubble distance c/H0',
  matterRadiationEquality: 'matter–radiation equality z_eq',
  matterDarkEnergyEquality: 'matter–dark-energy equality z',
  accelerationOnset: 'onset of acceleration z (q = 0)',
  accelerationOnsetLookback: 'lookback time to that onset',
  recombination: 'decoupling z*',
  ageAtRecombination: 'age at z*',
  soundHorizonAtRecombination: 'sound horizon r_s(z*)',
  acousticAngle100: '100 θ* = 100 r_s(z*)/D_M(z*)',
  dragEpoch: 'drag epoch z_d',
  soundHorizonDragFit: 'r_drag (calibrated fit)',
  soundHorizonDragIntegral: 'r_drag (integral to z_d)',
  soundHorizonDrag: 'r_drag used for checks',
};

/** The parameter set as declaration text, leaving out what does not apply (w0/wa for Λ, neutrinos without radiation). */
function describedInput(c: Cosmology): ParameterInput {
  const p = c.params;
  const input: ParameterInput = {
    H0: p.H0,
    Omega_m: p.Omega_m,
    ...(p.Omega_b !== null ? { Omega_b: p.Omega_b } : {}),
    ...(p.flat ? { flat: true } : { Omega_Lambda: p.Omega_Lambda }),
    ...(p.w0 !== -1 || p.wa !== 0 ? { w0: p.w0, wa: p.wa } : {}),
    T_CMB: p.T_CMB,
    ...(p.T_CMB > 0 ? { N_eff: p.N_eff, m_nu: p.m_nu } : {}),
  };
  for (const [k, v] of Object.entries(input)) if (typeof v === 'number') (input as Record<string, number>)[k] = Number(v.toPrecision(TEXT_DIGITS));
  return input;
}

/** The readable report: the parameter set, a quantity-by-redshift table in blocks, then the epochs. */
export function toText(c: Cosmology, keys: readonly string[], rows: readonly QuantityRow[], withEpochs: boolean, presetName: string | null = null): string {
  const p = c.params;
  const out: string[] = [];
  out.push(`Parameter set  ${presetName ? `${presetName}: ` : ''}${formatParameterInput(describedInput(c))}`);
  out.push(
    `  h = ${formatNumber(p.h)}  Ωm = ${formatNumber(p.Omega_m)}  ΩΛ = ${formatNumber(p.Omega_Lambda)}  Ωk = ${formatNumber(p.Omega_k)}  Ωr = ${formatNumber(p.Omega_r)}  Ων = ${formatNumber(p.Omega_nu)}` +
      (p.Omega_b !== null ? `  Ωb = ${formatNumber(p.Omega_b)}` : ''),
  );
  if (p.assumed.length) out.push(`  assumed: ${p.assumed.join(', ')}`);
  for (let start = 0; start < rows.length; start += TEXT_COLUMNS_PER_BLOCK) {
    const block = rows.slice(start, start + TEXT_COLUMNS_PER_BLOCK);
    const table: string[][] = [['', 'unit', ...block.map((r) => `z = ${formatNumber(r.z)}`)]];
    for (const k of keys) {
      const q = findQuantity(k)!;
      table.push([`${q.label}`, q.unit || '', ...block.map((r) => formatNumber(r[k], TEXT_DIGITS))]);
    }
    out.push('', ...alignColumns(table));
  }
  if (withEpochs) {
    const e = epochs(c);
    const table: string[][] = [];
    for (const [k, label] of Object.entries(EPOCH_LABELS) as Array<[keyof Epochs, string]>) {
      const v = e[k];
      table.push([label, formatNumber(v.value, TEXT_DIGITS), v.value === null ? '' : v.unit, v.method]);
    }
    out.push('', 'Epochs', ...alignColumns(table, 'lrll').map((l) => `  ${l}`));
    const notes = [...new Set(Object.values(e).map((v) => v.note).filter((n): n is string => !!n))];
    for (const n of notes) out.push(`  note: ${n}`);
  }
  return out.join('\n') + '\n';
}
