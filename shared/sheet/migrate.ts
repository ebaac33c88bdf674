// Brings a sheet document of any known format version up to the current one (version 1), one step at a time.
// Version 0 was the first draft format: arrays of items and wires, terse field names, one phase string per cable.
import { SHEET_FORMAT_VERSION } from './schema';
import type { SheetIssue } from './issues';

export type MigrationResult =
  | { ok: true; document: Record<string, unknown>; fromVersion: number; steps: number }
  | { ok: false; issues: SheetIssue[] };

type Json = Record<string, unknown>;
const isObject = (v: unknown): v is Json => typeof v === 'object' && v !== null && !Array.isArray(v);

/** The format version a document declares, or undefined when it declares none. */
export function documentVersion(doc: Json): number | undefined {
  if (typeof doc.formatVersion === 'number') return doc.formatVersion;
  if (typeof doc.version === 'number') return doc.version; // version 0 named its field "version"
  return undefined;
}

/** One migration step per old version: MIGRATIONS[v] turns version v into version v + 1. */
const MIGRATIONS: Record<number, (doc: Json) => Json> = {
  0: migrateV0ToV1,
};

export function migrateSheet(doc: unknown): MigrationResult {
  if (!isObject(doc)) return { ok: false, issues: [{ path: '', message: 'a sheet must be a JSON object' }] };
  const fromVersion = documentVersion(doc);
  if (fromVersion === undefined) {
    return { ok: false, issues: [{ path: 'formatVersion', message: 'the document gives no formatVersion' }] };
  }
  if (!Number.isInteger(fromVersion) || fromVersion < 0 || fromVersion > SHEET_FORMAT_VERSION) {
    return {
      ok: false,
      issues: [{ path: 'formatVersion', message: `format version ${fromVersion} is not known (this build reads 0 to ${SHEET_FORMAT_VERSION})` }],
    };
  }
  let current: Json = doc;
  let steps = 0;
  for (let v = fromVersion; v < SHEET_FORMAT_VERSION; v++) {
    try {
      current = MIGRATIONS[v](current);
    } catch (error) {
      return { ok: false, issues: [{ path: '', message: `migration from version ${v}: ${(error as Error).message}` }] };
    }
    steps++;
  }
  return { ok: true, document: current, fromVersion, steps };
}

// ---------------------------------------------------------------------------------------------------------------
// Version 0 → 1

const V0_KIND: Record<string, string> = {
  source: 'source',
  transformer: 'transformer',
  panel: 'bus',
  cable: 'run',
  breaker: 'breaker',
  load: 'load',
  'ground-rod': 'electrode',
};
const V0_TERMINAL: Record<string, Record<string, string>> = {
  source: { out: 'out' },
  transformer: { hv: 'primary', lv: 'secondary' },
  bus: { bus: 'bars' },
  run: { a: 'from', b: 'to' },
  breaker: { in: 'line', out: 'load' },
  load: { in: 'supply' },
  electrode: { rod: 'lead' },
};
const V0_LOAD_WIRING: Record<string, string> = { ln: 'line-to-neutral', ll: 'line-to-line', '3w': 'three-phase-wye', '3d': 'three-phase-delta' };
const V0_TRANSFORMER_WIRING: Record<string, string> = {
  'd-yg': 'delta-wye-grounded',
  'yg-yg': 'wye-grounded-wye-grounded',
  'd-d': 'delta-delta',
  '1ph': 'single-phase',
  '1ph-ct': 'single-phase-center-tapped',
};

function phasesOf(text: unknown): string[] {
  if (typeof text !== 'string') throw new Error('a phase string must be text such as "ABCN"');
  const out: string[] = [];
  for (let i = 0; i < text.length; i++) {
    if (text.startsWith('PE', i)) {
      out.push('PE');
      i++;
    } else if ('ABCN'.includes(text[i])) out.push(text[i]);
    else throw new Error(`"${text}" holds an unknown conductor letter "${text[i]}"`);
  }
  return out;
}

function migrateItemV0(item: Json): Json {
  const kind = V0_KIND[String(item.type)];
  if (!kind) throw new Error(`item ${String(item.id)} has an unknown type "${String(item.type)}"`);
  const [x, y] = Array.isArray(item.pos) ? item.pos : [0, 0];
  const base: Json = { kind, id: item.id, name: item.label ?? '', x, y, rotationDeg: item.angle ?? 0 };
  switch (kind) {
    case 'source':
      return { ...base, nominalVolts: Number(item.kv) * 1000, ...(item.faultKa ? { strength: 'fault-current', faultCurrentKa: item.faultKa, xOverR: item.xr ?? 10 } : {}) };
    case 'transformer':
      return {
        ...base,
        connection: V0_TRANSFORMER_WIRING[String(item.wiring)] ?? item.wiring,
        kva: item.kva,
        primaryVolts: item.hv,
        secondaryVolts: item.lv,
        percentImpedance: item.z,
        xOverR: item.xr,
      };
    case 'bus': {
      const phases = phasesOf(item.phases ?? 'ABCN');
      return {
        ...base,
        role: item.service ? 'service' : 'panel',
        phaseA: phases.includes('A'),
        phaseB: phases.includes('B'),
        phaseC: phases.includes('C'),
        neutralBar: phases.includes('N'),
        groundBar: true,
        neutralGroundBond: Boolean(item.bonded),
      };
    }
    case 'run': {
      const conductors: Json = {};
      for (const c of phasesOf(item.phases ?? 'ABCN')) {
        const size = c === 'N' && item.neutralSize ? item.neutralSize : item.conductorSize;
        conductors[c] = { size: String(size), material: item.material === 'al' ? 'aluminum' : 'copper' };
      }
      return { ...base, lengthFt: item.lengthFeet, conductors };
    }
    case 'breaker': {
      const state = item.open ? 'open' : 'closed';
      const poles = phasesOf(item.poles ?? 'ABC');
      const pole = (p: string) => (poles.includes(p) ? state : 'none');
      return { ...base, poleA: pole('A'), poleB: pole('B'), poleC: pole('C'), ...(item.amps ? { ratingAmperes: item.amps } : {}) };
    }
    case 'load':
      return {
        ...base,
        connection: V0_LOAD_WIRING[String(item.wiring ?? 'ln')] ?? item.wiring,
        kw: item.kw,
        powerFactor: item.pf ?? 1,
        ratedVolts: item.volts,
      };
    default:
      return { ...base, ohms: item.ohms };
  }
}

function endV0(text: unknown, kinds: Map<string, string>): Json {
  if (typeof text !== 'string' || !text.includes('/')) throw new Error(`a wire end must read "item/terminal", not ${JSON.stringify(text)}`);
  const [elementId, oldTerminal] = text.split('/');
  const kind = kinds.get(elementId);
  const terminal = (kind && V0_TERMINAL[kind]?.[oldTerminal]) ?? oldTerminal;
  return { elementId, terminal };
}

function migrateV0ToV1(doc: Json): Json {
  const items = Array.isArray(doc.items) ? (doc.items as Json[]) : [];
  const wires = Array.isArray(doc.wires) ? (doc.wires as Json[]) : [];
  const elements: Json = {};
  const kinds = new Map<string, string>();
  for (const item of items) {
    const element = migrateItemV0(item);
    elements[String(item.id)] = element;
    kinds.set(String(item.id), String(element.kind));
  }
  const connections: Json = {};
  wires.forEach((wire, i) => {
    const id = String(wire.id ?? `wire-${i + 1}`);
    // Version 0 wires landed each conductor on the same letter at both ends.
    const conductorMap: Json = {};
    for (const c of phasesOf(wire.phases ?? 'ABCN')) conductorMap[c] = c;
    connections[id] = { id, from: endV0(wire.a, kinds), to: endV0(wire.b, kinds), conductorMap };
  });
  return {
    formatVersion: 1,
    name: doc.title ?? '',
    settings: {
      frequencyHz: doc.hz ?? 60,
      voltageStandard: doc.standard === 'iec' ? 'iec-60038' : 'ansi-c84.1',
    },
    elements,
    connections,
    whatIfs: {},
  };
}
