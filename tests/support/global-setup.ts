// Runs once before the test files: migrates a template PGlite data folder that each test server copies,
// because initdb takes seconds and a copy takes milliseconds.
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { openDatabase } from '../../db/client';

export default async function setup() {
  const dir = mkdtempSync(path.join(os.tmpdir(), 'pw-template-'));
  const handle = await openDatabase({ dataDir: dir });
  await handle.migrate();
  await handle.close();
  writeFileSync(path.join(dir, 'auth-secret'), 'test-secret-for-phasewright-tests-only-0123456789\n');
  process.env.PW_TEMPLATE_DATA_DIR = dir;
  return () => rmSync(dir, { recursive: true, force: true });
}
