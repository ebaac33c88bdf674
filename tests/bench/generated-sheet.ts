// A generated 208Y/120 building of a chosen size for benchmarks and scale tests: a source, a service bus, and
// panels fed by feeders through breakers, each panel with line-to-neutral loads spread over its phases. Laid out
// in a grid so the drawing reads like a real sheet. Deterministic: the same size gives the same sheet.
import type { SheetInput } from '../../shared/sheet';

type Elements = NonNullable<SheetInput['elements']>;
type Connections = NonNullable<SheetInput['connections']>;

/** A sheet of about `elementCount` elements (never fewer than the source, the service and one panel group). */
export function generatedBuilding(elementCount: number, name = `Generated building, ${elementCount} elements`): SheetInput {
  const elements: Elements = {};
  const connections: Connections = {};
  let conn = 0;
  const link = (from: string, fromTerminal: string, to: string, toTerminal: string, map: Record<string, string>) => {
    const id = `c${++conn}`;
    connections[id] = { id, from: { elementId: from, terminal: fromTerminal }, to: { elementId: to, terminal: toTerminal }, conductorMap: map };
  };
  const four = { A: 'A', B: 'B', C: 'C', N: 'N' };
  const five = { ...four, PE: 'PE' };
  elements.utility = { kind: 'source', id: 'utility', name: 'Utility', x: 0, y: 0, nominalVolts: 208, strength: 'fault-current', faultCurrentKa: 22, xOverR: 6 };
  elements.service = { kind: 'bus', id: 'service', name: 'Service', x: 0, y: 160, role: 'service', neutralGroundBond: true };
  link('utility', 'out', 'service', 'bars', four);
  // Each panel group: breaker, feeder, panel and its loads.
  const loadsPerPanel = 6;
  const perGroup = 3 + loadsPerPanel;
  const groups = Math.max(1, Math.round((elementCount - 2) / perGroup));
  const columns = Math.ceil(Math.sqrt(groups));
  const groupWidth = 720;
  const groupHeight = 640;
  let made = 2;
  for (let g = 0; g < groups; g++) {
    const col = g % columns;
    const row = Math.floor(g / columns);
    const x0 = (col - (columns - 1) / 2) * groupWidth;
    const y0 = 360 + row * groupHeight;
    const cb = `cb-${g + 1}`;
    const feeder = `feeder-${g + 1}`;
    const panel = `panel-${g + 1}`;
    elements[cb] = { kind: 'breaker', id: cb, name: `CB ${g + 1}`, x: x0, y: y0, ratingAmperes: 100 };
    elements[feeder] = { kind: 'run', id: feeder, name: `Feeder ${g + 1}`, x: x0, y: y0 + 120, rotationDeg: 90, lengthFt: 60 + (g % 7) * 15,
      conductors: { A: { size: '2' }, B: { size: '2' }, C: { size: '2' }, N: { size: '2' }, PE: { size: '6' } } };
    elements[panel] = { kind: 'bus', id: panel, name: `Panel ${g + 1}`, x: x0, y: y0 + 260 };
    link('service', 'bars', cb, 'line', five);
    link(cb, 'load', feeder, 'from', five);
    link(feeder, 'to', panel, 'bars', five);
    made += 3;
    for (let k = 0; k < loadsPerPanel && made < Math.max(elementCount, 2 + perGroup); k++) {
      const id = `load-${g + 1}-${k + 1}`;
      const phase = (['A', 'B', 'C'] as const)[(g + k) % 3];
      elements[id] = {
        kind: 'load', id, name: `Load ${g + 1}.${k + 1}`, x: x0 - 250 + k * 100, y: y0 + 440, connection: 'line-to-neutral',
        ratedVolts: 120, kw: 0.6 + ((g * 7 + k * 3) % 10) * 0.15, powerFactor: 0.95, loadKind: (['lighting', 'receptacles', 'heating'] as const)[k % 3],
      };
      link(panel, 'bars', id, 'supply', { [phase]: 'A', N: 'N' });
      made++;
    }
  }
  return { formatVersion: 1, name, elements, connections, whatIfs: {} };
}
