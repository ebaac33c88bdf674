// The command line: tables or JSON of a sheet's results, the zod paths and exit code 2 for an invalid file.
import { spawnSync } from 'node:child_process';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';

const root = join(__dirname, '..', '..');
const farm = join(root, 'solver', 'fixtures', 'farm.json');

function run(args: string[]) {
  const r = spawnSync(join(root, 'node_modules', '.bin', 'tsx'), [join(root, 'solver', 'cli.ts'), ...args], { encoding: 'utf8', cwd: root });
  return { code: r.status, out: r.stdout, err: r.stderr };
}

function tempFile(text: string): string {
  const file = join(mkdtempSync(join(tmpdir(), 'pw-cli-')), 'sheet.json');
  writeFileSync(file, text);
  return file;
}

describe('npm run solve', () => {
  it('prints bus voltages, load voltages with their standing and conductor currents', () => {
    const r = run([farm]);
    expect(r.code).toBe(0);
    expect(r.out).toMatch(/Bus voltages \(V\)/);
    expect(r.out).toMatch(/Load voltages/);
    expect(r.out).toMatch(/Conductor currents/);
    expect(r.out).toMatch(/Farm service, 200 A\s+energised\s+\d+\.\d/);
    expect(r.out).toMatch(/engineering estimate/);
  });

  it('prints the loading study with --loading, as tables or JSON', () => {
    const r = run([farm, '--loading']);
    expect(r.code).toBe(0);
    expect(r.out).toMatch(/Conductors \(NEC 310\.16, worst first\)/);
    expect(r.out).toMatch(/Voltage drop \(3 % per run, 5 % in total\)/);
    expect(r.out).toMatch(/pole-transformer > service-drop > barn-feeder/);
    expect(r.out).toMatch(/overhead conductor in free air is not rated/);
    expect(r.out).toMatch(/IEC users get the same conductor check/);
    const j = run([farm, '--loading', '--what-if', 'open-service-neutral', '--json']);
    expect(j.code).toBe(0);
    const study = JSON.parse(j.out);
    expect(study.whatIf.id).toBe('open-service-neutral');
    expect(study.conductors.length).toBeGreaterThan(5);
  });

  it('solves a what-if and prints JSON on request', () => {
    const r = run([farm, '--what-if', 'open-service-neutral', '--json']);
    expect(r.code).toBe(0);
    const result = JSON.parse(r.out);
    expect(result.whatIf.id).toBe('open-service-neutral');
    expect(result.openNeutral).toBe(true);
    expect(result.buses.length).toBeGreaterThan(3);
  });

  it('gives the zod error paths and exit code 2 for an invalid sheet', () => {
    const file = tempFile(JSON.stringify({ formatVersion: 1, elements: { r: { kind: 'run', id: 'r', lengthFt: -5, conductors: { A: { size: '4/0' } } } } }));
    const r = run([file]);
    expect(r.code).toBe(2);
    expect(r.err).toMatch(/elements\.r\.lengthFt: lengthFt must be greater than zero/);
  });

  it('exit code 2 for a file that is not JSON, an unknown what-if or no file', () => {
    expect(run([tempFile('{ not json')]).code).toBe(2);
    const unknown = run([farm, '--what-if', 'nope']);
    expect(unknown.code).toBe(2);
    expect(unknown.err).toMatch(/no what-if "nope"/);
    expect(run([]).code).toBe(2);
  });
});
