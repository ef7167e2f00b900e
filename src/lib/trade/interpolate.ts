// Straight-line interpolation in a published table. Tables of the trade are short and the
// sources print them row by row; reading between two rows is how the printed tables are used.

export type TableRow = readonly [x: number, y: number];

/**
 * y at x from rows sorted by x (either direction of y). Outside the table the caller decides:
 * this returns null so that no value is ever extrapolated past what the source printed.
 */
export function interpolate(rows: readonly TableRow[], x: number): number | null {
  const first = rows[0];
  const last = rows[rows.length - 1];
  if (!first || !last || x < first[0] || x > last[0]) return null;
  for (let i = 1; i < rows.length; i++) {
    const [x1, y1] = rows[i - 1]!;
    const [x2, y2] = rows[i]!;
    if (x <= x2) {
      if (x === x2) return y2;
      return y1 + ((x - x1) * (y2 - y1)) / (x2 - x1);
    }
  }
  return last[1];
}

/** The inverse: x at which the table reaches y; the table must be monotonic in y. */
export function interpolateInverse(rows: readonly TableRow[], y: number): number | null {
  return interpolate(
    rows.map(([x, yy]) => [yy, x] as const).sort((a, b) => a[0] - b[0]),
    y,
  );
}
