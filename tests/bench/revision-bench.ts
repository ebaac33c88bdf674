// How long issuing a revision of each demo sheet takes in the study worker: the base case, what-ifs and fault study
// alone, then with the further studies (loading checks, break sweep, voltage profile), and the report PDF after.
// Then end to end: a server started with the demo seed (which issues a revision of each demo sheet), and a few
// revisions issued through POST /api/sheets/:id/revisions (the worker thread, PGlite and the JSON round trip).
// Prints figures and ratios; run with `npx tsx tests/bench/revision-bench.ts`.
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { readSheet } from '../../shared/sheet';
import { EXTRA_STUDIES, runExtraStudies } from '../../server/reports/extra-studies';
import { renderReportPdf } from '../../server/reports/report-pdf';
import { inputHash } from '../../server/revisions/input-hash';
import { studySheet } from '../../server/revisions/study';
import { DEMO_PASSWORD } from '../../db/seed';
import { startTestServer } from '../support/test-server';
import { TestClient } from '../support/http-client';

const REPEATS = 5;
const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)];
const time = (f: () => unknown) => {
  const t = performance.now();
  f();
  return performance.now() - t;
};

async function main() {
  for (const name of ['larkspur-row', 'farm']) {
    const doc = JSON.parse(readFileSync(path.resolve(__dirname, `../../solver/fixtures/${name}.json`), 'utf8'));
    const read = readSheet(doc);
    if (!read.ok) throw new Error(`${name} is not a valid sheet`);
    // A fresh sheet object each time: the sweep is cached per sheet object.
    const fresh = () => (readSheet(doc) as { ok: true; sheet: typeof read.sheet }).sheet;
    const cold = time(() => studySheet(fresh()));
    const all: number[] = [];
    const perStudy = new Map<string, number[]>();
    for (let i = 0; i < REPEATS; i++) {
      all.push(time(() => studySheet(fresh())));
      const s2 = fresh();
      for (const study of EXTRA_STUDIES) {
        const ms = time(() => runExtraStudies(s2, [study]));
        perStudy.set(study.id, [...(perStudy.get(study.id) ?? []), ms]);
      }
    }
    const results = studySheet(fresh());
    const pdfT = performance.now();
    await renderReportPdf({ projectName: 'Bench', sheetName: name, document: doc, results, generatedAt: new Date().toISOString(),
      revision: { id: 'r', sheetId: 's', number: 1, note: '', inputHash: inputHash(doc), solverVersion: results.solverVersion, issuedAt: new Date().toISOString(), issuedBy: { id: null, name: 'Bench' }, status: 'issued', reviews: [], cases: [] } });
    const pdfMs = performance.now() - pdfT;
    const extraMs = [...perStudy].map(([id, xs]) => `${id} ${median(xs).toFixed(0)} ms`).join(', ');
    const extraSum = [...perStudy.values()].reduce((a, xs) => a + median(xs), 0);
    console.log(`${name}: study with further studies ${median(all).toFixed(0)} ms (cold ${cold.toFixed(0)} ms); further studies ${extraSum.toFixed(0)} ms = ${extraMs}; share ${((extraSum / median(all)) * 100).toFixed(0)} %; report PDF ${pdfMs.toFixed(0)} ms`);
  }
}
async function endToEnd() {
  const t = performance.now();
  const server = await startTestServer({ SEED_DEMO: 'true' });
  console.log(`server start with the demo seed (two revisions issued): ${(performance.now() - t).toFixed(0)} ms`);
  try {
    const owner = new TestClient(server.url);
    await owner.signIn('owner@example.com', DEMO_PASSWORD);
    const project = (await owner.get('/api/projects')).body.projects[0];
    for (const s of (await owner.get(`/api/projects/${project.id}/sheets`)).body.sheets) {
      const ms: number[] = [];
      for (let i = 0; i < 3; i++) {
        const t0 = performance.now();
        const res = await owner.post(`/api/sheets/${s.id}/revisions`, { note: `bench ${i}` });
        if (res.status !== 201) throw new Error(`issue failed: ${res.status} ${JSON.stringify(res.body)}`);
        ms.push(performance.now() - t0);
      }
      console.log(`issue a revision of ${s.name}: ${ms.map((x) => x.toFixed(0)).join(', ')} ms`);
    }
  } finally {
    await server.stop();
  }
}

main().then(endToEnd);
