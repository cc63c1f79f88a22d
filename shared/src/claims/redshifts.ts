/**
 * Redshifts as stated in reading text: "z = 1.2", "z ≈ 2", "z_s = 2.1", "redshift of 0.5",
 * "redshift of about 0.5", "redshift two", "redshifts 0.3 and 0.5", "1.5 < z < 2.5", "z = 2–3". Photometric-band uses ("z-band",
 * "m_z", "z = 21.3 mag") and the named epochs (z_eq, z_*, z_drag) are not redshifts of objects.
 */

import { findNumbers, type StatedNumber } from './numberParser.js';

export interface RedshiftMention {
  /** The redshift, or the middle of a range. */
  readonly value: number;
  readonly range: readonly [number, number] | null;
  /** Reading-text range of the mention (symbol to number). */
  readonly start: number;
  readonly end: number;
  /** Where its number starts, to recognise it among the numbers of a sentence. */
  readonly numberStart: number;
  /** Further numbers in a list ("z = 0.3 and 0.5", "redshifts 1, 2 and 3"). */
  readonly list: readonly number[];
  readonly listNumberStarts: readonly number[];
}

/** The z symbol with an optional object subscript, then a relation. Epoch subscripts are excluded. */
const Z_SYMBOL = /(?<![A-Za-z_\\])z(?:_\{?[A-Za-z0-9,]{1,8}\}?)?\s*(=|≈|∼|~|≃|<|>|≲|≳|≤|≥)\s*/g;
const REDSHIFT_WORD = /\bredshifts?\s*(?:of\s*(?:about\s*|approximately\s*|around\s*|roughly\s*|nearly\s*|∼\s*|~\s*|≈\s*)?|z\s*(?:=|≈|∼|~)\s*|(?:=|≈|∼|~)\s*|around\s*|about\s*)?/gi;
/** Redshifts written as words ("at redshift two"). */
const NUMBER_WORDS: Readonly<Record<string, number>> = { one: 1, two: 2, three: 3, four: 4, five: 5, six: 6, seven: 7, eight: 8, nine: 9, ten: 10 };
const NUMBER_WORD = /^(one|two|three|four|five|six|seven|eight|nine|ten)\b/i;
const RANGE_FORM = /(\d*\.?\d+)\s*(<|≤|≲)\s*z\s*(<|≤|≲)\s*(\d*\.?\d+)/g;
/** "between z = 2 and z = 3", "from z = 2 to 3". */
const BETWEEN_FORM = /(?:between|from)\s+(?:redshifts?\s+|z\s*=\s*)(\d*\.?\d+)\s+(?:and|to)\s+(?:z\s*=\s*)?(\d*\.?\d+)/gi;
const EPOCH_SUBSCRIPT = /^_\{?(?:eq|\*|rec|dec|d|drag|acc|t|re|reion|ion|max|min|peak|form|f)\b/;

/** Every redshift mention in text[from, to). */
export function findRedshifts(text: string, from = 0, to = text.length, known?: readonly StatedNumber[]): RedshiftMention[] {
  const slice = text.slice(from, to);
  const numbers = known ?? findNumbers(text, from, to);
  const numberAt = (pos: number) => numbers.find((n) => n.start >= pos && n.start <= pos + 1);
  const out: RedshiftMention[] = [];
  const taken = new Set<number>();

  const add = (symbolStart: number, n: StatedNumber) => {
    if (taken.has(n.start)) return;
    if (n.unit && n.unit.text.trim() !== '') return; // "z = 21.3 mag": a magnitude
    taken.add(n.start);
    // A list continues with ", 0.5" / "and 0.5" right after.
    const list: number[] = [];
    const listStarts: number[] = [];
    let end = n.end;
    for (const next of numbers) {
      if (next.start <= end) continue;
      const gap = text.slice(end, next.start);
      if (!/^\s*(?:,|and|,\s*and|or)\s*$/.test(gap) || next.unit) break;
      list.push(next.value);
      listStarts.push(next.start);
      taken.add(next.start);
      end = next.end;
    }
    out.push({
      value: n.value,
      range: n.range ? [n.range.low, n.range.high] : null,
      start: symbolStart,
      end,
      numberStart: n.start,
      list,
      listNumberStarts: listStarts,
    });
  };

  for (const m of slice.matchAll(RANGE_FORM)) {
    const at = from + m.index!;
    const low = Number(m[1]);
    const high = Number(m[4]);
    const first = numberAt(at);
    const second = numbers.find((n) => n.start > at + m[1].length && n.start <= at + m[0].length);
    if (first) taken.add(first.start);
    if (second) taken.add(second.start);
    out.push({ value: (low + high) / 2, range: [low, high], start: at, end: at + m[0].length, numberStart: first?.start ?? at, list: [], listNumberStarts: [] });
  }
  for (const m of slice.matchAll(BETWEEN_FORM)) {
    const at = from + m.index!;
    const inside = numbers.filter((n) => n.start >= at && n.end <= at + m[0].length);
    if (inside.length < 2) continue;
    for (const n of inside) taken.add(n.start);
    const low = Number(m[1]);
    const high = Number(m[2]);
    out.push({ value: (low + high) / 2, range: [low, high], start: at, end: at + m[0].length, numberStart: inside[0].start, list: [], listNumberStarts: [] });
  }
  for (const m of slice.matchAll(Z_SYMBOL)) {
    const at = from + m.index!;
    const symbol = m[0];
    if (EPOCH_SUBSCRIPT.test(symbol.slice(1))) continue;
    const n = numberAt(at + symbol.length);
    // A bound ("z > 2") names no one redshift; "m_z" and "z-band" never match (see Z_SYMBOL).
    if (n && !/[<>≤≥≲≳]/.test(m[1])) add(at, n);
  }
  for (const m of slice.matchAll(REDSHIFT_WORD)) {
    const at = from + m.index!;
    const n = numberAt(at + m[0].length);
    if (n) add(at, n);
    else {
      const word = NUMBER_WORD.exec(text.slice(at + m[0].length, Math.min(to, at + m[0].length + 6)));
      const after = at + m[0].length;
      if (word && !taken.has(after)) {
        taken.add(after);
        out.push({ value: NUMBER_WORDS[word[1].toLowerCase()], range: null, start: at, end: after + word[0].length, numberStart: after, list: [], listNumberStarts: [] });
      }
    }
  }
  return out.sort((a, b) => a.start - b.start);
}
