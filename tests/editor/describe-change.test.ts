// What-if changes in words: a study's fitted figures are rounded, typed ones kept as typed, a fault named by type.
import { describe, expect, it } from 'vitest';
import { describeChange } from '../../editor/results/describe-change';

const nameOf = (id: string) => ({ f4: 'Apartment 4 feeder', svc: 'Service' })[id] ?? id;

describe('describing a change', () => {
  it('rounds fitted figures to three significant figures and keeps typed ones', () => {
    expect(describeChange({ kind: 'degrade-conductor', runId: 'f4', conductor: 'B', addedOhms: 32.896305620322906 }, nameOf)).toBe('32.9 Ω in series with B of Apartment 4 feeder');
    expect(describeChange({ kind: 'scale-loads', elementId: 'f4', factor: 0.9976862044785696, scope: 'downstream' }, nameOf)).toBe('Loads fed from Apartment 4 feeder × 0.998');
    expect(describeChange({ kind: 'degrade-connection', connectionId: 'c', conductor: 'N', ohms: 3 }, nameOf)).toBe('3 Ω on N of a connection');
  });

  it('names a shunt fault by its type and says when it is bolted', () => {
    expect(describeChange({ kind: 'shunt-fault', busId: 'svc', faultType: 'line-to-ground', to: 'PE', faultOhms: 0, faultReactanceOhms: 0 }, nameOf)).toBe('Line to ground fault at Service, bolted');
    expect(describeChange({ kind: 'shunt-fault', busId: 'svc', faultType: 'three-phase', to: 'PE', faultOhms: 0.5, faultReactanceOhms: 0 }, nameOf)).toBe('Three-phase fault at Service, through 0.5 + j0 Ω');
  });
});
