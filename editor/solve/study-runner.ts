// Runs one long study at a time in a worker of its own, beside the solve worker: progress comes back as it goes;
// cancelling ends that worker at once (a study in a busy loop cannot read a message) and the next study starts a
// fresh one. Without Worker support, or if the worker fails to start, the study runs on the main thread.
import type { SolveFailure } from '../../solver';
import { runStudy } from './run-study';
import type { StudyMessage, StudyRequest } from './study-request';

export interface StudyWorkerLike {
  postMessage(message: unknown): void;
  terminate(): void;
  onmessage: ((e: { data: unknown }) => void) | null;
  onerror: ((e: unknown) => void) | null;
}

export interface StudyRunnerOptions {
  workerUrl?: string;
  /** Makes the worker (tests give an in-process one). */
  createWorker?: (url: string) => StudyWorkerLike;
  onProgress: (id: number, done: number, total: number) => void;
  onDone: (id: number, message: Extract<StudyMessage, { type: 'study-done' }>, where: 'worker' | 'main') => void;
  onFailed: (id: number, error: SolveFailure) => void;
  onCancelled: (id: number) => void;
}

type Request = StudyRequest extends infer R ? (R extends StudyRequest ? Omit<R, 'id'> : never) : never;

export class StudyRunner {
  private nextId = 1;
  private running: { id: number; worker: StudyWorkerLike | null; timer: ReturnType<typeof setTimeout> | null } | null = null;
  private workerBroken = false;

  constructor(private readonly options: StudyRunnerOptions) {}

  get busy(): boolean {
    return this.running !== null;
  }

  /** Starts a study; one already running is cancelled first. Returns the new study's id. */
  start(request: Request): number {
    if (this.running) this.cancel();
    const id = this.nextId++;
    const full = { ...request, id } as StudyRequest;
    const worker = this.makeWorker();
    if (worker) {
      this.running = { id, worker, timer: null };
      worker.onmessage = (e) => this.receive(id, e.data as StudyMessage, 'worker');
      worker.onerror = () => {
        // The worker did not start (no file on a development server): run it here instead.
        worker.terminate();
        this.workerBroken = true;
        if (this.running?.id === id) this.runHere(full);
      };
      worker.postMessage(full);
    } else this.runHere(full);
    return id;
  }

  cancel(): void {
    const running = this.running;
    if (!running) return;
    this.running = null;
    running.worker?.terminate();
    if (running.timer) clearTimeout(running.timer);
    this.options.onCancelled(running.id);
  }

  destroy(): void {
    const running = this.running;
    this.running = null;
    running?.worker?.terminate();
    if (running?.timer) clearTimeout(running.timer);
  }

  private makeWorker(): StudyWorkerLike | null {
    const url = this.options.workerUrl;
    if (!url || this.workerBroken) return null;
    try {
      if (this.options.createWorker) return this.options.createWorker(url);
      if (typeof Worker === 'undefined') return null;
      return new Worker(url) as unknown as StudyWorkerLike;
    } catch {
      this.workerBroken = true;
      return null;
    }
  }

  /** On the main thread, after the current task (so the page shows that the study started). */
  private runHere(request: StudyRequest) {
    const slot = { id: request.id, worker: null, timer: null as ReturnType<typeof setTimeout> | null };
    this.running = slot;
    slot.timer = setTimeout(() => {
      slot.timer = null;
      runStudy(request, (m) => this.receive(request.id, m, 'main'), () => this.running?.id !== request.id);
    }, 0);
  }

  private receive(id: number, message: StudyMessage, where: 'worker' | 'main') {
    // A cancelled or replaced study's late messages are dropped.
    if (this.running?.id !== id || message.id !== id) return;
    if (message.type === 'study-progress') {
      this.options.onProgress(id, message.done, message.total);
      return;
    }
    const worker = this.running.worker;
    this.running = null;
    worker?.terminate();
    if (message.type === 'study-done') this.options.onDone(id, message, where);
    else this.options.onFailed(id, message.error);
  }
}
