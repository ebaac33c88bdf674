// Where imported circuits go on the drawing: a row under the panel, below whatever already hangs from it, each
// load (and its breaker, when the schedule rates one) connected to the panel's bars on the circuit's phases.
// Returns the new elements and connections for SheetCommands.insertEntries (one transaction).
import type { NewConnection, NewElement } from '../document/commands';
import { newId } from '../document/ids';
import { behaviourFractions } from './circuit-edit';
import type { ImportedCircuit } from './schedule-csv';
import type { ConductorId, Sheet } from '../../shared/sheet';
import { GRID } from '../../shared/symbols';

/** Horizontal pitch of the placed circuits, and the three heights their labels are staggered over. */
const PITCH = 4 * GRID;
const STAGGER = 3 * GRID;

export interface Placement {
  elements: (NewElement & { id: string })[];
  connections: (NewConnection & { id: string })[];
}

const LOAD_CONDUCTORS: ConductorId[] = ['A', 'B', 'C'];

export function placeCircuits(sheet: Sheet, busId: string, circuits: readonly ImportedCircuit[], ids: (prefix: string) => string = newId): Placement {
  const bus = sheet.elements[busId];
  if (bus?.kind !== 'bus') throw new Error(`${busId} is not a panel`);
  // Below every element that already hangs from the panel.
  const below = Object.values(sheet.connections)
    .flatMap((c) => (c.from.elementId === busId ? [c.to.elementId] : c.to.elementId === busId ? [c.from.elementId] : []))
    .map((id) => sheet.elements[id])
    .filter((e) => e && e.y > bus.y)
    .map((e) => e!.y);
  const top = Math.max(bus.y + 5 * GRID, ...below.map((y) => y + 8 * GRID));
  const left = bus.x - ((circuits.length - 1) * PITCH) / 2;
  const out: Placement = { elements: [], connections: [] };
  circuits.forEach((c, i) => {
    const x = Math.round((left + i * PITCH) / GRID) * GRID;
    const stagger = (i % 3) * STAGGER;
    const loadId = ids('load');
    const f = behaviourFractions(c.behaviour);
    out.elements.push({
      kind: 'load',
      id: loadId,
      name: c.description,
      circuit: c.circuit,
      x,
      y: top + 5 * GRID + stagger,
      rotationDeg: 0,
      connection: c.connection,
      loadKind: c.loadKind,
      givenAs: c.givenAs,
      kw: c.kw,
      amperes: c.amperes,
      powerFactor: c.powerFactor,
      ratedVolts: c.ratedVolts,
      ...(f.z !== undefined ? { constantImpedanceFraction: f.z, constantCurrentFraction: f.i, constantPowerFraction: f.p } : {}),
    });
    const neutral = c.connection === 'line-to-neutral' || c.connection === 'three-phase-wye';
    // The panel's phases land on the load's (or breaker's) A, B, C in order; the neutral on N.
    const fromBars: Partial<Record<ConductorId, ConductorId>> = {};
    c.phases.forEach((p, k) => (fromBars[p] = LOAD_CONDUCTORS[k]));
    if (neutral) fromBars.N = 'N';
    if (c.breakerAmperes !== undefined) {
      const breakerId = ids('breaker');
      const poles = c.phases.length;
      out.elements.push({
        kind: 'breaker',
        id: breakerId,
        name: `Circuit ${c.circuit} breaker`,
        x,
        y: top + stagger,
        rotationDeg: 0,
        device: 'breaker',
        poleA: 'closed',
        poleB: poles >= 2 ? 'closed' : 'none',
        poleC: poles >= 3 ? 'closed' : 'none',
        carriesNeutral: neutral,
        carriesGround: false,
        ratingAmperes: c.breakerAmperes,
      });
      out.connections.push({ id: ids('conn'), from: { elementId: busId, terminal: 'bars' }, to: { elementId: breakerId, terminal: 'line' }, conductorMap: fromBars });
      const through: Partial<Record<ConductorId, ConductorId>> = {};
      c.phases.forEach((_, k) => (through[LOAD_CONDUCTORS[k]] = LOAD_CONDUCTORS[k]));
      if (neutral) through.N = 'N';
      out.connections.push({ id: ids('conn'), from: { elementId: breakerId, terminal: 'load' }, to: { elementId: loadId, terminal: 'supply' }, conductorMap: through });
    } else {
      out.connections.push({ id: ids('conn'), from: { elementId: busId, terminal: 'bars' }, to: { elementId: loadId, terminal: 'supply' }, conductorMap: fromBars });
    }
  });
  return out;
}
