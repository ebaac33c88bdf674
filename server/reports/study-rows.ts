// Small helpers for the tables of the further studies: cut long lists with a count, format numbers.

/** Rows beyond `limit` are cut, with a last row saying how many more there are (tables stay readable on the page). */
export function limitRows(rows: (string | number | null)[][], limit: number, width: number): (string | number | null)[][] {
  if (rows.length <= limit) return rows;
  return [...rows.slice(0, limit), [`… and ${rows.length - limit} more`, ...Array<string>(Math.max(0, width - 1)).fill('')]];
}

/** A number with fixed digits, or a dash when there is none. */
export const fixed = (x: number | null | undefined, digits = 1): string => (typeof x === 'number' && Number.isFinite(x) ? x.toFixed(digits) : '—');
