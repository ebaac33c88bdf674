// Runs one study request and reports as it goes. The same function runs in the study worker and, where there is
// no worker, on the main thread. Progress is sent at most every 50 ms (and at the end), not after every bus.
import { faultStudy } from '../../solver';
import type { StudyMessage, StudyRequest } from './study-request';

export function runStudy(request: StudyRequest, post: (message: StudyMessage) => void, shouldCancel?: () => boolean): void {
  const started = performance.now();
  let lastPost = -Infinity;
  const onProgress = (done: number, total: number) => {
    const now = performance.now();
    if (done < total && now - lastPost < 50) return;
    lastPost = now;
    post({ type: 'study-progress', id: request.id, done, total });
  };
  try {
    const out = faultStudy(request.sheet, { transformerTolerance: request.transformerTolerance, onProgress, shouldCancel });
    if (!out.ok) post({ type: 'study-failed', id: request.id, error: out.error });
    else post({ type: 'study-done', id: request.id, study: 'fault', result: out.study, ms: performance.now() - started });
  } catch (error) {
    post({ type: 'study-failed', id: request.id, error: { code: 'internal', message: `the study failed unexpectedly: ${(error as Error).message}`, elementIds: [] } });
  }
}
