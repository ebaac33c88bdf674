// Panel schedules in a real browser, wide (1440x900) and on a phone (390x844): open the café panel's schedule from
// its inspector, read its totals and neutral, edit a circuit and undo it, import a CSV (a bad file first: every
// problem by line, nothing placed), then import a sheet from JSON (problems with paths first) after confirming.
// The demo seed's pins are there too.
import type { Page } from 'playwright-core';
import { apiAs, demoProjectId, documentOf, newSheet, openAs, symbolBox } from './editor-support';
import { assert, el, log, PHONE, runBrowserTest, screenshot, seeTestId, seeText, WIDE } from './harness';
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { importScheduleCsv, openSheet, selectElement, sheetIdByName, until } from './schedule-steps';

runBrowserTest('schedule', async (browser, server) => {
  const owner = await apiAs(server, 'owner@example.com');
  const projectId = await demoProjectId(owner);
  const building = await sheetIdByName(owner, projectId, 'Building distribution');

  // The demo seed put pins on the building sheet.
  const pins = await owner.get(`/api/sheets/${building}/pins`);
  assert(pins.status === 200, `pins: ${pins.status}`);
  const pinList = (pins.body.pins ?? pins.body) as { elementId: string | null }[];
  assert(pinList.length >= 2 && pinList.some((p) => p.elementId === 'cafe-panel'), `demo pins: ${JSON.stringify(pins.body).slice(0, 300)}`);

  // ---- wide
  const wide = await openAs(browser, server, 'owner@example.com', WIDE);
  const page = wide.page;
  await openSheet(page, server.url, building);
  await screenshot(page, 'demo-building-wide');
  // A closer look at the café panel's branch circuits as the demo draws them.
  const cafeBox = await symbolBox(page, 'cafe-panel');
  await page.evaluate(({ x, y }) => {
    const w = (window as any).__phasewright;
    const rect = (document.querySelector('[data-testid="sheet-canvas"]') as HTMLElement).getBoundingClientRect();
    w.canvas.zoomAt({ x: x - rect.left, y: y - rect.top }, 3.5);
  }, { x: cafeBox.x + cafeBox.width / 2, y: cafeBox.y + cafeBox.height / 2 + 40 });
  await screenshot(page, 'demo-cafe-close-wide');
  await page.evaluate(() => (window as any).__phasewright.actions.fit());
  await selectElement(page, 'cafe-panel');
  await el(page, 'inspector-schedule').click();
  await seeTestId(page, 'schedule-table');
  await seeText(page, 'Café panel');
  // the solve has answered: the neutral shows a number of amperes
  const neutralText = await until('the café neutral current', () => el(page, 'schedule-neutral').innerText(), (t) => /\d+\.\d A/.test(t));
  log(`café neutral: ${neutralText.replace(/\n/g, ' ')}`);
  await seeTestId(page, 'schedule-row-cafe-lights');
  const loading = await el(page, 'schedule-loading-cafe-lights').innerText();
  assert(/^\d+ %$/.test(loading.trim()), `café lighting breaker loading reads "${loading}"`);
  await screenshot(page, 'schedule-wide');

  // Edit a circuit: one save, one undo.
  await el(page, 'schedule-edit-cafe-lights').click();
  await el(page, 'circuit-field-amount').fill('2.2');
  await el(page, 'circuit-save').click();
  await until('the edit reaching the room', async () => (await documentOf(owner, building)).elements['cafe-lights'].kw, (kw) => kw === 2.2);
  await el(page, 'tool-undo').click();
  await until('the undo reaching the room', async () => (await documentOf(owner, building)).elements['cafe-lights'].kw, (kw) => kw === 1.8);

  // A bad CSV: every problem by line, and nothing can be placed.
  await el(page, 'schedule-import-csv').click();
  await seeTestId(page, 'csv-import');
  const bad = ['circuit,description,phases,load,power factor,breaker', '13,Dessert case,A,0.9,0.9,20', '15,Grinder,Q,0.6,0.9,20', '17,Blender,B,lots,0.9,20'].join('\n');
  await el(page, 'csv-text').fill(bad);
  await el(page, 'csv-check').click();
  await seeTestId(page, 'csv-problems');
  await seeText(page, /Line 3, phases: unknown phases "Q"/);
  await seeText(page, /Line 4, load: "lots" is not a load/);
  assert(await el(page, 'csv-import-confirm').isDisabled(), 'the import button is enabled while rows are bad');
  await screenshot(page, 'schedule-csv-bad-wide');
  const before = await documentOf(owner, building);

  // A 5 MB file is refused before it is read.
  const big = 'circuit,description,phases,load\n' + '1,Lights,A,1.2\n'.repeat(350_000);
  const bigChooser = page.waitForEvent('filechooser');
  await el(page, 'csv-pick').click();
  await (await bigChooser).setFiles({ name: 'huge-schedule.csv', mimeType: 'text/csv', buffer: Buffer.from(big) });
  await seeText(page, /huge-schedule\.csv is too large: 5\.\d MB, at most 1 MB\. Nothing was imported\./);

  // The fixed file, chosen from disk: checked at once, then placed under the panel, connected, in one step.
  const good = ['circuit,description,phases,load,power factor,breaker', '13,Dessert case,A,0.9,0.9,20', '15,Grinder,C,0.6,0.9,20', '17,Blender,B,1.1,0.9,20'].join('\n');
  await importScheduleCsv(page, { name: 'cafe-additions.csv', text: good }, 3, 'Café panel', 'Dessert case', () => screenshot(page, 'schedule-csv-preview-wide'));
  await seeTestId(page, 'schedule-table');
  const after = await until(
    'the imported circuits in the room',
    () => documentOf(owner, building),
    (d) => Object.values(d.elements).filter((e: any) => e.kind === 'load').length === Object.values(before.elements).filter((e: any) => e.kind === 'load').length + 3,
  );
  const dessert = Object.values(after.elements).find((e: any) => e.name === 'Dessert case') as any;
  const cafe = after.elements['cafe-panel'];
  assert(dessert.y > cafe.y, 'the imported load is not under the panel');
  const feeds = Object.values(after.connections).filter((c: any) => c.from.elementId === 'cafe-panel').length;
  assert(feeds === Object.values(before.connections).filter((c: any) => c.from.elementId === 'cafe-panel').length + 3, 'the imported circuits are not connected to the panel');
  await screenshot(page, 'schedule-after-import-wide');
  await el(page, 'panel-schedule-view-close').click();
  await screenshot(page, 'schedule-canvas-after-import-wide');

  // Import a sheet from JSON into a new sheet: problems with paths first, then the farm after confirming.
  const blank = await newSheet(owner, projectId, 'Imported farm');
  await openSheetEmpty(page, server.url, blank);
  await page.evaluate(() => (window as any).__phasewright.actions.openPanel('about'));
  await el(page, 'open-sheet-import').click();
  await seeTestId(page, 'sheet-import');
  const farm = JSON.parse(readFileSync(path.join(__dirname, '..', '..', 'solver', 'fixtures', 'farm.json'), 'utf8'));
  const broken = structuredClone(farm);
  broken.elements['service-drop'].lengthFt = -3;
  await el(page, 'sheet-import-text').fill(JSON.stringify(broken));
  await el(page, 'sheet-import-check').click();
  await seeTestId(page, 'sheet-import-issues');
  await seeText(page, 'elements.service-drop.lengthFt');
  await screenshot(page, 'sheet-import-issues-wide');
  await el(page, 'sheet-import-text').fill(JSON.stringify(farm));
  await el(page, 'sheet-import-check').click();
  await seeTestId(page, 'sheet-import-summary');
  await el(page, 'sheet-import-replace').click();
  await seeTestId(page, 'sheet-import-confirm');
  await screenshot(page, 'sheet-import-confirm-wide');
  await el(page, 'sheet-import-confirm-confirm').click();
  const imported = await until('the imported sheet in the room', () => documentOf(owner, blank), (d) => Object.keys(d.elements ?? {}).length === Object.keys(farm.elements).length);
  // The sheet keeps its name in the list: the file's own name ("Hollis farm") is not taken.
  assert(imported.name === 'Imported farm', `imported name ${imported.name}`);
  assert(imported.whatIfs['barn-ground-fault'], 'the fault what-if did not come along');
  await page.waitForFunction(() => document.querySelectorAll('[data-testid^="sym-"]').length > 10, undefined, { timeout: 15_000 });
  await screenshot(page, 'sheet-imported-wide');
  assert(wide.problems.length === 0, `browser problems (wide): ${wide.problems.join('; ')}`);
  await wide.context.close();

  // ---- a viewer reads the schedule but cannot change it or import
  const viewer = await openAs(browser, server, 'viewer@example.com', WIDE);
  await openSheet(viewer.page, server.url, building);
  await selectElement(viewer.page, 'cafe-panel');
  await el(viewer.page, 'inspector-schedule').click();
  await seeTestId(viewer.page, 'schedule-table');
  await seeText(viewer.page, 'Dessert case');
  assert((await viewer.page.locator('[data-testid^="schedule-edit-"]').count()) === 0, 'a viewer is offered to edit circuits');
  assert((await viewer.page.locator('[data-testid="schedule-import-csv"]').count()) === 0, 'a viewer is offered a CSV import');
  await el(viewer.page, 'panel-schedule-view-close').click();
  await viewer.page.evaluate(() => (window as any).__phasewright.actions.openPanel('about'));
  await seeTestId(viewer.page, 'open-schedules');
  assert((await viewer.page.locator('[data-testid="open-sheet-import"]').count()) === 0, 'a viewer is offered a sheet import');
  assert(viewer.problems.length === 0, `browser problems (viewer): ${viewer.problems.join('; ')}`);
  await viewer.context.close();

  // ---- phone: the farm's house panel as cards
  const farmSheet = await sheetIdByName(owner, projectId, 'Farm service, 120/240 V');
  const phone = await openAs(browser, server, 'owner@example.com', PHONE);
  await openSheet(phone.page, server.url, farmSheet);
  await screenshot(phone.page, 'demo-farm-phone');
  await selectElement(phone.page, 'house-panel');
  await phone.page.evaluate(() => (window as any).__phasewright.actions.openPanel('inspector'));
  await el(phone.page, 'inspector-schedule').click();
  await seeTestId(phone.page, 'schedule-cards');
  await until('the farm neutral current', () => el(phone.page, 'schedule-neutral').innerText(), (t) => /\d+\.\d A/.test(t));
  await screenshot(phone.page, 'schedule-phone');
  await el(phone.page, 'schedule-edit-kitchen').click();
  await seeTestId(phone.page, 'circuit-form-kitchen');
  await screenshot(phone.page, 'schedule-edit-phone');
  await el(phone.page, 'circuit-cancel').click();
  await el(phone.page, 'schedule-import-csv').click();
  await el(phone.page, 'csv-text').fill('circuit,description,phases,load\n10,Freezer,C,0.7\n');
  await el(phone.page, 'csv-check').click();
  await seeText(phone.page, /Line 2, phases: the panel has no phase C/);
  await screenshot(phone.page, 'schedule-csv-phone');
  assert(phone.problems.length === 0, `browser problems (phone): ${phone.problems.join('; ')}`);
  await phone.context.close();
});

async function openSheetEmpty(page: Page, url: string, sheetId: string) {
  await page.goto(`${url}/sheets/${sheetId}?probe`);
  await page.waitForFunction(() => !!(window as any).__phasewright, undefined, { timeout: 30_000 });
  await seeTestId(page, 'empty-sheet-hint');
}
