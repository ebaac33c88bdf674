// One edit of a panel schedule's row, turned into the field writes it makes: the load's own fields, the breaker's
// rating and the phases the circuit takes (on the connection from the bars). The caller applies them with
// SheetCommands.updateEntries, so the whole row is one undoable step.
import type { EntryEdit } from '../document/commands';
import { withLoadPhases } from '../document/conductor-map';
import type { Connection, LoadElement, PhaseId, Sheet } from '../../shared/sheet';
import type { BehaviourChoice, ScheduleRow } from './panel-schedule';

export interface CircuitEdit {
  description?: string;
  /** Empty clears the written circuit (the schedule numbers it). */
  circuit?: string;
  phases?: PhaseId[];
  /** The amount in the unit the load is given in (kW or A). */
  amount?: number;
  powerFactor?: number;
  behaviour?: Exclude<BehaviourChoice, 'mix'>;
  /** null clears the rating. */
  breakerAmperes?: number | null;
}

export type CircuitEditResult = { ok: true; edits: EntryEdit[] } | { ok: false; message: string };

const PHASE_COUNT: Record<LoadElement['connection'], number> = {
  'line-to-neutral': 1,
  'line-to-line': 2,
  'three-phase-wye': 3,
  'three-phase-delta': 3,
};

/** The behaviour fractions a choice writes: "by kind" clears all three so the load kind decides. */
export function behaviourFractions(choice: Exclude<BehaviourChoice, 'mix'>): { z?: number; i?: number; p?: number } {
  switch (choice) {
    case 'by-kind':
      return {};
    case 'impedance':
      return { z: 1, i: 0, p: 0 };
    case 'current':
      return { z: 0, i: 1, p: 0 };
    case 'power':
      return { z: 0, i: 0, p: 1 };
  }
}

export function circuitEditWrites(sheet: Sheet, busPhases: readonly PhaseId[], row: ScheduleRow, edit: CircuitEdit): CircuitEditResult {
  const load: EntryEdit = { where: 'elements', id: row.loadId, changes: [] };
  const w = (path: string[], value: string | number | undefined) => (load.changes as { path: string[]; value: string | number | undefined }[]).push({ path, value });
  if (edit.description !== undefined) {
    if (edit.description.trim() === '') return { ok: false, message: 'The description must not be empty' };
    if (edit.description.length > 200) return { ok: false, message: 'The description must be at most 200 characters' };
    if (edit.description.trim() !== row.description) w(['name'], edit.description.trim());
  }
  if (edit.circuit !== undefined) {
    const c = edit.circuit.trim();
    if (c.length > 20) return { ok: false, message: 'The circuit must be at most 20 characters' };
    if (c !== (row.circuitGiven ? row.circuit : '')) w(['circuit'], c === '' ? undefined : c);
  }
  if (edit.amount !== undefined) {
    if (!Number.isFinite(edit.amount) || edit.amount < 0) return { ok: false, message: `The load must be a number not below zero (${row.givenAs === 'kw' ? 'kW' : 'A'})` };
    const field = row.givenAs === 'kw' ? 'kw' : 'amperes';
    const current = row.givenAs === 'kw' ? row.kw : row.amperesGiven;
    if (edit.amount !== current) w([field], edit.amount);
  }
  if (edit.powerFactor !== undefined) {
    if (!(edit.powerFactor > 0 && edit.powerFactor <= 1)) return { ok: false, message: 'The power factor must be above 0 and at most 1' };
    if (edit.powerFactor !== row.powerFactor) w(['powerFactor'], edit.powerFactor);
  }
  if (edit.behaviour !== undefined && edit.behaviour !== row.behaviour) {
    const f = behaviourFractions(edit.behaviour);
    w(['constantImpedanceFraction'], f.z);
    w(['constantCurrentFraction'], f.i);
    w(['constantPowerFraction'], f.p);
  }
  const edits: EntryEdit[] = [load];

  if (edit.phases !== undefined && edit.phases.join('') !== row.phases.join('')) {
    const want = PHASE_COUNT[row.connection];
    if (edit.phases.length !== want) return { ok: false, message: `A ${row.connection} circuit takes ${want} phase${want > 1 ? 's' : ''}` };
    if (new Set(edit.phases).size !== edit.phases.length) return { ok: false, message: 'A circuit cannot take the same phase twice' };
    const missing = edit.phases.filter((p) => !busPhases.includes(p));
    if (missing.length) return { ok: false, message: `The panel has no phase ${missing.join(', ')}` };
    const connection = sheet.connections[row.phaseConnectionId] as Connection | undefined;
    if (!connection) return { ok: false, message: 'The circuit’s connection to the panel is gone' };
    edits.push({ where: 'connections', id: connection.id, changes: [{ path: ['conductorMap'], value: withLoadPhases(connection, row.phaseEndId, edit.phases) as Record<string, string> }] });
  }

  if (edit.breakerAmperes !== undefined && row.breaker) {
    if (edit.breakerAmperes !== null && !(edit.breakerAmperes > 0)) return { ok: false, message: 'The breaker rating must be above zero' };
    if ((edit.breakerAmperes ?? undefined) !== row.breaker.ratingAmperes) {
      edits.push({ where: 'elements', id: row.breaker.id, changes: [{ path: ['ratingAmperes'], value: edit.breakerAmperes ?? undefined }] });
    }
  } else if (edit.breakerAmperes !== undefined && edit.breakerAmperes !== null && !row.breaker) {
    return { ok: false, message: 'This circuit has no breaker of its own on the drawing' };
  }
  return { ok: true, edits: edits.filter((e) => e.changes.length > 0) };
}
