// A big break sweep as the study worker runs it with helper workers (here in-process ones that hand their messages
// over a task apart, as a real worker does): the same answer as the one-thread sweep, a share per two cores,
// each helper ended once it has answered; a helper that does not start leaves its share to the study worker; and small
// sheets, or a single core, do not split.
import { describe, expect, it } from 'vitest';
import { breakSweepSync, type BreakSweepResult } from '../../../solver';
import { buildingSheet } from '../../../solver/bench/building-sheet';
import { runStudy } from '../../../editor/solve/run-study';
import type { StudyMessage } from '../../../editor/solve/study-request';
import { SHARED_SWEEP_MIN_RUNS, runShareRequest, sharesFor, type ShareMessage, type ShareRequest, type ShareWorkerLike } from '../../../editor/solve/sweep-shares';
import { demoSheet } from '../support/fixtures';

function helperWorker(log: string[], broken = false) {
  const worker: ShareWorkerLike & { terminated: boolean } = {
    terminated: false,
    onmessage: null,
    onerror: null,
    postMessage(message: unknown) {
      if (broken) {
        setTimeout(() => worker.onerror?.({ message: 'no such script' }), 0);
        return;
      }
      log.push('helper asked');
      const queue: ShareMessage[] = [];
      runShareRequest(message as ShareRequest, (m) => queue.push(m), 0);
      const next = () => {
        const m = queue.shift();
        if (!m || worker.terminated) return;
        worker.onmessage?.({ data: m });
        setTimeout(next, 0);
      };
      setTimeout(next, 0);
    },
    terminate() {
      worker.terminated = true;
      log.push('helper ended');
    },
  };
  return worker;
}

const key = (c: BreakSweepResult['cases'][number]) => `${c.runId} ${c.conductor}`;

describe('break sweep across helper workers', () => {
  // our own generated building, above the size at which the sweep splits
  const sheet = buildingSheet(SHARED_SWEEP_MIN_RUNS + 20, 2);

  it('splits by core count only for big sheets', () => {
    expect(sharesFor(sheet, 2)).toBe(1);
    expect(sharesFor(sheet, 4)).toBe(2);
    expect(sharesFor(sheet, 8)).toBe(4);
    expect(sharesFor(sheet, 16)).toBe(4);
    expect(sharesFor(sheet, 1)).toBe(1);
    expect(sharesFor(sheet, undefined)).toBe(1);
    expect(sharesFor(demoSheet('larkspur-row.json'), 8)).toBe(1);
  });

  for (const broken of [false, true]) {
    it(broken ? 'a helper that does not start leaves its share to the study worker' : 'four cores: one helper, the one-thread answer', async () => {
      const log: string[] = [];
      const messages: StudyMessage[] = [];
      await runStudy({ type: 'study', study: 'break-sweep', id: 7, sheet, conductors: 'all' }, (m) => messages.push(m), undefined, {
        cores: 4,
        makeWorker: () => helperWorker(log, broken),
      });
      const done = messages.at(-1);
      if (done?.type !== 'study-done' || done.study !== 'break-sweep') throw new Error(`the sweep ended with ${JSON.stringify(done).slice(0, 300)}`);
      const whole = breakSweepSync(sheet, { conductors: 'all' });
      if (!whole.ok) throw new Error(whole.error.message);
      expect(done.result.total).toBe(whole.value.total);
      expect(done.result.cases.map(key).sort()).toEqual(whole.value.cases.map(key).sort());
      // the refined worst lead in the same order
      const refined = whole.value.cases.filter((c) => c.loadModel === 'sheet').length;
      expect(refined).toBeGreaterThan(0);
      expect(done.result.cases.slice(0, refined).map(key)).toEqual(whole.value.cases.slice(0, refined).map(key));
      expect(log).toEqual(broken ? ['helper ended'] : ['helper asked', 'helper ended']);
      const progress = messages.filter((m) => m.type === 'study-progress');
      for (const p of progress) if (p.type === 'study-progress') expect(p.done).toBeLessThanOrEqual(p.total);
    });
  }
});
