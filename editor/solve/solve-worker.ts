// The Web Worker entry: answers solve requests off the main thread. Bundled by esbuild into the web build
// (server/web-build.ts) as /solve-worker.js; it imports only the solver and the sheet format.
import { runSolve } from './run-solve';
import type { SolveRequest } from './solve-request';

const scope = self as unknown as { onmessage: ((e: MessageEvent<SolveRequest>) => void) | null; postMessage(message: unknown): void };

scope.onmessage = (event) => {
  try {
    scope.postMessage(runSolve(event.data, 'worker'));
  } catch (error) {
    scope.postMessage({ id: event.data.id, failed: String((error as Error)?.message ?? error) });
  }
};
