// Editor benchmark in headless Chromium on the web build: time to first render of a 2,000-element sheet, time
// from an edit to updated voltages on the drawing for 100- and 1,000-element sheets, and frame times while
// panning a 2,000-element sheet, and the break sweep of a 1,000-bus sheet in the study worker (editor-sweep-bench.ts).
// Prints figures and their ratio to the targets; asserts nothing.
// Run with `npm run bench:editor`; `npm run bench:editor -- --sweep` runs the break sweep part alone.
import { cpus, loadavg } from 'node:os';
import { ensureWebBuild, launchBrowser, startServer, WIDE } from '../e2e/harness';
import { demoProjectId, newSheet, openAs } from '../e2e/editor-support';
import { generatedBuilding } from './generated-sheet';
import { sweepBench } from './editor-sweep-bench';

const TARGETS = { firstRenderMs: 1000, edit100Ms: 50, edit1000Ms: 250, panFps: 50 };

function stats(values: number[]) {
  const s = [...values].sort((a, b) => a - b);
  const at = (q: number) => s[Math.min(s.length - 1, Math.floor(q * s.length))];
  return { median: at(0.5), p90: at(0.9), p95: at(0.95), max: s[s.length - 1], mean: s.reduce((a, b) => a + b, 0) / s.length, n: s.length };
}

const f1 = (v: number) => v.toFixed(1);

async function main() {
  ensureWebBuild();
  console.log(`editor bench: ${cpus().length} cores (${cpus()[0]?.model ?? 'unknown'}), load average ${loadavg().map((x) => x.toFixed(2)).join(' ')}`);
  const server = await startServer();
  const browser = await launchBrowser();
  try {
    if (process.argv.includes('--sweep')) {
      await sweepBench(browser, server);
      return;
    }
    const o = await openAs(browser, server, 'owner@example.com', WIDE);
    const projectId = await demoProjectId(o.api);
    const sheets: Record<number, string> = {};
    for (const n of [100, 1000, 2000]) {
      const id = await newSheet(o.api, projectId, `Bench ${n}`);
      const put = await o.api.request('PUT', `/api/sheets/${id}/document`, generatedBuilding(n));
      if (put.status !== 200) throw new Error(`import of ${n} elements failed: ${put.status}`);
      sheets[n] = id;
    }
    const page = o.page;
    // tsx keeps function names with a helper the page does not have; give the page a stand-in.
    await page.addInitScript('window.__name = (f) => f;');

    // 1. First render of 2,000 elements: from the document's arrival (and from navigation) to all drawn.
    const renders: { fromSync: number; fromNavigation: number }[] = [];
    for (let run = 0; run < 3; run++) {
      await page.goto(`${server.url}/sheets/${sheets[2000]}?probe`);
      const r = await page.evaluate(
        () =>
          new Promise<{ fromSync: number; fromNavigation: number }>((resolve) => {
            const tick = () => {
              const n = document.querySelectorAll('[data-testid^="sym-"]').length;
              const synced = performance.getEntriesByName('phasewright:synced')[0];
              if (n >= 2000 && synced) {
                // The frame after the one that drew them: the drawing is on screen.
                requestAnimationFrame(() => {
                  const now = performance.now();
                  resolve({ fromSync: now - synced.startTime, fromNavigation: now });
                });
              } else requestAnimationFrame(tick);
            };
            tick();
          }),
      );
      renders.push(r);
    }
    const first = stats(renders.map((r) => r.fromSync));
    const firstNav = stats(renders.map((r) => r.fromNavigation));

    // 2. Edit to voltages: change a load's power (one command, as the inspector writes it) and wait for the
    //    panel's tag to show the new voltage. The view is at 100 % on that panel, so its tags are drawn.
    const edits: Record<number, { ms: number[]; solveMs: number[]; answerMs: number[]; where: string }> = {};
    for (const n of [100, 1000]) {
      await page.goto(`${server.url}/sheets/${sheets[n]}?probe`);
      await page.waitForFunction((count) => document.querySelectorAll('[data-testid^="sym-"]').length >= count, n, { timeout: 30_000 });
      await page.evaluate(() => {
        const w = (window as any).__phasewright;
        const panel = w.session.mirror.current.elements.get('panel-1');
        const size = w.canvas.viewSize;
        w.canvas.setViewport({ zoom: 1, x: size.width / 2 - panel.x, y: size.height / 2 - panel.y });
      });
      await page.waitForSelector('[data-testid="tag-panel-1:ln-A"]', { timeout: 30_000 });
      const times: number[] = [];
      const solves: number[] = [];
      const answers: number[] = [];
      let where = '';
      for (let i = 0; i < 12; i++) {
        const r = await page.evaluate(
          (k) =>
            new Promise<{ ms: number; solveMs: number; answerMs: number; where: string }>((resolve, reject) => {
              const w = (window as any).__phasewright;
              const text = () => document.querySelector('[data-testid="tag-load-1-1:v"] text')?.textContent ?? '';
              const before = text();
              const t0 = performance.now();
              w.session.commands.setField('elements', 'load-1-1', ['kw'], k % 2 === 0 ? 4.5 : 0.6);
              const deadline = t0 + 10_000;
              const check = () => {
                if (text() !== before) {
                  const r = w.session.results.get();
                  return resolve({ ms: performance.now() - t0, solveMs: r.solveMs, answerMs: r.changeToAnswerMs, where: r.where });
                }
                if (performance.now() > deadline) return reject(new Error('the tag never changed'));
                requestAnimationFrame(check);
              };
              // Poll on every frame and, between frames, on a short timer (a change shows at the next paint anyway).
              check();
            }),
          i,
        );
        if (i >= 2) {
          times.push(r.ms);
          solves.push(r.solveMs);
          answers.push(r.answerMs);
        }
        where = r.where;
      }
      edits[n] = { ms: times, solveMs: solves, answerMs: answers, where };
    }

    // 3. Panning 2,000 elements with two fingers (DevTools-protocol touches), fitted (everything in view) and at
    //    100 % (the part in view and a screen around it drawn); frame intervals from requestAnimationFrame.
    const pans: Record<string, ReturnType<typeof stats>> = {};
    for (const mode of ['fitted', '100 %'] as const) {
      await page.goto(`${server.url}/sheets/${sheets[2000]}?probe`);
      await page.waitForFunction(() => document.querySelectorAll('[data-testid^="sym-"]').length >= 1, undefined, { timeout: 30_000 });
      await page.waitForTimeout(1500);
      if (mode === '100 %') {
        await page.evaluate(() => {
          const w = (window as any).__phasewright;
          const size = w.canvas.viewSize;
          w.canvas.setViewport({ zoom: 1, x: size.width / 2, y: 200 });
        });
        await page.waitForTimeout(800);
      }
      const box = (await page.locator('[data-testid="sheet-canvas"]').boundingBox())!;
      await page.evaluate(() => {
        (window as any).__frames = [];
        const frames = (window as any).__frames as number[];
        let last = performance.now();
        const tick = (t: number) => {
          frames.push(t - last);
          last = t;
          if ((window as any).__frames === frames) requestAnimationFrame(tick);
        };
        requestAnimationFrame(tick);
      });
      const cx = box.x + box.width / 2;
      const cy = box.y + box.height / 2;
      for (let sweep = 0; sweep < 4; sweep++) {
        const dir = sweep % 2 === 0 ? 1 : -1;
        await o.touch.pinch({ x: cx, y: cy }, 200, 200, { x: dir * 300, y: dir * 120 }, 60);
      }
      const frames = await page.evaluate(() => {
        const f = (window as any).__frames as number[];
        (window as any).__frames = null;
        return f.slice(5);
      });
      pans[mode] = stats(frames);
    }

    console.log('');
    console.log('first render of a 2,000-element sheet (fitted to a 1440x900 view; tags are hidden at that zoom)');
    console.log(`  document arrived -> drawn: median ${f1(first.median)} ms, max ${f1(first.max)} ms over ${first.n} loads; target < ${TARGETS.firstRenderMs} ms (ratio ${(first.median / TARGETS.firstRenderMs).toFixed(2)})`);
    console.log(`  page navigation  -> drawn: median ${f1(firstNav.median)} ms (bundle, sign-in check, websocket sync and render)`);
    for (const n of [100, 1000]) {
      const s = stats(edits[n].ms);
      const solve = stats(edits[n].solveMs);
      const target = n === 100 ? TARGETS.edit100Ms : TARGETS.edit1000Ms;
      console.log(`edit -> voltages on the drawing, ${n} elements (solved on the ${edits[n].where})`);
      const answer = stats(edits[n].answerMs);
      console.log(`  median ${f1(s.median)} ms, p90 ${f1(s.p90)} ms, max ${f1(s.max)} ms over ${s.n} edits; target < ${target} ms (ratio ${(s.median / target).toFixed(2)})`);
      console.log(`  of which: solving median ${f1(solve.median)} ms; edit -> answer back on the page median ${f1(answer.median)} ms (the rest is drawing it)`);
    }
    for (const [mode, s] of Object.entries(pans)) {
      const fps = 1000 / s.mean;
      console.log(`panning a 2,000-element sheet (${mode}), two-finger touch drags`);
      console.log(`  frame time mean ${f1(s.mean)} ms, median ${f1(s.median)} ms, p95 ${f1(s.p95)} ms, max ${f1(s.max)} ms over ${s.n} frames = ${f1(fps)} fps; target >= ${TARGETS.panFps} fps (ratio ${(fps / TARGETS.panFps).toFixed(2)})`);
    }
    console.log(`load average at the end ${loadavg().map((x) => x.toFixed(2)).join(' ')}`);
    await o.context.close();
    await sweepBench(browser, server);
  } finally {
    await browser.close();
    await server.stop();
  }
}

main().catch((error) => {
  console.error(error);
  process.exit(1);
});
