// The crew in real browsers: two editors on one sheet each add an element and see the other's within a second,
// and see each other's cursors; a viewer sees both elements and both people live, and has no editing tools
// (a cut there is a trial that is never saved).
import type { Page } from 'playwright-core';
import { assert, el, log, notSeeTestId, PHONE, runBrowserTest, screenshot, seeTestId, WIDE } from './harness';
import { demoProjectId, documentOf, newSheet, openAs, toScreen, viewTransform, type Opened, type Point } from './editor-support';

const SEE_WITHIN_MS = 1000;

async function countDrawn(page: Page): Promise<number> {
  return page.locator('[data-testid^="sym-"]').count();
}

/** Places an element with the place tool and returns how long until `other` draws it. */
async function placeAndWatch(o: Opened, other: Opened, kind: string, world: Point, phone: boolean): Promise<number> {
  const before = await countDrawn(other.page);
  if (phone) {
    await el(o.page, 'tool-add').click();
    await seeTestId(o.page, 'panel-palette');
  }
  await el(o.page, `palette-${kind}`).click();
  const v = await viewTransform(o.page);
  const seen = other.page.waitForFunction((n) => document.querySelectorAll('[data-testid^="sym-"]').length > n, before, { polling: 'raf', timeout: 10_000 });
  const started = Date.now();
  await o.touch.tap(toScreen(v, world));
  await seen;
  return Date.now() - started;
}

runBrowserTest('editor crew', async (browser, server) => {
  const a = await openAs(browser, server, 'owner@example.com', WIDE);
  const b = await openAs(browser, server, 'editor@example.com', PHONE);
  const c = await openAs(browser, server, 'viewer@example.com', WIDE);
  const projectId = await demoProjectId(a.api);
  const members = (await a.api.get(`/api/projects/${projectId}/members`)).body.members as { userId: string; email: string }[];
  const idOf = (email: string) => members.find((m) => m.email === email)!.userId;
  const sheetId = await newSheet(a.api, projectId, 'Crew check');
  for (const o of [a, b, c]) {
    await o.page.goto(`${server.url}/sheets/${sheetId}`);
    await seeTestId(o.page, 'sheet-canvas');
    await seeTestId(o.page, 'link-connected');
  }

  // Each sees the other two in the crew.
  for (const [o, others] of [
    [a, ['editor@example.com', 'viewer@example.com']],
    [b, ['owner@example.com', 'viewer@example.com']],
    [c, ['owner@example.com', 'editor@example.com']],
  ] as const) {
    for (const email of others) await seeTestId(o.page, `crew-chip-${idOf(email)}`);
  }

  // Each person has a colour of their own, the same on every screen.
  const colours: Record<string, string>[] = [];
  for (const o of [a, b, c]) {
    const seen: Record<string, string> = {};
    for (const email of ['owner@example.com', 'editor@example.com', 'viewer@example.com']) {
      seen[email] = await el(o.page, `crew-chip-${idOf(email)}`).evaluate((n) => getComputedStyle(n).backgroundColor);
    }
    assert(new Set(Object.values(seen)).size === 3, `two people share a colour: ${JSON.stringify(seen)}`);
    colours.push(seen);
  }
  assert(colours.every((x) => JSON.stringify(x) === JSON.stringify(colours[0])), `the colours differ between screens: ${JSON.stringify(colours)}`);

  // Each editor adds an element; the other sees it within a second.
  const aToB = await placeAndWatch(a, b, 'bus', { x: -100, y: 40 }, false);
  const bToA = await placeAndWatch(b, a, 'load', { x: 60, y: 200 }, true);
  log(`an element placed by one editor reached the other in ${aToB} ms and ${bToA} ms`);
  assert(aToB < SEE_WITHIN_MS, `the editor saw the owner's bus after ${aToB} ms`);
  assert(bToA < SEE_WITHIN_MS, `the owner saw the editor's load after ${bToA} ms`);
  await c.page.waitForFunction(() => document.querySelectorAll('[data-testid^="sym-"]').length === 2);
  const doc = await documentOf(a.api, sheetId);
  assert(Object.keys(doc.elements).length === 2, `the room holds ${Object.keys(doc.elements).length} elements`);

  // Cursors: the owner's mouse over the canvas, the editor's finger on it.
  const box = (await el(a.page, 'sheet-canvas').boundingBox())!;
  await a.page.mouse.move(box.x + box.width / 2 + 40, box.y + 300);
  await a.page.mouse.move(box.x + box.width / 2 + 60, box.y + 320, { steps: 4 });
  await b.page.locator(`[data-testid="crew-cursor-${idOf('owner@example.com')}"]`).waitFor({ state: 'attached', timeout: 3000 });
  const bv = await viewTransform(b.page);
  await b.touch.tap(toScreen(bv, { x: 120, y: 360 }));
  await a.page.locator(`[data-testid="crew-cursor-${idOf('editor@example.com')}"]`).waitFor({ state: 'attached', timeout: 3000 });
  await c.page.locator(`[data-testid="crew-cursor-${idOf('owner@example.com')}"]`).waitFor({ state: 'attached', timeout: 3000 });
  await c.page.locator(`[data-testid="crew-cursor-${idOf('editor@example.com')}"]`).waitFor({ state: 'attached', timeout: 3000 });
  // The name beside a cursor comes from the session, not from what the browser claims.
  const label = await b.page.locator(`[data-testid="crew-cursor-${idOf('owner@example.com')}"] text`).first().textContent();
  assert(label === 'Rosa Almeida', `the owner's cursor is labelled ${label}`);
  await screenshot(a.page, 'editor-crew-wide-owner');
  await screenshot(b.page, 'editor-crew-phone-editor');

  // The owner opens the sheet in a second tab: still one person in every crew, with a cursor per tab.
  const ownerTab2 = await a.context.newPage();
  await ownerTab2.goto(`${server.url}/sheets/${sheetId}`);
  await seeTestId(ownerTab2, 'sheet-canvas');
  await seeTestId(ownerTab2, 'link-connected');
  const box2 = (await el(ownerTab2, 'sheet-canvas').boundingBox())!;
  await ownerTab2.mouse.move(box2.x + box2.width / 2 - 80, box2.y + 200);
  await ownerTab2.mouse.move(box2.x + box2.width / 2 - 60, box2.y + 220, { steps: 4 });
  const ownerCursors = `[data-testid="crew-cursor-${idOf('owner@example.com')}"]`;
  await b.page.waitForFunction((sel) => document.querySelectorAll(sel).length === 2, ownerCursors, { timeout: 5000 });
  for (const [page, who] of [[a.page, 'owner, first tab'], [ownerTab2, 'owner, second tab'], [b.page, 'editor'], [c.page, 'viewer']] as const) {
    const chips = await page.locator(`[data-testid="crew-chip-${idOf('owner@example.com')}"]`).count();
    assert(chips === 1, `the ${who} sees the owner ${chips} times in the top bar`);
  }
  await el(b.page, 'crew-button').click();
  await seeTestId(b.page, 'crew-list');
  const rows = b.page.locator(`[data-testid="crew-list"] [data-testid="crew-member-${idOf('owner@example.com')}"]`);
  assert((await rows.count()) === 1, `the crew list names the owner ${await rows.count()} times`);
  const row = (await rows.first().textContent()) ?? '';
  assert(row.includes('2 tabs'), `the owner's crew row says ${row}`);
  await screenshot(b.page, 'editor-crew-phone-two-tabs');
  await ownerTab2.close();

  // The viewer: no editing tools, fields that cannot change, and a cut that stays a local trial.
  for (const id of ['tool-add', 'tool-undo', 'tool-redo', 'palette-source', 'palette-load']) await notSeeTestId(c.page, id);
  await seeTestId(c.page, 'tool-cut');
  const cv = await viewTransform(c.page);
  await c.touch.tap(toScreen(cv, { x: -100, y: 40 }));
  await seeTestId(c.page, 'inspector-form');
  const editable = await c.page.locator('[data-testid="field-name"]').filter({ visible: true }).first().evaluate((n) => !(n as HTMLInputElement).readOnly);
  assert(!editable, "the viewer can type into the bus's name");
  await notSeeTestId(c.page, 'inspector-delete');
  const caseLine = await el(c.page, 'editor-case').textContent();
  assert(caseLine?.startsWith('View only'), `the viewer's top bar says ${caseLine}`);
  await screenshot(c.page, 'editor-crew-wide-viewer');
  const after = await documentOf(a.api, sheetId);
  assert(JSON.stringify(after.elements) === JSON.stringify(doc.elements), 'the viewer changed the sheet');

  for (const o of [a, b, c]) assert(o.problems.length === 0, `a browser reported problems:\n${o.problems.join('\n')}`);
  for (const o of [a, b, c]) await o.context.close();
});
