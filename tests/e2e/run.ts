// Runs every tests/e2e/*.e2e.ts in turn, each in its own process, and exits non-zero if any fails.
import { spawnSync } from 'node:child_process';
import { readdirSync } from 'node:fs';
import path from 'node:path';

const here = __dirname;
const files = readdirSync(here).filter((name) => name.endsWith('.e2e.ts')).sort();
if (files.length === 0) {
  console.error('[e2e] no *.e2e.ts files found');
  process.exit(1);
}

const failed: string[] = [];
for (const file of files) {
  console.log(`[e2e] running ${file}`);
  const started = Date.now();
  const result = spawnSync('npx', ['tsx', path.join(here, file)], { stdio: 'inherit', env: process.env });
  const seconds = ((Date.now() - started) / 1000).toFixed(1);
  if (result.status === 0) console.log(`[e2e] ${file} passed in ${seconds} s`);
  else {
    console.error(`[e2e] ${file} FAILED (exit ${result.status ?? result.signal}) after ${seconds} s`);
    failed.push(file);
  }
}
// The plain closing line CI reads: "N passed, N failed".
console.log(`e2e: ${files.length - failed.length} passed, ${failed.length} failed`);
process.exit(failed.length > 0 ? 1 : 0);
