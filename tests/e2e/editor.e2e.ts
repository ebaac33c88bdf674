// The editor in a real browser on the web build, at 390x844 (phone) and 1440x900 (wide), with touch input through
// Chromium's DevTools protocol: draw a small 208Y/120 system on an empty sheet (a source, a feeder, a panel, two
// 120 V loads on different phases), read the load voltages on the drawing, open the neutral with the cut tool and
// check the new voltages against the hand calculation, undo, reload and find the sheet as left.
// Screenshots of each step land in tests/e2e/screenshots/editor-*.png.
import type { Browser, Page } from 'playwright-core';
import { assert, assertTouchTarget, el, log, PHONE, runBrowserTest, screenshot, seeTestId, WIDE, type ServerProcess } from './harness';
import {
  demoProjectId,
  documentOf,
  newSheet,
  openAs,
  symbolBox,
  tagNumber,
  toScreen,
  viewTransform,
  waitForTag,
  type Opened,
  type Point,
} from './editor-support';

// Two resistive (heating, constant-impedance) loads at 120 V rating.
const LOAD_A_KW = 1.2;
const LOAD_B_KW = 2.4;

async function placeAt(o: Opened, kind: string, world: Point, phone: boolean) {
  if (phone) {
    await el(o.page, 'tool-add').click();
    await seeTestId(o.page, 'panel-palette');
  }
  await el(o.page, `palette-${kind}`).click();
  const before = await o.page.locator('[data-testid^="sym-"]').count();
  const v = await viewTransform(o.page);
  await o.touch.tap(toScreen(v, world));
  await o.page.waitForFunction((n) => document.querySelectorAll('[data-testid^="sym-"]').length === n + 1, before);
}

/** Clears the selection (a tap on empty canvas) and fits the sheet in view, for a picture of the whole drawing. */
async function showWhole(o: Opened) {
  // Fitted first: zoomed in on a phone, the drawing may cover the whole canvas.
  await el(o.page, 'view-fit').click();
  await o.page.waitForTimeout(300);
  await tapEmptyCanvas(o);
  assert((await o.page.locator('[data-testid^="selected-"]').count()) === 0, 'a tap on empty canvas left something selected');
}

// The drawing this test makes spans about x -120..120 and y -50..450 (drawing units); tag stacks reach x 230.
const DRAWN = { left: -160, top: -70, right: 260, bottom: 470 };

/** Taps a point of the canvas that is on the page's canvas (not under a panel) and away from the drawing. */
async function tapEmptyCanvas(o: Opened) {
  const v = await viewTransform(o.page);
  const box = (await el(o.page, 'sheet-canvas').boundingBox())!;
  const candidates: Point[] = [];
  for (const fx of [0.08, 0.5, 0.92]) for (const fy of [0.2, 0.3, 0.5, 0.7, 0.85]) candidates.push({ x: box.x + box.width * fx, y: box.y + box.height * fy });
  for (const p of candidates) {
    const world = { x: (p.x - v.left - v.x) / v.zoom, y: (p.y - v.top - v.y) / v.zoom };
    const clear = world.x < DRAWN.left || world.x > DRAWN.right || world.y < DRAWN.top || world.y > DRAWN.bottom;
    const onCanvas = await o.page.evaluate(({ x, y }) => !!document.elementFromPoint(x, y)?.closest('[data-testid="sheet-canvas"]'), p);
    if (clear && onCanvas) return o.touch.tap(p);
  }
  throw new Error('no empty spot of the canvas in view to tap');
}

/** A tap with a finger at a drawing point. */
async function dragless(o: Opened, world: Point) {
  const v = await viewTransform(o.page);
  await o.touch.tap(toScreen(v, world));
}

/** Drags with a finger from one drawing point to another. */
async function dragWorld(o: Opened, from: Point, to: Point) {
  const v = await viewTransform(o.page);
  await o.touch.drag(toScreen(v, from), toScreen(v, to));
}

async function idsByName(o: Opened, sheetId: string): Promise<Record<string, string>> {
  const doc = await documentOf(o.api, sheetId);
  return Object.fromEntries(Object.values(doc.elements as Record<string, { id: string; name: string }>).map((e) => [e.name, e.id]));
}

async function openInspectorFor(o: Opened, world: Point, phone: boolean) {
  const v = await viewTransform(o.page);
  await o.touch.tap(toScreen(v, world));
  if (phone) {
    await seeTestId(o.page, 'selection-peek');
    await el(o.page, 'peek-details').click();
    await seeTestId(o.page, 'panel-inspector');
  }
  await seeTestId(o.page, 'inspector-form');
}

async function closePanel(o: Opened, phone: boolean) {
  if (!phone) return;
  const close = o.page.locator('[data-testid$="-close"][aria-label^="Close"]').filter({ visible: true }).first();
  if (await close.count()) await close.click();
}

async function setField(page: Page, key: string, value: string) {
  const input = el(page, `field-${key}`);
  await input.fill(value);
  await input.blur();
  await page.waitForTimeout(150);
}

/** Polls the room's copy of the sheet until `check` holds. */
async function waitForDocument(o: Opened, sheetId: string, check: (doc: any) => boolean, what: string) {
  const deadline = Date.now() + 5000;
  while (Date.now() < deadline) {
    if (check(await documentOf(o.api, sheetId))) return;
    await o.page.waitForTimeout(100);
  }
  throw new Error(`the sheet never came to ${what}`);
}

/** The wide screen's keyboard shortcuts, each checked on the room's copy of the sheet. */
async function keyboardShortcuts(o: Opened, sheetId: string, ids: Record<string, string>) {
  const { page } = o;
  const count = (doc: any) => Object.keys(doc.elements).length;
  const clickOn = async (name: string) => {
    const b = await symbolBox(page, ids[name]);
    await page.mouse.click(b.x + b.width / 2, b.y + b.height / 2);
    await page.locator(`[data-testid="selected-${ids[name]}"]`).waitFor({ state: 'attached', timeout: 3000 });
  };
  await clickOn('Load B');
  await page.keyboard.press('r');
  await waitForDocument(o, sheetId, (d) => d.elements[ids['Load B']].rotationDeg === 90, 'Load B turned a quarter (R)');
  await page.keyboard.press('Control+z');
  await waitForDocument(o, sheetId, (d) => !d.elements[ids['Load B']].rotationDeg, 'Load B turned back (Ctrl+Z)');
  await page.keyboard.press('Control+Shift+z');
  await waitForDocument(o, sheetId, (d) => d.elements[ids['Load B']].rotationDeg === 90, 'Load B turned again (Ctrl+Shift+Z)');
  await page.keyboard.press('Control+z');
  await page.keyboard.press('Control+d');
  await waitForDocument(o, sheetId, (d) => count(d) === 6, 'a copy of Load B (Ctrl+D)');
  await page.keyboard.press('Delete');
  await waitForDocument(o, sheetId, (d) => count(d) === 5 && !!d.elements[ids['Load B']], 'the copy deleted and Load B kept (Delete)');
  // Typing in a field is never a shortcut: Backspace in Load A's name edits the name, not the sheet.
  await clickOn('Load A');
  await el(page, 'field-name').click();
  await page.keyboard.press('End');
  await page.keyboard.press('Backspace');
  await page.keyboard.press('r');
  await page.waitForTimeout(300);
  const typed = await documentOf(o.api, sheetId);
  assert(count(typed) === 5 && !typed.elements[ids['Load A']].rotationDeg, 'keys typed into a field acted on the sheet');
  await page.keyboard.press('Tab'); // the name is written when the field loses the focus
  await waitForDocument(o, sheetId, (d) => d.elements[ids['Load A']].name === 'Load r', 'the typed name "Load r"');
  await page.locator('[data-testid="sheet-canvas"]').first().focus().catch(() => undefined);
  await page.mouse.move(0, 0);
  await page.keyboard.press('Escape');
  await page.locator('[data-testid^="selected-"]').first().waitFor({ state: 'detached', timeout: 3000 }).catch(() => {
    throw new Error('Escape left the selection');
  });
  await screenshot(page, 'editor-wide-11-shortcuts');
}

async function drawingJourney(browser: Browser, server: ServerProcess, size: { width: number; height: number }, label: 'phone' | 'wide') {
  const phone = label === 'phone';
  const o = await openAs(browser, server, 'owner@example.com', size);
  const projectId = await demoProjectId(o.api);
  const sheetId = await newSheet(o.api, projectId, `Small 208Y/120 (${label})`);
  await o.page.goto(`${server.url}/sheets/${sheetId}`);
  await seeTestId(o.page, 'sheet-canvas');
  await seeTestId(o.page, 'empty-sheet-hint');
  await seeTestId(o.page, 'link-connected');
  // Every button of the editor's frame is finger-sized (44 px), at both sizes.
  const frame = ['tool-select', 'tool-cut', 'tool-undo', 'tool-redo', 'view-fit', 'editor-back', 'editor-about', 'open-cautions'];
  for (const id of phone ? [...frame, 'tool-add', 'tool-results'] : [...frame, 'view-zoom-in', 'view-zoom-out']) await assertTouchTarget(el(o.page, id), id);
  if (!phone) for (const kind of ['source', 'bus', 'run', 'load']) await assertTouchTarget(el(o.page, `palette-${kind}`), `palette-${kind}`);
  await screenshot(o.page, `editor-${label}-1-empty`);

  // Place the five elements with the place tool (one tap each).
  await placeAt(o, 'source', { x: 0, y: 0 }, phone);
  await placeAt(o, 'run', { x: 0, y: 140 }, phone);
  await placeAt(o, 'bus', { x: 0, y: 280 }, phone);
  await placeAt(o, 'load', { x: -80, y: 380 }, phone);
  await placeAt(o, 'load', { x: 80, y: 380 }, phone);
  await screenshot(o.page, `editor-${label}-2-placed`);

  // Connect by dragging from terminal to terminal (source out → feeder; feeder → panel bar; each load → bar).
  await dragWorld(o, { x: 0, y: 44 }, { x: 0, y: 80 });
  await dragWorld(o, { x: 0, y: 200 }, { x: 0, y: 280 });
  await dragWorld(o, { x: -80, y: 350 }, { x: -80, y: 282 });
  await dragWorld(o, { x: 80, y: 350 }, { x: 80, y: 282 });
  const doc = await documentOf(o.api, sheetId);
  const connections = Object.values(doc.connections as Record<string, { conductorMap: Record<string, string> }>);
  assert(connections.length === 4, `expected 4 connections, the sheet has ${connections.length}`);
  await screenshot(o.page, `editor-${label}-3-connected`);

  // The two loads: names, power, resistive.
  const ids0 = await idsByName(o, sheetId);
  for (const [world, name, kw] of [
    [{ x: -80, y: 380 }, 'Load A', LOAD_A_KW],
    [{ x: 80, y: 380 }, 'Load B', LOAD_B_KW],
  ] as const) {
    await openInspectorFor(o, world, phone);
    await setField(o.page, 'name', name);
    await setField(o.page, 'kw', `${kw * 1000} W`);
    await el(o.page, 'field-loadKind-heating').click();
    await o.page.waitForTimeout(150);
    if (name === 'Load A') await screenshot(o.page, `editor-${label}-4-inspector`);
    await closePanel(o, phone);
  }
  const ids = await idsByName(o, sheetId);
  assert(ids['Load A'] && ids['Load B'] && ids0.Utility, `the loads were not renamed: ${JSON.stringify(ids)}`);
  const docAfter = await documentOf(o.api, sheetId);
  // Which bus phase each load's own A terminal lands on, read from the connection's conductor map.
  const phaseOf = (loadId: string) => {
    const c = Object.values(docAfter.connections as Record<string, any>).find((x) => x.from.elementId === loadId || x.to.elementId === loadId);
    assert(c, `no connection feeds ${loadId}`);
    const map = c.conductorMap as Record<string, string>;
    return c.from.elementId === loadId ? map.A : Object.keys(map).find((k) => map[k] === 'A');
  };
  const phases = [phaseOf(ids['Load A']), phaseOf(ids['Load B'])];
  assert(phases[0] !== phases[1] && phases.every((p) => ['A', 'B', 'C'].includes(p!)), `the two loads should be on different phases: ${JSON.stringify(phases)}`);
  assert(docAfter.elements[ids['Load A']].kw === LOAD_A_KW, `Load A holds ${docAfter.elements[ids['Load A']].kw} kW`);

  // Read the load voltages on the drawing.
  const vA = await waitForTag(o.page, `${ids['Load A']}:v`, (v) => v > 110 && v < 125, 'about 120 V');
  const vB = await waitForTag(o.page, `${ids['Load B']}:v`, (v) => v > 110 && v < 125, 'about 120 V');
  // source: 208Y/120 nominal, V_LN = 208/√3 = 120.1 V (common practice, no source); a 100 ft 4/0 feeder drops under 1 %
  assert(Math.abs(vA - 120.1) < 1.5 && Math.abs(vB - 120.1) < 1.5, `load voltages ${vA} and ${vB}, not about 120 V`);
  await showWhole(o);
  await screenshot(o.page, `editor-${label}-5-voltages`);
  log(`${label}: closed neutral, loads at ${vA} V and ${vB} V`);

  // Two fingers: pinch out, then back in; the view zooms about the fingers and the drawing stays.
  const canvasBox = (await el(o.page, 'sheet-canvas').boundingBox())!;
  const centre = { x: canvasBox.x + canvasBox.width / 2, y: canvasBox.y + canvasBox.height / 2 };
  const before = await viewTransform(o.page);
  await o.touch.pinch(centre, 240, 120);
  const pinched = await viewTransform(o.page);
  assert(pinched.zoom < before.zoom * 0.75, `a pinch from 240 to 120 px left the zoom at ${pinched.zoom} (was ${before.zoom})`);
  await screenshot(o.page, `editor-${label}-6-pinched`);
  await o.touch.pinch(centre, 120, 240, { x: 0, y: 0 });
  const restored = await viewTransform(o.page);
  assert(Math.abs(restored.zoom - before.zoom) / before.zoom < 0.15, `pinching back gave zoom ${restored.zoom}, not about ${before.zoom}`);
  await o.touch.pinch(centre, 160, 160, { x: 40, y: 30 });
  const panned = await viewTransform(o.page);
  assert(Math.abs(panned.x - restored.x - 40) < 12 && Math.abs(panned.y - restored.y - 30) < 12, `a two-finger pan of (40, 30) moved the view by (${panned.x - restored.x}, ${panned.y - restored.y})`);
  await o.touch.pinch(centre, 160, 160, { x: -40, y: -30 });

  // The cut tool: tap the feeder, choose its neutral.
  await el(o.page, 'tool-cut').click();
  await dragless(o, { x: 0, y: 140 });
  await seeTestId(o.page, 'cut-chooser');
  await assertTouchTarget(el(o.page, 'cut-N'), 'the neutral button of the cut chooser');
  await screenshot(o.page, `editor-${label}-7-cut-chooser`);
  await el(o.page, 'cut-N').click();
  const openA = await waitForTag(o.page, `${ids['Load A']}:v`, (v) => v > 130, 'above 130 V with the neutral open');
  const openB = await waitForTag(o.page, `${ids['Load B']}:v`, (v) => v < 80, 'below 80 V with the neutral open');
  // Hand calculation: with the neutral open the two loads are in series across the line-to-line voltage, each
  // resistive load's impedance from its rating, Z = V²/P, read from the sheet as drawn:
  // V1 = V_LL · Z1 / (Z1 + Z2) (Ohm's law / voltage divider, common practice, no source).
  // The feeder's two phase conductors add about 0.012 Ω to an 18 Ω loop (100 ft of 4/0 copper, from memory),
  // well under 0.1 V at these figures, so the drawing must agree within 0.3 V.
  const sheetNow = await documentOf(o.api, sheetId);
  const vLL = sheetNow.elements[ids0.Utility].nominalVolts as number;
  const ohms = (name: string) => {
    const load = sheetNow.elements[ids[name]];
    return load.ratedVolts ** 2 / (load.kw * 1000);
  };
  const zA = ohms('Load A');
  const zB = ohms('Load B');
  const expectA = (vLL * zA) / (zA + zB);
  const expectB = (vLL * zB) / (zA + zB);
  assert(vLL === 208 && Math.abs(zA - 12) < 1e-9 && Math.abs(zB - 6) < 1e-9, `the sheet holds ${vLL} V and loads of ${zA} Ω and ${zB} Ω`);
  assert(Math.abs(openA - expectA) < 0.3, `Load A reads ${openA} V with the neutral open; the hand calculation gives ${expectA.toFixed(2)} V`);
  assert(Math.abs(openB - expectB) < 0.3, `Load B reads ${openB} V with the neutral open; the hand calculation gives ${expectB.toFixed(2)} V`);
  const feederId = ids.Feeder;
  const neutralAmps = await tagNumber(o.page, `${feederId}:i-N`);
  assert(neutralAmps < 0.05, `the opened neutral still carries ${neutralAmps} A`);
  const standing = await o.page.locator(`[data-testid="tag-${ids['Load A']}:v"]`).first().getAttribute('data-standing');
  assert(standing === 'outside', `Load A's ${openA} V tag stands as ${standing}, not outside`);
  // The lost neutral is named on the drawing: the panel's neutral bar and the loads are live only through loads.
  const panelState = await o.page.locator(`[data-testid="state-${ids.Panel}"] text`).first().textContent();
  assert(panelState === 'N BACK-FED', `the panel's state badge reads ${panelState}`);
  for (const name of ['Load A', 'Load B']) {
    const word = await o.page.locator(`[data-testid="state-${ids[name]}"] text`).first().textContent();
    assert(word === 'BACK-FED', `${name}'s state badge reads ${word}`);
  }
  log(`${label}: neutral open, loads at ${openA} V and ${openB} V (hand: ${expectA.toFixed(2)}, ${expectB.toFixed(2)})`);
  await el(o.page, 'tool-cut').click(); // back to select
  await showWhole(o);
  await screenshot(o.page, `editor-${label}-8-neutral-open`);
  const cutDoc = await documentOf(o.api, sheetId);
  assert(cutDoc.elements[feederId].conductors.N.open === true, 'the cut did not reach the document');

  // Undo the cut: the neutral closes and the voltages return, and the message says so.
  await el(o.page, 'tool-undo').click();
  await o.page.waitForFunction(() => document.querySelector('[data-testid="editor-message"]')?.textContent === 'Undone', undefined, { timeout: 3000 });
  await waitForTag(o.page, `${ids['Load A']}:v`, (v) => v > 110 && v < 125, 'about 120 V again after undo');
  await screenshot(o.page, `editor-${label}-9-undone`);

  // An ungrounded source: the panel is named ungrounded on the drawing; undo grounds it again.
  await openInspectorFor(o, { x: 0, y: 0 }, phone);
  await el(o.page, 'field-grounding-ungrounded').click();
  const ungroundedMark = o.page.locator(`[data-testid="ungrounded-${ids.Panel}"]`);
  await ungroundedMark.waitFor({ state: 'attached', timeout: 8000 }).catch(() => {
    throw new Error('an ungrounded source did not mark the panel UNGROUNDED');
  });
  assert((await ungroundedMark.textContent())?.trim() === 'UNGROUNDED', `the panel's mark reads ${await ungroundedMark.textContent()}`);
  await closePanel(o, phone);
  await showWhole(o);
  await screenshot(o.page, `editor-${label}-9b-ungrounded`);
  await el(o.page, 'tool-undo').click();
  await ungroundedMark.waitFor({ state: 'detached', timeout: 8000 });

  // Reload: the sheet is as it was left.
  await o.page.reload();
  await seeTestId(o.page, 'sheet-canvas');
  const again = await waitForTag(o.page, `${ids['Load A']}:v`, (v) => v > 110 && v < 125, 'about 120 V after a reload');
  const left = await documentOf(o.api, sheetId);
  assert(Object.keys(left.elements).length === 5 && Object.keys(left.connections).length === 4, 'after the reload the sheet has lost elements or connections');
  assert(left.elements[feederId].conductors.N.open !== true, 'after undo and reload the neutral should be closed');
  for (const name of ['Utility', 'Feeder', 'Panel', 'Load A', 'Load B']) assert(await o.page.locator(`[data-testid="sym-${ids[name]}"]`).count() === 1, `${name} is not drawn after the reload`);
  assert(left.elements[ids0.Utility].grounding === 'solid', `after undo and reload the source is ${left.elements[ids0.Utility].grounding}`);
  await screenshot(o.page, `editor-${label}-10-reloaded`);
  log(`${label}: after undo and reload, Load A at ${again} V`);
  if (!phone) await keyboardShortcuts(o, sheetId, ids);
  assert(o.problems.length === 0, `the browser reported problems:\n${o.problems.join('\n')}`);
  await o.context.close();
}

runBrowserTest('editor', async (browser, server) => {
  await drawingJourney(browser, server, PHONE, 'phone');
  await drawingJourney(browser, server, WIDE, 'wide');
});
