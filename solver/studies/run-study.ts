// Running a study in slices: in one go (Node, worker threads, Web Workers) or yielding to the event loop between
// slices (a UI thread), reporting progress after each slice and stopping between cases when the signal aborts.
import type { StudyOutcome, StudyRunOptions, StudyProgress } from './study-types';

export const DEFAULT_SLICE_MS = 12;

export interface SlicedStudy<R> {
  readonly finished: boolean;
  runSlice(ms: number, signal?: AbortSignal): void;
  progress(): StudyProgress;
  result(cancelled: boolean): R;
}

const failure = (what: string, error: unknown) => ({
  ok: false as const,
  error: { code: 'internal' as const, message: `the ${what} failed unexpectedly: ${(error as Error).message}`, elementIds: [] },
});

export function runSync<R>(what: string, prepare: () => StudyOutcome<SlicedStudy<R>>, options: StudyRunOptions): StudyOutcome<R> {
  try {
    const prepared = prepare();
    if (!prepared.ok) return prepared;
    const study = prepared.value;
    while (!study.finished && !options.signal?.aborted) {
      study.runSlice(options.sliceMs ?? DEFAULT_SLICE_MS, options.signal);
      options.onProgress?.(study.progress());
    }
    return { ok: true, value: study.result(!study.finished) };
  } catch (error) {
    return failure(what, error);
  }
}

const yieldToEventLoop = (): Promise<void> => new Promise((resolve) => setTimeout(resolve, 0));

export async function runAsync<R>(what: string, prepare: () => StudyOutcome<SlicedStudy<R>>, options: StudyRunOptions): Promise<StudyOutcome<R>> {
  try {
    const prepared = prepare();
    if (!prepared.ok) return prepared;
    const study = prepared.value;
    while (!study.finished && !options.signal?.aborted) {
      study.runSlice(options.sliceMs ?? DEFAULT_SLICE_MS, options.signal);
      options.onProgress?.(study.progress());
      if (!study.finished) await yieldToEventLoop();
    }
    return { ok: true, value: study.result(!study.finished) };
  } catch (error) {
    return failure(what, error);
  }
}
