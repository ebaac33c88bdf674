// The messages between the editor and a long study (run in its own Web Worker so that the drawing keeps solving):
// which study on which sheet, progress while it runs, and the answer. A study is cancelled by ending its worker.
import type { Sheet } from '../../shared/sheet';
import type { BreakSweepResult, FaultStudyResult, Reading, ReadingsMatchResult, SolveFailure } from '../../solver';

export interface FaultStudyRequest {
  type: 'study';
  study: 'fault';
  id: number;
  sheet: Sheet;
  /** Transformer impedances at nameplate × (1 − 0.075), for the maximum duty. */
  transformerTolerance: boolean;
}

export interface BreakSweepRequest {
  type: 'study';
  study: 'break-sweep';
  id: number;
  sheet: Sheet;
  conductors: 'all' | 'neutrals';
}

export interface ReadingsMatchRequest {
  type: 'study';
  study: 'readings-match';
  id: number;
  sheet: Sheet;
  readings: Reading[];
  conductors: 'all' | 'neutrals';
}

export type StudyRequest = FaultStudyRequest | BreakSweepRequest | ReadingsMatchRequest;
export type StudyKind = StudyRequest['study'];

export interface StudyResults {
  fault: FaultStudyResult;
  'break-sweep': BreakSweepResult;
  'readings-match': ReadingsMatchResult;
}

export type StudyDone = { [K in StudyKind]: { type: 'study-done'; id: number; study: K; result: StudyResults[K]; ms: number } }[StudyKind];

export type StudyMessage =
  | { type: 'study-progress'; id: number; done: number; total: number }
  | StudyDone
  | { type: 'study-failed'; id: number; error: SolveFailure };

export function isStudyRequest(data: unknown): data is StudyRequest {
  return typeof data === 'object' && data !== null && (data as { type?: unknown }).type === 'study';
}
