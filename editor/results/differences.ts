// The base case and a what-if side by side: every value tag of either, with both values and the change,
// largest change first, so the results panel can say what the what-if does.
import type { DrawnResults } from './value-tags';

export interface DifferenceRow {
  key: string;
  elementId: string;
  label: string;
  unit: 'V' | 'A';
  base: number | null;
  whatIf: number | null;
  /** whatIf − base; null when either side has no value (de-energised there). */
  change: number | null;
}

export function differences(base: DrawnResults, whatIf: DrawnResults): DifferenceRow[] {
  const keys = new Set([...base.tags.keys(), ...whatIf.tags.keys()]);
  const rows: DifferenceRow[] = [];
  for (const key of keys) {
    const b = base.tags.get(key);
    const w = whatIf.tags.get(key);
    const any = (w ?? b)!;
    const bv = b ? b.value : null;
    const wv = w ? w.value : null;
    rows.push({ key, elementId: any.elementId, label: any.label, unit: any.unit, base: bv, whatIf: wv, change: bv !== null && wv !== null ? wv - bv : null });
  }
  const size = (r: DifferenceRow) => (r.change === null ? Infinity : Math.abs(r.change));
  return rows.sort((x, y) => size(y) - size(x) || x.key.localeCompare(y.key));
}
