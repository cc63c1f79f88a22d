/**
 * Fast CSV output for large tables: numbers are written straight into a byte buffer with 12
 * significant digits (no intermediate strings), which is several times faster than
 * toPrecision plus string concatenation for 10⁵ × 30 values.
 */

/** Significant digits written: beyond the engine's accuracy (about 1e-10). */
export const CSV_DIGITS = 12;
/** The most bytes one number can take: sign, 12 digits, point, 'e', exponent sign and 3 digits. */
export const MAX_NUMBER_BYTES = 20;

const POW10 = Array.from({ length: 700 }, (_, i) => 10 ** (i - 350));
/** ASCII tens and units digit of 0…99. */
const PAIR_HIGH = Uint8Array.from({ length: 100 }, (_, k) => 48 + Math.floor(k / 10));
const PAIR_LOW = Uint8Array.from({ length: 100 }, (_, k) => 48 + (k % 10));
const INFINITY_BYTES = Uint8Array.from('Infinity', (ch) => ch.charCodeAt(0));

/** 12 significant digits, trailing zeros trimmed, by toPrecision (for the extremes of the double range). */
function formatExtreme(v: number): string {
  const [mantissa, exponent] = v.toPrecision(12).split('e');
  const trimmed = mantissa.includes('.') ? mantissa.replace(/0+$/, '').replace(/\.$/, '') : mantissa;
  return exponent === undefined ? trimmed : `${trimmed}e${exponent.replace('+', '')}`;
}

/** Powers of ten from 1e-8 to 1e16, for finding a decimal exponent by comparisons. */
const DECADES = Float64Array.from({ length: 25 }, (_, i) => 10 ** (i - 8));

/** floor(log10(v)) for v > 0: a binary search over DECADES (cheaper than Math.log10), log10 outside them. */
function decimalExponent(v: number): number {
  if (!(v >= 1e-8 && v < 1e16)) return Math.floor(Math.log10(v));
  let lo = 0;
  let hi = DECADES.length - 1;
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if (DECADES[mid] <= v) lo = mid;
    else hi = mid;
  }
  return lo - 8;
}

/**
 * Writes v at b[len] with 12 significant digits, trailing zeros removed; plain notation for
 * 1e-5 ≤ |v| < 1e12, otherwise d.ddde±x. NaN writes nothing (an empty cell). Returns the new
 * length. The caller guarantees MAX_NUMBER_BYTES of room; `digits` is 12 bytes of scratch.
 */
export function writeNumber(b: Uint8Array, len: number, v: number, digits: Uint8Array): number {
  if (v !== v) return len;
  if (v < 0) {
    b[len++] = 45; // '-'
    v = -v;
  }
  if (v === 0) {
    b[len++] = 48;
    return len;
  }
  if (v === Infinity) {
    b.set(INFINITY_BYTES, len);
    return len + INFINITY_BYTES.length;
  }
  // The decimal exponent from the binary one (log10(2) ≈ 0.30103), corrected below if off by one.
  if (v < 1e-290 || v > 1e290) {
    // Where the power-of-ten table under- or overflows, the slow way.
    const text = formatExtreme(v);
    for (let i = 0; i < text.length; i++) b[len++] = text.charCodeAt(i);
    return len;
  }
  let exp = decimalExponent(v);
  let mant = Math.round(v / POW10[exp + 339]);
  // log10 can be off by one near powers of ten; normalise the mantissa to 12 digits.
  if (mant >= 1e12) {
    exp++;
    mant = Math.round(v / POW10[exp + 339]);
  } else if (mant < 1e11) {
    exp--;
    mant = Math.round(v / POW10[exp + 339]);
  }
  if (mant >= 1e12) {
    mant = Math.round(mant / 10);
    exp++;
  }
  // Digits, two at a time, from two int32 halves: 4 high digits and 8 low digits.
  let high = (mant / 1e8) | 0;
  let low = (mant - high * 1e8) | 0;
  for (let i = 11; i > 4; i -= 2) {
    const q = (low / 100) | 0;
    const pair = low - q * 100;
    digits[i] = PAIR_LOW[pair];
    digits[i - 1] = PAIR_HIGH[pair];
    low = q;
  }
  const q = (high / 100) | 0;
  const pair = high - q * 100;
  digits[3] = PAIR_LOW[pair];
  digits[2] = PAIR_HIGH[pair];
  digits[1] = PAIR_LOW[q];
  digits[0] = PAIR_HIGH[q];
  let last = 11;
  while (last > 0 && digits[last] === 48) last--;
  if (exp >= -5 && exp < 12) {
    if (exp < 0) {
      b[len++] = 48;
      b[len++] = 46;
      for (let i = -1; i > exp; i--) b[len++] = 48;
      for (let i = 0; i <= last; i++) b[len++] = digits[i];
    } else {
      const top = last > exp ? last : exp;
      for (let i = 0; i <= top; i++) {
        if (i === exp + 1) b[len++] = 46;
        b[len++] = digits[i];
      }
    }
    return len;
  }
  b[len++] = digits[0];
  if (last > 0) {
    b[len++] = 46;
    for (let i = 1; i <= last; i++) b[len++] = digits[i];
  }
  b[len++] = 101; // 'e'
  if (exp < 0) {
    b[len++] = 45;
    exp = -exp;
  }
  if (exp >= 100) b[len++] = 48 + ((exp / 100) | 0);
  if (exp >= 10) b[len++] = 48 + (((exp / 10) | 0) % 10);
  b[len++] = 48 + (exp % 10);
  return len;
}

/** Writes numeric columns as CSV rows under a header line; returns the bytes. */
export function columnsToCsv(header: string, columns: readonly Float64Array[]): Uint8Array {
  const headerBytes = new TextEncoder().encode(header + '\n');
  const rows = columns.length ? columns[0].length : 0;
  const rowMax = columns.length * (MAX_NUMBER_BYTES + 1);
  // Sized for a typical 15 bytes a value; grown (rarely) when the numbers are longer.
  let b = new Uint8Array(headerBytes.length + rows * columns.length * 15 + rowMax);
  b.set(headerBytes);
  let len = headerBytes.length;
  const digits = new Uint8Array(12);
  for (let i = 0; i < rows; i++) {
    if (len + rowMax > b.length) {
      const grown = new Uint8Array(Math.max(b.length * 2, len + rowMax));
      grown.set(b.subarray(0, len));
      b = grown;
    }
    for (let j = 0; j < columns.length; j++) {
      if (j) b[len++] = 44; // ','
      len = writeNumber(b, len, columns[j][i], digits);
    }
    b[len++] = 10;
  }
  return b.subarray(0, len);
}
