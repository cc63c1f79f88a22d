/**
 * Fast CSV output for large tables: numbers are written straight into a byte buffer with a
 * fixed number of significant digits (no intermediate strings), which is several times
 * faster than Number.prototype.toPrecision plus string concatenation for 10⁵ × 30 values.
 */

const POW10 = Array.from({ length: 700 }, (_, i) => 10 ** (i - 350));

/** Writes rows of numbers as CSV into a growing byte buffer. */
export class CsvWriter {
  private buf: Uint8Array;
  private len = 0;
  private readonly digitScratch = new Uint8Array(24);

  private readonly upper: number;
  private readonly lower: number;

  /** `significantDigits` from 1 to 15. */
  constructor(initialBytes = 1 << 16, private readonly significantDigits = 12) {
    this.buf = new Uint8Array(initialBytes);
    this.upper = 10 ** significantDigits;
    this.lower = 10 ** (significantDigits - 1);
  }

  private ensure(extra: number): void {
    if (this.len + extra <= this.buf.length) return;
    let size = this.buf.length * 2;
    while (size < this.len + extra) size *= 2;
    const next = new Uint8Array(size);
    next.set(this.buf.subarray(0, this.len));
    this.buf = next;
  }

  /** Appends ASCII text (headers, separators). */
  text(s: string): void {
    this.ensure(s.length * 3);
    this.len += new TextEncoder().encodeInto(s, this.buf.subarray(this.len)).written;
  }

  byte(code: number): void {
    this.ensure(1);
    this.buf[this.len++] = code;
  }

  /**
   * Appends a number with `significantDigits` digits, trailing zeros removed; plain notation
   * for 1e-5 ≤ |v| < 1e12, otherwise d.ddde±x. NaN writes nothing (an empty cell).
   */
  number(v: number): void {
    if (Number.isNaN(v)) return;
    this.ensure(32);
    const b = this.buf;
    let len = this.len;
    if (v < 0) {
      b[len++] = 45; // '-'
      v = -v;
    }
    if (v === 0 || v === Infinity) {
      if (v === 0) b[len++] = 48;
      else for (let i = 0; i < 8; i++) b[len++] = 'Infinity'.charCodeAt(i);
      this.len = len;
      return;
    }
    const n = this.significantDigits;
    let exp = Math.floor(Math.log10(v));
    let mant = Math.round(v / POW10[exp - n + 1 + 350]);
    // log10 can be off by one near powers of ten; normalise the mantissa to n digits.
    if (mant >= this.upper) {
      exp += 1;
      mant = Math.round(v / POW10[exp - n + 1 + 350]);
    } else if (mant < this.lower) {
      exp -= 1;
      mant = Math.round(v / POW10[exp - n + 1 + 350]);
    }
    if (mant >= this.upper) {
      mant = Math.round(mant / 10);
      exp += 1;
    }
    // Digits, most significant first, in two int32 halves of up to 8 digits each.
    const d = this.digitScratch;
    let high = Math.floor(mant / 1e8);
    let low = (mant - high * 1e8) | 0;
    for (let i = n - 1; i >= 0; i--) {
      if (i >= n - 8) {
        d[i] = low % 10;
        low = (low / 10) | 0;
      } else {
        d[i] = high % 10;
        high = Math.floor(high / 10);
      }
    }
    let last = n - 1;
    while (last > 0 && d[last] === 0) last--;
    if (exp >= -5 && exp < n) {
      if (exp < 0) {
        b[len++] = 48;
        b[len++] = 46;
        for (let i = -1; i > exp; i--) b[len++] = 48;
        for (let i = 0; i <= last; i++) b[len++] = 48 + d[i];
      } else {
        const top = last > exp ? last : exp;
        for (let i = 0; i <= top; i++) {
          if (i === exp + 1) b[len++] = 46;
          b[len++] = 48 + d[i];
        }
      }
    } else {
      b[len++] = 48 + d[0];
      if (last > 0) {
        b[len++] = 46;
        for (let i = 1; i <= last; i++) b[len++] = 48 + d[i];
      }
      b[len++] = 101; // 'e'
      let e = exp;
      if (e < 0) {
        b[len++] = 45;
        e = -e;
      }
      if (e >= 100) b[len++] = 48 + ((e / 100) | 0);
      if (e >= 10) b[len++] = 48 + (((e / 10) | 0) % 10);
      b[len++] = 48 + (e % 10);
    }
    this.len = len;
  }

  /** The bytes written so far. */
  bytes(): Uint8Array {
    return this.buf.subarray(0, this.len);
  }

  toString(): string {
    return new TextDecoder().decode(this.bytes());
  }
}
