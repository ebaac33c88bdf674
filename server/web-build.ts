// Builds the web export into dist/ when it is missing or its inputs changed (a content hash, not timestamps,
// so a fresh clone and a touched-but-unchanged file behave alike). Run directly: `tsx server/web-build.ts [--force]`.
import { spawnSync } from 'node:child_process';
import { createHash } from 'node:crypto';
import { existsSync, readdirSync, readFileSync, statSync, writeFileSync } from 'node:fs';
import path from 'node:path';

const root = path.resolve(__dirname, '..');
export const distDir = path.join(root, 'dist');
const stampFile = path.join(distDir, '.phasewright-build');
/** The solve worker's file in dist/ (served from the site root; the editor loads it from /solve-worker.js). */
export const WORKER_FILE = 'solve-worker.js';
const INPUT_DIRS = ['app', 'components', 'editor', 'solver', 'shared', 'assets'];
const INPUT_FILES = ['app.json', 'package-lock.json', 'tsconfig.json', 'babel.config.js', 'metro.config.js'];
const SKIP = new Set(['node_modules', 'fixtures', 'bench', 'README.md']);

function* files(dir: string): Generator<string> {
  if (!existsSync(dir)) return;
  for (const entry of readdirSync(dir, { withFileTypes: true }).sort((a, b) => a.name.localeCompare(b.name))) {
    if (SKIP.has(entry.name)) continue;
    const full = path.join(dir, entry.name);
    if (entry.isDirectory()) yield* files(full);
    else if (entry.isFile()) yield full;
  }
}

export function inputHash(): string {
  const hash = createHash('sha256');
  const all = [...INPUT_DIRS.flatMap((d) => [...files(path.join(root, d))]), ...INPUT_FILES.map((f) => path.join(root, f))];
  for (const file of all) {
    if (!existsSync(file) || !statSync(file).isFile()) continue;
    hash.update(path.relative(root, file)).update('\0').update(readFileSync(file)).update('\0');
  }
  return hash.digest('hex');
}

export function webBuildIsCurrent(): boolean {
  return existsSync(path.join(distDir, 'index.html')) && existsSync(path.join(distDir, WORKER_FILE)) && existsSync(stampFile) && readFileSync(stampFile, 'utf8').trim() === inputHash();
}

export function buildWeb(log: (line: string) => void = console.log): void {
  const started = Date.now();
  log('Building the web app (expo export) ...');
  const result = spawnSync('npx', ['expo', 'export', '--platform', 'web', '--output-dir', 'dist'], {
    cwd: root,
    stdio: 'inherit',
    env: { ...process.env, EXPO_OFFLINE: '1', CI: '1', EXPO_NO_TELEMETRY: '1' },
  });
  if (result.status !== 0) throw new Error(`expo export failed with exit code ${result.status}`);
  // Metro cannot bundle a Web Worker: esbuild bundles the solve worker (solver + sheet format) beside the export.
  const worker = spawnSync(
    path.join(root, 'node_modules', '.bin', 'esbuild'),
    [path.join('editor', 'solve', 'solve-worker.ts'), '--bundle', '--format=iife', '--target=es2020', '--minify', `--outfile=${path.join('dist', WORKER_FILE)}`, '--log-level=warning'],
    { cwd: root, stdio: 'inherit' },
  );
  if (worker.status !== 0) throw new Error(`bundling the solve worker failed with exit code ${worker.status}`);
  writeFileSync(stampFile, inputHash() + '\n');
  log(`Web app built in ${((Date.now() - started) / 1000).toFixed(1)} s`);
}

export function ensureWebBuild(options: { force?: boolean; log?: (line: string) => void } = {}): void {
  const log = options.log ?? console.log;
  if (!options.force && webBuildIsCurrent()) {
    log('Web app is up to date.');
    return;
  }
  buildWeb(log);
}

if (require.main === module) {
  try {
    ensureWebBuild({ force: process.argv.includes('--force') });
  } catch (err) {
    console.error(String(err instanceof Error ? err.message : err));
    process.exit(1);
  }
}
