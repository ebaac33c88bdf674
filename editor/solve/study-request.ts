// The messages between the editor and a long study (run in its own Web Worker so that the drawing keeps solving):
// which study on which sheet, progress while it runs, and the answer. A study is cancelled by ending its worker.
import type { Sheet } from '../../shared/sheet';
import type { FaultStudyResult, SolveFailure } from '../../solver';

export interface FaultStudyRequest {
  type: 'study';
  study: 'fault';
  id: number;
  sheet: Sheet;
  /** Transformer impedances at nameplate × (1 − 0.075), for the maximum duty. */
  transformerTolerance: boolean;
}

export type StudyRequest = FaultStudyRequest;

export type StudyResultOf<R extends StudyRequest> = R extends FaultStudyRequest ? FaultStudyResult : never;

export type StudyMessage =
  | { type: 'study-progress'; id: number; done: number; total: number }
  | { type: 'study-done'; id: number; study: 'fault'; result: FaultStudyResult; ms: number }
  | { type: 'study-failed'; id: number; error: SolveFailure };

export function isStudyRequest(data: unknown): data is StudyRequest {
  return typeof data === 'object' && data !== null && (data as { type?: unknown }).type === 'study';
}
