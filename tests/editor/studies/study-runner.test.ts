// The fault study run as the editor runs it: through the study runner and a worker (here an in-process one that
// hands messages over one task at a time, like a real worker), with progress, the answer, cancel, a study that
// replaces one still running, the fallback to the main thread, and the study session's stale mark and case on show.
import { afterEach, describe, expect, it } from 'vitest';
import { faultStudy } from '../../../solver';
import { runStudy } from '../../../editor/solve/run-study';
import { StudyRunner, type StudyWorkerLike } from '../../../editor/solve/study-runner';
import type { StudyMessage, StudyRequest } from '../../../editor/solve/study-request';
import { SheetSession } from '../../../editor/session/sheet-session';
import { writeSheet } from '../../../editor/document/sheet-doc';
import { StudySession, shownFaultKey, shownOpeningKey } from '../../../editor/studies/study-session';
import { demoSheet } from '../support/fixtures';

const sheet = demoSheet('larkspur-row.json');

/** A worker in this process: runs the study when posted to, then delivers its messages one task apart. */
function fakeWorker(log: string[]) {
  const worker: StudyWorkerLike & { terminated: boolean } = {
    terminated: false,
    onmessage: null,
    onerror: null,
    postMessage(message: unknown) {
      const queue: StudyMessage[] = [];
      runStudy(message as StudyRequest, (m) => queue.push(m));
      const next = () => {
        const m = queue.shift();
        if (!m || worker.terminated) return;
        log.push(m.type);
        worker.onmessage?.({ data: m });
        setTimeout(next, 0);
      };
      setTimeout(next, 0);
    },
    terminate() {
      worker.terminated = true;
    },
  };
  return worker;
}

const settle = (ms = 5) => new Promise((r) => setTimeout(r, ms));
async function until(check: () => boolean, what: string) {
  for (let i = 0; i < 400; i++) {
    if (check()) return;
    await settle(5);
  }
  throw new Error(`timed out waiting for ${what}`);
}

function runnerWith(workers: ReturnType<typeof fakeWorker>[], log: string[], url: string | undefined = 'x.js') {
  const events: string[] = [];
  let result: StudyMessage | null = null;
  const runner = new StudyRunner({
    workerUrl: url || undefined,
    createWorker: () => {
      const w = fakeWorker(log);
      workers.push(w);
      return w;
    },
    onProgress: (id, done, total) => events.push(`progress ${id} ${done}/${total}`),
    onDone: (id, m, where) => {
      events.push(`done ${id} ${where}`);
      result = m;
    },
    onFailed: (id, e) => events.push(`failed ${id} ${e.message}`),
    onCancelled: (id) => events.push(`cancelled ${id}`),
  });
  return { runner, events, result: () => result as Extract<StudyMessage, { type: 'study-done' }> | null };
}

const request = { type: 'study' as const, study: 'fault' as const, sheet, transformerTolerance: false };

describe('the study runner', () => {
  it('reports the last progress as every bus done and answers what the solver answers', async () => {
    const workers: ReturnType<typeof fakeWorker>[] = [];
    const { runner, events, result } = runnerWith(workers, []);
    const id = runner.start(request);
    await until(() => events.some((e) => e.startsWith('done')), 'the answer');
    const buses = Object.values(sheet.elements).filter((e) => e.kind === 'bus').length;
    expect(events.filter((e) => e.startsWith('progress')).at(-1)).toBe(`progress ${id} ${buses}/${buses}`);
    expect(events.at(-1)).toBe(`done ${id} worker`);
    const direct = faultStudy(sheet);
    if (!direct.ok) throw new Error(direct.error.message);
    expect((result()!.result as typeof direct.study).cases).toEqual(direct.study.cases);
    expect(workers[0].terminated).toBe(true); // ended once it answered
    expect(runner.busy).toBe(false);
  });

  it('cancels by ending the worker: no answer arrives afterwards', async () => {
    const workers: ReturnType<typeof fakeWorker>[] = [];
    const log: string[] = [];
    const { runner, events } = runnerWith(workers, log);
    const id = runner.start(request);
    runner.cancel();
    await settle(40);
    expect(workers[0].terminated).toBe(true);
    expect(events).toEqual([`cancelled ${id}`]);
    expect(log).toEqual([]);
  });

  it('a new study replaces one still running, whose late messages are dropped', async () => {
    const workers: ReturnType<typeof fakeWorker>[] = [];
    const { runner, events } = runnerWith(workers, []);
    const first = runner.start(request);
    const second = runner.start({ ...request, transformerTolerance: true });
    await until(() => events.some((e) => e.startsWith('done')), 'the answer');
    expect(events[0]).toBe(`cancelled ${first}`);
    expect(events.filter((e) => e.includes(` ${first} `) && !e.startsWith('cancelled'))).toEqual([]);
    expect(events.at(-1)).toBe(`done ${second} worker`);
  });

  it('runs on the main thread when there is no worker', async () => {
    const { runner, events } = runnerWith([], [], '');
    const id = runner.start(request);
    expect(events).toEqual([]); // not before the page has shown that it started
    await until(() => events.some((e) => e.startsWith('done')), 'the answer');
    expect(events.at(-1)).toBe(`done ${id} main`);
  });
});

describe('the study session', () => {
  const open: { destroy(): void }[] = [];
  afterEach(() => open.splice(0).forEach((x) => x.destroy()));

  function sessionWithStudies() {
    const session = new SheetSession({ sheetId: 's', wsBase: '', editable: true, user: { id: 'u1', name: 'Rosa' }, solveMode: 'main', workerUrl: 'x.js' });
    session.doc.transact(() => writeSheet(session.doc, sheet), 'seed');
    const said: string[] = [];
    const studies = new StudySession(session, (t) => said.push(t), () => fakeWorker([]));
    open.push(studies, session);
    return { session, studies, said };
  }

  it('runs the study on the sheet as it reads, then marks it stale when the sheet changes', async () => {
    const { session, studies } = sessionWithStudies();
    studies.runFaultStudy();
    expect(studies.store.get().fault.status).toBe('running');
    await until(() => studies.store.get().fault.status === 'done', 'the study');
    const f = studies.store.get().fault;
    expect(f.result!.cases.length).toBe(50);
    expect(f.stale).toBe(false);
    session.commands.setField('elements', 'house-panel', ['name'], 'House panel (renamed)');
    expect(studies.store.get().fault.stale).toBe(true);
  });

  it('runs with the transformer tolerance when asked, giving larger currents', async () => {
    const { studies } = sessionWithStudies();
    studies.runFaultStudy();
    await until(() => studies.store.get().fault.status === 'done', 'the study');
    const nameplate = studies.store.get().fault.result!.cases[0].symmetricalKa!;
    studies.setTransformerTolerance(true);
    studies.runFaultStudy();
    await until(() => studies.store.get().fault.status === 'done' && studies.store.get().fault.ranWithTolerance, 'the study');
    // A smaller transformer impedance lets more current through (common practice, no source).
    expect(studies.store.get().fault.result!.cases[0].symmetricalKa!).toBeGreaterThan(nameplate);
  });

  it('shows a case on the drawing as a one-fault trial over the base case, and clears it', () => {
    const { session, studies, said } = sessionWithStudies();
    session.ui.set({ whatIfId: 'some-what-if' });
    studies.showFaultCase({ busId: 'apt-3', busName: 'Apartment 3', faultType: 'line-to-ground' });
    const ui = session.ui.get();
    expect(ui.whatIfId).toBeNull();
    expect(ui.trialChanges).toEqual([{ kind: 'shunt-fault', busId: 'apt-3', faultType: 'line-to-ground', to: 'PE', faultOhms: 0, faultReactanceOhms: 0 }]);
    expect(shownFaultKey(ui.trialChanges)).toBe('apt-3|line-to-ground');
    expect(said.at(-1)).toContain('Line to ground fault at Apartment 3');
    studies.clearCase();
    expect(shownFaultKey(session.ui.get().trialChanges)).toBeNull();
  });
});

describe('the study session query', () => {
  it('sorts on a first tap by the column’s own first direction, reverses on a second, and toggles filters', () => {
    const session = new SheetSession({ sheetId: 's', wsBase: '', editable: true, user: { id: 'u1', name: 'Rosa' }, solveMode: 'main' });
    const studies = new StudySession(session, () => {});
    try {
      studies.sortFaultsBy('symmetricalKa');
      expect(studies.store.get().faultQuery.sort).toEqual({ key: 'symmetricalKa', direction: 'descending' });
      studies.sortFaultsBy('symmetricalKa');
      expect(studies.store.get().faultQuery.sort).toEqual({ key: 'symmetricalKa', direction: 'ascending' });
      studies.sortFaultsBy('status');
      expect(studies.store.get().faultQuery.sort).toEqual({ key: 'status', direction: 'ascending' });
      studies.toggleFaultFilter('faultType', 'three-phase');
      studies.toggleFaultFilter('faultType', 'line-to-ground');
      expect(studies.store.get().faultQuery.only.faultType).toEqual(['three-phase', 'line-to-ground']);
      studies.toggleFaultFilter('faultType', 'three-phase');
      expect(studies.store.get().faultQuery.only.faultType).toEqual(['line-to-ground']);
    } finally {
      studies.destroy();
      session.destroy();
    }
  });
});

describe('a case with no figures', () => {
  it('is not put on the drawing; the reason is said instead', () => {
    const session = new SheetSession({ sheetId: 's', wsBase: '', editable: true, user: { id: 'u1', name: 'Rosa' }, solveMode: 'main' });
    const said: string[] = [];
    const studies = new StudySession(session, (t) => said.push(t));
    try {
      studies.showFaultCase({ busId: 'apt-3', busName: 'Apartment 3', faultType: 'three-phase', problem: 'the bus has 2 phases' });
      expect(session.ui.get().trialChanges).toEqual([]);
      expect(said).toEqual(['No figures for this case: the bus has 2 phases']);
    } finally {
      studies.destroy();
      session.destroy();
    }
  });
});

describe('the break sweep through the study session', () => {
  it('runs in the worker, and a row shown puts that one opening on the drawing', async () => {
    const session = new SheetSession({ sheetId: 's', wsBase: '', editable: true, user: { id: 'u1', name: 'Rosa' }, solveMode: 'main', workerUrl: 'x.js' });
    session.doc.transact(() => writeSheet(session.doc, sheet), 'seed');
    const studies = new StudySession(session, () => {}, () => fakeWorker([]));
    try {
      studies.setSweepConductors('neutrals');
      studies.runBreakSweep();
      await until(() => studies.store.get().sweep.status === 'done', 'the sweep');
      const result = studies.store.get().sweep.result!;
      const runsWithNeutral = Object.values(sheet.elements).filter((e) => e.kind === 'run' && e.conductors.N && !e.conductors.N.open).length;
      expect(result.total).toBe(runsWithNeutral);
      expect(studies.store.get().fault.status).toBe('idle'); // the other studies are untouched
      const worst = result.cases[0];
      studies.showChanges([worst.change], 'worst');
      expect(shownOpeningKey(session.ui.get().trialChanges)).toBe(`${worst.runId}|N`);
    } finally {
      studies.destroy();
      session.destroy();
    }
  });
});

describe('the readings match through the study session', () => {
  it('ranks causes on apartment 4’s supply from two of its readings and shows the best candidate on the drawing', async () => {
    // Synthetic readings: the voltages the open-neutral what-if gives at two of apartment 4's loads.
    const { solveSheet } = await import('../../../solver');
    const open = solveSheet(sheet, { whatIfId: 'open-apt-4-neutral' });
    if (!open.ok) throw new Error(open.error.message);
    const at = (id: string) => open.result.loads.find((l) => l.loadId === id)!.elements[0].volts;
    const session = new SheetSession({ sheetId: 's', wsBase: '', editable: true, user: { id: 'u1', name: 'Rosa' }, solveMode: 'main', workerUrl: 'x.js' });
    session.doc.transact(() => writeSheet(session.doc, sheet), 'seed');
    const said: string[] = [];
    const studies = new StudySession(session, (t) => said.push(t), () => fakeWorker([]));
    try {
      studies.runReadingsMatch([
        { at: { kind: 'load', loadId: 'apt-4-lights' }, volts: at('apt-4-lights') },
        { at: { kind: 'load', loadId: 'apt-4-kitchen' }, volts: at('apt-4-kitchen') },
      ]);
      await until(() => studies.store.get().match.status !== 'running', 'the match');
      const m = studies.store.get().match;
      expect(m.status, m.error?.message).toBe('done');
      expect(m.result!.groups.length).toBeGreaterThan(0);
      expect(m.result!.best).toBe(m.result!.groups[0].candidates[0]);
      // Every candidate the match names lies on apartment 4's supply path (its feeder, its loads' lugs, the service).
      for (const c of m.result!.groups[0].candidates) expect(c.description).toMatch(/apt-4|service-lateral/);
      // The best is on the drawing at once, as a trial: its cause and its fitted load level.
      const trial = session.ui.get().trialChanges;
      expect(trial).toEqual(Object.values(m.result!.best!.changes));
      expect(said.at(-1)).toContain('Best match');
    } finally {
      studies.destroy();
      session.destroy();
    }
  });
});
