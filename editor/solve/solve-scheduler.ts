// Re-solves the sheet after every change: at most one solve runs at a time and only the newest request waits, so
// a burst of edits costs one solve. Tiny sheets are solved on the main thread (a worker's round trip costs more
// than their solve); larger ones in the Web Worker. `mode` forces one path (tests, the ?solveIn= parameter).
import type { Sheet, WhatIfChange } from '../../shared/sheet';
import type { ResultWarning } from '../../solver';
import { runSolve } from './run-solve';
import type { SolveReply, SolveRequest } from './solve-request';

export type SolveMode = 'auto' | 'main' | 'worker';

/** Sheets with more elements than this are solved in the worker. */
export const MAIN_THREAD_MAX_ELEMENTS = 60;

export interface SolveInput {
  sheet: Sheet;
  readWarnings: ResultWarning[];
  whatIfId?: string;
  trialChanges: WhatIfChange[];
}

export interface SchedulerOptions {
  mode: SolveMode;
  /** Where the bundled worker is served; no URL (or no Worker support) means the main thread only. */
  workerUrl?: string;
  onReply: (reply: SolveReply, input: SolveInput, requestedAt: number) => void;
  onError?: (message: string) => void;
}

interface WorkerLike {
  postMessage(message: unknown): void;
  terminate(): void;
  onmessage: ((e: MessageEvent) => void) | null;
  onerror: ((e: unknown) => void) | null;
}

export class SolveScheduler {
  private nextId = 1;
  private running: { id: number; input: SolveInput; at: number } | null = null;
  private pending: { input: SolveInput; at: number } | null = null;
  private worker: WorkerLike | null = null;
  private workerBroken = false;
  private timer: ReturnType<typeof setTimeout> | null = null;
  private destroyed = false;

  constructor(private readonly options: SchedulerOptions) {}

  /** Asks for a solve of this input; replaces any request still waiting. */
  request(input: SolveInput): void {
    if (this.destroyed) return;
    this.pending = { input, at: performance.now() };
    if (this.running || this.timer) return;
    // The worker takes it at once (the page then redraws what changed while the worker solves); a solve here waits
    // for the current task to end, so a burst of changes in one task costs one solve.
    if (this.placeFor(Object.keys(input.sheet.elements).length) === 'worker') this.startNext();
    else this.timer = setTimeout(() => this.startNext(), 0);
  }

  /** Where a sheet of this size is solved now. */
  placeFor(elementCount: number): 'main' | 'worker' {
    if (this.workerBroken || !this.options.workerUrl || typeof Worker === 'undefined') return 'main';
    if (this.options.mode === 'main') return 'main';
    if (this.options.mode === 'worker') return 'worker';
    return elementCount > MAIN_THREAD_MAX_ELEMENTS ? 'worker' : 'main';
  }

  destroy(): void {
    this.destroyed = true;
    if (this.timer) clearTimeout(this.timer);
    this.worker?.terminate();
    this.worker = null;
  }

  private startNext() {
    this.timer = null;
    if (this.destroyed || this.running || !this.pending) return;
    const { input, at } = this.pending;
    this.pending = null;
    const id = this.nextId++;
    const request: SolveRequest = { id, sheet: input.sheet, whatIfId: input.whatIfId, trialChanges: input.trialChanges, readWarnings: input.readWarnings };
    this.running = { id, input, at };
    if (this.placeFor(Object.keys(input.sheet.elements).length) === 'worker' && this.ensureWorker()) {
      this.worker!.postMessage(request);
      return;
    }
    let reply: SolveReply;
    try {
      reply = runSolve(request, 'main');
    } catch (error) {
      this.running = null;
      this.options.onError?.(String((error as Error)?.message ?? error));
      this.startNext();
      return;
    }
    this.finish(reply);
  }

  private finish(reply: SolveReply) {
    const running = this.running;
    this.running = null;
    if (running && running.id === reply.id) this.options.onReply(reply, running.input, running.at);
    if (this.pending) this.startNext();
  }

  private ensureWorker(): boolean {
    if (this.worker) return true;
    try {
      const worker = new Worker(this.options.workerUrl!) as unknown as WorkerLike;
      worker.onmessage = (e: MessageEvent) => {
        const data = e.data as SolveReply | { id: number; failed: string };
        if ('failed' in data) {
          this.running = null;
          this.options.onError?.(data.failed);
          if (this.pending) this.startNext();
          return;
        }
        this.finish(data);
      };
      worker.onerror = () => {
        // The worker file is missing (a development server) or failed to start: solve here from now on.
        this.workerBroken = true;
        this.worker?.terminate();
        this.worker = null;
        const running = this.running;
        this.running = null;
        if (running && !this.pending) this.pending = { input: running.input, at: running.at };
        this.startNext();
      };
      this.worker = worker;
      return true;
    } catch {
      this.workerBroken = true;
      return false;
    }
  }
}
