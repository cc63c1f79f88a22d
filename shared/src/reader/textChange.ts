/**
 * Where two versions of a text differ: the length of the start they share and of the end they
 * share. Editors compare each new version with the last one to find the edit; this runs on every
 * keystroke, so whole chunks are compared natively before single characters.
 */

const CHUNK = 256;

/** The change from `before` to `after` as one replaced stretch: `after` keeps `prefix` characters at its start and `suffix` at its end. */
export interface TextChange {
  readonly prefix: number;
  readonly suffix: number;
}

export function textChange(before: string, after: string): TextChange {
  const max = Math.min(before.length, after.length);
  let p = 0;
  while (p + CHUNK <= max && before.slice(p, p + CHUNK) === after.slice(p, p + CHUNK)) p += CHUNK;
  while (p < max && before.charCodeAt(p) === after.charCodeAt(p)) p++;
  // The shared end may not overlap the shared start.
  const room = max - p;
  const b = before.length;
  const a = after.length;
  let q = 0;
  while (q + CHUNK <= room && before.slice(b - q - CHUNK, b - q) === after.slice(a - q - CHUNK, a - q)) q += CHUNK;
  while (q < room && before.charCodeAt(b - 1 - q) === after.charCodeAt(a - 1 - q)) q++;
  return { prefix: p, suffix: q };
}
