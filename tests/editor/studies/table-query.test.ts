// Sorting and filtering of study tables: direction, blanks last, stable ties, words and chosen values.
import { describe, expect, it } from 'vitest';
import { emptyQuery, nextSort, queryRows, type TableQuery } from '../../../editor/studies/table-query';

interface Row {
  name: string;
  ka?: number;
  kind: string;
}
const rows: Row[] = [
  { name: 'Panel 10', ka: 4.2, kind: 'bus' },
  { name: 'Panel 2', ka: undefined, kind: 'bus' },
  { name: 'Service', ka: 10.1, kind: 'service' },
  { name: 'Panel 3', ka: 4.2, kind: 'bus' },
];
type K = 'name' | 'ka' | 'kind';
const cell = (r: Row, k: K) => r[k];
const text = (r: Row) => `${r.name} ${r.kind}`;
const run = (q: Partial<TableQuery<K>>) => queryRows(rows, { ...emptyQuery<K>(), ...q }, cell, text).map((r) => r.name);

describe('study table queries', () => {
  it('keeps the given order with no sort and no filter', () => {
    expect(run({})).toEqual(['Panel 10', 'Panel 2', 'Service', 'Panel 3']);
  });

  it('sorts figures either way, blanks last in both, ties in their given order', () => {
    expect(run({ sort: { key: 'ka', direction: 'descending' } })).toEqual(['Service', 'Panel 10', 'Panel 3', 'Panel 2']);
    expect(run({ sort: { key: 'ka', direction: 'ascending' } })).toEqual(['Panel 10', 'Panel 3', 'Service', 'Panel 2']);
  });

  it('sorts names with numbers in them as people read them', () => {
    expect(run({ sort: { key: 'name', direction: 'ascending' } })).toEqual(['Panel 2', 'Panel 3', 'Panel 10', 'Service']);
  });

  it('filters by every word in any order and any case, and by chosen values', () => {
    expect(run({ text: 'BUS 3' })).toEqual(['Panel 3']);
    expect(run({ only: { kind: ['service'] } })).toEqual(['Service']);
    expect(run({ only: { kind: [] } })).toHaveLength(4);
    expect(run({ text: 'panel', only: { kind: ['service'] } })).toEqual([]);
  });

  it('turns a second tap on the same column into the other direction, a new column into its first', () => {
    const first = nextSort<K>(null, 'ka', 'descending');
    expect(first).toEqual({ key: 'ka', direction: 'descending' });
    expect(nextSort(first, 'ka', 'descending')).toEqual({ key: 'ka', direction: 'ascending' });
    expect(nextSort(first, 'name', 'ascending')).toEqual({ key: 'name', direction: 'ascending' });
  });
});
