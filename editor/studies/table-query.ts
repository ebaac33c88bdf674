// Sorting and filtering of a study's rows, shared by every study table: a column to sort by and its direction,
// words to look for, and chosen values of a few columns. Blank figures sort last whichever the direction.

export type SortDirection = 'ascending' | 'descending';

export interface SortSpec<K extends string> {
  key: K;
  direction: SortDirection;
}

/** The value a column sorts and filters by: a number, words, or nothing (a case with no figures). */
export type CellValue = number | string | undefined;

export interface TableQuery<K extends string> {
  sort: SortSpec<K> | null;
  /** Words to find in the row's text (every word must appear, in any order, any case). */
  text: string;
  /** Only rows whose column has one of these values; an absent or empty list lets every row through. */
  only: Partial<Record<K, readonly string[]>>;
}

export function emptyQuery<K extends string>(sort: SortSpec<K> | null = null): TableQuery<K> {
  return { sort, text: '', only: {} };
}

/** The next sort after a tap on a column's head: that column descending (figures) or ascending (words), then the other way. */
export function nextSort<K extends string>(current: SortSpec<K> | null, key: K, firstDirection: SortDirection): SortSpec<K> {
  if (current?.key !== key) return { key, direction: firstDirection };
  return { key, direction: current.direction === 'ascending' ? 'descending' : 'ascending' };
}

function compareCells(a: CellValue, b: CellValue): number {
  if (typeof a === 'number' && typeof b === 'number') return a - b;
  return String(a).localeCompare(String(b), undefined, { numeric: true, sensitivity: 'base' });
}

const blank = (v: CellValue) => v === undefined || (typeof v === 'number' && !Number.isFinite(v));

export function queryRows<R, K extends string>(
  rows: readonly R[],
  query: TableQuery<K>,
  cell: (row: R, key: K) => CellValue,
  text: (row: R) => string,
): R[] {
  const words = query.text.toLowerCase().split(/\s+/).filter(Boolean);
  const chosen = (Object.entries(query.only) as [K, readonly string[] | undefined][]).filter(([, values]) => values && values.length > 0);
  const kept = rows.filter((row) => {
    for (const [key, values] of chosen) if (!values!.includes(String(cell(row, key)))) return false;
    if (words.length === 0) return true;
    const haystack = text(row).toLowerCase();
    return words.every((w) => haystack.includes(w));
  });
  const sort = query.sort;
  if (!sort) return kept;
  const sign = sort.direction === 'ascending' ? 1 : -1;
  // Array.prototype.sort is stable: rows that tie keep their order (the study's own, failures first).
  return kept
    .map((row, index) => ({ row, index, value: cell(row, sort.key) }))
    .sort((x, y) => {
      const bx = blank(x.value);
      const by = blank(y.value);
      if (bx || by) return bx === by ? x.index - y.index : bx ? 1 : -1;
      return sign * compareCells(x.value, y.value) || x.index - y.index;
    })
    .map((x) => x.row);
}
