// Everything the editor's components show, read from the session's stores and turned into plain props: the
// canvas's inputs, the inspector's subject, the results panel's lists, the crew. Components never see Yjs.
import { useMemo } from 'react';
import { terminalConductors, type ConductorId, type PhaseId, type SheetElement } from '../../shared/sheet';
import { KIND_LABEL } from '../document/element-defaults';
import { loadPhases } from '../document/conductor-map';
import type { ElementView } from '../document/sheet-mirror';
import { fieldsFor } from '../inspector/fields';
import { CAUTION } from '../results/cautions';
import { describeChange } from '../results/describe-change';
import { describeFailure } from '../results/describe-failure';
import { differences } from '../results/differences';
import { phasorView } from '../results/phasor-view';
import type { EditorHandle } from './use-sheet-editor';
import { useStore } from './use-store';
import { Store } from '../session/store';
import { initialUiState } from '../session/editor-state';
import { initialResults } from '../session/results-state';
import { buildScene } from '../canvas/scene';
import type { ZoomBand } from '../canvas/canvas-controller';
import type { LinkState } from '../session/sheet-session';
import type { CrewMember, CrewPerson } from '../presence/crew';
import type { Rect } from '../../shared/symbols';

const EMPTY = {
  ui: new Store(initialUiState()),
  results: new Store(initialResults()),
  link: new Store<LinkState>({ status: 'connecting', synced: false, ended: null }),
  crew: new Store<{ members: CrewMember[]; people: CrewPerson[] }>({ members: [], people: [] }),
  history: new Store({ canUndo: false, canRedo: false }),
  scene: new Store({ scene: buildScene({ elements: new Map(), connections: new Map() }) }),
  view: new Store<{ band: ZoomBand; zoom: number; renderRect: Rect | null }>({ band: 'near', zoom: 1, renderRect: null }),
  mirror: new Store({ snapshot: { version: 0, settings: {}, elements: new Map(), connections: new Map(), whatIfs: new Map() } }),
};

const LOAD_ROWS = 30;

const PAIRS: PhaseId[][] = [
  ['A', 'B'],
  ['B', 'C'],
  ['C', 'A'],
];

/** The document's snapshot as a store for React. */
const mirrorStores = new WeakMap<object, Store<{ snapshot: EditorHandle['session']['mirror']['current'] }>>();
function mirrorStore(handle: EditorHandle | null) {
  if (!handle) return EMPTY.mirror as unknown as Store<{ snapshot: EditorHandle['session']['mirror']['current'] }>;
  let s = mirrorStores.get(handle.session);
  if (!s) {
    const store = new Store({ snapshot: handle.session.mirror.current });
    handle.session.mirror.subscribe((snapshot) => store.set({ snapshot }));
    mirrorStores.set(handle.session, store);
    s = store;
  }
  return s;
}

export function useEditorView(handle: EditorHandle | null) {
  const session = handle?.session;
  const ui = useStore(session?.ui ?? EMPTY.ui, (s) => s);
  const results = useStore(session?.results ?? EMPTY.results, (s) => s);
  const link = useStore(session?.link ?? EMPTY.link, (s) => s);
  const crew = useStore(session?.crew ?? EMPTY.crew, (s) => s.people);
  const tabs = useStore(session?.crew ?? EMPTY.crew, (s) => s.members);
  const history = useStore(session?.history ?? EMPTY.history, (s) => s);
  const scene = useStore(handle?.canvas.sceneStore ?? EMPTY.scene, (s) => s.scene);
  const view = useStore(handle?.canvas.view ?? EMPTY.view, (s) => s);
  const snapshot = useStore(mirrorStore(handle), (s) => s.snapshot);
  const editable = session?.editable ?? false;

  const read = useMemo(() => (session ? session.reader.read(snapshot) : null), [session, snapshot]);
  const nameOf = useMemo(() => (id: string) => snapshot.elements.get(id)?.name || id, [snapshot]);

  const inspector = useMemo(() => {
    const ids = [...ui.selection].filter((id) => snapshot.elements.has(id));
    if (ui.selectedConnection && snapshot.connections.has(ui.selectedConnection)) {
      const c = snapshot.connections.get(ui.selectedConnection)!;
      return {
        kind: 'connection' as const,
        id: c.id,
        fromName: nameOf(c.from.elementId),
        toName: nameOf(c.to.elementId),
        pairs: Object.entries(c.conductorMap).map(([f, t]) => (f === t ? f : `${f}→${t}`)),
        conductors: Object.keys(c.conductorMap) as ConductorId[],
      };
    }
    if (ids.length > 1) return { kind: 'many' as const, count: ids.length };
    if (ids.length === 0) return { kind: 'none' as const };
    const element = snapshot.elements.get(ids[0])!;
    const parsed = read?.sheet.elements[element.id] as SheetElement | undefined;
    const readable = (parsed ? { ...element, ...parsed } : element) as ElementView;
    let feed = null;
    if (parsed?.kind === 'load' && read && (parsed.connection === 'line-to-neutral' || parsed.connection === 'line-to-line')) {
      const conn = Object.values(read.sheet.connections).find(
        (c) => (c.to.elementId === element.id && read.sheet.elements[c.from.elementId]?.kind === 'bus') || (c.from.elementId === element.id && read.sheet.elements[c.to.elementId]?.kind === 'bus'),
      );
      if (conn) {
        const busId = conn.to.elementId === element.id ? conn.from.elementId : conn.to.elementId;
        const bus = read.sheet.elements[busId];
        const phasesOfBus = (terminalConductors(bus, 'bars') ?? []).filter((c): c is PhaseId => c === 'A' || c === 'B' || c === 'C');
        const options = parsed.connection === 'line-to-neutral' ? phasesOfBus.map((p) => [p]) : PAIRS.filter(([a, b]) => phasesOfBus.includes(a) && phasesOfBus.includes(b));
        feed = { connectionId: conn.id, busName: bus.name || bus.id, phases: loadPhases(conn, element.id) ?? [], options };
      }
    }
    const invalid = (read?.invalid ?? []).filter((i) => i.elementId === element.id).map((i) => `${i.path.split('.').slice(2).join('.') || 'element'}: ${i.message}`);
    return {
      kind: 'element' as const,
      element,
      readable,
      kindLabel: KIND_LABEL[element.kind as keyof typeof KIND_LABEL] ?? element.kind,
      defs: fieldsFor(element.kind),
      feed,
      invalid,
    };
  }, [ui.selection, ui.selectedConnection, snapshot, read, nameOf]);

  const shownWhatIf = ui.whatIfId ? snapshot.whatIfs.get(ui.whatIfId) : undefined;
  const changeDestination = !editable ? 'a trial, not saved' : ui.trialChanges.length ? 'the trial, not saved' : shownWhatIf ? `the what-if "${shownWhatIf.name}"` : null;

  const shown = results.active ?? results.base;
  const resultsPanel = useMemo(() => {
    const cases = [
      { id: null, name: 'Base case (as built)', changes: 0 },
      ...[...snapshot.whatIfs.values()].sort((a, b) => a.name.localeCompare(b.name)).map((w) => ({ id: w.id, name: w.name || 'Unnamed what-if', changes: Object.keys(w.changes).length })),
    ];
    const drawn = results.drawn;
    // Worst first, and only as many as a panel can show (a big sheet has hundreds of loads).
    const severity = { outside: 0, tolerable: 1, plain: 2, normal: 3 } as const;
    const allLoads = drawn
      ? [...drawn.tags.values()]
          .filter((t) => snapshot.elements.get(t.elementId)?.kind === 'load')
          .sort((x, y) => severity[x.standing] - severity[y.standing] || x.key.localeCompare(y.key))
      : [];
    const loads = allLoads.slice(0, LOAD_ROWS).map((t) => ({ key: t.key, name: nameOf(t.elementId), label: t.label, volts: t.value, standing: t.standing }));
    const diff =
      results.active && results.drawnBase && drawn
        ? differences(results.drawnBase, drawn).map((d) => ({ ...d, name: nameOf(d.elementId) }))
        : null;
    const bus = ui.phasorBusId ? shown?.buses.find((b) => b.busId === ui.phasorBusId) : undefined;
    return {
      cases,
      shownCase: shownWhatIf ? ui.whatIfId : null,
      shownChanges: shownWhatIf ? Object.entries(shownWhatIf.changes).map(([id, c]) => ({ id, text: describeChange(c, nameOf) })) : [],
      trial: ui.trialChanges.map((c) => describeChange(c, nameOf)),
      solve: { ms: results.solveMs, where: results.where, place: session?.solvePlace() ?? 'page' },
      failure: results.failure
        ? {
            message: describeFailure(results.failure.message, results.failure.elementIds, {
              element: (id) => snapshot.elements.get(id)?.name || undefined,
              connection: (id) => snapshot.connections.get(id),
            }),
            elementIds: results.failure.elementIds,
          }
        : null,
      invalid: results.invalid.map((i) => `${nameOf(i.elementId ?? '')}: ${i.message}`),
      warnings: (shown?.warnings ?? []).slice(0, 20).map((w) => w.message),
      loads,
      moreLoads: allLoads.length - loads.length,
      differences: diff,
      phasor: bus && bus.state !== 'de-energised' ? { busName: bus.name || bus.busId, view: phasorView(bus) } : null,
    };
  }, [snapshot, results, ui.whatIfId, ui.trialChanges, ui.phasorBusId, shownWhatIf, shown, nameOf, session]);

  const errorIds = useMemo(() => new Set([...(results.failure?.elementIds ?? []), ...results.invalid.map((i) => i.elementId ?? '')]), [results.failure, results.invalid]);
  const documentOpen = useMemo(() => {
    const out = new Set<string>();
    for (const e of snapshot.elements.values()) {
      if (e.kind !== 'run') continue;
      for (const [c, k] of Object.entries((e.conductors ?? {}) as Record<string, { open?: boolean }>)) if (k?.open) out.add(`${e.id}|${c}`);
    }
    return out;
  }, [snapshot]);

  const settings = snapshot.settings as { phaseColors?: string; voltageStandard?: string };
  const convention = settings.phaseColors === 'iec-60445' ? ('iec-60445' as const) : ('north-american' as const);
  const standardLabel = results.drawn?.standard.label ?? (settings.voltageStandard === 'iec-60038' ? 'IEC 60038 (±10 % of nominal)' : 'ANSI C84.1 (Range A normal, Range B tolerable)');
  const caseLabel = ui.trialChanges.length ? 'Trial (not saved)' : shownWhatIf ? `What-if: ${shownWhatIf.name}` : 'Base case';
  const chooserTitle = ui.chooser
    ? ui.chooser.kind === 'connection'
      ? 'Which conductor of the connection?'
      : `Which ${ui.chooser.kind === 'breaker' ? 'pole' : 'conductor'} of ${nameOf(ui.chooser.elementId)}?`
    : '';
  // Cursors are per tab: a colleague's two tabs (or this person's other one) each show theirs.
  const others = useMemo(() => tabs.filter((m) => !m.self), [tabs]);
  const chooserOpen = useMemo(() => {
    const c = ui.chooser;
    const out = new Set<string>();
    if (!c) return out;
    if (c.kind === 'run') for (const k of results.drawn?.openConductors ?? documentOpen) if (k.startsWith(`${c.elementId}|`)) out.add(k.split('|')[1]);
    if (c.kind === 'breaker') for (const p of ['A', 'B', 'C']) if (snapshot.elements.get(c.elementId)?.[`pole${p}`] === 'open') out.add(p);
    return out;
  }, [ui.chooser, results.drawn, documentOpen, snapshot]);

  return {
    ready: !!handle,
    editable,
    ui,
    results,
    link,
    crew,
    others,
    history,
    scene,
    view,
    snapshot,
    inspector,
    changeDestination,
    resultsPanel,
    errorIds,
    documentOpen,
    convention,
    standardLabel,
    caseLabel,
    chooserTitle,
    chooserOpen,
    caution: shown?.caution ?? CAUTION,
    assumptions: shown?.assumptions ?? [],
  };
}

export type EditorView = ReturnType<typeof useEditorView>;
