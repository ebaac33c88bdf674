// The IEEE PES 4 Node Test Feeder (REFERENCES.md) as a sheet: infinite bus at node 1, an overhead line 1–2 of
// 2000 ft, the transformer 2–3, an overhead line 3–4 of 2500 ft and the load at node 4.
import { SheetBuilder } from './sheet-builder';

// source: IEEE PES 4 Node Test Feeder, REFERENCES.md (seen): pole geometry and conductor data
const PHASE = { gmrFt: 0.0244, rOhmsPerMile: 0.306 }; // 336,400 26/7 ACSR
const NEUTRAL = { gmrFt: 0.00814, rOhmsPerMile: 0.592 }; // 4/0 6/1 ACSR
const POLE = { A: [0, 28], B: [2.5, 28], C: [7, 28], N: [4, 24] } as const;

export const SOURCE_PER_UNIT = (7200 * Math.sqrt(3)) / 12470;

export type Ieee4Connection = 'gry-gry' | 'delta-gry' | 'delta-delta';
export interface Ieee4Options {
  connection: Ieee4Connection;
  stepUp?: boolean;
  unbalanced?: boolean;
}

function overhead(lengthFt: number, fourWire: boolean) {
  const ids = fourWire ? (['A', 'B', 'C', 'N'] as const) : (['A', 'B', 'C'] as const);
  return {
    lengthFt,
    impedanceFrom: 'overhead',
    conductors: Object.fromEntries(
      ids.map((id) => [id, { xFt: POLE[id][0], yFt: POLE[id][1], ...(id === 'N' ? NEUTRAL : PHASE) }]),
    ),
  };
}

/**
 * Four-wire lines carry the neutral as a conductor grounded solidly at both ends (a 0 Ω electrode), which is what
 * the published Kron-reduced phase matrices assume; three-wire lines have no neutral.
 */
export function ieee4Sheet({ connection, stepUp = false, unbalanced = false }: Ieee4Options) {
  const primaryFourWire = connection === 'gry-gry';
  const secondaryFourWire = connection !== 'delta-delta';
  const lowVolts = stepUp ? 24900 : 4160;
  const w = (four: boolean) => (four ? ['A', 'B', 'C', 'N'] : ['A', 'B', 'C']);
  const b = new SheetBuilder(`IEEE 4 Node Test Feeder, ${connection}${stepUp ? ' step-up' : ' step-down'}, ${unbalanced ? 'unbalanced' : 'balanced'}`)
    // The published results come from a 7200 V line-to-neutral source (12.47 kV is its rounded line-to-line value):
    // derived, with 7199.6 V every low-side value comes out 0.01 % low, with 7200 V every printed digit matches.
    .source('source', { system: 'three-phase-wye', nominalVolts: 12470, voltsPerUnit: SOURCE_PER_UNIT })
    .bus('node-1', { role: 'junction', groundBar: false })
    .run('line-12', overhead(2000, primaryFourWire))
    .bus('node-2', { role: 'junction', groundBar: false, neutralBar: primaryFourWire })
    .transformer('xfmr-23', {
      connection: { 'gry-gry': 'wye-grounded-wye-grounded', 'delta-gry': 'delta-wye-grounded', 'delta-delta': 'delta-delta' }[connection],
      ...(connection === 'delta-gry' ? { vectorGroup: 'Dyn1' } : {}),
      kva: 6000,
      primaryVolts: 12470,
      secondaryVolts: lowVolts,
      // source: REFERENCES.md, Z = 1.0 + j6.0 %
      percentImpedance: Math.hypot(1, 6),
      xOverR: 6,
      ...(connection === 'gry-gry' ? { primaryGrounding: 'solid' } : {}),
      ...(secondaryFourWire ? { secondaryGrounding: 'solid' } : {}),
    })
    .bus('node-3', { role: 'junction', groundBar: false, neutralBar: secondaryFourWire })
    .run('line-34', overhead(2500, secondaryFourWire))
    .bus('node-4', { role: 'junction', groundBar: false, neutralBar: secondaryFourWire })
    .load('load-4', {
      connection: secondaryFourWire ? 'three-phase-wye' : 'three-phase-delta',
      ratedVolts: lowVolts,
      loadKind: 'motor',
      constantPowerFraction: 1,
      ...(unbalanced
        ? { phaseKw: { A: 1275, B: 1800, C: 2375 }, phasePowerFactor: { A: 0.85, B: 0.9, C: 0.95 } }
        : { kw: 5400, powerFactor: 0.9 }),
    })
    .connect('source', 'out', 'node-1', 'bars', w(true))
    .connect('node-1', 'bars', 'line-12', 'from', w(primaryFourWire))
    .connect('line-12', 'to', 'node-2', 'bars', w(primaryFourWire))
    .connect('node-2', 'bars', 'xfmr-23', 'primary', w(primaryFourWire))
    .connect('xfmr-23', 'secondary', 'node-3', 'bars', w(secondaryFourWire))
    .connect('node-3', 'bars', 'line-34', 'from', w(secondaryFourWire))
    .connect('line-34', 'to', 'node-4', 'bars', w(secondaryFourWire))
    .connect('node-4', 'bars', 'load-4', 'supply', w(secondaryFourWire));
  if (primaryFourWire) b.electrode('ground-2', 0).connect('node-2', 'bars', 'ground-2', 'lead', { N: 'PE' });
  if (secondaryFourWire) b.electrode('ground-4', 0).connect('node-4', 'bars', 'ground-4', 'lead', { N: 'PE' });
  return b;
}
