// The Web Worker entry: answers solve requests off the main thread, and runs long studies (a second instance of
// this worker, so the drawing keeps solving meanwhile). Bundled by esbuild into the web build
// (server/web-build.ts) as /solve-worker.js; it imports only the solver and the sheet format.
import { runSolve } from './run-solve';
import type { SolveRequest } from './solve-request';
import { runStudy } from './run-study';
import { isStudyRequest, type StudyRequest } from './study-request';

const scope = self as unknown as { onmessage: ((e: MessageEvent<SolveRequest | StudyRequest>) => void) | null; postMessage(message: unknown): void };

scope.onmessage = (event) => {
  const data = event.data;
  if (isStudyRequest(data)) {
    runStudy(data, (message) => scope.postMessage(message));
    return;
  }
  try {
    scope.postMessage(runSolve(data, 'worker'));
  } catch (error) {
    scope.postMessage({ id: data.id, failed: String((error as Error)?.message ?? error) });
  }
};
