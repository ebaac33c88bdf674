// Runs inside the worker thread: takes task requests from the server, answers each with its output or its error.
import { parentPort } from 'node:worker_threads';
import { runStudy } from '../revisions/study';
import { drawingPng } from '../exports/drawing-png';
import { renderReportPdf } from '../reports/report-pdf';
import type { TaskReply, TaskRequest, Tasks } from './tasks';

const handlers: { [K in keyof Tasks]: (input: Tasks[K]['input']) => Promise<Tasks[K]['output']> | Tasks[K]['output'] } = {
  study: (input) => runStudy(input.document, { baseOnly: input.baseOnly }),
  png: (input) => new Uint8Array(drawingPng(input.svg, input.width, input.height)),
  report: (input) => renderReportPdf(input),
};

parentPort?.on('message', async (req: TaskRequest) => {
  let reply: TaskReply;
  try {
    const output = await (handlers[req.task] as (input: unknown) => unknown)(req.input);
    reply = { id: req.id, ok: true, output };
  } catch (error) {
    reply = { id: req.id, ok: false, message: error instanceof Error ? (error.stack ?? error.message) : String(error) };
  }
  parentPort!.postMessage(reply);
});
