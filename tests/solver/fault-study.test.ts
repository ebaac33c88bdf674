// The fault study: every bus by every fault type, interrupting ratings against the duty, service markings.
import { describe, expect, it } from 'vitest';
import { faultStudy, testXOverR } from '../../solver';
import { building } from './helpers/building';

describe('fault study', () => {
  const sheet = building().sheet();

  it('checks every bus and fault type, lists the failing breaker first and marks the service (NEC 110.24)', () => {
    const progress: number[] = [];
    const out = faultStudy(sheet, { onProgress: (done) => progress.push(done) });
    if (!out.ok) throw new Error(out.error.message);
    const { study } = out;
    expect(progress).toEqual([1, 2, 3]); // three buses
    expect(study.cases.length).toBe(3 * 5);
    // the apartment bus has two phases: a three-phase fault there has no figures, with a reason
    expect(study.cases.find((c) => c.busId === 'apt' && c.faultType === 'three-phase')?.problem).toMatch(/needs 3 phases/);
    // a 20 kA source straight onto the service: about 20 kA available (the loads, at constant impedance, change it little)
    const marking = study.serviceMarkings.find((m) => m.busId === 'service')!;
    expect(marking.availableFaultKa).toBeGreaterThan(19.8); // source: the sheet's 20 kA utility figure
    expect(marking.availableFaultKa).toBeLessThan(20.2);
    expect(marking.faultType).toBe('three-phase');
    // the 10 kA main feeder breaker at the service cannot interrupt it; it comes first
    expect(study.duties[0].elementId).toBe('cb-panel');
    expect(study.duties[0].status).toBe('fails');
    const apt = study.duties.find((d) => d.elementId === 'cb-apt')!;
    expect(apt.locationBusId).toBe('panel');
    // 150 ft of 4/0 lowers the duty at the panel below the service's
    expect(apt.dutyKa).toBeLessThan(marking.availableFaultKa);
    const rank = { fails: 0, 'passes-x-over-r-above-test': 1, passes: 2 } as const;
    const ranks = study.duties.map((d) => rank[d.status]);
    expect(ranks).toEqual([...ranks].sort((x, y) => x - y));
  });

  it('the transformer tolerance option raises no duty on a sheet without transformers, and cancellation stops it', () => {
    const a = faultStudy(sheet);
    const b = faultStudy(sheet, { transformerTolerance: true });
    if (!a.ok || !b.ok) throw new Error('study failed');
    expect(b.study.serviceMarkings[0].availableFaultKa).toBeCloseTo(a.study.serviceMarkings[0].availableFaultKa, 9);
    let polls = 0;
    const c = faultStudy(sheet, { shouldCancel: () => ++polls > 1 });
    if (!c.ok) throw new Error('study failed');
    expect(c.study.cancelled).toBe(true);
    expect(c.study.cases.length).toBe(5);
  });

  it('UL 489 test X/R by rating: 50 %, 30 %, 20 % power factor', () => {
    expect(testXOverR(10)).toBeCloseTo(Math.sqrt(0.75) / 0.5, 9); // from memory: UL 489 test power factors
    expect(testXOverR(14)).toBeCloseTo(Math.sqrt(0.91) / 0.3, 9);
    expect(testXOverR(65)).toBeCloseTo(Math.sqrt(0.96) / 0.2, 9);
  });
});
