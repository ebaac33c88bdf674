// The break sweep part of `npm run bench:editor` (alone with `-- --sweep`): the generated 1,000-bus building of
// `npm run bench:solver -- --studies 1000` imported into a sheet, then in the browser Studies → Break sweep → Every
// conductor → Run, timed on the page from the press to the first row of the filled table on screen. The study runs
// in the app's own study worker, as a user's would. The same sweep by `breakSweepSync` in Node gives the ratio.
// Prints figures; asserts nothing beyond the run having happened on the worker.
import { loadavg } from 'node:os';
import type { Browser } from 'playwright-core';
import { breakSweepSync } from '../../solver';
import { buildingSheet } from '../../solver/bench/building-sheet';
import { el, seeTestId, WIDE, type ServerProcess } from '../e2e/harness';
import { demoProjectId, newSheet, openAs } from '../e2e/editor-support';

const TARGET_MS = 2000;
const BUSES = 1000;
const load = () => loadavg().map((x) => x.toFixed(2)).join(' ');

interface BrowserRun {
  /** Press of "Run the break sweep" to the first table row painted, on the page's clock. */
  pressToTableMs: number;
  /** The worker's own time for the study (its `study-done` message), as the panel's note states it. */
  note: string;
  cases: number;
  rows: number;
}

/** The Node figure: the same sweep the worker runs (every conductor, the study's default options), JIT warmed. */
function nodeSweep(sheet: ReturnType<typeof buildingSheet>) {
  breakSweepSync(buildingSheet(40, 2), { conductors: 'all' });
  const runs: number[] = [];
  let cases = 0;
  for (let i = 0; i < 3; i++) {
    const t0 = performance.now();
    const r = breakSweepSync(sheet, { conductors: 'all' });
    runs.push(performance.now() - t0);
    if (!r.ok) throw new Error(`the Node sweep failed: ${r.error.message}`);
    cases = r.value.total;
  }
  return { ms: Math.min(...runs), runs, cases };
}

export async function sweepBench(browser: Browser, server: ServerProcess): Promise<void> {
  const sheet = buildingSheet(BUSES);
  console.log(`\nbreak sweep in the browser: generated building of ${BUSES} buses (solver/bench/building-sheet.ts), every conductor; load average at start ${load()}`);
  const o = await openAs(browser, server, 'owner@example.com', WIDE);
  try {
    const projectId = await demoProjectId(o.api);
    const id = await newSheet(o.api, projectId, `Sweep bench ${BUSES} buses`);
    const put = await o.api.request('PUT', `/api/sheets/${id}/document`, sheet);
    if (put.status !== 200) throw new Error(`import of the ${BUSES}-bus sheet failed: ${put.status} ${JSON.stringify(put.body).slice(0, 300)}`);
    const page = o.page;
    await page.addInitScript('window.__name = (f) => f;');
    page.on('crash', () => console.log(`  the page crashed (load average ${load()})`));
    page.on('console', (m) => {
      if (m.type() === 'error') console.log(`  page console: ${m.text().slice(0, 200)}`);
    });

    const runs: BrowserRun[] = [];
    for (let run = 0; run < 2; run++) {
      await page.goto(`${server.url}/sheets/${id}?probe`);
      // The base case solved and drawn first, so the sweep does not share the machine with the first solve.
      // The whole document synced (not the empty sheet shown before it arrives), then its solve drawn.
      await page.waitForFunction(
        (count) => {
          const w = (window as any).__phasewright;
          return performance.getEntriesByName('phasewright:synced').length > 0 && (w?.session.mirror.current.elements.size ?? 0) >= count && Boolean(w.session.results.get().drawn);
        },
        Object.keys(sheet.elements).length,
        { timeout: 120_000 },
      );
      await page.waitForTimeout(1000);
      await el(page, 'tool-studies').click();
      await seeTestId(page, 'studies-panel');
      await el(page, 'study-tab-sweep').click();
      await el(page, 'sweep-all').click();
      // The clock starts at the press as the page sees it (the pointer event's own time stamp) and stops at the
      // frame after the one in which the table's first row appeared.
      await page.evaluate(() => {
        const w = window as any;
        w.__sweepPress = null;
        w.__sweepArmed = performance.now();
        w.__sweepDone = new Promise<{ ms: number; ended: string }>((resolve) => {
          document.addEventListener('pointerdown', (e) => (w.__sweepPress ??= e.timeStamp), { capture: true, once: true });
          const tick = () => {
            const ended = document.querySelector('[data-testid^="sweep-case-"]') ? 'rows' : document.querySelector('[data-testid="sweep-error"]') ? 'error' : document.querySelector('[data-testid="sweep-summary"]') ? 'summary without rows' : performance.now() - w.__sweepArmed > 120_000 ? 'nothing after 120 s' : null;
            const from = w.__sweepPress ?? w.__sweepArmed;
            if (ended) requestAnimationFrame(() => resolve({ ms: performance.now() - from, ended: w.__sweepPress === null ? `${ended} (no pointerdown seen; timed from just before the press)` : ended }));
            else requestAnimationFrame(tick);
          };
          tick();
        });
      });
      await el(page, 'sweep-run').click();
      console.log(`  run ${run + 1}: pressed at ${new Date().toISOString()}`);
      const done = await page.evaluate(() => (window as any).__sweepDone as Promise<{ ms: number; ended: string }>, undefined);
      const pressToTableMs = done.ms;
      if (done.ended !== 'rows') {
        const text = (await page.locator('[data-testid="studies-panel"]').textContent().catch(() => '')) ?? '';
        throw new Error(`the sweep ended with ${done.ended} after ${done.ms.toFixed(0)} ms: ${text.slice(0, 400)}`);
      }
      await seeTestId(page, 'sweep-note');
      const note = (await el(page, 'sweep-note').textContent()) ?? '';
      if (!/on the worker/.test(note)) throw new Error(`the sweep did not run in the study worker: "${note}"`);
      const m = /(\d[\d,]*) cases/.exec(note);
      const rows = await page.locator('[data-testid^="sweep-case-"]').count();
      runs.push({ pressToTableMs, note, cases: m ? Number(m[1].replace(/,/g, '')) : NaN, rows });
    }
    if (o.problems.length) console.log(`  the browser reported: ${o.problems.slice(0, 5).join('; ')}`);

    const node = nodeSweep(sheet);
    const best = runs.reduce((a, b) => (b.pressToTableMs < a.pressToTableMs ? b : a));
    const cases = best.cases;
    console.log(`  press -> table filled (${best.rows} rows on show), in the study worker: ${runs.map((r) => r.pressToTableMs.toFixed(0)).join(', ')} ms over ${runs.length} runs`);
    console.log(`  best ${best.pressToTableMs.toFixed(0)} ms for ${cases} cases = ${(cases / (best.pressToTableMs / 1000)).toFixed(0)} cases/s; target < ${TARGET_MS} ms (ratio ${(best.pressToTableMs / TARGET_MS).toFixed(2)})`);
    console.log(`  the panel's note: "${best.note}" (the worker's own time, from the request arriving to its answer)`);
    console.log(
      `  Node breakSweepSync on the same sheet: best ${node.ms.toFixed(0)} ms (${node.runs.map((x) => x.toFixed(0)).join(', ')}) for ${node.cases} cases = ` +
        `${(node.cases / (node.ms / 1000)).toFixed(0)} cases/s; browser / Node ${(best.pressToTableMs / node.ms).toFixed(2)}`,
    );
    const worker = /in ([\d.]+) (ms|s) on the worker/.exec(best.note);
    const workerMs = worker ? Number(worker[1]) * (worker[2] === 's' ? 1000 : 1) : NaN;
    console.log(
      `  of which in the worker about ${workerMs.toFixed(0)} ms (worker / Node ${(workerMs / node.ms).toFixed(2)}); the other ` +
        `${(best.pressToTableMs - workerMs).toFixed(0)} ms is the page: the request sent, the answer received, the rows built and drawn`,
    );
    if (node.cases !== cases) console.log(`  NOTE: the browser counted ${cases} cases, Node ${node.cases}`);
    console.log(`  load average at the end ${load()}`);
  } finally {
    await o.context.close();
  }
}
