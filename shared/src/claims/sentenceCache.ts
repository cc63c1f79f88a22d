/**
 * Sentence readings remembered between analyses of the same document, owned by the caller (an
 * editor keeps one per open document): after a keystroke only the edited sentence is read again;
 * every other sentence's numbers, redshifts and typed claims are taken from the cache and moved
 * to their new offsets. A reading depends only on the sentence's text and a few characters around
 * it (the key), so a hit gives exactly what reading would. Entries unused in a run are dropped at
 * its end.
 */

import type { StatedNumber } from './numberParser.js';
import type { RedshiftMention } from './redshifts.js';
import type { Sentence } from '../reader/documentReading.js';
import type { SentenceReading } from './claimExtractor.js';

/** Characters before and after a sentence that its reading may look at (relations, signs, units). */
const BEFORE = 24;
const AFTER = 64;

/** The cache key of a sentence: its text with the characters around it that its reading may see. */
export function sentenceKey(text: string, s: Pick<Sentence, 'start' | 'end'>): string {
  return `${text.slice(Math.max(0, s.start - BEFORE), s.start)}\u0001${text.slice(s.start, s.end)}\u0001${text.slice(s.end, s.end + AFTER)}`;
}

function moveNumber(n: StatedNumber, d: number): StatedNumber {
  return {
    ...n,
    start: n.start + d,
    end: n.end + d,
    digitsStart: n.digitsStart + d,
    digitsEnd: n.digitsEnd + d,
    unit: n.unit ? { ...n.unit, start: n.unit.start + d, end: n.unit.end + d } : null,
  };
}

function moveMention(m: RedshiftMention, d: number): RedshiftMention {
  return { ...m, start: m.start + d, end: m.end + d, numberStart: m.numberStart + d, listNumberStarts: m.listNumberStarts.map((x) => x + d) };
}

function move(r: SentenceReading, d: number): SentenceReading {
  if (d === 0) return r;
  return {
    numbers: r.numbers.map((n) => moveNumber(n, d)),
    mentions: r.mentions.map((m) => moveMention(m, d)),
    found: r.found.map((f) => ({ ...f, value: moveNumber(f.value, d), start: f.start + d, end: f.end + d, sentenceStart: f.sentenceStart + d, sentenceEnd: f.sentenceEnd + d })),
  };
}

/** A map that keeps what was used in the current run and the one before: older entries go. */
class RecentMap<V> {
  private current = new Map<string, V>();
  private previous = new Map<string, V>();

  take(key: string): V | undefined {
    let v = this.current.get(key);
    if (v === undefined) {
      v = this.previous.get(key);
      if (v !== undefined) {
        this.previous.delete(key);
        this.current.set(key, v);
      }
    }
    return v;
  }

  put(key: string, v: V): void {
    this.current.set(key, v);
  }

  endRun(): void {
    this.previous = this.current;
    this.current = new Map();
  }

  get size(): number {
    return this.current.size + this.previous.size;
  }
}

export class SentenceCache {
  private readonly readings = new RecentMap<{ start: number; reading: SentenceReading }>();
  /** Numbers of other spans (table cells, declaration sentences), kept the same way. */
  private readonly numbers = new RecentMap<{ start: number; numbers: readonly StatedNumber[] }>();
  private hitCount = 0;
  private missCount = 0;

  beginRun(): void {
    this.hitCount = 0;
    this.missCount = 0;
  }

  /** The reading of a sentence with this key, moved to `start`, or null. */
  take(key: string, start: number): SentenceReading | null {
    const entry = this.readings.take(key);
    if (!entry) {
      this.missCount++;
      return null;
    }
    this.hitCount++;
    return move(entry.reading, start - entry.start);
  }

  put(key: string, start: number, reading: SentenceReading): void {
    this.readings.put(key, { start, reading });
  }

  /** The numbers of a span with this key, moved to `start`, or null. */
  takeNumbers(key: string, start: number): readonly StatedNumber[] | null {
    const entry = this.numbers.take(key);
    if (!entry) return null;
    const d = start - entry.start;
    return d === 0 ? entry.numbers : entry.numbers.map((n) => moveNumber(n, d));
  }

  putNumbers(key: string, start: number, numbers: readonly StatedNumber[]): void {
    this.numbers.put(key, { start, numbers });
  }

  /** Ends a run: what was not used in it is forgotten. */
  endRun(): void {
    this.readings.endRun();
    this.numbers.endRun();
  }

  /** Hits and misses of the last run (for tests and benchmarks). */
  get stats(): { hits: number; misses: number; size: number } {
    return { hits: this.hitCount, misses: this.missCount, size: this.readings.size };
  }
}
