// What tools and buttons do to the sheet and the editor's state: select, move, connect, place, cut. Every change
// to the document is one command (one transaction, one undo step). Cuts go where the case on show says: the
// sheet itself (base case), the what-if on show, or the trial layer that is never saved (viewers, trials).
import type { ConductorId, ElementKind, PhaseId, WhatIfChange } from '../../shared/sheet';
import { GRID, type Point } from '../../shared/symbols';
import type { SheetCommands } from '../document/commands';
import { proposeConductorMap } from '../document/conductor-map';
import { newElement } from '../document/element-defaults';
import type { SheetMirror } from '../document/sheet-mirror';
import type { SheetReader } from '../document/sheet-reader';
import { hitTest, laneAt, type SceneIndex } from '../canvas/hit-test';
import { snap } from '../canvas/viewport';
import type { CutChooser, EditorUiState } from '../session/editor-state';
import type { Store } from '../session/store';

export interface ToolActions {
  select(ids: ReadonlySet<string>): void;
  toggleInSelection(id: string): void;
  selectConnection(id: string): void;
  previewDrag(ids: ReadonlySet<string> | null, dx: number, dy: number): void;
  moveBy(ids: ReadonlySet<string>, dx: number, dy: number): void;
  connect(from: { elementId: string; terminal: string }, to: { elementId: string; terminal: string }): void;
  placeAt(world: Point): void;
  cutAt(world: Point): void;
  chooseCut(chooser: CutChooser, which: string): void;
  say(text: string, tone?: 'info' | 'danger'): void;
}

export interface ActionDeps {
  ui: Store<EditorUiState>;
  mirror: SheetMirror;
  reader: SheetReader;
  commands: SheetCommands;
  editable: () => boolean;
  zoom: () => number;
  index: () => SceneIndex;
  /** Tells the others (presence) about a drag in progress. */
  onDragPreview: (drag: { ids: string[]; dx: number; dy: number } | null) => void;
}

type CaseMode = 'base' | 'what-if' | 'trial';

const sameChange = (a: Record<string, unknown>, b: WhatIfChange) =>
  a.kind === b.kind &&
  (['runId', 'conductor', 'breakerId', 'pole', 'connectionId'] as const).every((k) => (a as Record<string, unknown>)[k] === (b as Record<string, unknown>)[k]);

export function createToolActions(deps: ActionDeps): ToolActions {
  const { ui, mirror, reader, commands } = deps;
  let serial = 0;
  const say = (text: string, tone: 'info' | 'danger' = 'info') => ui.set({ message: { text, tone, serial: ++serial } });
  const nameOf = (id: string) => mirror.current.elements.get(id)?.name || id;

  const caseMode = (): CaseMode => {
    if (!deps.editable()) return 'trial';
    const { whatIfId, trialChanges } = ui.get();
    if (trialChanges.length > 0) return 'trial';
    return whatIfId && mirror.current.whatIfs.has(whatIfId) ? 'what-if' : 'base';
  };

  /** Adds the change to the what-if on show or the trial layer, or takes it out when it is already there. */
  const toggleChange = (mode: Exclude<CaseMode, 'base'>, change: WhatIfChange): boolean => {
    if (mode === 'trial') {
      const list = ui.get().trialChanges;
      const found = list.findIndex((c) => sameChange(c as unknown as Record<string, unknown>, change));
      ui.set({ trialChanges: found >= 0 ? list.filter((_, i) => i !== found) : [...list, change] });
      return found < 0;
    }
    const whatIfId = ui.get().whatIfId!;
    const whatIf = mirror.current.whatIfs.get(whatIfId)!;
    const existing = Object.entries(whatIf.changes).find(([, c]) => sameChange(c, change));
    if (existing) commands.removeChange(whatIfId, existing[0]);
    else commands.addChange(whatIfId, change);
    return !existing;
  };

  const where = (mode: CaseMode) => (mode === 'trial' ? ' (trial, not saved)' : mode === 'what-if' ? ' in this what-if' : '');

  const cutRunConductor = (runId: string, conductor: ConductorId) => {
    const mode = caseMode();
    const label = `${conductor} of ${nameOf(runId)}`;
    if (mode === 'base') {
      const run = mirror.current.elements.get(runId);
      const conductors = (run?.conductors ?? {}) as Record<string, { open?: boolean }>;
      const open = !conductors[conductor]?.open;
      commands.setField('elements', runId, ['conductors', conductor, 'open'], open);
      say(`${open ? 'Opened' : 'Closed'} ${label}`);
      return;
    }
    const opened = toggleChange(mode, { kind: 'open-conductor', runId, conductor });
    say(`${opened ? 'Opened' : 'Closed'} ${label}${where(mode)}`);
  };

  const cutBreakerPole = (breakerId: string, pole: PhaseId) => {
    const mode = caseMode();
    const label = `pole ${pole} of ${nameOf(breakerId)}`;
    if (mode === 'base') {
      const field = `pole${pole}`;
      const current = mirror.current.elements.get(breakerId)?.[field] ?? 'closed';
      const next = current === 'open' ? 'closed' : 'open';
      commands.setField('elements', breakerId, [field], next);
      say(`${next === 'open' ? 'Opened' : 'Closed'} ${label}`);
      return;
    }
    const opened = toggleChange(mode, { kind: 'open-pole', breakerId, pole });
    say(`${opened ? 'Opened' : 'Closed'} ${label}${where(mode)}`);
  };

  const cutConnection = (connectionId: string, conductor: ConductorId) => {
    const mode = caseMode();
    if (mode === 'base') {
      say('A connection opens only in a what-if or a trial: choose one in the what-if list', 'danger');
      return;
    }
    const opened = toggleChange(mode, { kind: 'open-connection', connectionId, conductor });
    say(`${opened ? 'Opened' : 'Closed'} ${conductor} of the connection${where(mode)}`);
  };

  return {
    say,
    select(ids) {
      // The inspector opens from the selection's bar on a phone (so drawing several elements in a row is not
      // covered by it); a wide screen shows it beside the canvas anyway.
      ui.set((s) => ({
        selection: ids,
        selectedConnection: null,
        panel: s.panel === 'inspector' && ids.size === 0 ? 'none' : s.panel,
        phasorBusId: ids.size === 1 && mirror.current.elements.get([...ids][0])?.kind === 'bus' ? [...ids][0] : null,
      }));
    },
    toggleInSelection(id) {
      const next = new Set(ui.get().selection);
      if (next.has(id)) next.delete(id);
      else next.add(id);
      ui.set({ selection: next, selectedConnection: null });
    },
    selectConnection(id) {
      ui.set({ selection: new Set(), selectedConnection: id, phasorBusId: null });
    },
    previewDrag(ids, dx, dy) {
      ui.set({ drag: ids ? { ids, dx, dy } : null });
      deps.onDragPreview(ids ? { ids: [...ids], dx, dy } : null);
    },
    moveBy(ids, dx, dy) {
      const moves = [...ids].flatMap((id) => {
        const e = mirror.current.elements.get(id);
        return e ? [{ id, x: e.x + dx, y: e.y + dy }] : [];
      });
      commands.moveElements(moves);
    },
    connect(from, to) {
      if (!deps.editable()) return;
      const sheet = reader.read(mirror.current).sheet;
      const a = sheet.elements[from.elementId];
      const b = sheet.elements[to.elementId];
      if (!a || !b) {
        say(`Fix the fields of ${nameOf(a ? to.elementId : from.elementId)} before connecting it`, 'danger');
        return;
      }
      const duplicate = [...mirror.current.connections.values()].some(
        (c) =>
          (c.from.elementId === from.elementId && c.from.terminal === from.terminal && c.to.elementId === to.elementId && c.to.terminal === to.terminal) ||
          (c.to.elementId === from.elementId && c.to.terminal === from.terminal && c.from.elementId === to.elementId && c.from.terminal === to.terminal),
      );
      if (duplicate && a.kind !== 'bus' && b.kind !== 'bus') {
        say('These two terminals are connected already', 'danger');
        return;
      }
      const proposal = proposeConductorMap(sheet, { element: a, terminal: from.terminal }, { element: b, terminal: to.terminal });
      if (!proposal.ok) {
        say(proposal.message, 'danger');
        return;
      }
      commands.connect({ from, to, conductorMap: proposal.conductorMap });
      const pairs = Object.entries(proposal.conductorMap).map(([f, t]) => (f === t ? f : `${f}→${t}`));
      say(`Connected ${nameOf(from.elementId)} to ${nameOf(to.elementId)} (${pairs.join(', ')})`);
    },
    placeAt(world) {
      const kind = ui.get().placeKind as ElementKind | null;
      if (!kind || !deps.editable()) return;
      const names = [...mirror.current.elements.values()].map((e) => e.name);
      const at = { x: snap(world.x, GRID), y: snap(world.y, GRID) };
      const element = newElement(kind, at, names);
      const id = commands.addElement(element);
      ui.set({ tool: 'select', placeKind: null, selection: new Set([id]), selectedConnection: null, phasorBusId: null });
      say(`Placed ${String(element.name)}: drag from its terminals to connect it`);
    },
    cutAt(world) {
      const index = deps.index();
      const zoom = deps.zoom();
      const hit = hitTest(index, world, zoom, { terminals: false });
      if (hit.kind === 'element') {
        const placed = index.scene.elements.get(hit.elementId)!;
        const kind = placed.element.kind;
        if (kind === 'run') {
          const lane = laneAt(placed, world, zoom);
          if (lane) cutRunConductor(hit.elementId, lane);
          else ui.set({ chooser: { kind: 'run', elementId: hit.elementId, conductors: placed.symbol.lanes.map((l) => l.conductor) } });
          return;
        }
        if (kind === 'breaker') {
          const poles = (['A', 'B', 'C'] as const).filter((p) => (placed.element[`pole${p}`] ?? 'closed') !== 'none');
          if (poles.length === 1) cutBreakerPole(hit.elementId, poles[0]);
          else if (poles.length > 1) ui.set({ chooser: { kind: 'breaker', elementId: hit.elementId, poles } });
          return;
        }
        say('Tap a feeder, a breaker or a connection to open one of its conductors');
        return;
      }
      if (hit.kind === 'connection') {
        if (caseMode() === 'base') {
          say('A connection opens only in a what-if or a trial: choose one in the what-if list', 'danger');
          return;
        }
        const placed = index.scene.connections.get(hit.connectionId)!;
        ui.set({ chooser: { kind: 'connection', connectionId: hit.connectionId, conductors: placed.conductors } });
        return;
      }
      say('Tap a feeder, a breaker or a connection to open one of its conductors');
    },
    chooseCut(chooser, which) {
      ui.set({ chooser: null });
      if (chooser.kind === 'run') cutRunConductor(chooser.elementId, which as ConductorId);
      else if (chooser.kind === 'breaker') cutBreakerPole(chooser.elementId, which as PhaseId);
      else cutConnection(chooser.connectionId, which as ConductorId);
    },
  };
}
