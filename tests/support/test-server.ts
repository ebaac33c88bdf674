// Starts a real server on a free port with a fresh copy of the migrated template database.
import { cpSync, mkdtempSync, rmSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { readConfig } from '../../server/config';
import { startServer, type RunningServer } from '../../server/app';
import { freePort } from './free-port';

export interface TestServer extends RunningServer {
  dataDir: string;
  logs: string[];
  stop(options?: { keepData?: boolean }): Promise<void>;
}

export async function startTestServer(env: Record<string, string> = {}, dataDir?: string): Promise<TestServer> {
  const dir = dataDir ?? freshDataDir();
  // better-auth checks the Origin against PUBLIC_URL, so the port must be known before the server starts.
  const port = await freePort();
  const config = readConfig({ PORT: String(port), DATA_DIR: dir, SEED_DEMO: 'false', ...env });
  const logs: string[] = [];
  const server = await startServer(config, (line) => logs.push(line));
  return {
    ...server,
    logs,
    dataDir: dir,
    async stop(options = {}) {
      await server.close();
      if (!options.keepData) rmSync(dir, { recursive: true, force: true });
    },
  };
}

export function freshDataDir(): string {
  const template = process.env.PW_TEMPLATE_DATA_DIR;
  const dir = mkdtempSync(path.join(os.tmpdir(), 'pw-test-'));
  if (template) cpSync(template, dir, { recursive: true });
  return dir;
}

