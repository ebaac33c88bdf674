// The inspector's fields for each element kind: label, kind of input, the unit a number is stored in, when the
// field shows, and how it reads from and writes to the element (most map to one path; a run's sizes and material
// apply to several conductors at once).
import { AWG_KCMIL_SIZES, CONDUCTOR_MATERIALS, RACEWAY_KINDS } from '../../shared/conductor-sizes';
import {
  BUS_ROLES,
  LOAD_CONNECTIONS,
  LOAD_KINDS,
  POLE_STATES,
  TRANSFORMER_CONNECTIONS,
  type ConductorId,
  type ElementKind,
} from '../../shared/sheet';
import type { ElementView } from '../document/sheet-mirror';
import type { Plain } from '../document/y-values';
import { formatQuantity, type FieldUnit } from '../quantity/parse-quantity';

export type FieldValue = string | boolean;
export interface Write {
  path: string[];
  value: Plain | undefined;
}

interface Common {
  key: string;
  label: string;
  hint?: string;
  /** Shown only when this holds for the values in the form. */
  visible?: (values: Record<string, FieldValue>) => boolean;
  read?: (e: ElementView) => FieldValue;
  write?: (value: FieldValue | number | undefined, e: ElementView) => Write[];
  /** Paths of the sheet format this field stands for (to place schema messages under it). */
  paths?: string[][];
}

export type FieldDef =
  | (Common & { type: 'text' })
  | (Common & { type: 'quantity'; unit: FieldUnit; optional?: boolean; integer?: boolean })
  | (Common & { type: 'choice'; options: { value: string; label: string }[] })
  | (Common & { type: 'toggle' });

const opts = (values: readonly string[], labels: Record<string, string> = {}) => values.map((value) => ({ value, label: labels[value] ?? value }));

const name: FieldDef = { key: 'name', label: 'Name', type: 'text' };
const is = (key: string, ...values: string[]) => (v: Record<string, FieldValue>) => values.includes(String(v[key]));
const isNot = (key: string, ...values: string[]) => (v: Record<string, FieldValue>) => !values.includes(String(v[key]));

const RUN_CONDUCTORS: ConductorId[] = ['A', 'B', 'C', 'N', 'PE'];
const runConductors = (e: ElementView) => (e.conductors ?? {}) as Record<string, Record<string, Plain> | undefined>;
const PHASES_OF_RUN: ConductorId[] = ['A', 'B', 'C'];

function runSize(which: 'phase' | 'N' | 'PE'): FieldDef {
  const targets = which === 'phase' ? PHASES_OF_RUN : [which];
  return {
    key: `size-${which}`,
    label: which === 'phase' ? 'Phase conductor size' : which === 'N' ? 'Neutral size' : 'Ground (PE) size',
    type: 'choice',
    options: opts(AWG_KCMIL_SIZES, Object.fromEntries(AWG_KCMIL_SIZES.map((s) => [s, Number(s) >= 250 ? `${s} kcmil` : `${s} AWG`]))),
    visible: (v) => targets.some((c) => v[`has-${c}`] === true),
    read: (e) => String(targets.map((c) => runConductors(e)[c]?.size).find((s) => s !== undefined) ?? '4/0'),
    write: (value, e) => targets.filter((c) => runConductors(e)[c]).map((c) => ({ path: ['conductors', c, 'size'], value: String(value) })),
    paths: targets.map((c) => ['conductors', c, 'size']),
  };
}

function runHas(c: ConductorId): FieldDef {
  return {
    key: `has-${c}`,
    label: c === 'N' ? 'Neutral' : c === 'PE' ? 'Ground (PE)' : `Phase ${c}`,
    type: 'toggle',
    read: (e) => runConductors(e)[c] !== undefined,
    write: (value, e) => {
      const present = runConductors(e)[c] !== undefined;
      if (value === present) return [];
      if (!value) return [{ path: ['conductors', c], value: undefined }];
      const like = runConductors(e)[c === 'PE' ? 'PE' : c === 'N' ? 'N' : 'A'] ?? Object.values(runConductors(e))[0] ?? {};
      return [{ path: ['conductors', c], value: { size: (like.size as string) ?? (c === 'PE' ? '4' : '4/0'), material: (like.material as string) ?? 'copper' } }];
    },
    paths: [['conductors', c]],
  };
}

const runMaterial: FieldDef = {
  key: 'material',
  label: 'Material',
  type: 'choice',
  options: opts(CONDUCTOR_MATERIALS, { copper: 'Copper', aluminum: 'Aluminium' }),
  read: (e) => String(Object.values(runConductors(e))[0]?.material ?? 'copper'),
  write: (value, e) => RUN_CONDUCTORS.filter((c) => runConductors(e)[c]).map((c) => ({ path: ['conductors', c, 'material'], value: String(value) })),
};

export const FIELDS: Record<ElementKind, FieldDef[]> = {
  source: [
    name,
    {
      key: 'system',
      label: 'System',
      type: 'choice',
      options: opts(['three-phase-wye', 'three-phase-delta', 'single-phase', 'split-phase'], {
        'three-phase-wye': 'Three-phase wye',
        'three-phase-delta': 'Three-phase delta',
        'single-phase': 'Single-phase',
        'split-phase': 'Split-phase 120/240',
      }),
    },
    { key: 'nominalVolts', label: 'Nominal voltage', hint: 'Line-to-line; line-to-neutral for single-phase', type: 'quantity', unit: 'V' },
    { key: 'voltsPerUnit', label: 'Operating voltage (per unit of nominal)', type: 'quantity', unit: 'number' },
    {
      key: 'strength',
      label: 'Strength',
      type: 'choice',
      options: opts(['infinite', 'fault-current', 'short-circuit-mva', 'impedance'], {
        infinite: 'Ideal (no impedance)',
        'fault-current': 'Available fault current',
        'short-circuit-mva': 'Short-circuit MVA',
        impedance: 'Impedance in ohms',
      }),
    },
    { key: 'faultCurrentKa', label: 'Available fault current', type: 'quantity', unit: 'kA', optional: true, visible: is('strength', 'fault-current') },
    { key: 'shortCircuitMva', label: 'Short-circuit MVA', type: 'quantity', unit: 'MVA', optional: true, visible: is('strength', 'short-circuit-mva') },
    { key: 'r1Ohms', label: 'R1', type: 'quantity', unit: 'ohm', optional: true, visible: is('strength', 'impedance') },
    { key: 'x1Ohms', label: 'X1', type: 'quantity', unit: 'ohm', optional: true, visible: is('strength', 'impedance') },
    { key: 'xOverR', label: 'X/R', type: 'quantity', unit: 'number', visible: isNot('strength', 'infinite', 'impedance') },
    { key: 'grounding', label: 'Grounding', type: 'choice', options: opts(['solid', 'resistance', 'ungrounded'], { solid: 'Solid', resistance: 'Through a resistance', ungrounded: 'Ungrounded' }) },
    { key: 'groundingOhms', label: 'Grounding resistance', type: 'quantity', unit: 'ohm', visible: is('grounding', 'resistance') },
  ],
  transformer: [
    name,
    {
      key: 'connection',
      label: 'Connection',
      type: 'choice',
      options: opts(TRANSFORMER_CONNECTIONS, {
        'delta-wye-grounded': 'Delta – wye grounded',
        'wye-grounded-wye-grounded': 'Wye grounded – wye grounded',
        'delta-delta': 'Delta – delta',
        'high-leg-delta': 'High-leg (four-wire) delta',
        'open-delta': 'Open delta',
        'single-phase': 'Single-phase',
        'single-phase-center-tapped': 'Single-phase centre-tapped 120/240',
      }),
    },
    { key: 'kva', label: 'Rating', type: 'quantity', unit: 'kVA' },
    { key: 'primaryVolts', label: 'Primary voltage', type: 'quantity', unit: 'V' },
    { key: 'secondaryVolts', label: 'Secondary voltage', type: 'quantity', unit: 'V' },
    { key: 'percentImpedance', label: 'Impedance (%Z)', type: 'quantity', unit: 'percent' },
    { key: 'xOverR', label: 'X/R', type: 'quantity', unit: 'number' },
    { key: 'tapPercent', label: 'Primary tap (%)', type: 'quantity', unit: 'percent' },
    { key: 'secondaryGrounding', label: 'Secondary neutral grounding', type: 'choice', options: opts(['solid', 'resistance', 'none'], { solid: 'Solid', resistance: 'Through a resistance', none: 'None' }) },
    { key: 'secondaryGroundingOhms', label: 'Secondary grounding resistance', type: 'quantity', unit: 'ohm', visible: is('secondaryGrounding', 'resistance') },
  ],
  bus: [
    name,
    {
      key: 'role',
      label: 'Role',
      type: 'choice',
      options: opts(BUS_ROLES, { service: 'Service', panel: 'Panel', switchboard: 'Switchboard', 'separately-derived': 'Separately derived system', junction: 'Junction' }),
    },
    { key: 'phaseA', label: 'Phase A', type: 'toggle' },
    { key: 'phaseB', label: 'Phase B', type: 'toggle' },
    { key: 'phaseC', label: 'Phase C', type: 'toggle' },
    { key: 'neutralBar', label: 'Neutral bar', type: 'toggle' },
    { key: 'groundBar', label: 'Ground bar', type: 'toggle' },
    { key: 'neutralGroundBond', label: 'Neutral-to-ground bond', hint: 'At the service or a separately derived system only', type: 'toggle' },
    { key: 'ratingAmperes', label: 'Bus rating', type: 'quantity', unit: 'A', optional: true },
  ],
  run: [
    name,
    { key: 'lengthFt', label: 'Length', hint: 'Feet, or give a unit: 45 m', type: 'quantity', unit: 'ft' },
    { key: 'parallelSets', label: 'Parallel sets', type: 'quantity', unit: 'number', integer: true },
    runHas('A'),
    runHas('B'),
    runHas('C'),
    runHas('N'),
    runHas('PE'),
    runSize('phase'),
    runSize('N'),
    runSize('PE'),
    runMaterial,
    { key: 'raceway', label: 'Raceway', type: 'choice', options: opts(RACEWAY_KINDS, { pvc: 'PVC', aluminum: 'Aluminium', steel: 'Steel' }) },
  ],
  breaker: [
    name,
    { key: 'device', label: 'Device', type: 'choice', options: opts(['breaker', 'switch', 'fuse'], { breaker: 'Breaker', switch: 'Switch', fuse: 'Fuse' }) },
    ...(['A', 'B', 'C'] as const).map(
      (p): FieldDef => ({ key: `pole${p}`, label: `Pole ${p}`, type: 'choice', options: opts(POLE_STATES, { closed: 'Closed', open: 'Open', none: 'No pole' }) }),
    ),
    { key: 'carriesNeutral', label: 'Neutral passes through', type: 'toggle' },
    { key: 'ratingAmperes', label: 'Rating', type: 'quantity', unit: 'A', optional: true },
    { key: 'interruptingKa', label: 'Interrupting rating', type: 'quantity', unit: 'kA' },
  ],
  load: [
    name,
    {
      key: 'connection',
      label: 'Connection',
      type: 'choice',
      options: opts(LOAD_CONNECTIONS, { 'line-to-neutral': 'Line to neutral', 'line-to-line': 'Line to line', 'three-phase-wye': 'Three-phase wye', 'three-phase-delta': 'Three-phase delta' }),
    },
    {
      key: 'loadKind',
      label: 'Kind',
      hint: 'Sets how it behaves with voltage: heating is constant impedance',
      type: 'choice',
      options: opts(LOAD_KINDS, { lighting: 'Lighting', receptacles: 'Receptacles', motor: 'Motor', electronics: 'Electronics', heating: 'Heating' }),
    },
    { key: 'givenAs', label: 'Given as', type: 'choice', options: opts(['kw', 'amperes'], { kw: 'Power (kW)', amperes: 'Current (A)' }) },
    { key: 'kw', label: 'Power', type: 'quantity', unit: 'kW', visible: is('givenAs', 'kw') },
    { key: 'amperes', label: 'Current', type: 'quantity', unit: 'A', visible: is('givenAs', 'amperes') },
    { key: 'powerFactor', label: 'Power factor', type: 'quantity', unit: 'number' },
    { key: 'ratedVolts', label: 'Rated voltage', hint: 'Line-to-neutral for a line-to-neutral load', type: 'quantity', unit: 'V' },
    { key: 'contributesToFaults', label: 'Feeds faults', hint: 'During a fault the motor is a source behind its subtransient reactance', type: 'toggle', visible: is('loadKind', 'motor') },
    {
      key: 'subtransientReactancePu',
      label: 'Subtransient reactance X"d',
      hint: 'Per unit on the motor’s kVA; empty: 0.17 (common practice)',
      type: 'quantity',
      unit: 'number',
      optional: true,
      visible: (v) => v.loadKind === 'motor' && v.contributesToFaults === true,
    },
  ],
  electrode: [name, { key: 'ohms', label: 'Resistance to earth', type: 'quantity', unit: 'ohm' }],
};

export function fieldsFor(kind: string): FieldDef[] {
  return FIELDS[kind as ElementKind] ?? [name];
}

/**
 * The form's starting values (numbers in the field's unit, as text). Give it the element as read through its
 * schema where it is valid, so defaults show; an invalid element shows what is stored.
 */
export function readValues(defs: FieldDef[], e: ElementView): Record<string, FieldValue> {
  const out: Record<string, FieldValue> = {};
  for (const d of defs) {
    const v = e[d.key];
    if (d.read) out[d.key] = d.read(e);
    else if (d.type === 'toggle') out[d.key] = v === true;
    else if (d.type === 'quantity') out[d.key] = typeof v === 'number' ? formatQuantity(v) : '';
    else if (d.type === 'choice') out[d.key] = typeof v === 'string' ? v : d.options[0].value;
    else out[d.key] = typeof v === 'string' ? v : '';
  }
  return out;
}

export function writesOf(d: FieldDef, value: FieldValue | number | undefined, e: ElementView): Write[] {
  if (d.write) return d.write(value, e);
  return [{ path: [d.key], value: value as Plain | undefined }];
}

export function pathsOf(d: FieldDef): string[][] {
  return d.paths ?? [[d.key]];
}
