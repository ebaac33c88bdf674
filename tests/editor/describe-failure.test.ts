// A solve failure named the way the sheet names things.
import { describe, expect, it } from 'vitest';
import { describeFailure } from '../../editor/results/describe-failure';

const elements: Record<string, string> = { src2: 'Standby', feeder: 'Feeder', 'apt-4': 'Apartment 4', 'apt-4-feeder': 'Apartment 4 feeder' };
const connections: Record<string, { from: { elementId: string }; to: { elementId: string } }> = { c5: { from: { elementId: 'src2' }, to: { elementId: 'feeder' } } };
const names = { element: (id: string) => elements[id], connection: (id: string) => connections[id] };

describe('describeFailure', () => {
  it('puts names for the ids the solver gave, connections by their ends', () => {
    const m = 'ideal sources are shorted or in parallel at different voltages where connection c5 (A) joins src2 out A to feeder from A';
    expect(describeFailure(m, ['c5', 'src2', 'feeder'], names)).toBe(
      'ideal sources are shorted or in parallel at different voltages where the connection Standby → Feeder (A) joins Standby out A to Feeder from A',
    );
  });

  it('replaces whole ids only: apt-4 inside apt-4-feeder stays for its own replacement', () => {
    expect(describeFailure('loads apt-4-feeder, apt-4', ['apt-4', 'apt-4-feeder'], names)).toBe('loads Apartment 4 feeder, Apartment 4');
  });

  it('leaves a message alone when it names nothing known', () => {
    expect(describeFailure('the network equations are singular at unknown 3', ['zz'], names)).toBe('the network equations are singular at unknown 3');
  });
});
