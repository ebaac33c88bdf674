// What the panel schedule, the CSV import and the sheet import do: plain functions over the session, each edit one
// SheetCommands transaction (so one undo takes it back), handed to the components as callbacks.
import type { SolveResult } from '../../solver';
import type { Sheet } from '../../shared/sheet';
import { readSheetImport, type SheetImportResult } from '../import/sheet-import';
import { circuitEditWrites, type CircuitEdit } from '../schedule/circuit-edit';
import { panelSchedule, type PanelSchedule } from '../schedule/panel-schedule';
import { placeCircuits } from '../schedule/place-circuits';
import { readScheduleCsv, type CsvReadResult, type ImportedCircuit, type PanelTarget } from '../schedule/schedule-csv';
import type { SheetSession } from '../session/sheet-session';

export type ScheduleActions = ReturnType<typeof scheduleActions>;

/** The case on show, else the base case. */
const shownResult = (session: SheetSession): SolveResult | null => session.results.get().active ?? session.results.get().base;

/** What a CSV import into the panel is checked against: its bars, its voltages (from the base case) and circuits. */
export function importTarget(sheet: Sheet, schedule: PanelSchedule, base: SolveResult | null): PanelTarget {
  const nominal = base?.buses.find((b) => b.busId === schedule.busId)?.nominal;
  return {
    phases: schedule.phases,
    hasNeutral: schedule.hasNeutral,
    ...(nominal?.lineToNeutralVolts ? { lineToNeutralVolts: Math.round(nominal.lineToNeutralVolts) } : {}),
    ...(nominal?.lineToLineVolts ? { lineToLineVolts: Math.round(nominal.lineToLineVolts) } : {}),
    existingCircuits: new Map(schedule.rows.filter((r) => r.circuitGiven).map((r) => [r.circuit, r.description])),
  };
}

export function scheduleActions(session: SheetSession) {
  const ui = session.ui;
  const sheet = () => session.reader.read(session.mirror.current).sheet;
  const scheduleOf = (busId: string) => panelSchedule(sheet(), busId, shownResult(session));

  return {
    openSchedule(busId: string) {
      ui.set({ scheduleBusId: busId, panel: 'schedule' });
    },
    /** The schedule of the panel chosen last, or of the first panel on the sheet. */
    openSchedules() {
      const s = sheet();
      const last = ui.get().scheduleBusId;
      const first = Object.values(s.elements).find((e) => e.kind === 'bus' && e.role === 'panel') ?? Object.values(s.elements).find((e) => e.kind === 'bus');
      ui.set({ scheduleBusId: last && s.elements[last]?.kind === 'bus' ? last : (first?.id ?? null), panel: 'schedule' });
    },
    choosePanel: (busId: string) => ui.set({ scheduleBusId: busId }),
    openSheetImport: () => ui.set({ panel: 'import-sheet' }),
    close: () => ui.set({ panel: 'none' }),
    /** Applies one row's edit in one transaction; returns the reason when it cannot. */
    editCircuit(busId: string, loadId: string, edit: CircuitEdit): string | null {
      if (!session.editable) return 'Viewers cannot change the sheet';
      const schedule = scheduleOf(busId);
      const row = schedule?.rows.find((r) => r.loadId === loadId);
      if (!schedule || !row) return 'The circuit is no longer on this panel';
      const made = circuitEditWrites(sheet(), schedule.phases, row, edit);
      if (!made.ok) return made.message;
      session.commands.updateEntries(made.edits);
      return null;
    },
    readCsv(busId: string, text: string): CsvReadResult | null {
      const schedule = scheduleOf(busId);
      if (!schedule) return null;
      return readScheduleCsv(text, importTarget(sheet(), schedule, session.results.get().base));
    },
    /** Places the checked circuits under the panel, connected, in one transaction. */
    importCircuits(busId: string, circuits: readonly ImportedCircuit[]): number {
      if (!session.editable || circuits.length === 0) return 0;
      const placement = placeCircuits(sheet(), busId, circuits);
      session.commands.insertEntries(placement);
      return circuits.length;
    },
    readSheetText: (text: string): SheetImportResult => readSheetImport(text),
    replaceSheet(next: Sheet) {
      if (!session.editable) return;
      session.commands.replaceSheet(next);
      ui.set({ panel: 'none', selection: new Set(), selectedConnection: null, whatIfId: null, trialChanges: [] });
    },
  };
}
