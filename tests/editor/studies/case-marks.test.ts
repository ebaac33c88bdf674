// The fault's mark on the drawing and bringing a marked element into the part of the canvas a panel leaves free.
import { describe, expect, it } from 'vitest';
import { solveSheet } from '../../../solver';
import { caseMarks, revealViewport } from '../../../editor/studies/case-marks';
import { faultCaseChange } from '../../../editor/studies/fault-study-rows';
import { worldToScreen } from '../../../editor/canvas/viewport';
import { demoSheet } from '../support/fixtures';

const sheet = demoSheet('larkspur-row.json');

describe('case marks', () => {
  it('marks the faulted bus with the fault type and its current, and nothing for a plain case', () => {
    const withFault = { ...sheet, whatIfs: { f: { id: 'f', name: 'f', changes: { x: faultCaseChange({ busId: 'apt-3', faultType: 'line-to-line' }) } } } };
    const out = solveSheet(withFault, { whatIfId: 'f' });
    if (!out.ok) throw new Error(out.error.message);
    const body = { x: 100, y: 200, width: 120, height: 10 };
    const marks = caseMarks(out.result, (id) => (id === 'apt-3' ? body : undefined));
    expect(marks).toHaveLength(1);
    expect(marks[0]).toMatchObject({ kind: 'fault', elementId: 'apt-3', x: 100, y: 205 });
    expect(marks[0].label).toBe(`L–L fault ${out.result.fault!.symmetricalKa.toFixed(1)} kA`);
    const base = solveSheet(sheet);
    if (!base.ok) throw new Error(base.error.message);
    expect(caseMarks(base.result, () => body)).toEqual([]);
  });

  it('marks a degraded or opened lug at the element its connection lands on', () => {
    const body = { x: 10, y: 20, width: 40, height: 8 };
    const marks = caseMarks(
      null,
      (id) => (id === 'apt-2' ? body : undefined),
      [
        { kind: 'degrade-connection', connectionId: 'c-apt-2-feeder-to', conductor: 'N', ohms: 3.2 },
        { kind: 'open-connection', connectionId: 'elsewhere', conductor: 'A' },
      ],
      (cid) => (cid === 'c-apt-2-feeder-to' ? 'apt-2' : undefined),
    );
    expect(marks).toEqual([{ key: 'lug-c-apt-2-feeder-to-N', kind: 'candidate', elementId: 'apt-2', x: 10, y: 24, label: '3.20 Ω on N at this lug' }]);
    const splice = caseMarks(null, (id) => (id === 'apt-4-feeder' ? body : undefined), [{ kind: 'degrade-conductor', runId: 'apt-4-feeder', conductor: 'N', addedOhms: 33 }]);
    expect(splice.map((m) => [m.elementId, m.label])).toEqual([['apt-4-feeder', '33.0 Ω in N']]);
  });

  it('moves the view only when the element is out of the free part, then centres it there at the same zoom', () => {
    const size = { width: 390, height: 700 };
    const rect = { x: 1000, y: 900, width: 60, height: 20 };
    const vp = { x: 0, y: 0, zoom: 0.5 };
    const moved = revealViewport(vp, size, rect, 0.4);
    expect(moved.zoom).toBe(0.5);
    const c = worldToScreen(moved, { x: 1030, y: 910 });
    expect(c.x).toBeCloseTo(195, 9);
    expect(c.y).toBeCloseTo(700 * 0.4 * 0.6, 9);
    expect(revealViewport(moved, size, rect, 0.4)).toBe(moved);
    // Zoomed out too far for value tags: zoomed in to the floor, the element still where it is put.
    const nearer = revealViewport(moved, size, rect, 0.4, 0.8);
    expect(nearer.zoom).toBe(0.8);
    const n = worldToScreen(nearer, { x: 1030, y: 910 });
    expect(n.x).toBeCloseTo(195, 9);
    expect(n.y).toBeCloseTo(700 * 0.4 * 0.6, 9);
    expect(revealViewport({ x: 0, y: 0, zoom: 2 }, size, { x: 10, y: 10, width: 20, height: 5 }, 1, 0.8).zoom).toBe(2);
  });
});
