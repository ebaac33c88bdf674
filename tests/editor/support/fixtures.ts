// The demo sheets, read and validated, for the editor's unit tests.
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { readSheet, type Sheet } from '../../../shared/sheet';

export function demoSheet(name: 'larkspur-row.json' | 'farm.json'): Sheet {
  const read = readSheet(JSON.parse(readFileSync(path.join(__dirname, '..', '..', '..', 'solver', 'fixtures', name), 'utf8')));
  if (!read.ok) throw new Error(JSON.stringify(read.issues));
  return read.sheet;
}
