// Sharing a sheet in a real browser: the owner invites an editor, whose invitation is read from the outbox; the
// editor accepts in a fresh browser and edits the farm sheet; the owner makes a viewer link; a fresh browser with
// no account opens it, sees the sheet follow the editor's changes, has no editing tools, gives a name and pins a
// load; the owner sees the pin arrive live, finds its e-mail in the outbox and replies, which the visitor sees
// live; the owner revokes the link and the visitor's page says so. Pictures at 390x844 and 1440x900 (sharing-*).
import type { Browser, Page } from 'playwright-core';
import { touchOf, type Touch } from './editor-support';
import { DEMO_SHEETS } from '../../db/seed';
import {
  assert,
  closeAll,
  el,
  linkFromOutbox,
  newBrowserPage,
  openDemoProject,
  PHONE,
  runBrowserTest,
  screenshot,
  seeTestId,
  seeText,
  signInWithForm,
  WIDE,
  type OpenPage,
  type ServerProcess,
} from './harness';

const FARM = 'Farm service, 120/240 V';
// The demo seed may already have pinned the farm sheet: this test's pins follow those.
const SEEDED_PINS = DEMO_SHEETS.find((s) => s.name === FARM)?.pins.length ?? 0;
const FIRST = SEEDED_PINS + 1;
const PINS_AT_START = SEEDED_PINS === 0 ? 'No pins yet.' : `${SEEDED_PINS} open pin${SEEDED_PINS === 1 ? '' : 's'}, 0 resolved`;

/** The middle of an element's symbol as drawn, in page pixels. */
async function middleOf(page: Page, elementId: string) {
  const box = await page.locator(`[data-testid="sym-${elementId}"]`).first().boundingBox();
  assert(box, `${elementId} is not drawn on ${page.url()}`);
  return { x: box.x + box.width / 2, y: box.y + box.height / 2 };
}

/** Waits until the element's name on the drawing (its accessible label) starts with `name`. */
async function seeElementNamed(page: Page, elementId: string, name: string) {
  await page
    .waitForFunction(
      ([id, n]) => document.querySelector(`[data-testid="el-${id}"]`)?.getAttribute('aria-label')?.startsWith(n) === true,
      [elementId, name] as const,
      { timeout: 15_000 },
    )
    .catch(() => {
      throw new Error(`${elementId} is not drawn as "${name}" on ${page.url()}`);
    });
}

/** Attaches a file to the open pin through the browser's file chooser. */
async function attach(page: Page, file: { name: string; mimeType: string; buffer: Buffer }) {
  const chooser = page.waitForEvent('filechooser', { timeout: 15_000 });
  await el(page, 'pin-attach').click();
  await (await chooser).setFiles(file);
}

/** Renames an element on a phone: tap it, open its details, type the name, Enter. */
async function renameOnPhone(p: OpenPage, touch: Touch, elementId: string, name: string) {
  await touch.tap(await middleOf(p.page, elementId));
  await seeTestId(p.page, 'selection-peek');
  await el(p.page, 'peek-details').click();
  await seeTestId(p.page, 'panel-inspector');
  await el(p.page, 'field-name').fill(name);
  await el(p.page, 'field-name').press('Enter');
  await seeElementNamed(p.page, elementId, name);
  await el(p.page, 'panel-inspector-close').click();
}

async function run(browser: Browser, server: ServerProcess) {
  const stamp = Date.now().toString(36);
  const invited = { name: 'Imani Osei', email: `crew.${stamp}@example.com`, password: 'service-drop-2026' };

  // The owner invites an editor.
  const owner = await newBrowserPage(browser, WIDE);
  await signInWithForm(owner.page, server.url, 'owner@example.com');
  const projectPath = await openDemoProject(owner.page);
  const farmRow = owner.page.locator('[data-testid^="sheet-row-"]').filter({ hasText: FARM }).filter({ visible: true }).first();
  await farmRow.waitFor({ state: 'visible' });
  const farmId = (await farmRow.getAttribute('data-testid'))!.replace('sheet-row-', '');
  await el(owner.page, 'invite-email').fill(invited.email);
  await el(owner.page, 'invite-role-editor').click();
  await el(owner.page, 'invite-submit').click();
  await seeText(owner.page, `Invitation sent to ${invited.email}.`);
  const inviteUrl = await linkFromOutbox(owner.page, server.url, invited.email, '/invite/');

  // The editor accepts in a fresh browser on a phone and edits the farm sheet.
  const editor = await newBrowserPage(browser, PHONE);
  await editor.page.goto(inviteUrl);
  await seeTestId(editor.page, 'invite-screen');
  await el(editor.page, 'name').fill(invited.name);
  await el(editor.page, 'password').fill(invited.password);
  await el(editor.page, 'sign-up-submit').click();
  await el(editor.page, 'accept-invitation').click();
  await seeTestId(editor.page, 'project-detail');
  await editor.page.goto(`${server.url}/sheets/${farmId}`);
  await seeTestId(editor.page, 'editor-phone');
  await seeTestId(editor.page, 'tool-undo'); // an editor's tools
  const editorTouch = await touchOf(editor);
  await renameOnPhone(editor, editorTouch, 'house-lights', 'House and porch lighting');
  await seeTestId(editor.page, 'tool-pins');
  await screenshot(editor.page, 'sharing-phone-editor');

  // The owner makes a viewer link for the farm sheet.
  await owner.page.goto(`${server.url}${projectPath}`);
  await el(owner.page, `share-sheet-${farmId}`).click();
  await seeTestId(owner.page, 'share-sheet');
  await el(owner.page, 'link-label').fill('For the county inspector');
  await el(owner.page, 'link-submit').click();
  const linkUrl = await (await seeTestId(owner.page, 'new-link-url')).inputValue();
  assert(linkUrl.startsWith(`${server.url}/view/`), `the new link's address is ${linkUrl}`);
  await el(owner.page, 'new-link-done').click();
  const linkRow = owner.page.locator('[data-testid^="link-row-"]').filter({ hasText: 'For the county inspector' }).filter({ visible: true }).first();
  await linkRow.waitFor({ state: 'visible' });
  const linkId = (await linkRow.getAttribute('data-testid'))!.replace('link-row-', '');

  // The owner also has the sheet open, to watch pins arrive; the editor's change is there.
  const ownerSheet = await owner.context.newPage();
  ownerSheet.on('pageerror', (error) => owner.problems.push(`page error: ${error.message}`));
  await ownerSheet.goto(`${server.url}/sheets/${farmId}`);
  await seeTestId(ownerSheet, 'editor-wide');
  await seeElementNamed(ownerSheet, 'house-lights', 'House and porch lighting');
  await seeText(ownerSheet, PINS_AT_START);

  // A fresh browser with no account opens the link on a phone: the sheet, read-only, no editing tools.
  const visitor = await newBrowserPage(browser, PHONE);
  await visitor.page.goto(linkUrl);
  await seeTestId(visitor.page, 'editor-phone');
  await seeElementNamed(visitor.page, 'house-lights', 'House and porch lighting');
  for (const tool of ['tool-add', 'tool-undo', 'tool-redo', 'editor-back']) {
    assert((await visitor.page.getByTestId(tool).count()) === 0, `the visitor's page should have no ${tool}`);
  }
  const lookLabel = await (await seeTestId(visitor.page, 'tool-select')).textContent();
  assert(lookLabel?.includes('Look'), `the visitor's first tool reads ${lookLabel}`);
  const caseLine = await (await seeTestId(visitor.page, 'editor-case')).textContent();
  assert(caseLine?.startsWith('View only'), `the visitor's case line reads ${caseLine}`);
  // The top bar names the sheet as its project's list does (not by the name inside its drawing).
  const visitorTitle = await (await seeTestId(visitor.page, 'editor-sheet-name')).textContent();
  assert(visitorTitle === FARM, `the visitor's top bar names the sheet ${visitorTitle}`);
  await seeTestId(visitor.page, 'tool-pins');
  // It is live: the editor's next change reaches the visitor without a reload.
  await renameOnPhone(editor, editorTouch, 'office', 'Office and router');
  await seeElementNamed(visitor.page, 'office', 'Office and router');
  await screenshot(visitor.page, 'sharing-phone-visitor-sheet');

  // The same link on a wide screen, another visitor: the side pane has pins, details and results, no palette.
  const wideVisitor = await newBrowserPage(browser, WIDE);
  await wideVisitor.page.goto(linkUrl);
  await seeTestId(wideVisitor.page, 'editor-wide');
  await seeTestId(wideVisitor.page, 'pane-pins');
  await seeTestId(wideVisitor.page, 'tool-pin');
  assert((await wideVisitor.page.getByTestId('palette').count()) === 0, 'the wide visitor should have no palette');
  await seeElementNamed(wideVisitor.page, 'office', 'Office and router');
  const wideTitle = await el(wideVisitor.page, 'editor-sheet-name').textContent();
  assert(wideTitle === FARM, `the wide visitor's top bar names the sheet ${wideTitle}`);
  await screenshot(wideVisitor.page, 'sharing-wide-visitor-sheet');
  // The sheet's what-ifs can be looked at; showing one is this browser's own business.
  await wideVisitor.page.locator('[data-testid^="case-"]:not([data-testid="case-list"])').filter({ hasText: 'Open neutral in the service drop' }).filter({ visible: true }).first().click();
  await wideVisitor.page.waitForFunction(
    () => document.querySelector('[data-testid="editor-case"]')?.textContent === 'View only · What-if: Open neutral in the service drop',
    undefined,
    { timeout: 15_000 },
  );
  const ownerCase = await el(ownerSheet, 'editor-case').textContent();
  assert(ownerCase === 'Base case', `the owner's editor should still show the base case, it shows ${ownerCase}`);
  await el(wideVisitor.page, 'case-base').click();

  // To comment the visitor gives a name, then pins the water heater.
  await el(visitor.page, 'tool-pins').click();
  await seeTestId(visitor.page, 'panel-pins');
  await seeText(visitor.page, PINS_AT_START);
  await el(visitor.page, 'pin-add').click();
  await seeTestId(visitor.page, 'guest-name-form');
  await screenshot(visitor.page, 'sharing-phone-visitor-name');
  await el(visitor.page, 'guest-name-submit').click();
  await seeText(visitor.page, 'Give the name to show beside your comments.');
  await el(visitor.page, 'guest-name').fill('Dale from the county');
  await el(visitor.page, 'guest-name-submit').click();
  await seeTestId(visitor.page, 'pin-placing-hint');
  const visitorTouch = await touchOf(visitor);
  await visitorTouch.tap(await middleOf(visitor.page, 'water-heater'));
  await seeTestId(visitor.page, 'pin-draft');
  await seeText(visitor.page, 'New pin on Water heater');
  await el(visitor.page, 'pin-new-text').fill('The heater’s breaker label is faded; which circuit feeds it?');
  await el(visitor.page, 'pin-new-send').click();
  await seeTestId(visitor.page, `pin-thread-${FIRST}`);
  await seeText(visitor.page, 'Dale from the county');
  await seeTestId(visitor.page, `pin-flag-${FIRST}`);
  // A photo goes with it (a picture of the drawing will do), shown as a thumbnail; a file that is not what its
  // name says is refused, saying why.
  const photo = await visitor.page.locator('[data-testid="sheet-canvas"]').first().screenshot();
  await attach(visitor.page, { name: 'heater-label.png', mimeType: 'image/png', buffer: photo });
  await seeTestId(visitor.page, 'pin-attachment-heater-label.png');
  await visitor.page
    .waitForFunction(() => Array.from(document.querySelectorAll('[data-testid="pin-attachments"] img')).some((i) => (i as HTMLImageElement).naturalWidth > 0), undefined, { timeout: 15_000 })
    .catch(() => {
      throw new Error('the photo on the pin shows no thumbnail');
    });
  await attach(visitor.page, { name: 'readings.csv', mimeType: 'text/csv', buffer: Buffer.from([0x00, 0x9f, 0x92, 0x96, 0x00]) });
  await seeText(visitor.page, 'readings.csv is not a photo, a PDF or a CSV file');
  await screenshot(visitor.page, 'sharing-phone-visitor-pinned');

  // The other visitor, with no session at all, sees it arrive too, listed beside the drawing.
  await seeTestId(wideVisitor.page, `pin-flag-${FIRST}`);
  await seeTestId(wideVisitor.page, `pin-row-${FIRST}`);
  await screenshot(wideVisitor.page, 'sharing-wide-visitor-pin-arrived');

  // The owner sees it arrive without a reload, by the water heater, and opens its thread.
  await seeTestId(ownerSheet, `pin-flag-${FIRST}`);
  await seeTestId(ownerSheet, `pin-row-${FIRST}`);
  const flag = await el(ownerSheet, `pin-flag-${FIRST}`).boundingBox();
  const heater = await ownerSheet.locator('[data-testid="sym-water-heater"]').first().boundingBox();
  assert(flag && heater, 'the pin flag and the water heater should both be drawn for the owner');
  const near = Math.abs(flag.x + flag.width / 2 - (heater.x + heater.width)) < 60 && Math.abs(flag.y + flag.height - heater.y) < 60;
  assert(near, `the pin flag (${JSON.stringify(flag)}) should stand on the water heater (${JSON.stringify(heater)})`);
  await el(ownerSheet, `pin-flag-${FIRST}`).click();
  await seeTestId(ownerSheet, `pin-thread-${FIRST}`);
  await seeText(ownerSheet, `Pin ${FIRST} on Water heater`);
  await seeTestId(ownerSheet, 'pin-attachment-heater-label.png');
  await el(ownerSheet, 'pin-reply-text').fill('Circuit 7, the 30 A two-pole. I will relabel it.');
  await el(ownerSheet, 'pin-reply-send').click();
  await seeText(ownerSheet, 'Circuit 7, the 30 A two-pole. I will relabel it.');
  await screenshot(ownerSheet, 'sharing-wide-owner-pin');
  // The reply reaches the visitor live too.
  await seeText(visitor.page, 'Circuit 7, the 30 A two-pole. I will relabel it.');
  await screenshot(visitor.page, 'sharing-phone-visitor-reply');
  // The owner resolves the pin: the visitor's thread and flag say so without a reload.
  await el(ownerSheet, 'pin-resolve').click();
  await seeTestId(ownerSheet, 'pin-reopen');
  await visitor.page
    .waitForFunction(() => document.querySelector('[data-testid="pin-thread-state"]')?.textContent?.startsWith('Resolved') === true, undefined, { timeout: 15_000 })
    .catch(() => {
      throw new Error('the visitor does not see the pin resolved');
    });
  const flagLabel = await el(visitor.page, `pin-flag-${FIRST}`).getAttribute('aria-label');
  assert(flagLabel?.includes('resolved'), `the visitor's flag reads ${flagLabel}`);

  // On a wide screen with a mouse, the owner pins an empty point of the sheet: the flag stands where they clicked.
  await el(ownerSheet, 'tool-pin').click();
  await seeTestId(ownerSheet, 'pin-placing-hint');
  const layer = await el(ownerSheet, 'pin-target-layer').boundingBox();
  assert(layer, 'the pin tool should cover the canvas');
  const spot = { x: layer.x + layer.width * 0.8, y: layer.y + layer.height * 0.45 };
  await ownerSheet.mouse.click(spot.x, spot.y);
  await seeText(ownerSheet, 'New pin on the sheet');
  await el(ownerSheet, 'pin-new-text').fill('Planned: a second barn circuit here.');
  await el(ownerSheet, 'pin-new-send').click();
  await seeTestId(ownerSheet, `pin-thread-${FIRST + 1}`);
  const second = await (await seeTestId(ownerSheet, `pin-flag-${FIRST + 1}`)).boundingBox();
  assert(second, 'the second flag should be drawn');
  // The flag's staff stands on the point (its foot is near the bottom-left of the flag's button).
  const foot = { x: second.x + 12, y: second.y + second.height - 8 };
  assert(Math.hypot(foot.x - spot.x, foot.y - spot.y) < 16, `the flag's foot ${JSON.stringify(foot)} should be on the click ${JSON.stringify(spot)}`);
  await seeTestId(wideVisitor.page, `pin-row-${FIRST + 1}`);

  // The pin's e-mail to the owner is in the outbox, linking to the pin.
  const pinUrl = await linkFromOutbox(owner.page, server.url, 'owner@example.com', `/sheets/${farmId}?pin=${FIRST}`, new RegExp(`Dale from the county added pin ${FIRST}`));
  // Followed, it opens the sheet with that pin's thread on show.
  await owner.page.goto(pinUrl);
  await seeTestId(owner.page, `pin-thread-${FIRST}`);

  // A signed-in person who opens the link comments under their own name, with no name to give.
  await editor.page.goto(linkUrl);
  await seeTestId(editor.page, 'editor-phone');
  await el(editor.page, 'editor-about').click();
  const you = await (await seeTestId(editor.page, 'view-you')).textContent();
  assert(you?.includes(invited.name), `the signed-in person's link page says: ${you}`);
  await el(editor.page, 'panel-about-close').click();
  await el(editor.page, 'tool-pins').click();
  await el(editor.page, 'pin-add').click();
  await seeTestId(editor.page, 'pin-placing-hint');
  assert((await editor.page.getByTestId('guest-name-form').count()) === 0, 'a signed-in person should not be asked for a name');
  await el(editor.page, 'pin-placing-cancel').click();

  // The owner revokes the link: the visitor's open page says so at once.
  await owner.page.goto(`${server.url}${projectPath}`);
  await el(owner.page, `share-sheet-${farmId}`).click();
  await el(owner.page, `revoke-link-${linkId}`).click();
  await el(owner.page, 'revoke-link-dialog-confirm').click();
  await owner.page.waitForFunction(
    (id) => document.querySelector(`[data-testid="link-state-${id}"]`)?.textContent?.includes('Revoked') === true,
    linkId,
    { timeout: 15_000 },
  );
  await seeTestId(visitor.page, 'view-gone');
  await seeText(visitor.page, 'This link no longer works');
  await screenshot(visitor.page, 'sharing-phone-link-revoked');
  await seeTestId(wideVisitor.page, 'view-gone');
  await screenshot(wideVisitor.page, 'sharing-wide-link-revoked');
  // The guest has no projects: the app's own pages send them to sign in.
  await visitor.page.goto(`${server.url}/`);
  await seeTestId(visitor.page, 'sign-in-screen');
  // Opened afresh, it says the same.
  const late = await newBrowserPage(browser, PHONE);
  await late.page.goto(linkUrl);
  await seeTestId(late.page, 'view-gone');

  await closeAll([['owner', owner], ['editor', editor], ['visitor', visitor], ['wide visitor', wideVisitor], ['late visitor', late]]);
}

runBrowserTest('sharing', run);
