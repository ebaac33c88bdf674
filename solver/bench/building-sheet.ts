// A generated 208Y/120 building sheet of any number of buses (invented, for benchmarks and checks): a utility
// source, a bonded service with its electrode, and panels fed in a tree (some from the service, the rest from
// earlier panels) by five-conductor feeders (A, B, C, N, PE), each panel with line-to-neutral loads on every phase
// and a three-phase motor. Seeded, so every size is reproducible.
import { validateSheet, type Sheet } from '../../shared/sheet';
import { mulberry32 } from './four-wire-network';

type Json = Record<string, unknown>;

/** Ohms per 1000 ft (R, X) of three feeder sizes, copper in PVC: NEC Chapter 9 Table 9 values for 2/0, 1/0, 2 AWG. */
const FEEDERS: [number, number][] = [
  [0.1, 0.043],
  [0.12, 0.044],
  [0.19, 0.045],
];
/** 6 AWG copper for the PE (Table 9). */
const PE: [number, number] = [0.49, 0.051];
const KINDS = ['lighting', 'receptacles', 'electronics', 'heating'] as const;

export function buildingSheet(buses: number, seed = 1): Sheet {
  if (!(buses >= 2)) throw new RangeError(`a building needs at least 2 buses (the service and one panel), got ${buses}`);
  const rng = mulberry32(seed);
  const elements: Json = {};
  const connections: Json = {};
  let count = 0;
  const add = (kind: string, id: string, fields: Json) => (elements[id] = { kind, id, name: id, ...fields });
  const connect = (from: string, fromTerminal: string, to: string, toTerminal: string, map: Record<string, string>) => {
    const id = `c${++count}`;
    connections[id] = { id, from: { elementId: from, terminal: fromTerminal }, to: { elementId: to, terminal: toTerminal }, conductorMap: map };
  };
  const same = (ids: string[]) => Object.fromEntries(ids.map((c) => [c, c]));
  const five = same(['A', 'B', 'C', 'N', 'PE']);

  add('source', 'utility', { nominalVolts: 208, strength: 'fault-current', faultCurrentKa: 42, xOverR: 8, interruptingKa: 65 });
  add('bus', 'service', { role: 'service', neutralGroundBond: true, interruptingKa: 65 });
  add('electrode', 'rod', { ohms: 25 });
  connect('utility', 'out', 'service', 'bars', same(['A', 'B', 'C', 'N']));
  connect('service', 'bars', 'rod', 'lead', { PE: 'PE' });
  // The building's total load stays near 300 kW whatever the number of panels, so deep feeders stay in range.
  const loadScale = Math.min(1, 80 / buses);
  const panels: string[] = [];
  for (let i = 1; i < buses; i++) {
    const panel = `panel-${i}`;
    // About a third from the service, the rest from an earlier panel (a tree some eight levels deep).
    const parent = panels.length === 0 || rng() < 0.3 ? 'service' : panels[Math.floor(panels.length * Math.sqrt(rng()))];
    const [r, x] = FEEDERS[Math.floor(rng() * FEEDERS.length)];
    const run = `feeder-${i}`;
    const conductors = (ids: string[]) => Object.fromEntries(ids.map((c) => [c, { rOhmsPer1000Ft: c === 'PE' ? PE[0] : r, xOhmsPer1000Ft: c === 'PE' ? PE[1] : x }]));
    add('run', run, { lengthFt: Math.round(30 + 120 * rng()), impedanceFrom: 'custom', conductors: conductors(['A', 'B', 'C', 'N', 'PE']) });
    add('bus', panel, { interruptingKa: 22 });
    connect(parent, 'bars', run, 'from', five);
    connect(run, 'to', panel, 'bars', five);
    for (let k = 0; k < 3; k++) {
      const load = `${panel}-load-${k}`;
      add('load', load, {
        connection: 'line-to-neutral',
        ratedVolts: 120,
        kw: Math.round((0.2 + 1.2 * rng()) * loadScale * 1000) / 1000,
        powerFactor: 0.95,
        loadKind: KINDS[Math.floor(rng() * KINDS.length)],
      });
      connect(panel, 'bars', load, 'supply', { ['ABC'[(i + k) % 3]]: 'A', N: 'N' });
    }
    const motor = `${panel}-motor`;
    add('load', motor, { connection: 'three-phase-delta', ratedVolts: 208, kw: Math.round(1.5 * loadScale * 1000) / 1000, powerFactor: 0.85, loadKind: 'motor' });
    connect(panel, 'bars', motor, 'supply', same(['A', 'B', 'C']));
    panels.push(panel);
  }
  const v = validateSheet({ formatVersion: 1, name: `generated building of ${buses} buses`, settings: {}, elements, connections, whatIfs: {} });
  if (!v.ok) throw new Error(`generated sheet is invalid: ${v.issues.slice(0, 3).map((i) => `${i.path}: ${i.message}`).join('; ')}`);
  return v.sheet;
}
