// Revisions in a real browser, on a phone (390x844) and wide (1440x900), one server for both: the demo owner opens
// the café panel's schedule and imports a small CSV into it, issues a revision with a note, makes a viewer link; a
// fresh browser with no account opens the link, goes to its revisions, gives a name and approves the revision with
// a comment; the owner sees the approval on the revision, finds the review e-mail in the outbox, and downloads the
// revision's report: a PDF whose text names the sheet and the revision. Pictures revisions-<size>-*.
import { spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import type { Browser, Page } from 'playwright-core';
import {
  assert,
  byPrefix,
  closeAll,
  el,
  linkFromOutbox,
  log,
  newBrowserPage,
  openDemoProject,
  PHONE,
  runBrowserTest,
  screenshot,
  seeTestId,
  seeText,
  signInWithForm,
  WIDE,
  type ServerProcess,
} from './harness';
import { importScheduleCsv, openScheduleOf, openSheet } from './schedule-steps';

const SHEET = 'Building distribution';

/** Clicks a download button; the app opens the file's address, which the server sends as an attachment. */
async function download(page: Page, testId: string): Promise<{ url: string; file: string }> {
  const context = page.context();
  const popup = context.waitForEvent('page', { timeout: 15_000 }).catch(() => null);
  const here = page.waitForEvent('download', { timeout: 15_000 }).catch(() => null);
  await el(page, testId).click();
  const opened = await popup;
  const got = opened ? await Promise.race([opened.waitForEvent('download', { timeout: 15_000 }), here]) : await here;
  assert(got, `clicking ${testId} downloaded nothing`);
  const dir = mkdtempSync(path.join(os.tmpdir(), 'pw-download-'));
  const file = path.join(dir, got.suggestedFilename());
  await got.saveAs(file);
  if (opened && !opened.isClosed()) await opened.close();
  return { url: got.url(), file };
}

async function runAt(browser: Browser, server: ServerProcess, size: 'phone' | 'wide') {
  const viewport = size === 'phone' ? PHONE : WIDE;
  const isPhone = size === 'phone';
  const shot = (page: Page, step: string) => screenshot(page, `revisions-${size}-${step}`);
  // Each size adds its own circuits, so the second pass imports into a schedule the first one changed.
  const circuits = size === 'phone' ? ['Ice machine', 'Hand dryer'] : ['Dessert case', 'Grinder'];
  const numbers = size === 'phone' ? [13, 15] : [17, 19];
  const csv = ['circuit,description,phases,load,power factor,breaker', `${numbers[0]},${circuits[0]},A,0.9,0.9,20`, `${numbers[1]},${circuits[1]},C,0.6,0.9,20`].join('\n');

  // The owner opens the café panel's schedule and imports the file.
  const owner = await newBrowserPage(browser, viewport);
  await signInWithForm(owner.page, server.url, 'owner@example.com');
  const projectPath = await openDemoProject(owner.page);
  const row = owner.page.locator('[data-testid^="sheet-row-"]').filter({ hasText: SHEET }).filter({ visible: true }).first();
  await row.waitFor({ state: 'visible' });
  const sheetId = (await row.getAttribute('data-testid'))!.replace('sheet-row-', '');
  await openSheet(owner.page, server.url, sheetId);
  await openScheduleOf(owner.page, 'cafe-panel', isPhone);
  await shot(owner.page, '1-schedule');
  await importScheduleCsv(owner.page, { name: `cafe-${size}.csv`, text: csv }, 2, 'Café panel', circuits[0], () => shot(owner.page, '2-csv-preview'));
  await (await seeText(owner.page, circuits[1])).scrollIntoViewIfNeeded();
  await shot(owner.page, '3-schedule-imported');
  await el(owner.page, 'panel-schedule-view-close').click();

  // Issues a revision with a note, reached from the sheet's details.
  await el(owner.page, 'editor-about').click();
  await el(owner.page, 'open-revisions').click();
  await seeTestId(owner.page, 'revisions-screen');
  const note = `Café circuits added (${size})`;
  await seeTestId(owner.page, 'revision-list');
  const before = await byPrefix(owner.page, 'revision-row-').evaluateAll((rows) => rows.map((r) => Number(r.getAttribute('data-testid')!.replace('revision-row-', ''))));
  const number = Math.max(0, ...before) + 1;
  await el(owner.page, 'revision-note').fill(note);
  await el(owner.page, 'issue-revision-button').click();
  // The new revision is chosen and shown at once (on a phone in place of the list).
  await seeTestId(owner.page, `revision-detail-${number}`);
  await el(owner.page, `revision-detail-${number}`).getByText(note, { exact: true }).waitFor({ state: 'visible', timeout: 15_000 });
  assert((await el(owner.page, `revision-detail-${number}`).locator('[aria-label="Status: Issued"]').count()) === 1, `revision ${number} is not shown as issued`);
  await shot(owner.page, '4-revision-issued');
  // The note box is empty again for the next revision.
  if (isPhone) await el(owner.page, 'revisions-all').click();
  assert((await el(owner.page, 'revision-note').inputValue()) === '', 'the note box still holds the issued revision\'s note');

  // Makes a viewer link from the share panel.
  await owner.page.goto(`${server.url}${projectPath}`);
  await el(owner.page, `share-sheet-${sheetId}`).click();
  await seeTestId(owner.page, 'share-sheet');
  await el(owner.page, 'link-label').fill(`For the reviewer (${size})`);
  await el(owner.page, 'link-submit').click();
  const linkUrl = await (await seeTestId(owner.page, 'new-link-url')).inputValue();
  assert(linkUrl.startsWith(`${server.url}/view/`), `the new link's address is ${linkUrl}`);
  await shot(owner.page, '5-link-made');
  await el(owner.page, 'new-link-done').click();

  // A fresh browser without an account opens the link, goes to its revisions, gives a name and approves.
  const visitor = await newBrowserPage(browser, viewport);
  await visitor.page.goto(linkUrl);
  await seeTestId(visitor.page, isPhone ? 'editor-phone' : 'editor-wide');
  await el(visitor.page, 'editor-about').click();
  await shot(visitor.page, '6-link-about');
  await el(visitor.page, 'view-open-revisions').click();
  await seeTestId(visitor.page, 'link-revisions-screen');
  await seeTestId(visitor.page, `revision-row-${number}`);
  assert((await visitor.page.getByTestId('issue-revision').count()) === 0, 'a visitor through a link is offered to issue a revision');
  await seeTestId(visitor.page, 'guest-name');
  await shot(visitor.page, '7-link-revisions');
  const reviewer = size === 'phone' ? 'Rosa Lindqvist' : 'Tomas Ferreira';
  await el(visitor.page, 'guest-name-field').fill(reviewer);
  await el(visitor.page, 'guest-name-submit').click();
  await seeText(visitor.page, `Reviewing as ${reviewer} (guest)`);
  await el(visitor.page, `revision-row-${number}`).click();
  await seeTestId(visitor.page, `revision-detail-${number}`);
  assert((await visitor.page.getByTestId('restore-revision').count()) === 0, 'a visitor through a link is offered to restore');
  const comment = 'Checked the café circuits against the schedule; approved.';
  await el(visitor.page, 'review-comment').fill(comment);
  await el(visitor.page, 'review-approved').click();
  await seeText(visitor.page, `Approved by ${reviewer} (viewer link)`);
  await (await seeText(visitor.page, comment)).scrollIntoViewIfNeeded();
  await shot(visitor.page, '8-link-approved');

  // Back as the owner: the approval on the revision, and the review e-mail in the outbox.
  await owner.page.goto(`${server.url}/revisions/${sheetId}?number=${number}`);
  await seeTestId(owner.page, `revision-detail-${number}`);
  await seeText(owner.page, `Approved by ${reviewer} (viewer link)`);
  await (await seeText(owner.page, comment)).scrollIntoViewIfNeeded();
  const status = await el(owner.page, `revision-detail-${number}`).locator('[aria-label="Status: Approved"]').count();
  assert(status === 1, `revision ${number} does not show the status Approved`);
  await shot(owner.page, '9-owner-sees-approval');
  const mailLink = await linkFromOutbox(owner.page, server.url, 'owner@example.com', '/revisions/', new RegExp(`${reviewer} approved revision ${number} of ${SHEET}`));
  await shot(owner.page, '10-outbox');
  assert(mailLink.includes(sheetId), `the review e-mail links to ${mailLink}, not to the sheet's revisions`);

  // Downloads the revision's report from the revision's page.
  await owner.page.goto(mailLink);
  await seeTestId(owner.page, `revision-detail-${number}`);
  const report = await download(owner.page, 'download-report.pdf');
  const head = await owner.context.request.get(report.url);
  assert(head.ok(), `the report answered ${head.status()}`);
  assert(head.headers()['content-type']?.startsWith('application/pdf'), `the report's content-type is ${head.headers()['content-type']}`);
  const bytes = readFileSync(report.file);
  assert(bytes.subarray(0, 5).toString('latin1') === '%PDF-', `the downloaded report starts with ${JSON.stringify(bytes.subarray(0, 8).toString('latin1'))}`);
  const text = spawnSync('/usr/bin/pdftotext', ['-layout', report.file, '-'], { encoding: 'utf8' });
  assert(text.status === 0, `pdftotext failed: ${text.stderr}`);
  assert(text.stdout.includes(SHEET), `the report's text does not name the sheet "${SHEET}"`);
  assert(new RegExp(`Revision\\s+${number}\\b`, 'i').test(text.stdout), `the report's text does not name revision ${number}`);
  log(`${size}: revision ${number}, report ${path.basename(report.file)} ${bytes.length} bytes`);
  rmSync(path.dirname(report.file), { recursive: true, force: true });

  await closeAll([['owner', owner], ['visitor', visitor]]);
}

runBrowserTest('revisions', async (browser, server) => {
  await runAt(browser, server, 'phone');
  await runAt(browser, server, 'wide');
});
