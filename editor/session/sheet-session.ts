// One open sheet in the browser: the shared document and its websocket provider, this user's commands and undo,
// the mirror the canvas draws from, presence (the crew), the editor's own state, and the solve after every change.
// Created in an effect (never at module scope: no WebSocket or Worker during an export's render).
import * as Y from 'yjs';
import { WebsocketProvider } from 'y-websocket';
import { SheetCommands } from '../document/commands';
import { SheetMirror } from '../document/sheet-mirror';
import { SheetReader } from '../document/sheet-reader';
import { createUndoManager } from '../document/undo';
import { drawnResults, reuseUnchanged } from '../results/value-tags';
import { SolveScheduler, type SolveInput, type SolveMode } from '../solve/solve-scheduler';
import type { SolveReply } from '../solve/solve-request';
import { crewList, crewColor, crewPeople, distinctColors, type CrewMember, type CrewPerson, type LocalPresence } from '../presence/crew';
import { initialUiState, type EditorUiState } from './editor-state';
import { initialResults, type ResultsState } from './results-state';
import { Store } from './store';
import type { Point } from '../../shared/symbols';

export type ConnectionStatus = 'connecting' | 'connected' | 'offline';

export interface SessionOptions {
  sheetId: string;
  /** ws(s)://host, without a path. */
  wsBase: string;
  editable: boolean;
  user: { id: string; name: string };
  /** A viewer link's token: the socket is opened through the link (read-only, no membership needed). */
  viewLink?: string;
  solveMode: SolveMode;
  workerUrl?: string;
}

export interface LinkState {
  status: ConnectionStatus;
  /** The first full copy of the sheet has arrived. */
  synced: boolean;
  /** The server closed the socket for good (4410: the viewer link was revoked or expired; 4403: access removed). */
  ended: { code: number; reason: string } | null;
}

export class SheetSession {
  readonly doc = new Y.Doc();
  readonly commands: SheetCommands;
  readonly undoManager: Y.UndoManager;
  readonly mirror: SheetMirror;
  readonly reader = new SheetReader();
  readonly ui = new Store<EditorUiState>(initialUiState());
  readonly results = new Store<ResultsState>(initialResults());
  readonly link = new Store<LinkState>({ status: 'connecting', synced: false, ended: null });
  /** Every tab on the sheet (`members`, for the cursors) and one entry per person (`people`, for the crew list). */
  readonly crew = new Store<{ members: CrewMember[]; people: CrewPerson[] }>({ members: [], people: [] });
  readonly history = new Store<{ canUndo: boolean; canRedo: boolean }>({ canUndo: false, canRedo: false });
  private provider: WebsocketProvider | null = null;
  private readonly scheduler: SolveScheduler;
  private presence: LocalPresence = { cursor: null, selection: [], drag: null };
  private presenceTimer: ReturnType<typeof setTimeout> | null = null;
  private readonly offs: (() => void)[] = [];

  constructor(readonly options: SessionOptions) {
    this.commands = new SheetCommands(this.doc, { user: options.user.id });
    this.undoManager = createUndoManager(this.doc, this.commands.origin);
    this.mirror = new SheetMirror(this.doc, (origin) => origin === this.commands.origin || origin === this.undoManager);
    this.scheduler = new SolveScheduler({
      mode: options.solveMode,
      workerUrl: options.workerUrl,
      onReply: (reply, input, at) => this.onReply(reply, input, at),
      onError: (message) =>
        this.results.set({ failure: { code: 'not-finite', message: `the solve stopped: ${message}`, elementIds: [] }, drawn: null }),
    });
    this.offs.push(
      this.mirror.subscribe(() => this.requestSolve()),
    );
    let lastUi = this.ui.get();
    this.offs.push(
      this.ui.subscribe(() => {
        const ui = this.ui.get();
        if (ui.whatIfId !== lastUi.whatIfId || ui.trialChanges !== lastUi.trialChanges) this.requestSolve();
        if (ui.selection !== lastUi.selection) this.publish({ selection: [...ui.selection] });
        lastUi = ui;
      }),
    );
    const onStack = () => this.history.set({ canUndo: this.undoManager.canUndo(), canRedo: this.undoManager.canRedo() });
    this.undoManager.on('stack-item-added', onStack);
    this.undoManager.on('stack-item-popped', onStack);
    this.undoManager.on('stack-cleared', onStack);
    this.requestSolve();
  }

  get editable(): boolean {
    return this.options.editable;
  }

  /** Opens the websocket to the sheet's room. */
  connect(): void {
    if (this.provider) return;
    const provider = new WebsocketProvider(`${this.options.wsBase}/sync`, this.options.sheetId, this.doc, {
      disableBc: true,
      maxBackoffTime: 2500,
      params: this.options.viewLink ? { link: this.options.viewLink } : {},
    });
    this.provider = provider;
    provider.on('status', ({ status }: { status: string }) =>
      this.link.set({ status: status === 'connected' ? 'connected' : status === 'connecting' ? 'connecting' : 'offline' }),
    );
    // Close codes 4400-4499 are final: y-websocket stops reconnecting and reports them here.
    provider.on('closed', ({ code, reason }: { code: number; reason: string }) => this.link.set({ status: 'offline', ended: { code, reason } }));
    provider.on('sync', (synced: boolean) => {
      if (!synced || this.link.get().synced) return;
      // A mark for the benchmark: the first full copy of the sheet is here.
      if (typeof performance !== 'undefined' && typeof performance.mark === 'function') performance.mark('phasewright:synced');
      this.link.set({ synced: true });
    });
    const awareness = provider.awareness;
    awareness.setLocalState({ ...this.presence });
    const onAwareness = () => {
      const members = this.crewMembers();
      this.crew.set({ members, people: crewPeople(members) });
    };
    awareness.on('change', onAwareness);
    this.offs.push(() => awareness.off('change', onAwareness));
    onAwareness();
  }

  private crewMembers(): CrewMember[] {
    const awareness = this.provider?.awareness;
    const me: CrewMember = {
      clientId: this.doc.clientID,
      userId: this.options.user.id,
      name: this.options.user.name,
      readOnly: !this.options.editable,
      color: crewColor(this.options.user.id),
      cursor: null,
      selection: [],
      drag: null,
      self: true,
    };
    if (!awareness) return [me];
    const others = crewList(awareness.getStates() as Map<number, Record<string, unknown>>, this.doc.clientID).filter((m) => !m.self);
    return distinctColors([me, ...others]);
  }

  /** Publishes part of this user's presence (cursor moves are sent at most every 50 ms). */
  publish(patch: Partial<LocalPresence>, throttle = false): void {
    this.presence = { ...this.presence, ...patch };
    const awareness = this.provider?.awareness;
    if (!awareness) return;
    if (throttle) {
      if (this.presenceTimer) return;
      this.presenceTimer = setTimeout(() => {
        this.presenceTimer = null;
        this.provider?.awareness.setLocalState({ ...this.presence });
      }, 50);
      return;
    }
    awareness.setLocalState({ ...this.presence });
  }

  setCursor(world: Point | null): void {
    this.publish({ cursor: world ? { x: Math.round(world.x), y: Math.round(world.y) } : null }, true);
  }

  undo(): void {
    if (this.editable) this.undoManager.undo();
  }

  redo(): void {
    if (this.editable) this.undoManager.redo();
  }

  requestSolve(): void {
    const snapshot = this.mirror.current;
    const read = this.reader.read(snapshot);
    const ui = this.ui.get();
    const input: SolveInput = {
      sheet: read.sheet,
      readWarnings: read.warnings.map((w) => ({ message: w.message, elementId: w.elementId })),
      whatIfId: ui.whatIfId && read.sheet.whatIfs[ui.whatIfId] ? ui.whatIfId : undefined,
      trialChanges: ui.trialChanges,
    };
    this.results.set({ invalid: read.invalid });
    this.scheduler.request(input);
  }

  /** Where the sheet is solved now (shown beside the results; a browser test checks the worker is used). */
  solvePlace(): 'main' | 'worker' {
    return this.scheduler.placeFor(this.mirror.current.elements.size);
  }

  private onReply(reply: SolveReply, input: SolveInput, requestedAt: number) {
    const base = reply.base.ok ? reply.base.result : null;
    const active = reply.active ? (reply.active.ok ? reply.active.result : null) : null;
    const failure = !reply.base.ok ? reply.base.error : reply.active && !reply.active.ok ? reply.active.error : null;
    const previous = this.results.get();
    const drawnBase = base ? reuseUnchanged(previous.drawnBase, drawnResults(input.sheet, base)) : null;
    const shown = reply.active ? active : base;
    const drawn = shown ? (shown === base ? drawnBase : reuseUnchanged(previous.drawn, drawnResults(input.sheet, shown))) : null;
    this.results.set((r) => ({
      serial: r.serial + 1,
      base,
      active,
      drawnBase,
      drawn,
      failure,
      solveMs: reply.solveMs,
      where: reply.where,
      changeToAnswerMs: performance.now() - requestedAt,
    }));
  }

  destroy(): void {
    for (const off of this.offs) off();
    if (this.presenceTimer) clearTimeout(this.presenceTimer);
    this.scheduler.destroy();
    this.provider?.awareness.setLocalState(null);
    this.provider?.destroy();
    this.provider = null;
    this.mirror.destroy();
    this.undoManager.destroy();
    this.doc.destroy();
  }
}
