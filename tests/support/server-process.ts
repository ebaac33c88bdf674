// The real server as a child process (for crash tests): started with tsx, ready when /api/health answers.
import { spawn, type ChildProcess } from 'node:child_process';
import path from 'node:path';

export interface ServerProcess {
  url: string;
  child: ChildProcess;
  output: () => string;
  kill(signal?: NodeJS.Signals): Promise<void>;
}

const root = path.resolve(__dirname, '../..');

export async function spawnServer(env: Record<string, string>, port: number, nodeArgs: string[] = []): Promise<ServerProcess> {
  const child = spawn(process.execPath, [...nodeArgs, '--import', 'tsx', 'server/main.ts'], {
    cwd: root,
    env: { ...process.env, PORT: String(port), SEED_DEMO: 'false', ...env },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  let out = '';
  child.stdout!.on('data', (d) => {
    out += d;
    if (process.env.PW_TRACE) process.stdout.write(d);
  });
  child.stderr!.on('data', (d) => (out += d));
  const url = `http://localhost:${port}`;
  const started = Date.now();
  for (;;) {
    if (child.exitCode !== null) throw new Error(`server exited early:\n${out}`);
    try {
      if ((await fetch(`${url}/api/health`)).ok) break;
    } catch {
      // not listening yet
    }
    if (Date.now() - started > 60_000) throw new Error(`server did not start:\n${out}`);
    await new Promise((r) => setTimeout(r, 100));
  }
  return {
    url,
    child,
    output: () => out,
    kill: (signal = 'SIGTERM') =>
      new Promise<void>((resolve) => {
        if (child.exitCode !== null || child.signalCode !== null) return resolve();
        child.once('exit', () => resolve());
        child.kill(signal);
      }),
  };
}
