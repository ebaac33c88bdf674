// A sweep split into shares against the one-thread sweep (itself checked case by case against fresh solves in
// break-sweep.test.ts): the same cases, the same figures, the same refined worst cases in the same order, with the
// shares run here in turn, and with a share that fails elsewhere swept by share 0 instead.
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { readSheet, type Sheet } from '../../shared/sheet';
import { breakSweepInShares, breakSweepSync, type BreakCase, type BreakSweepResult, type ShareRunner } from '../../solver';
import { buildingSheet } from '../../solver/bench/building-sheet';

function fixture(name: string): Sheet {
  const read = readSheet(JSON.parse(readFileSync(join(__dirname, '..', '..', 'solver', 'fixtures', name), 'utf8')));
  if (!read.ok) throw new Error(read.issues.map((i) => `${i.path}: ${i.message}`).join('; '));
  return read.sheet;
}

const key = (c: BreakCase) => `${c.runId} ${c.conductor}`;

/** Shares run in this thread, one after another, as another thread would run them. */
const hereInTurn: ShareRunner = (_share, options, onProgress) => ({
  started: Promise.resolve(),
  outcome: Promise.resolve().then(() => breakSweepSync(sheetUnderTest, { ...options, onProgress: (p) => onProgress(p.done, p.total) })),
});
let sheetUnderTest: Sheet;

function expectSameSweep(split: BreakSweepResult, whole: BreakSweepResult) {
  expect(split.total).toBe(whole.total);
  expect(split.cases.length).toBe(whole.cases.length);
  expect(new Set(split.cases.map(key))).toEqual(new Set(whole.cases.map(key)));
  const byKey = new Map(whole.cases.map((c) => [key(c), c]));
  for (const c of split.cases) {
    const w = byKey.get(key(c))!;
    expect(c.loadModel, key(c)).toBe(w.loadModel);
    expect(c.loadsOutside, key(c)).toBe(w.loadsOutside);
    expect(c.loadsWithoutVoltage, key(c)).toBe(w.loadsWithoutVoltage);
    expect(c.severityPercent, key(c)).toBeCloseTo(w.severityPercent, 6);
    expect(c.worstOver?.loadId, key(c)).toBe(w.worstOver?.loadId);
    if (c.worstOver && w.worstOver) expect(c.worstOver.volts, key(c)).toBeCloseTo(w.worstOver.volts, 6);
  }
  // the refined worst cases lead in the same order (the ranking of all shares together)
  const refined = whole.cases.filter((c) => c.loadModel === 'sheet').length;
  expect(refined).toBeGreaterThan(0);
  expect(split.cases.slice(0, refined).map(key)).toEqual(whole.cases.slice(0, refined).map(key));
}

describe('break sweep in shares', () => {
  for (const [name, sheet] of [
    ['the demo building', () => fixture('larkspur-row.json')],
    ['a generated building of 60 buses', () => buildingSheet(60, 3)],
  ] as const) {
    it(`${name}: three shares give the one-thread sweep`, async () => {
      sheetUnderTest = sheet();
      const whole = breakSweepSync(sheetUnderTest, { refineWorst: 6 });
      if (!whole.ok) throw new Error(whole.error.message);
      const seen: number[] = [];
      const split = await breakSweepInShares(sheetUnderTest, { refineWorst: 6, onProgress: (p) => seen.push(p.done / p.total) }, 3, hereInTurn);
      if (!split.ok) throw new Error(split.error.message);
      expectSameSweep(split.value, whole.value);
      expect(seen.at(-1)).toBe(1);
      expect(seen.every((f) => f >= 0 && f <= 1)).toBe(true);
    });
  }

  it('a share that fails elsewhere is swept here, and nothing is lost', async () => {
    sheetUnderTest = buildingSheet(60, 3);
    const whole = breakSweepSync(sheetUnderTest, { refineWorst: 4 });
    if (!whole.ok) throw new Error(whole.error.message);
    let asked = 0;
    const failing: ShareRunner = (share, options, onProgress) => {
      asked++;
      if (share.index === 1) return { started: new Promise<void>(() => {}), outcome: Promise.reject(new Error('the helper thread did not start')) };
      return hereInTurn(share, options, onProgress);
    };
    const split = await breakSweepInShares(sheetUnderTest, { refineWorst: 4 }, 3, failing);
    if (!split.ok) throw new Error(split.error.message);
    expect(asked).toBe(2);
    expectSameSweep(split.value, whole.value);
  });

  it('a bad share is refused with a message that names it', () => {
    const out = breakSweepSync(buildingSheet(20, 3), { share: { index: 2, count: 2 } });
    expect(out.ok).toBe(false);
    if (!out.ok) expect(out.error.message).toMatch(/share must be index 0 to count − 1.*not 2 of 2/);
  });
});
