// Test helper: writes sheets in the version-1 format element by element, and validates them.
import { validateSheet, type Sheet } from '../../../shared/sheet';

type Json = Record<string, unknown>;

export class SheetBuilder {
  private readonly elements: Json = {};
  private readonly connections: Json = {};
  private readonly whatIfs: Json = {};
  private count = 0;

  constructor(private readonly name = 'test sheet', private readonly settings: Json = {}) {}

  add(kind: string, id: string, fields: Json): this {
    this.elements[id] = { kind, id, name: id, ...fields };
    return this;
  }
  source(id: string, fields: Json) {
    return this.add('source', id, fields);
  }
  transformer(id: string, fields: Json) {
    return this.add('transformer', id, fields);
  }
  bus(id: string, fields: Json = {}) {
    return this.add('bus', id, fields);
  }
  run(id: string, fields: Json) {
    return this.add('run', id, fields);
  }
  breaker(id: string, fields: Json = {}) {
    return this.add('breaker', id, fields);
  }
  load(id: string, fields: Json) {
    return this.add('load', id, fields);
  }
  electrode(id: string, ohms: number) {
    return this.add('electrode', id, { ohms });
  }
  /** Connects from.terminal to to.terminal; the map defaults to the same letters for the given conductors. */
  connect(from: string, fromTerminal: string, to: string, toTerminal: string, map: Json | string[], id?: string): this {
    const conductorMap = Array.isArray(map) ? Object.fromEntries(map.map((c) => [c, c])) : map;
    const key = id ?? `c${++this.count}`;
    this.connections[key] = { id: key, from: { elementId: from, terminal: fromTerminal }, to: { elementId: to, terminal: toTerminal }, conductorMap };
    return this;
  }
  whatIf(id: string, changes: Json, name = id): this {
    this.whatIfs[id] = { id, name, changes };
    return this;
  }
  json(): Json {
    return { formatVersion: 1, name: this.name, settings: this.settings, elements: this.elements, connections: this.connections, whatIfs: this.whatIfs };
  }
  sheet(): Sheet {
    const v = validateSheet(this.json());
    if (!v.ok) throw new Error(`test sheet is invalid: ${v.issues.map((i) => `${i.path}: ${i.message}`).join('; ')}`);
    return v.sheet;
  }
}

/** A run with a custom impedance per conductor (ohms per 1000 ft), no mutual coupling. */
export function customRun(lengthFt: number, conductors: Record<string, [number, number]>): Json {
  return {
    lengthFt,
    impedanceFrom: 'custom',
    conductors: Object.fromEntries(
      Object.entries(conductors).map(([id, [r, x]]) => [id, { rOhmsPer1000Ft: r, xOhmsPer1000Ft: x }]),
    ),
  };
}
