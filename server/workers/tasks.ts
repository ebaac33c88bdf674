// The jobs the server hands to its worker thread: solving a sheet for a revision, and rendering a report PDF.
import type { StudyResults } from '../revisions/study';
import type { ReportInput } from '../reports/report-input';

export interface Tasks {
  study: { input: { document: unknown; baseOnly?: boolean }; output: StudyResults };
  png: { input: { svg: string; width: number; height: number }; output: Uint8Array };
  report: { input: ReportInput; output: Uint8Array };
}

export type TaskName = keyof Tasks;

export interface TaskRequest<K extends TaskName = TaskName> {
  id: number;
  task: K;
  input: Tasks[K]['input'];
}

export type TaskReply = { id: number; ok: true; output: unknown } | { id: number; ok: false; message: string };
