// The studies in a real browser on the demo building: open the sheet, run the fault study (in the study worker),
// sort by current, tap the largest case and see that fault on the drawing (its mark, the bus's voltages falling),
// filter, see the voltage profile of the base case beside the fault, run the break sweep and show its worst
// opening, match two pasted readings, and see the loading; on a phone (cards) and a wide screen (table).
import type { Browser, Page } from 'playwright-core';
import { assert, byPrefix, el, log, PHONE, runBrowserTest, screenshot, seeTestId, WIDE, type ServerProcess } from './harness';
import { apiAs, demoProjectId, openAs } from './editor-support';
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
  const { page, context, problems } = await openAs(browser, server, 'owner@example.com', size);
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
