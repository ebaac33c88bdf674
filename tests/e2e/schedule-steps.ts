// Steps the panel-schedule browser tests share: finding a demo sheet, opening it with the page's probe, choosing an
// element, waiting for a reading, and importing a CSV into the open schedule through the file chooser.
import type { Page } from 'playwright-core';
import type { TestClient } from '../support/http-client';
import { assert, el, seeTestId, seeText } from './harness';

export async function sheetIdByName(api: TestClient, projectId: string, name: string): Promise<string> {
  const r = await api.get(`/api/projects/${projectId}/sheets`);
  const s = (r.body.sheets as { id: string; name: string }[]).find((x) => x.name === name);
  assert(s, `demo sheet ${name} is missing`);
  return s.id;
}

/** Reads until `ok` holds, failing with the last value read after `timeoutMs`. */
export async function until<T>(what: string, read: () => Promise<T>, ok: (v: T) => boolean, timeoutMs = 10_000): Promise<T> {
  const deadline = Date.now() + timeoutMs;
  let last: T = await read();
  while (!ok(last)) {
    if (Date.now() > deadline) throw new Error(`${what}: still ${JSON.stringify(last)}`);
    await new Promise((r) => setTimeout(r, 200));
    last = await read();
  }
  return last;
}

/** Opens a drawn sheet with the page's probe (window.__phasewright) and waits for its symbols. */
export async function openSheet(page: Page, url: string, sheetId: string) {
  await page.goto(`${url}/sheets/${sheetId}?probe`);
  await page.waitForFunction(() => document.querySelectorAll('[data-testid^="sym-"]').length > 10, undefined, { timeout: 30_000 });
  await page.waitForFunction(() => !!(window as any).__phasewright, undefined, { timeout: 15_000 });
}

export async function selectElement(page: Page, id: string) {
  await page.evaluate((elementId) => (window as any).__phasewright.actions.selectElements([elementId]), id);
}

/** Opens the chosen panel's schedule from its inspector (on a phone the inspector is a panel to open first). */
export async function openScheduleOf(page: Page, panelId: string, isPhone: boolean) {
  await selectElement(page, panelId);
  if (isPhone) await page.evaluate(() => (window as any).__phasewright.actions.openPanel('inspector'));
  await el(page, 'inspector-schedule').click();
  await seeTestId(page, isPhone ? 'schedule-cards' : 'schedule-table');
}

/**
 * Imports a good CSV file into the open schedule (or its open import form), chosen from disk: its text and the preview shown, then placed.
 * `count` circuits under `panelName`; returns once the schedule is back with `firstName` in it.
 */
export async function importScheduleCsv(page: Page, file: { name: string; text: string }, count: number, panelName: string, firstName: string, onPreview?: () => Promise<void>) {
  // The import form may be open already (after a bad file, say).
  if ((await page.getByTestId('csv-import').filter({ visible: true }).count()) === 0) await el(page, 'schedule-import-csv').click();
  await seeTestId(page, 'csv-import');
  const chooser = page.waitForEvent('filechooser');
  await el(page, 'csv-pick').click();
  await (await chooser).setFiles({ name: file.name, mimeType: 'text/csv', buffer: Buffer.from(file.text) });
  await seeText(page, `Text of ${file.name}`);
  await seeText(page, new RegExp(`Place ${count} circuits? under ${panelName}`));
  if (onPreview) await onPreview();
  await el(page, 'csv-import-confirm').click();
  await seeText(page, firstName);
}
