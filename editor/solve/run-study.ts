// Runs one study request and reports as it goes. The same function runs in the study worker and, where there is
// no worker, on the main thread. Progress is sent at most every 250 ms (and at the end), not after every case: each
// message redraws the studies panel, and on a big sheet a redraw can take longer than 50 ms, so faster messages
// queued up behind one another and held the answer back.
import { breakSweepInShares, breakSweepSync, faultStudy, readingsMatchSync, type SolveFailure } from '../../solver';
import type { StudyDone, StudyMessage, StudyRequest } from './study-request';
import { sharesFor, workerShareRunner, type ShareWorkerLike } from './sweep-shares';

const PROGRESS_EVERY_MS = 250;

type Outcome = { ok: true; result: StudyDone['result'] } | { ok: false; error: SolveFailure };

/** Where helper workers can be started (in the study worker): a big sweep is then split across them. */
export interface StudyHelpers {
  cores: number | undefined;
  makeWorker: () => ShareWorkerLike;
}

/**
 * Runs the request and posts its progress and answer. Synchronous, except a break sweep split across helper
 * workers, which returns a promise that settles once the answer is posted.
 */
export function runStudy(request: StudyRequest, post: (message: StudyMessage) => void, shouldCancel?: () => boolean, helpers?: StudyHelpers): void | Promise<void> {
  const started = performance.now();
  let lastPost = -Infinity;
  const onProgress = (done: number, total: number) => {
    const now = performance.now();
    if (done < total && now - lastPost < PROGRESS_EVERY_MS) return;
    lastPost = now;
    post({ type: 'study-progress', id: request.id, done, total });
  };
  // The sweep and the match stop on an aborted signal; here it is raised when asked to (main thread only: a worker
  // is ended instead).
  const controller = typeof AbortController !== 'undefined' ? new AbortController() : undefined;
  const signal = controller?.signal;
  const progress = ({ done, total }: { done: number; total: number }) => {
    if (shouldCancel?.()) controller?.abort();
    onProgress(done, total);
  };
  const finish = (out: Outcome) => {
    const ms = performance.now() - started;
    if (!out.ok) post({ type: 'study-failed', id: request.id, error: out.error });
    else post({ type: 'study-done', id: request.id, study: request.study, result: out.result, ms } as StudyDone);
  };
  const failed = (error: unknown) =>
    post({ type: 'study-failed', id: request.id, error: { code: 'internal', message: `the study failed unexpectedly: ${(error as Error).message}`, elementIds: [] } });
  const shares = request.study === 'break-sweep' && helpers ? sharesFor(request.sheet, helpers.cores) : 1;
  if (request.study === 'break-sweep' && helpers && shares > 1) {
    return breakSweepInShares(request.sheet, { conductors: request.conductors, onProgress: progress, signal }, shares, workerShareRunner(request.sheet, helpers.makeWorker))
      .then((r) => finish(r.ok ? { ok: true, result: r.value } : r))
      .catch(failed);
  }
  try {
    let out: Outcome;
    if (request.study === 'fault') {
      const r = faultStudy(request.sheet, { transformerTolerance: request.transformerTolerance, onProgress, shouldCancel });
      out = r.ok ? { ok: true, result: r.study } : r;
    } else if (request.study === 'break-sweep') {
      const r = breakSweepSync(request.sheet, { conductors: request.conductors, onProgress: progress, signal });
      out = r.ok ? { ok: true, result: r.value } : r;
    } else {
      const r = readingsMatchSync(request.sheet, request.readings, { conductors: request.conductors, onProgress: progress, signal });
      out = r.ok ? { ok: true, result: r.value } : r;
    }
    finish(out);
  } catch (error) {
    failed(error);
  }
}
