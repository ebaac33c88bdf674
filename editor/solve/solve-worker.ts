// The Web Worker entry: answers solve requests off the main thread, and runs long studies (a second instance of
// this worker, so the drawing keeps solving meanwhile). Bundled by esbuild into the web build
// (server/web-build.ts) as /solve-worker.js; it imports only the solver and the sheet format.
import { runSolve } from './run-solve';
import type { SolveRequest } from './solve-request';
import { runStudy, type StudyHelpers } from './run-study';
import { isStudyRequest, type StudyRequest } from './study-request';
import { isShareRequest, runShareRequest, type ShareRequest, type ShareWorkerLike } from './sweep-shares';

const scope = self as unknown as {
  onmessage: ((e: MessageEvent<SolveRequest | StudyRequest | ShareRequest>) => void) | null;
  postMessage(message: unknown): void;
  location?: { href: string };
  navigator?: { hardwareConcurrency?: number };
};

// A study worker may start helpers from its own script for a big break sweep (sweep-shares.ts).
const helpers: StudyHelpers | undefined =
  typeof Worker !== 'undefined' && scope.location ? { cores: scope.navigator?.hardwareConcurrency, makeWorker: () => new Worker(scope.location!.href) as unknown as ShareWorkerLike } : undefined;

scope.onmessage = (event) => {
  const data = event.data;
  if (isStudyRequest(data)) {
    void runStudy(data, (message) => scope.postMessage(message), undefined, helpers);
    return;
  }
  if (isShareRequest(data)) {
    runShareRequest(data, (message) => scope.postMessage(message));
    return;
  }
  try {
    scope.postMessage(runSolve(data, 'worker'));
  } catch (error) {
    scope.postMessage({ id: data.id, failed: String((error as Error)?.message ?? error) });
  }
};
