/** Number and table formatting for the command line. */

/** A readable number with `digits` significant digits: plain for ordinary magnitudes, exponential otherwise. */
export function formatNumber(v: number | null, digits = 6): string {
  if (v === null || Number.isNaN(v)) return '—';
  if (v === Infinity) return '∞';
  if (v === -Infinity) return '−∞';
  if (v === 0) return '0';
  const a = Math.abs(v);
  if (a >= 10 ** digits || a < 1e-4) {
    const [m, e] = v.toExponential(digits - 1).split('e');
    return `${trimZeros(m)}e${e.replace('+', '')}`;
  }
  return trimZeros(v.toPrecision(digits));
}

function trimZeros(s: string): string {
  return s.includes('.') ? s.replace(/0+$/, '').replace(/\.$/, '') : s;
}

/**
 * Pads the cells of a table into aligned columns. `align` gives 'l' or 'r' per column
 * (default: the first two left, the rest right).
 */
export function alignColumns(rows: readonly (readonly string[])[], align = '', gap = 2): string[] {
  const widths: number[] = [];
  for (const row of rows) row.forEach((cell, i) => (widths[i] = Math.max(widths[i] ?? 0, [...cell].length)));
  return rows.map((row) =>
    row
      .map((cell, i) => {
        const pad = ' '.repeat(widths[i] - [...cell].length);
        const side = align[i] ?? (i <= 1 ? 'l' : 'r');
        return side === 'l' ? cell + pad : pad + cell;
      })
      .join(' '.repeat(gap))
      .trimEnd(),
  );
}
