// What the editor's buttons, panels and shortcuts do: one object of plain functions over the session and the
// canvas, handed to the components as callbacks.
import type { ElementKind, PhaseId, WhatIfChange } from '../../shared/sheet';
import { GRID } from '../../shared/symbols';
import type { CanvasController } from '../canvas/canvas-controller';
import { snap } from '../canvas/viewport';
import { withLoadPhases } from '../document/conductor-map';
import { newElement } from '../document/element-defaults';
import type { Write } from '../inspector/fields';
import type { CutChooser, PanelName, ToolName } from '../session/editor-state';
import type { SheetSession } from '../session/sheet-session';

export type EditorActions = ReturnType<typeof editorActions>;

export function editorActions(session: SheetSession, canvas: CanvasController) {
  const ui = session.ui;
  const commands = session.commands;
  const editable = () => session.editable;
  const selected = () => [...ui.get().selection].filter((id) => session.mirror.current.elements.has(id));

  /** A change goes to the what-if on show (editors) or to the trial layer (viewers, or with no what-if). */
  const addChange = (change: WhatIfChange) => {
    const { whatIfId } = ui.get();
    if (editable() && whatIfId && session.mirror.current.whatIfs.has(whatIfId) && ui.get().trialChanges.length === 0) {
      commands.addChange(whatIfId, change);
      canvas.actions.say('Added to the what-if');
    } else {
      ui.set((s) => ({ trialChanges: [...s.trialChanges, change] }));
      canvas.actions.say('Tried here only: not saved');
    }
  };

  return {
    setTool(tool: ToolName) {
      ui.set({ tool, placeKind: tool === 'place' ? ui.get().placeKind : null, chooser: null, panel: tool === 'place' ? ui.get().panel : ui.get().panel === 'palette' ? 'none' : ui.get().panel });
      if (tool === 'cut') canvas.actions.say('Tap a feeder, a breaker or a connection to open a conductor');
    },
    /** Arms the place tool: the next tap on the canvas puts the element there. */
    choosePlace(kind: ElementKind) {
      if (!editable()) return;
      ui.set({ tool: 'place', placeKind: kind, panel: 'none', chooser: null });
      canvas.actions.say('Tap the sheet where it goes');
    },
    placeAtCentre(kind: ElementKind) {
      if (!editable()) return;
      const c = canvas.viewCentre();
      const names = [...session.mirror.current.elements.values()].map((e) => e.name);
      const id = commands.addElement(newElement(kind, { x: snap(c.x, GRID), y: snap(c.y, GRID) }, names));
      ui.set({ tool: 'select', placeKind: null, selection: new Set([id]), selectedConnection: null });
    },
    // Said, so the last message ("Opened N of Feeder") does not stand over a drawing that no longer shows it.
    undo() {
      if (!editable() || !session.history.get().canUndo) return;
      session.undo();
      canvas.actions.say('Undone');
    },
    redo() {
      if (!editable() || !session.history.get().canRedo) return;
      session.redo();
      canvas.actions.say('Redone');
    },
    deleteSelection() {
      if (!editable()) return;
      const ids = selected();
      const connection = ui.get().selectedConnection;
      if (ids.length) commands.deleteElements(ids);
      else if (connection) commands.disconnect(connection);
      else return;
      ui.set({ selection: new Set(), selectedConnection: null, panel: ui.get().panel === 'inspector' ? 'none' : ui.get().panel });
    },
    duplicateSelection() {
      const ids = selected();
      if (!editable() || ids.length === 0) return;
      const copies = commands.duplicateElements(ids, { dx: 2 * GRID, dy: 2 * GRID });
      ui.set({ selection: new Set(copies) });
    },
    rotateSelection() {
      const ids = selected();
      if (editable() && ids.length) commands.rotateElements(ids, 90);
    },
    nudge(dx: number, dy: number) {
      const ids = selected();
      if (editable() && ids.length) canvas.actions.moveBy(new Set(ids), dx, dy);
    },
    escape() {
      canvas.cancelGesture();
      const s = ui.get();
      if (s.chooser) ui.set({ chooser: null });
      else if (s.tool !== 'select') ui.set({ tool: 'select', placeKind: null });
      else if (s.panel !== 'none') ui.set({ panel: 'none' });
      else ui.set({ selection: new Set(), selectedConnection: null });
    },
    fit: () => canvas.fitAll(),
    zoomBy: (factor: number) => canvas.zoomAt({ x: canvas.viewSize.width / 2, y: canvas.viewSize.height / 2 }, factor),
    openPanel: (panel: PanelName) => ui.set({ panel }),
    closePanel: () => ui.set({ panel: 'none' }),
    showCase(whatIfId: string | null) {
      ui.set({ whatIfId });
    },
    addWhatIf() {
      if (!editable()) return;
      const n = session.mirror.current.whatIfs.size + 1;
      const id = commands.addWhatIf(`What-if ${n}`);
      ui.set({ whatIfId: id, trialChanges: [] });
      canvas.actions.say('New what-if: cut conductors or set changes in the inspector');
    },
    renameWhatIf(id: string, name: string) {
      if (editable() && name.trim()) commands.setField('whatIfs', id, ['name'], name.trim());
    },
    removeWhatIf(id: string) {
      if (!editable()) return;
      commands.removeWhatIf(id);
      if (ui.get().whatIfId === id) ui.set({ whatIfId: null });
    },
    removeChange(whatIfId: string, changeId: string) {
      if (editable()) commands.removeChange(whatIfId, changeId);
    },
    removeTrial(index: number) {
      ui.set((s) => ({ trialChanges: s.trialChanges.filter((_, i) => i !== index) }));
    },
    clearTrial: () => ui.set({ trialChanges: [] }),
    /** An editor keeps the trial as a what-if of the sheet. */
    keepTrial() {
      const changes = ui.get().trialChanges;
      if (!editable() || changes.length === 0) return;
      const id = commands.addWhatIf(`What-if ${session.mirror.current.whatIfs.size + 1}`);
      for (const c of changes) commands.addChange(id, c);
      ui.set({ trialChanges: [], whatIfId: id });
    },
    addChange,
    saveFields(elementId: string, writes: Write[]) {
      if (editable() && writes.length) commands.updateFields('elements', elementId, writes);
    },
    setLoadPhases(connectionId: string, loadId: string, phases: PhaseId[]) {
      if (!editable()) return;
      const c = session.reader.read(session.mirror.current).sheet.connections[connectionId];
      if (!c) return;
      commands.setField('connections', connectionId, ['conductorMap'], withLoadPhases(c, loadId, phases) as Record<string, string>);
    },
    deleteConnection(id: string) {
      if (!editable()) return;
      commands.disconnect(id);
      ui.set({ selectedConnection: null });
    },
    chooseCut: (chooser: CutChooser, which: string) => canvas.actions.chooseCut(chooser, which),
    closeChooser: () => ui.set({ chooser: null }),
    selectElements(ids: string[]) {
      ui.set({ selection: new Set(ids.filter((id) => session.mirror.current.elements.has(id))), selectedConnection: null });
    },
    showPhasor: (busId: string | null) => ui.set({ phasorBusId: busId }),
    dismissMessage: () => ui.set({ message: null }),
  };
}
