// Worker threads that run shares of a break sweep for the benchmark (breakSweepInShares' ShareRunner in Node).
import path from 'node:path';
import { Worker } from 'node:worker_threads';
import type { Sheet } from '../../shared/sheet';
import type { ShareRunner } from '../index';
import type { FromShareThread } from './sweep-share-thread';

export class ShareThreads {
  private readonly threads: Worker[];

  constructor(count: number) {
    // Threads do not inherit tsx's loader: a CommonJS stub registers it, then loads the TypeScript entry.
    const file = path.join(__dirname, 'sweep-share-thread.ts');
    this.threads = Array.from({ length: count }, () => new Worker(`require('tsx/cjs/api').register(); require(${JSON.stringify(file)});`, { eval: true }));
  }

  /** The runner for breakSweepInShares on `sheet`: share i goes to thread i − 1. */
  runner(sheet: Sheet): ShareRunner {
    // A thread runs without this one's event loop: a share is under way as soon as it is posted.
    return (share, options, onProgress) => ({
      started: Promise.resolve(),
      outcome: new Promise((resolve, reject) => {
        const thread = this.threads[share.index - 1];
        if (!thread) return reject(new Error(`no thread for share ${share.index}`));
        const onMessage = (m: FromShareThread) => {
          if (m.type === 'progress') return onProgress(m.done, m.total);
          thread.off('message', onMessage);
          thread.off('error', reject);
          resolve(m.outcome);
        };
        thread.on('message', onMessage);
        thread.once('error', reject);
        // Functions do not cross to a thread; the signal stays here (share 0 stops, the others finish unread).
        const { onProgress: _p, signal: _s, ...plain } = options;
        thread.postMessage({ sheet, options: plain });
      }),
    });
  }

  async close(): Promise<void> {
    await Promise.all(this.threads.map((t) => t.terminate()));
  }
}
