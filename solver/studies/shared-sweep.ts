// A break sweep split into shares run side by side (Web Workers, worker threads): every share builds and factors
// the same base case, sweeps every count-th case, and this thread, which sweeps share 0 meanwhile, gathers the
// others' cases and then refines the worst of them all with the load laws, so the answer is the one-thread
// sweep's. The solver knows nothing of threads: the caller says how another share is run.
import type { Sheet } from '../../shared/sheet';
import { BreakSweeper, breakSweepSync } from './break-sweep';
import { DEFAULT_SLICE_MS } from './run-study';
import type { BreakSweepOptions, BreakSweepResult, StudyOutcome, SweepShare } from './study-types';

/**
 * Sweeps one share elsewhere (its own refinement off), reporting its progress: `started` settles once the share is
 * under way there, `outcome` with its cases.
 */
export type ShareRunner = (
  share: SweepShare,
  options: BreakSweepOptions,
  onProgress: (done: number, total: number) => void,
) => { started: Promise<void>; outcome: Promise<StudyOutcome<BreakSweepResult>> };

/** How long share 0 waits for the others to be under way before it starts its own. */
const START_WAIT_MS = 3000;

/** The options a share runs with: the caller's, its share, and no refinement (share 0 refines them all). */
export function shareOptions(options: BreakSweepOptions, share: SweepShare): BreakSweepOptions {
  return { conductors: options.conductors, loadModel: options.loadModel, rankBy: options.rankBy, share, refineWorst: 0 };
}

/**
 * The sweep in `count` shares, share 0 here and the others through `runShare`. A share that fails elsewhere is
 * swept here instead, so a lost thread costs time, not cases. The same result as breakSweepSync, up to the
 * rounding of the base solve each share repeats.
 */
export async function breakSweepInShares(sheet: Sheet, options: BreakSweepOptions, count: number, runShare: ShareRunner): Promise<StudyOutcome<BreakSweepResult>> {
  if (count <= 1) return breakSweepSync(sheet, options);
  const progress = Array.from({ length: count }, () => ({ done: 0, total: 0 }));
  const report = () => {
    const done = progress.reduce((s, p) => s + p.done, 0);
    // Before a share has reported, count it as large as this one.
    const total = progress.reduce((s, p) => s + (p.total || progress[0].total), 0);
    options.onProgress?.({ done, total });
  };
  const runs = Array.from({ length: count - 1 }, (_, i) => {
    const share = { index: i + 1, count };
    try {
      return runShare(share, shareOptions(options, share), (done, total) => {
        progress[share.index] = { done, total };
        report();
      });
    } catch (error) {
      return { started: Promise.resolve(), outcome: Promise.reject(error) };
    }
  });
  const others = runs.map((r) =>
    r.outcome.catch((error: unknown): StudyOutcome<BreakSweepResult> => ({ ok: false, error: { code: 'internal', message: String((error as Error)?.message ?? error), elementIds: [] } })),
  );
  // A worker started from a worker may need this thread's event loop to get going (a browser's nested worker
  // does): wait until each has begun (or failed, or a few seconds passed) before sweeping here.
  let timer: ReturnType<typeof setTimeout> | undefined;
  await Promise.race([
    Promise.all(runs.map((r, i) => Promise.race([r.started.catch(() => undefined), others[i]]))),
    new Promise<void>((resolve) => (timer = setTimeout(resolve, START_WAIT_MS))),
  ]);
  clearTimeout(timer);
  try {
    const prepared = BreakSweeper.prepare(sheet, { ...options, share: { index: 0, count } });
    if (!prepared.ok) return prepared;
    const sweeper = prepared.value;
    sweeper.hold();
    const slices = (until: () => boolean) => {
      while (!until() && !options.signal?.aborted) {
        sweeper.runSlice(options.sliceMs ?? DEFAULT_SLICE_MS, options.signal);
        progress[0] = sweeper.progress();
        report();
      }
    };
    slices(() => sweeper.swept);
    for (let i = 0; i < others.length; i++) {
      if (options.signal?.aborted) break;
      let outcome = await others[i];
      if (!outcome.ok) outcome = breakSweepSync(sheet, shareOptions(options, { index: i + 1, count }));
      if (!outcome.ok) return outcome;
      sweeper.absorb(outcome.value.cases, outcome.value.total);
      progress[i + 1] = { done: outcome.value.total, total: outcome.value.total };
    }
    sweeper.release();
    slices(() => sweeper.finished);
    return { ok: true, value: sweeper.result(!sweeper.finished) };
  } catch (error) {
    return { ok: false, error: { code: 'internal', message: `the break sweep failed unexpectedly: ${(error as Error).message}`, elementIds: [] } };
  }
}
