// The studies in a real browser on the demo building: open the sheet, run the fault study (in the study worker),
// sort by current, tap the largest case and see that fault on the drawing (its mark, the bus's voltages falling),
// filter, see the voltage profile of the base case beside the fault, run the break sweep and show its worst
// opening, match two pasted readings, tap a bus on the drawing and add a reading across bars chosen there (B–N of
// an apartment's 120/240 panel), match again, and see the loading; on a phone (cards) and a wide screen (table).
import type { Browser, Page } from 'playwright-core';
import { assert, assertTouchTarget, byPrefix, el, log, PHONE, runBrowserTest, screenshot, seeTestId, WIDE, type ServerProcess } from './harness';
import { apiAs, demoProjectId, documentOf, openAs, toScreen, viewTransform, type Touch } from './editor-support';
import { sheetIdByName } from './schedule-steps';

/** A value of the case on show, read from the editor's own results through the ?probe handle (tags are hidden when zoomed out). */
async function shownValue(page: Page, key: string): Promise<number> {
  return page.evaluate((k) => {
    const probe = (window as unknown as { __phasewright?: { session: { results: { get(): { drawn: { tags: Map<string, { value: number }> } | null } } } } }).__phasewright;
    return probe?.session.results.get().drawn?.tags.get(k)?.value ?? NaN;
  }, key);
}

async function waitForValue(page: Page, key: string, check: (v: number) => boolean, what: string, timeoutMs = 15_000): Promise<number> {
  const deadline = Date.now() + timeoutMs;
  let last = NaN;
  while (Date.now() < deadline) {
    last = await shownValue(page, key);
    if (check(last)) return last;
    await page.waitForTimeout(100);
  }
  throw new Error(`${key}: expected ${what}, last read ${last}`);
}

/**
 * Taps an element on the drawing with a finger, a little right of its place (a bus's middle is where its feeder
 * lands); first, while that point is out of sight or under a panel, two fingers drag the drawing (a pan, which
 * cannot move an element) a step at a time toward the top of the canvas.
 */
async function tapOnDrawing(page: Page, touch: Touch, world: { x: number; y: number }, elementId: string) {
  for (let step = 0; step < 12; step++) {
    const at = toScreen(await viewTransform(page), world);
    const clear = await page.evaluate(({ x, y }) => {
      const hit = document.elementFromPoint(x, y);
      return !!hit?.closest('[data-testid="sheet-canvas"]') && !hit.closest('[data-testid="panel-studies"]');
    }, at);
    if (clear) {
      await touch.tap(at);
      await page.locator(`[data-testid="selected-${elementId}"]`).first().waitFor({ state: 'attached', timeout: 5000 });
      return;
    }
    const canvas = await el(page, 'sheet-canvas').boundingBox();
    assert(canvas, 'no canvas on the page');
    // Clear of the legend at the top and of a phone's sliding panel over the lower part of the canvas.
    const target = { x: canvas.x + canvas.width / 2, y: canvas.y + Math.min(canvas.height, page.viewportSize()!.height * 0.45) * 0.6 };
    const clamp = (v: number) => Math.max(-120, Math.min(120, v));
    const shift = { x: clamp(target.x - at.x), y: clamp(target.y - at.y) };
    await touch.pinch({ x: target.x - shift.x, y: target.y - shift.y }, 60, 60, shift);
  }
  throw new Error(`${elementId} never came into sight to be tapped`);
}

async function demoSheetId(server: ServerProcess) {
  const api = await apiAs(server, 'owner@example.com');
  return sheetIdByName(api, await demoProjectId(api), 'Building distribution');
}

/** The symmetrical kA of each case card or row on show, in page order. */
async function shownCurrents(page: Page): Promise<{ key: string; ka: number }[]> {
  const rows = byPrefix(page, 'fault-case-');
  const out: { key: string; ka: number }[] = [];
  for (let i = 0; i < (await rows.count()); i++) {
    const row = rows.nth(i);
    const key = ((await row.getAttribute('data-testid')) ?? '').replace('fault-case-', '');
    const label = (await row.getAttribute('aria-label')) ?? '';
    const m = /: ([\d.]+|—) kA/.exec(label);
    out.push({ key, ka: m && m[1] !== '—' ? Number(m[1]) : NaN });
  }
  return out;
}

async function journey(browser: Browser, server: ServerProcess, sheetId: string, size: { width: number; height: number }, name: 'phone' | 'wide') {
  const { page, context, problems, touch, api } = await openAs(browser, server, 'owner@example.com', size);
  await page.goto(`${server.url}/sheets/${sheetId}?probe`);
  // The base case on the drawing: the service bus near 120 V.
  const baseVolts = await waitForValue(page, 'service:ln-A', (v) => v > 100 && v < 130, 'about 120 V', 20_000);
  await el(page, 'tool-studies').click();
  await seeTestId(page, 'studies-panel');
  await el(page, 'fault-run').click();
  await seeTestId(page, 'fault-summary');
  const summary = (await el(page, 'fault-summary').textContent()) ?? '';
  assert(/interrupting ratings/.test(summary), `the summary reads "${summary}"`);
  const note = (await el(page, 'fault-note').textContent()) ?? '';
  assert(/50 cases/.test(note) && /on the worker/.test(note), `the study ran "${note}" (expected 50 cases on the worker)`);
  await seeTestId(page, 'marking-service');
  await screenshot(page, `studies-${name}-faults`);

  // Sort by current, largest first: a tap on the column's head (wide) or the sort chip (phone).
  await el(page, 'fault-sort-symmetricalKa').click();
  await page.waitForTimeout(200);
  const sorted = (await shownCurrents(page)).filter((r) => Number.isFinite(r.ka));
  assert(sorted.length >= 10, `only ${sorted.length} cases with figures on show`);
  for (let i = 1; i < sorted.length; i++) assert(sorted[i - 1].ka >= sorted[i].ka, `not sorted high to low at ${i}: ${sorted[i - 1].ka} then ${sorted[i].ka}`);

  // Tap the largest: the three-phase fault at the service (or a bus tied to it). The drawing shows the fault.
  const top = sorted[0];
  const busId = top.key.split('|')[0];
  await el(page, `fault-case-${top.key}`).click();
  await page.locator(`[data-testid="case-mark-fault-${busId}"]`).first().waitFor({ state: 'attached', timeout: 15_000 });
  await seeTestId(page, 'fault-shown');
  // A bolted fault pulls the bus's voltage to ground down (the service bus during a fault at or next to it).
  const during = await waitForValue(page, 'service:ln-A', (v) => v < baseVolts * 0.5, 'below half its base value during the fault');
  log(`${name}: ${top.key} ${top.ka} kA; service A–N ${baseVolts} V before, ${during} V during the fault`);
  await screenshot(page, `studies-${name}-fault-on-drawing`);

  // Filter to line-to-ground faults only.
  await el(page, 'fault-filter-line-to-ground').click();
  await page.waitForTimeout(200);
  const lg = await shownCurrents(page);
  assert(lg.length > 0 && lg.every((r) => r.key.endsWith('|line-to-ground')), `the filter let through ${lg.map((r) => r.key).join(', ')}`);
  await el(page, 'fault-filter-line-to-ground').click();

  // The voltage profile: the base case beside the fault on show.
  await el(page, 'study-tab-profile').click();
  await seeTestId(page, 'voltage-profile-plot');
  const columns = await byPrefix(page, 'profile-column-').count();
  assert(columns >= 30, `the profile has ${columns} columns (the demo building has over 30 load elements)`);
  await el(page, 'profile-order-base-voltage').click();
  await byPrefix(page, 'profile-column-').first().click();
  const picked = (await el(page, 'profile-picked').textContent()) ?? '';
  assert(/base case .* V/.test(picked) && /Trial/.test(picked), `the picked column reads "${picked}"`);
  await screenshot(page, `studies-${name}-profile`);

  // The break sweep: every conductor opened in turn; the worst opening shown on the drawing.
  await el(page, 'study-tab-sweep').click();
  await el(page, 'sweep-run').click();
  await seeTestId(page, 'sweep-summary');
  const first = byPrefix(page, 'sweep-case-').first();
  const opening = ((await first.getAttribute('data-testid')) ?? '').replace('sweep-case-', '');
  await first.click();
  await seeTestId(page, 'sweep-shown');
  // The solve of the opening answers from the worker a moment after the tap.
  const open = await page
    .waitForFunction(
      (key) => {
        const probe = (window as unknown as { __phasewright?: { session: { results: { get(): { drawn: { openConductors: Set<string> } | null } } } } }).__phasewright;
        return probe?.session.results.get().drawn?.openConductors.has(key) ?? false;
      },
      opening,
      { timeout: 15_000 },
    )
    .then(() => true, () => false);
  assert(open, `the drawing does not show ${opening} open after tapping its row`);
  log(`${name}: worst opening ${opening}`);
  await screenshot(page, `studies-${name}-sweep`);

  // The readings match: a bad paste is refused line by line; a good one runs, and the best candidate is shown.
  await el(page, 'study-tab-readings').click();
  await el(page, 'readings-csv').fill('Apartment 4 lighting, 186\nNo such panel, 120');
  await el(page, 'readings-csv-use').click();
  const refused = (await el(page, 'readings-csv-problems').textContent()) ?? '';
  assert(/Line 2: no load or bus is called "No such panel"/.test(refused), `the paste's problems read "${refused}"`);
  await el(page, 'readings-csv').fill('Apartment 4 lighting, 186\nApartment 4 kitchen receptacles, 19');
  await el(page, 'readings-csv-use').click();
  assert((await byPrefix(page, 'reading-volts-').count()) === 2, 'the two pasted readings are not listed');
  await el(page, 'match-run').click();
  await seeTestId(page, 'match-result');
  await seeTestId(page, 'match-shown');
  const fitBefore = (await el(page, 'match-fit').textContent()) ?? '';

  // A reading tapped on the drawing: Apartment 4's panel (120/240: bars A, B, N and PE), across B–N.
  const apt4 = (await documentOf(api, sheetId)).elements['apt-4'] as { x: number; y: number };
  await tapOnDrawing(page, touch, { x: apt4.x + 60, y: apt4.y }, 'apt-4');
  const add = el(page, 'reading-add');
  await page.waitForFunction(() => /Add a reading at Apartment 4$/.test(document.querySelector('[data-testid="reading-add"]')?.textContent ?? ''), undefined, { timeout: 10_000 });
  await add.click();
  const wheres = byPrefix(page, 'reading-where-');
  assert((await wheres.count()) === 3, `${await wheres.count()} readings listed after adding one at Apartment 4`);
  const id = ((await wheres.nth(2).getAttribute('data-testid')) ?? '').replace('reading-where-', '');
  assert((await wheres.nth(2).textContent()) === 'Apartment 4 A–N', `the new reading reads "${await wheres.nth(2).textContent()}" (expected A–N by default)`);
  // Its bars are open for choosing: only the pairs the panel has (no C), each chip finger-sized, A–N chosen.
  const chip = (key: string) => el(page, `reading-across-${id}-${key}`);
  for (const key of ['A-N', 'B-N', 'A-B', 'A-PE', 'N-PE', 'N-earth']) assert((await chip(key).count()) === 1, `no ${key} chip for Apartment 4`);
  for (const key of ['C-N', 'B-C', 'C-earth']) assert((await chip(key).count()) === 0, `a ${key} chip is offered on a panel without a C bar`);
  assert((await chip('A-N').getAttribute('aria-checked')) === 'true', 'A–N is not the chosen pair of a new reading at a panel with a neutral');
  await assertTouchTarget(chip('B-N'), 'the B–N chip');
  await assertTouchTarget(el(page, `reading-across-toggle-${id}`), 'the bars toggle');
  await chip('B-N').click();
  await page.waitForFunction((i) => document.querySelector(`[data-testid="reading-where-${i}"]`)?.textContent === 'Apartment 4 B–N', id, { timeout: 5000 });
  assert((await chip('B-N').getAttribute('aria-checked')) === 'true', 'B–N is not shown chosen after the tap');
  await el(page, `reading-volts-${id}`).fill('19.5');
  await screenshot(page, `studies-${name}-readings-bars`);
  // Closed, the entry still says what it is across.
  await el(page, `reading-across-toggle-${id}`).click();
  assert((await chip('B-N').count()) === 0, 'the chips stay open after closing the bars');
  const toggle = (await el(page, `reading-across-toggle-${id}`).textContent()) ?? '';
  assert(/Across\s*B–N/.test(toggle), `the closed bars read "${toggle}"`);

  // The match with the third reading answers with new figures.
  await el(page, 'match-run').click();
  await page.waitForFunction((before) => {
    const fit = document.querySelector('[data-testid="match-fit"]')?.textContent ?? '';
    return !!fit && fit !== before && !!document.querySelector('[data-testid="match-run"]');
  }, fitBefore, { timeout: 30_000 });
  assert((await el(page, 'match-error').count()) === 0, `the match failed: ${await el(page, 'match-error').textContent().catch(() => '')}`);
  assert((await el(page, 'readings-problems').count()) === 0, `the entries were refused: ${await el(page, 'readings-problems').textContent().catch(() => '')}`);
  await seeTestId(page, 'match-group-0');
  log(`${name}: with Apartment 4 B–N 19.5 V: ${(await el(page, 'match-fit').textContent()) ?? ''}`);
  await el(page, 'match-fit').scrollIntoViewIfNeeded();
  await screenshot(page, `studies-${name}-readings`);

  // The loading of the case on show.
  await el(page, 'study-tab-loading').click();
  await seeTestId(page, 'loading-summary');
  await screenshot(page, `studies-${name}-loading`);

  assert(problems.length === 0, `the browser reported problems:\n${problems.join('\n')}`);
  await context.close();
}

runBrowserTest('studies', async (browser, server) => {
  const sheetId = await demoSheetId(server);
  await journey(browser, server, sheetId, PHONE, 'phone');
  log('phone journey passed');
  await journey(browser, server, sheetId, WIDE, 'wide');
  log('wide journey passed');
});
