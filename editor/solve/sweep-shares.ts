// A big break sweep split across Web Workers: the study worker sweeps share 0 and starts one helper worker (this
// same script) per other share; each helper builds and factors the base case itself and answers with its cases
// (solver/studies/shared-sweep.ts gathers them and refines the worst). The messages between the two live here.
import type { Sheet } from '../../shared/sheet';
import { breakSweepSync, type BreakSweepOptions, type BreakSweepResult, type ShareRunner, type StudyOutcome } from '../../solver';

export interface ShareRequest {
  type: 'sweep-share';
  sheet: Sheet;
  /** Plain options (shareOptions of the study's): share, conductors, no refinement. */
  options: BreakSweepOptions;
}

export type ShareMessage =
  | { type: 'share-started' }
  | { type: 'share-progress'; done: number; total: number }
  | { type: 'share-done'; outcome: StudyOutcome<BreakSweepResult> };

export interface ShareWorkerLike {
  postMessage(message: unknown): void;
  terminate(): void;
  onmessage: ((e: { data: unknown }) => void) | null;
  onerror: ((e: unknown) => void) | null;
}

/** Below this many runs a sweep takes well under a second in one worker: a helper's start costs more than it saves. */
export const SHARED_SWEEP_MIN_RUNS = 250;
const MAX_SHARES = 4;

export function isShareRequest(data: unknown): data is ShareRequest {
  return typeof data === 'object' && data !== null && (data as { type?: unknown }).type === 'sweep-share';
}

/**
 * How many shares a sweep of this sheet takes on a machine of `cores` logical cores: half of them, leaving the
 * page and the collectors theirs, up to four. On 2 cores one worker alone was faster (the 1,000-bus building:
 * 2.6 s against 3.3 s in two shares, each share's cold build and factorization competing with the other's).
 */
export function sharesFor(sheet: Sheet, cores: number | undefined): number {
  let runs = 0;
  for (const e of Object.values(sheet.elements)) if (e.kind === 'run') runs++;
  if (runs < SHARED_SWEEP_MIN_RUNS || !cores) return 1;
  return Math.max(1, Math.min(MAX_SHARES, Math.floor(cores / 2)));
}

/** In a helper: sweep the share asked for, reporting progress at most every `everyMs`. */
export function runShareRequest(request: ShareRequest, post: (message: ShareMessage) => void, everyMs = 250): void {
  post({ type: 'share-started' });
  let last = -Infinity;
  let outcome: StudyOutcome<BreakSweepResult>;
  try {
    outcome = breakSweepSync(request.sheet, {
      ...request.options,
      onProgress: ({ done, total }) => {
        const now = performance.now();
        if (now - last < everyMs) return;
        last = now;
        post({ type: 'share-progress', done, total });
      },
    });
  } catch (error) {
    outcome = { ok: false, error: { code: 'internal', message: `a share of the sweep failed unexpectedly: ${(error as Error).message}`, elementIds: [] } };
  }
  post({ type: 'share-done', outcome });
}

/** In the study worker: each other share goes to a helper worker of its own, ended once it has answered. */
export function workerShareRunner(sheet: Sheet, makeWorker: () => ShareWorkerLike): ShareRunner {
  return (_share, options, onProgress) => {
    let started = () => {};
    const startedPromise = new Promise<void>((resolve) => (started = resolve));
    const outcome = new Promise<StudyOutcome<BreakSweepResult>>((resolve, reject) => {
      const worker = makeWorker();
      worker.onmessage = (e) => {
        const m = e.data as ShareMessage;
        if (m.type === 'share-started') return started();
        if (m.type === 'share-progress') return onProgress(m.done, m.total);
        worker.terminate();
        resolve(m.outcome);
      };
      worker.onerror = (e) => {
        worker.terminate();
        reject(new Error(`the helper worker failed: ${(e as { message?: string })?.message ?? 'it did not start'}`));
      };
      // Functions and signals do not cross to a worker; the helper sweeps plain options.
      const { onProgress: _p, signal: _s, ...plain } = options;
      worker.postMessage({ type: 'sweep-share', sheet, options: plain } satisfies ShareRequest);
    });
    return { started: startedPromise, outcome };
  };
}
