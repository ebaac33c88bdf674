// Every single opening of the demo sheets (each conductor of each run, each breaker pole) solves to finite numbers
// with a closed power balance: no NaN, no singular matrix, no exception reaches the caller.
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { readSheet, type Sheet } from '../../shared/sheet';
import { SheetSolver } from '../../solver';
import { nonFiniteNumbers } from './helpers/finite';

function withOpenings(name: string): Sheet {
  const json = JSON.parse(readFileSync(join(__dirname, '..', '..', 'solver', 'fixtures', name), 'utf8'));
  json.whatIfs = {};
  for (const [id, el] of Object.entries<Record<string, unknown>>(json.elements)) {
    if (el.kind === 'run') {
      for (const c of Object.keys(el.conductors as object)) {
        json.whatIfs[`open-${id}-${c}`] = { id: `open-${id}-${c}`, changes: { x: { kind: 'open-conductor', runId: id, conductor: c } } };
      }
    }
    if (el.kind === 'breaker') {
      for (const pole of ['A', 'B', 'C']) {
        if (el[`pole${pole}`] === 'none') continue;
        json.whatIfs[`pole-${id}-${pole}`] = { id: `pole-${id}-${pole}`, changes: { x: { kind: 'open-pole', breakerId: id, pole } } };
      }
    }
  }
  const read = readSheet(json);
  if (!read.ok) throw new Error('fixture invalid');
  return read.sheet;
}

describe('single openings of the demo sheets', () => {
  for (const name of ['larkspur-row.json', 'farm.json']) {
    it(`${name}: every opening solves to finite numbers`, () => {
      // derived: Kirchhoff's current law and Tellegen's theorem hold for every solution
      const sheet = withOpenings(name);
      const solver = new SheetSolver(sheet);
      const failures: string[] = [];
      for (const id of Object.keys(sheet.whatIfs)) {
        const outcome = solver.solve(id);
        if (!outcome.ok) {
          failures.push(`${id}: ${outcome.error.message}`);
          continue;
        }
        expect(nonFiniteNumbers(outcome.result)).toEqual([]);
        expect(outcome.result.kclResidual).toBeLessThan(1e-9);
        expect(outcome.result.powerBalance.mismatchPercent).toBeLessThan(1e-6);
      }
      expect(failures).toEqual([]);
      expect(Object.keys(sheet.whatIfs).length).toBeGreaterThan(10);
    });
  }
});
