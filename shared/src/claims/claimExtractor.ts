/**
 * Finds the cosmology-dependent claims of a document: each number whose unit and wording make
 * it a distance, time, scale, volume, temperature, expansion factor, density or epoch, typed
 * and bound to its redshift. Numbers that are not claims — years, equation and figure numbers,
 * counts, masses, wavelengths, photometric magnitudes, apertures, seeing, parallax distances,
 * measured posteriors — are left alone. Where the binding is ambiguous the claim is kept as
 * `unchecked` with the reason: better than a wrong binding.
 */

import type { Block, DocumentReading, Sentence } from '../reader/documentReading.js';
import { KIND_CUES, NEEDS_REDSHIFT, PURE_NUMBER_CUES, type ClaimKind } from './claimKinds.js';
import { findDeclarations, parameterStatements, type Declaration, type DeclarationScan } from './declarations.js';
import { ARCSEC_RAD } from '../cosmology/constants.js';
import type { Unit } from '../cosmology/units.js';
import { findNumbers, unitAt, type StatedNumber, type StatedUnit } from './numberParser.js';
import { findRedshifts, type RedshiftMention } from './redshifts.js';
import type { SentenceCache } from './sentenceCache.js';

export type RedshiftSource = 'sentence' | 'respectively' | 'previous-sentence' | 'table-row' | 'caption' | 'epoch';

export interface Claim {
  readonly kind: ClaimKind;
  readonly value: StatedNumber;
  /** Redshift the claim is about (null for epochs and today's values). */
  readonly z: number | null;
  /** For claims about an interval of redshift (a volume between z1 and z2). */
  readonly zRange: readonly [number, number] | null;
  readonly zSource: RedshiftSource | null;
  /** For a size stated for an angle ("1″ corresponds to 8.4 kpc"): the angle in arcsec. */
  readonly angleArcsec: number | null;
  /** For density claims: the parameter or component named. */
  readonly parameter: string | null;
  /** Epoch a "since …" claim refers to (an expansion factor since recombination). */
  readonly sinceEpoch: 'recombination' | null;
  /** Reading-text range of the claim (number and unit). */
  readonly start: number;
  readonly end: number;
  readonly sentenceStart: number;
  readonly sentenceEnd: number;
  /** Every single redshift named in the claim's sentence (for the checker's neighbouring-redshift slip). */
  readonly sentenceRedshifts: readonly number[];
  /** 0–1: how sure the extraction is of the kind and binding. */
  readonly confidence: number;
  /** Why the claim cannot be checked as it stands, or null. */
  readonly unchecked: string | null;
}

export interface ClaimScan {
  readonly claims: readonly Claim[];
  readonly declarations: DeclarationScan;
}

/** How far before a number its cue may stand, in characters. */
const CUE_REACH = 200;

/** Contexts in which a number with a unit is not a cosmological claim. */
const NOT_A_CLAIM = /parallax|Gaia|Milky Way|Galactic|nearby star|aperture|seeing|FWHM|PSF|pixel|slit|beam|wavelength|λ|strain|posterior|credible|gravitational[- ]wave|GW\d|H\s*II|\brest[- ]frame\b/i;
/** What stands between an angle and the length it subtends: "1″ corresponds to", "the 3.2″ separation is", "0.4″ resolution … resolves". */
const ANGLE_TO_LENGTH = /^\s*(?:[A-Za-z]+\s+){0,4}(?:corresponds?\s+to|is|are|=|subtends|spans|resolves|maps\s+to|equals|of|→)\s*(?:about |roughly |∼ ?|≈ ?|~ ?)?$/i;
const MEASURED = /\b(?:we (?:measure|find|obtain|infer|derive|constrain)|measured|posterior|best[- ]fit|credible)\b/i;

/** Global copies of the cue patterns, made once (matchAll needs the g flag). */
const GLOBAL_PATTERNS = new Map<RegExp, RegExp>(
  [...KIND_CUES.map((c) => c.pattern), ...PURE_NUMBER_CUES.map((c) => c.pattern)].map((re) => [re, new RegExp(re.source, re.flags.includes('g') ? re.flags : re.flags + 'g')]),
);

/** End of the last match of `re` in `text`, or −1. */
function lastMatchEnd(re: RegExp, text: string): number {
  const g = GLOBAL_PATTERNS.get(re) ?? new RegExp(re.source, re.flags.includes('g') ? re.flags : re.flags + 'g');
  let end = -1;
  for (const m of text.matchAll(g)) end = m.index! + m[0].length;
  return end;
}

/** Whether pos lies in one of the ranges, sorted by start and not overlapping much (binary search, then a short scan back). */
function inRanges(ranges: ReadonlyArray<{ start: number; end: number }>, pos: number): boolean {
  let lo = 0;
  let hi = ranges.length;
  while (lo < hi) {
    const mid = (lo + hi) >> 1;
    if (ranges[mid].start <= pos) lo = mid + 1;
    else hi = mid;
  }
  for (let i = lo - 1; i >= 0 && i >= lo - 8; i--) if (pos >= ranges[i].start && pos < ranges[i].end) return true;
  return false;
}

function dimensionsMatch(want: Partial<Record<string, number>> | null, got: Record<string, number>): boolean {
  if (!want) return false;
  for (const k of ['length', 'time', 'angle', 'temperature', 'mass', 'magnitude']) if ((want[k] ?? 0) !== (got[k] ?? 0)) return false;
  return true;
}

/** Extracts the claims of a document. Never throws. */
export function extractClaims(doc: DocumentReading, cache?: SentenceCache): ClaimScan {
  cache?.beginRun(doc.reading.text);
  const units = new Map<string, Unit | null>();
  // Numbers of a span, parsed once: declarations, claims and table rows all ask for them.
  const parsed = new Map<number, { to: number; numbers: StatedNumber[] }>();
  const numbersIn = (from: number, to: number): StatedNumber[] => {
    const hit = parsed.get(from);
    if (hit && hit.to === to) return hit.numbers;
    let numbers = cache?.takeNumbers(from, to) as StatedNumber[] | null;
    if (!numbers) {
      numbers = findNumbers(doc.reading.text, from, to, units);
      cache?.putNumbers(from, to, numbers);
    }
    parsed.set(from, { to, numbers });
    return numbers;
  };
  const declarations = findDeclarations(doc, units, numbersIn, cache ? (s, read) => cache.declarationOf(s.start, s.end, read) : undefined);
  const text = doc.reading.text;
  const claims: Claim[] = [];
  const skips = [...declarations.skips].sort((a, b) => a.start - b.start);
  const inSkip = (pos: number) => inRanges(skips, pos);
  const declared = declarations.declarations.filter((d: Declaration) => d.origin === 'prose').sort((a, b) => a.start - b.start);
  const inDeclaration = (pos: number) => inRanges(declared, pos);
  let blockIndex = 0;

  let previous: SentenceReading | null = null;
  /** Redshifts of named objects ("LDS-B1 lies at z = 0.512"), for later sentences that name them again. */
  const objectRedshifts = new Map<string, number>();
  /** The one redshift the paragraph is about so far, if it has named exactly one. */
  let context: { block: unknown; z: number } | null = null;
  for (const sentence of doc.sentences) {
    while (blockIndex < doc.blocks.length && doc.blocks[blockIndex].end < sentence.end) blockIndex++;
    const block = doc.blocks[blockIndex];
    if (context && context.block !== block) context = null;
    if (block && block.kind === 'table-cell') continue; // table cells are read by the table pass
    let read = cache?.take(sentence.start, sentence.end) ?? null;
    if (!read) {
      read = readSentence(text, sentence, numbersIn(sentence.start, sentence.end));
      cache?.put(sentence.start, sentence.end, read);
    }
    if (read.found.length > 0) bindClaims(read, sentence);
    previous = read;
    // A limit ("the volume to z = 3") says nothing about where the paragraph's objects are.
    if (!read.anchored) continue;
    if (read.redshifts.length === 1 && !read.hasRange) {
      context = { block, z: read.redshifts[0] };
      for (const name of read.objects) objectRedshifts.set(name, read.redshifts[0]);
    } else if (read.redshifts.length > 1 || read.hasRange) context = null;
  }

  /** Binds the claims a sentence reading found to their redshifts. */
  function bindClaims(read: SentenceReading, sentence: Sentence): void {
    const mentions = read.mentions;
    const found = read.found.filter((f) => !inSkip(f.start) && !inDeclaration(f.start));
    // Bind the redshift-dependent claims.
    const needing = found.filter((f) => NEEDS_REDSHIFT.has(f.kind) && f.sinceEpoch === null);
    // An epoch stated as a redshift ("recombination at z ≈ 1100") is also the redshift of the
    // sentence's other claims ("…when the universe was 3000 K").
    const flat = mentions.flatMap((m) => [{ value: m.value, range: m.range, start: m.numberStart }, ...m.list.map((v, i) => ({ value: v, range: null, start: m.listNumberStarts[i] }))]);
    // Ordered pairing: "…, respectively", or as many claims of one kind as redshifts ("at z = 0.3
    // and z = 0.5 … 4.4 and 6.1 kpc … at each redshift").
    const sameKind = needing.length > 1 && needing.every((f) => f.kind === needing[0].kind);
    const respectively = flat.length > 1 && flat.length === needing.length && (read.saysRespectively || sameKind);
    // Epochs stated as redshifts in this sentence ("recombination at z_* ≈ 1090, when the universe was 372,000 years old").
    const sentenceRedshifts = read.redshifts;
    const epochRedshifts = found.filter((f) => f.kind === 'recombination' || f.kind === 'matterRadiationEquality' || f.kind === 'dragEpoch' || f.kind === 'accelerationOnset');
    for (const f of found) {
      let z: number | null = null;
      let zRange: readonly [number, number] | null = null;
      let zSource: RedshiftSource | null = null;
      let unchecked: string | null = null;
      let confidence = f.cueDistance < 40 ? 0.9 : 0.7;
      if (!NEEDS_REDSHIFT.has(f.kind) || f.sinceEpoch) {
        zSource = f.sinceEpoch ? 'epoch' : null;
      } else if (respectively) {
        const m = flat[needing.indexOf(f)];
        if (m.range && f.kind === 'comovingVolume') zRange = m.range;
        else if (m.range) unchecked = 'the claim refers to a range of redshift';
        else z = m.value;
        zSource = 'respectively';
      } else {
        const distinct = [...new Set(flat.map((m) => (m.range ? `${m.range[0]}-${m.range[1]}` : String(m.value))))];
        if (distinct.length === 1) {
          const m = flat[0];
          if (m.range && f.kind === 'comovingVolume') zRange = m.range;
          else if (m.range) unchecked = 'the claim refers to a range of redshift';
          else z = m.value;
          zSource = 'sentence';
        } else if (distinct.length > 1) {
          // The nearest redshift before the claim in the same clause, if the clause has one.
          const clauseStart = Math.max(sentence.start, text.lastIndexOf(';', f.start) + 1, text.lastIndexOf(', and', f.start) + 1);
          const inClause = flat.filter((m) => m.start >= clauseStart && m.start < f.start);
          const afterClaim = flat.filter((m) => m.start > f.start && !text.slice(f.end, m.start).includes(';'));
          // One redshift before the claim in its clause, or else exactly one after it; two or more
          // in the clause with nothing to order them is ambiguous.
          const pick = inClause.length === 1 ? inClause[0] : inClause.length === 0 && afterClaim.length === 1 ? afterClaim[0] : null;
          if (pick && pick.range && f.kind === 'comovingVolume') {
            zRange = pick.range;
            zSource = 'sentence';
          } else if (pick && !pick.range) {
            z = pick.value;
            zSource = 'sentence';
            confidence -= 0.15;
          } else unchecked = `the sentence names ${distinct.length} redshifts and the claim could be about any of them`;
        } else if (epochRedshifts.some((e) => e.start < f.start)) {
          const epoch = epochRedshifts.filter((e) => e.start < f.start).pop()!;
          z = epoch.value.value;
          zSource = 'epoch';
          confidence -= 0.1;
        } else if (previous && read.refersBack && previous.onlyZ !== null) {
          z = previous.onlyZ;
          zSource = 'previous-sentence';
          confidence -= 0.2;
        } else if (previous && previous.soleZ !== null) {
          z = previous.soleZ;
          zSource = 'previous-sentence';
          confidence -= 0.3;
        } else if (context) {
          z = context.z;
          zSource = 'previous-sentence';
          confidence -= 0.35;
        } else if (read.objects.some((o) => objectRedshifts.has(o))) {
          const names = [...new Set(read.objects.filter((o) => objectRedshifts.has(o)).map((o) => objectRedshifts.get(o)!))];
          if (names.length === 1) {
            z = names[0];
            zSource = 'previous-sentence';
            confidence -= 0.3;
          } else unchecked = 'the sentence names several objects with different redshifts';
        } else {
          unchecked = 'no redshift is stated for this number';
        }
      }
      if (f.value.qualifier === 'upper-bound' || f.value.qualifier === 'lower-bound') confidence -= 0.1;
      // Written out field by field: a spread of the draft was the costliest line of extraction.
      claims.push({
        kind: f.kind, value: f.value, z, zRange, zSource, angleArcsec: f.angleArcsec, parameter: f.parameter, sinceEpoch: f.sinceEpoch,
        start: f.start, end: f.end, sentenceStart: f.sentenceStart, sentenceEnd: f.sentenceEnd, sentenceRedshifts,
        confidence: Math.max(0.1, Math.min(1, confidence)), unchecked,
      });
    }
  }

  // Pushed one by one: a spread of a very long list overflows the stack.
  for (const c of tableClaims(doc, inSkip, units, numbersIn, cache)) claims.push(c);
  claims.sort((a, b) => a.start - b.start);
  cache?.endRun();
  return { claims, declarations };
}

/** A claim found in a sentence before it is bound to a redshift. */
type FoundClaim = Omit<Claim, 'z' | 'zRange' | 'zSource' | 'unchecked' | 'confidence' | 'sentenceRedshifts'> & { cueDistance: number };

/** What a sentence says, from its text alone: its typed (unbound) claims and the redshift facts that binding needs. */
export interface SentenceReading {
  /** The redshift mentions, when the sentence has claims to bind (else empty). */
  readonly mentions: readonly RedshiftMention[];
  readonly found: readonly FoundClaim[];
  /** The distinct single redshifts the sentence names (ranges left out). */
  readonly redshifts: readonly number[];
  /** Whether it names a range of redshift. */
  readonly hasRange: boolean;
  /** Whether it names no redshift or at least one that is not a limit ("to z = 3"). */
  readonly anchored: boolean;
  /** Its one redshift mention's value, if it has exactly one and that is not a range ("this redshift" in the next sentence). */
  readonly onlyZ: number | null;
  /** The same, when that mention is a single value and not a limit (an unmarked next sentence may inherit it). */
  readonly soleZ: number | null;
  /** Whether it points back ("this redshift", "there", "at this distance"). */
  readonly refersBack: boolean;
  /** Whether it pairs lists ("respectively", "each"). */
  readonly saysRespectively: boolean;
  /** Catalogue-style object names in it. */
  readonly objects: readonly string[];
}

/** Reads the numbers, redshifts and claims of one sentence. Depends only on the text in and just around the sentence. */
function readSentence(text: string, sentence: Sentence, numbers: StatedNumber[]): SentenceReading {
  const mentions = findRedshifts(text, sentence.start, sentence.end, numbers);
  const redshiftNumbers = new Set<number>([...mentions.map((m) => m.numberStart), ...mentions.flatMap((m) => m.listNumberStarts)]);
  const statementRanges = parameterStatements(text, sentence.start, sentence.end, numbers);
  const sentenceText = text.slice(sentence.start, sentence.end);
  const measured = MEASURED.test(sentenceText) && !/\badopt|\bassum/i.test(sentenceText);

  const found: FoundClaim[] = [];
  /** Records a claim on number n, ending at `end` (the unit's end, or the number's). */
  const add = (kind: ClaimKind, n: StatedNumber, end: number, cueDistance = 0, extra: { angleArcsec?: number; parameter?: string; sinceEpoch?: 'recombination' | null } = {}) =>
    found.push({
      kind, value: n, angleArcsec: extra.angleArcsec ?? null, parameter: extra.parameter ?? null, sinceEpoch: extra.sinceEpoch ?? null,
      start: n.start, end, sentenceStart: sentence.start, sentenceEnd: sentence.end, cueDistance,
    });
  /** A proper (or, if the text says so, comoving) scale claim; with the angle when a size is stated for one. */
  const addScale = (n: StatedNumber, near: string, angleArcsec?: number) =>
    add(/comoving/i.test(near) ? 'comovingScale' : 'properScale', n, n.unit!.end, 0, angleArcsec === undefined ? {} : { angleArcsec });
  numbers.forEach((stated, index) => {
    let n = stated;
    if (statementRanges.some((st) => n.start >= st.start && n.start < st.end)) {
      // Ω and H0 statements outside a declaration are density and Hubble-constant claims.
      const st = statementRanges.find((x) => n.start >= x.start && n.start < x.end)!;
      if (st.key !== 'H0' && st.key !== 'h' && !measured) {
        add('densityParameter', n, n.end, 0, { parameter: st.key });
      }
      return;
    }
    // Everything before the number in its sentence; the nearest cue wins.
    const before = text.slice(sentence.start, n.start);
    const near = text.slice(Math.max(sentence.start, n.start - 90), n.start);
    const after = text.slice(n.end, Math.min(sentence.end, n.end + 40));
    // "4.4 and 6.1 kpc": a number without a unit shares the unit of the next one in a list.
    const next = numbers[index + 1];
    const shared = !n.unit && next?.unit?.unit && /^\s*(?:,|and|or|,\s*and)\s*$/.test(text.slice(n.end, next.start)) ? next.unit : null;
    if (shared) n = { ...n, unit: { ...shared, start: n.end, end: n.end } };
    const unit = n.unit?.unit ?? null;
    if (NOT_A_CLAIM.test(near) || (n.uncertainty && measured)) return;

    if (redshiftNumbers.has(n.start)) {
      // A redshift is a claim only when it names an epoch ("recombination at z ≈ 1100").
      const epoch = pureNumberKind(near, n);
      if (epoch && (epoch.kind === 'recombination' || epoch.kind === 'matterRadiationEquality' || epoch.kind === 'dragEpoch' || epoch.kind === 'accelerationOnset')) {
        add(epoch.kind, n, n.end, epoch.distance);
      }
      return;
    }

    if (n.unit && n.unit.text.trim().startsWith('%')) {
      const COMPONENT = /(baryon|cold dark matter|dark matter|dark energy|matter|radiation|neutrino)s?/i;
      const clauseBefore = near.slice(Math.max(near.lastIndexOf(','), near.lastIndexOf(';')) + 1);
      const clauseAfter = after.split(/[,;]/)[0];
      // "5% baryons" names the component after the number; "baryons make up 5%" before it.
      const right = new RegExp(`^\\s*(?:of\\s+(?:the\\s+)?)?${COMPONENT.source}`, 'i').exec(after.slice(1));
      const lastBefore = [...clauseBefore.matchAll(new RegExp(COMPONENT.source, 'gi'))].pop();
      const component = right ?? lastBefore ?? COMPONENT.exec(clauseAfter);
      if (component && /universe|budget|energy density|content|composition|made|consists|dark energy|dark matter/i.test(sentenceText)) {
        add('compositionPercentage', n, n.unit.end, 0, { parameter: component[1].toLowerCase() });
      }
      return;
    }

    if (unit) {
      const dims = unit.dimensions as unknown as Record<string, number>;
      // Scales: length per angle.
      if (dims.length === 1 && dims.angle === -1) {
        addScale(n, near);
        return;
      }
      const lengthOnly = dims.length === 1 && Object.keys(dims).every((k) => k === 'length' || dims[k] === 0);
      // "1″ corresponds to 8.4 kpc": a length after an angle.
      if (lengthOnly && index > 0) {
        const prev = numbers[index - 1];
        const prevUnit = prev.unit?.unit;
        const link = text.slice(prev.unit ? prev.unit.end : prev.end, n.start);
        if (prevUnit && (prevUnit.dimensions.angle === 1) && ANGLE_TO_LENGTH.test(link)) {
          addScale(n, near, prev.value * (prevUnit.factor / ARCSEC_RAD));
          return;
        }
      }
      // "4.4 and 6.1 kpc …, which corresponds to 1.0″": an angle after the lengths.
      if (lengthOnly) {
        const angle = numbers.slice(index + 1).find((m) => m.unit?.unit?.dimensions.angle === 1);
        if (angle && /(?:corresponds?|correspond)\s+to\s*$|subtends?\s*$/i.test(text.slice(n.unit!.end, angle.start))) {
          addScale(n, near, angle.value * (angle.unit!.unit!.factor / ARCSEC_RAD));
          return;
        }
      }
      // "one arcsecond corresponds to 5.5 kpc"
      if (lengthOnly && /\b(?:one|an|each|a single)\s+(?:arcsec(?:ond)?|″)\s+(?:corresponds?\s+to|is|spans|equals)\s*(?:about |roughly |∼ ?|≈ ?|~ ?)?$/i.test(near)) {
        addScale(n, near, 1);
        return;
      }
      // The cue nearest before the number (or just after it: "6.6 Gpc for the luminosity distance").
      let best: { kind: ClaimKind; distance: number } | null = null;
      // Cues are looked for in the last CUE_REACH characters before the number: a cue farther
      // away names something else (and scanning whole long sentences for every number was the
      // slowest part of extraction).
      const reach = before.length > CUE_REACH ? before.slice(before.length - CUE_REACH) : before;
      const following = text.slice(n.unit!.end, Math.min(sentence.end, n.unit!.end + 40));
      for (const cue of KIND_CUES) {
        const volumeLike = cue.kind === 'comovingVolume' && dims.length === 3 && (dims.angle === 0 || dims.angle === -2);
        if (!volumeLike && !dimensionsMatch(cue.dimension, dims)) continue;
        const endBefore = lastMatchEnd(cue.pattern, reach);
        const distance = endBefore >= 0 ? reach.length - endBefore : /^\s*(?:for|as|is) the /.test(following) && cue.pattern.test(following) ? 25 : -1;
        if (distance < 0) continue;
        if (!best || distance < best.distance) best = { kind: cue.kind, distance };
      }
      if (!best && dims.time === 1 && Object.keys(dims).every((k) => k === 'time' || dims[k] === 0)) {
        // "…left it 11.59 Gyr ago", "…was 4.8 Gyr old": the word after the time names it.
        const afterTime = text.slice(n.unit!.end, Math.min(sentence.end, n.unit!.end + 12));
        if (/^\s*ago\b/i.test(afterTime)) best = { kind: 'lookbackTime', distance: 30 };
        else if (/^\s*old\b/i.test(afterTime)) best = { kind: 'age', distance: 30 };
      }
      if (!best) {
        // Unlabelled times and distances are common in prose ("8.4 kpc", "13.8 Gyr") but unbound: leave them.
        return;
      }
      const afterUnit = text.slice(n.unit!.end, Math.min(sentence.end, n.unit!.end + 30));
      let kind: ClaimKind = best.kind;
      // Words right after a time decide it: "12.6 Gyr ago", "4.8 Gyr old (today)".
      if (dims.time === 1 && /^\s*ago\b/i.test(afterUnit)) kind = 'lookbackTime';
      else if (dims.time === 1 && /^\s*old\b/i.test(afterUnit) && kind === 'lookbackTime') kind = 'age';
      const clauseBefore = before.slice(Math.max(before.lastIndexOf(';'), before.lastIndexOf(',')) + 1);
      if (kind === 'age' && (/^\s*(?:old\s*)?(?:today|now|at present|at z\s*=\s*0\b)/i.test(afterUnit) || /\b(?:today|now|at present|presently|currently)\b/i.test(clauseBefore))) kind = 'ageToday';
      add(kind, n, n.unit!.end, best.distance);
      return;
    }

    if (!n.unit) {
      const pure = pureNumberKind(near, n);
      if (pure) {
        const since = pure.kind === 'expansionFactor' && /recombination|decoupling|last[- ]scattering|CMB/i.test(sentenceText) ? 'recombination' : null;
        add(pure.kind, n, n.end, pure.distance, { sinceEpoch: since });
      }
    }
  });

  // Word numbers: "expanded a thousandfold", "the universe has tripled in size".
  for (const m of sentenceText.matchAll(/\b(ten|hundred|thousand|million)fold\b|\b(doubled|tripled|quadrupled)\b(?=\s+(?:in size|its size))/gi)) {
    const at = sentence.start + m.index!;
    const word = (m[1] ?? m[2]).toLowerCase();
    const value = ({ ten: 10, hundred: 100, thousand: 1000, million: 1e6, doubled: 2, tripled: 3, quadrupled: 4 } as Record<string, number>)[word];
    const exact = m[2] !== undefined;
    const n: StatedNumber = { value, start: at, end: at + m[0].length, digitsStart: at, digitsEnd: at + m[0].length, text: m[0], significantDigits: 1, resolution: exact ? 1 : value, qualifier: exact ? 'exact' : 'approximate', relation: null, uncertainty: null, range: null, unit: null };
    const since = /recombination|decoupling|last[- ]scattering|CMB/i.test(sentenceText) ? 'recombination' : null;
    add('expansionFactor', n, n.end, 0, { sinceEpoch: since });
  }

  const only = mentions.length === 1 && !mentions[0].range ? mentions[0] : null;
  return {
    // Redshift mentions matter only for binding this sentence's claims: without claims they are
    // dropped (and a cached reading then has no offsets to move).
    mentions: found.length > 0 ? mentions : [],
    found,
    redshifts: [...new Set(mentions.flatMap((m) => (m.range ? m.list : [m.value, ...m.list])))],
    hasRange: mentions.some((m) => m.range !== null),
    anchored: mentions.length === 0 || mentions.some((m) => !isLimit(text, m)),
    onlyZ: only ? only.value : null,
    soleZ: only && only.list.length === 0 && !isLimit(text, only) ? only.value : null,
    refersBack: /\b(?:this|that|the same) redshift|there\b|at this distance/i.test(sentenceText),
    saysRespectively: /respectively|\beach\b/i.test(sentenceText),
    objects: namedObjects(sentenceText),
  };
}

/** Whether a redshift mention is a limit ("to z = 3", "out to z = 6", "within z < 1") rather than where something is. */
function isLimit(text: string, m: RedshiftMention): boolean {
  return /\b(?:to|within|beyond|below|above|out to|up to|down to)\s*\$?\s*$/i.test(text.slice(Math.max(0, m.start - 12), m.start));
}

/** Names of objects in a sentence: catalogue-style identifiers such as LDS-B1, Ember-3, J1234+56. */
function namedObjects(sentence: string): string[] {
  return [...sentence.matchAll(/\b[A-Z][A-Za-z]*[-–][A-Z]?\d+[A-Za-z]?\b|\b[A-Z]{1,4}\d{3,}[+-]?\d*\b/g)].map((m) => m[0]);
}


/** The epoch, growth or expansion-factor kind announced just before a pure number. */
function pureNumberKind(near: string, n: StatedNumber): { kind: ClaimKind; distance: number } | null {
  let best: { kind: ClaimKind; distance: number } | null = null;
  for (const cue of PURE_NUMBER_CUES) {
    const end = lastMatchEnd(cue.pattern, near);
    if (end < 0) continue;
    const distance = near.length - end;
    if (distance > 45) continue;
    if (!best || distance < best.distance) best = { kind: cue.kind, distance };
  }
  if (best && (best.kind === 'growthRate' || best.kind === 'growthFactor') && !(n.value > 0 && n.value < 2)) return null;
  if (best && best.kind === 'expansionFactor' && n.value < 1.5) return null;
  if (best && best.kind === 'distanceModulus' && !(n.value > 10 && n.value < 70)) return null;
  return best;
}

/** A table's cells with the captions that belong to it (one set just above it, any set just below). */
interface TableParts {
  readonly cells: Block[];
  above: Block | null;
  readonly below: Block[];
}

/** The tables of a document with their captions, in document order. */
function tablesOf(doc: DocumentReading): TableParts[] {
  const tables = new Map<number, TableParts>();
  let lastCaption: Block | null = null;
  let lastTable: TableParts | null = null;
  for (const b of doc.blocks) {
    if (b.kind === 'caption') {
      lastTable?.below.push(b);
      lastCaption = b;
      lastTable = null;
    } else if (b.kind === 'table-cell' && b.cell) {
      let table = tables.get(b.cell.table);
      if (!table) tables.set(b.cell.table, (table = { cells: [], above: lastCaption, below: [] }));
      table.cells.push(b);
      lastTable = table;
    } else {
      lastCaption = null;
      lastTable = null;
    }
  }
  return [...tables.values()];
}

/**
 * Claims in table cells: the kind from the column header, the redshift from the row's z column
 * (or the table's caption). A table's claims depend only on its cells, their layout and its
 * captions, so an editor's cache keeps them per table.
 */
function tableClaims(doc: DocumentReading, inSkip: (pos: number) => boolean, units: Map<string, Unit | null>, numbersIn: (from: number, to: number) => StatedNumber[], cache?: SentenceCache): Claim[] {
  const out: Claim[] = [];
  for (const table of tablesOf(doc)) {
    const first = table.cells[0];
    const last = table.cells[table.cells.length - 1];
    const start = Math.min(first.start, table.above?.start ?? Infinity);
    const end = Math.max(last.end, ...table.below.map((b) => b.end));
    // What the claims depend on besides the text: where cells and captions are, rows and headers.
    const layout = cache ? tableLayout(table, start) : '';
    let claims = cache?.takeTable(start, end, layout) ?? null;
    if (!claims) {
      claims = claimsOfTable(doc.reading.text, table, units, numbersIn);
      cache?.putTable(start, end, layout, claims);
    }
    for (const c of claims) if (!inSkip(c.sentenceStart)) out.push(c);
  }
  return out;
}

function tableLayout(table: TableParts, start: number): string {
  const parts: (string | number)[] = [table.above ? table.above.start - start : -1, table.above ? table.above.end - start : -1];
  for (const b of table.below) parts.push('b', b.start - start, b.end - start);
  for (const c of table.cells) parts.push('c', c.start - start, c.end - start, c.cell!.row, c.cell!.header ?? '\u0002');
  return parts.join('\u0001');
}

function claimsOfTable(text: string, table: TableParts, units: Map<string, Unit | null>, numbersIn: (from: number, to: number) => StatedNumber[]): Claim[] {
  const out: Claim[] = [];
  // The redshift cell of each row ("z", "z_spec", "redshift" column).
  const zCellOfRow = new Map<number, Block>();
  for (const c of table.cells) {
    if (!zCellOfRow.has(c.cell!.row) && /^(?:z|z_\w+|redshift)\b/i.test((c.cell!.header ?? '').trim())) zCellOfRow.set(c.cell!.row, c);
  }
  // A caption may give the redshift of all rows ("Distances at z = 0.5"): the one above the
  // table, or else one below it.
  let captionZ: number | null = null;
  for (const caption of [...(table.above ? [table.above] : []), ...table.below]) {
    const mentions = findRedshifts(text, caption.start, caption.end);
    captionZ = mentions.length === 1 && !mentions[0].range && mentions[0].list.length === 0 ? mentions[0].value : null;
    if (captionZ !== null) break;
  }
  /** Units the caption gives for its columns ("distances in Mpc, times in Gyr"). */
  let captionUnits: StatedUnit[] | null = null;
  const unitsOfCaption = (): StatedUnit[] => {
    if (!captionUnits) {
      captionUnits = [];
      const caption = table.above ?? table.below[0];
      if (caption) {
        for (const m of text.slice(caption.start, caption.end).matchAll(/\b(?:in|in units of)\s+/g)) {
          const u = unitAt(text, caption.start + m.index! + m[0].length, units);
          if (u?.unit) captionUnits.push(u);
        }
      }
    }
    return captionUnits;
  };
  const kindOfHeader = new Map<string, ClaimKind | null>();
  for (const c of table.cells) {
    const header = c.cell!.header;
    if (!header) continue;
    let headerKind = kindOfHeader.get(header);
    if (headerKind === undefined) kindOfHeader.set(header, (headerKind = kindFromHeader(header)));
    if (!headerKind) continue;
    const numbers = numbersIn(c.start, c.end);
    if (numbers.length !== 1) continue;
    const n = numbers[0];
    const unitText = /\(([^)]+)\)|\[([^\]]+)\]/.exec(header);
    const wanted = KIND_CUES.find((k) => k.kind === headerKind)?.dimension ?? null;
    const unit = n.unit ?? (unitText ? unitAt(unitText[1] ?? unitText[2], 0, units) : null) ??
      unitsOfCaption().find((u) => dimensionsMatch(wanted, u.unit!.dimensions as unknown as Record<string, number>)) ?? null;
    const value: StatedNumber = unit && !n.unit ? { ...n, unit: { ...unit, start: c.start, end: c.start } } : n;
    const rowZ = zCellOfRow.get(c.cell!.row) ?? null;
    const zCell = rowZ !== c ? rowZ : null;
    const zNumbers = zCell ? numbersIn(zCell.start, zCell.end) : [];
    const fromCaption = zCell ? null : captionZ;
    const z = zNumbers.length === 1 ? zNumbers[0].value : fromCaption;
    out.push({
      kind: headerKind,
      value,
      z,
      zRange: null,
      zSource: z === null ? null : fromCaption !== null ? 'caption' : 'table-row',
      angleArcsec: null,
      parameter: null,
      sinceEpoch: null,
      start: n.start,
      end: n.end,
      sentenceStart: c.start,
      sentenceEnd: c.end,
      sentenceRedshifts: [],
      confidence: z === null ? 0.4 : 0.85,
      unchecked: z === null && NEEDS_REDSHIFT.has(headerKind) ? 'the table row has no redshift column' : unit?.unit ? null : 'the column header gives no unit Comove knows',
    });
  }
  return out;
}

function kindFromHeader(header: string): ClaimKind | null {
  for (const cue of KIND_CUES) if (cue.pattern.test(header)) return cue.kind;
  if (/scale|kpc\s*\/\s*(?:″|arcsec)/i.test(header)) return 'properScale';
  return null;
}


