// The foundation in a real browser: make an account, sign out and in, make a project and a sheet, rename the
// sheet, reset a password through the local outbox, and the demo users' view of "Larkspur Row" on a phone
// (390x844) and a wide screen (1440x900), in the light theme and once in the dark one.
import { randomUUID } from 'node:crypto';
import type { Browser, Page } from 'playwright-core';
import {
  assert,
  byPrefix,
  DEMO_PASSWORD,
  el,
  txt,
  assertTouchTarget,
  log,
  newBrowserPage,
  notSeeTestId,
  notSeeText,
  PHONE,
  runBrowserTest,
  screenshot,
  seeTestId,
  seeText,
  signInWithForm as signIn,
  WIDE,
  type ServerProcess,
} from './harness';

// A missing font or script (a 404 outside /api/) fails these journeys too.
const newPage = (browser: Browser, viewport: { width: number; height: number }, dark = false) => newBrowserPage(browser, viewport, { dark, missingFiles: true });

/** The shipped fonts are really in use, not a fallback: Inter for words and JetBrains Mono for the figures. */
async function assertFontsLoaded(page: Page) {
  const status = await page.evaluate(async () => {
    await document.fonts.ready;
    const faces: Record<string, string> = {};
    document.fonts.forEach((face) => (faces[face.family.replace(/"/g, '')] = face.status));
    return faces;
  });
  for (const family of ['Inter_400Regular', 'Inter_600SemiBold', 'JetBrainsMono_400Regular', 'feather']) {
    assert(status[family] === 'loaded', `the font ${family} is ${status[family] ?? 'missing'}: ${JSON.stringify(status)}`);
  }
  const title = await el(page, 'header-title').evaluate((node) => getComputedStyle(node).fontFamily);
  assert(title.includes('Inter'), `the header title is drawn in ${title}, not Inter`);
  const figure = await page
    .locator('[data-testid^="project-sheet-count-"][data-testid$="-figure"]')
    .filter({ visible: true })
    .first()
    .evaluate((node) => getComputedStyle(node).fontFamily);
  assert(figure.includes('JetBrainsMono'), `a sheet count is drawn in ${figure}, not JetBrains Mono`);
}

async function signOut(page: Page) {
  await el(page, 'sign-out').click();
  await seeTestId(page, 'sign-in-screen');
  assert(new URL(page.url()).pathname === '/sign-in', `after sign-out the page is ${page.url()}`);
}

async function phoneJourney(browser: Browser, server: ServerProcess) {
  const { context, page, problems } = await newPage(browser, PHONE);
  const stamp = Date.now().toString(36);
  const user = { name: 'Tomas Reyes', email: `tomas.${stamp}@example.com`, password: 'feeder-check-77' };

  // Signed out, the projects list sends you to sign in.
  await page.goto(`${server.url}/`);
  await seeTestId(page, 'sign-in-screen');
  await seeText(page, 'Sign in', { exact: true });
  await screenshot(page, 'phone-sign-in');

  // Make an account; the form checks its fields before it asks the server.
  await el(page, 'go-sign-up').click();
  await seeTestId(page, 'sign-up-screen');
  await el(page, 'sign-up-submit').click();
  await seeText(page, 'Enter your name');
  await seeText(page, 'Use at least 8 characters');
  await screenshot(page, 'phone-sign-up-errors');
  await el(page, 'name').fill(user.name);
  await el(page, 'email').fill(user.email);
  await el(page, 'password').fill(user.password);
  await el(page, 'sign-up-submit').click();

  // A new account has no projects yet.
  await seeTestId(page, 'projects-panel');
  await seeText(page, 'No projects yet');
  await assertTouchTarget(el(page, 'sign-out'), 'the sign-out button');
  await assertTouchTarget(el(page, 'new-project'), 'the New project button');
  const bar = await el(page, 'new-project').boundingBox();
  assert(bar && bar.y > PHONE.height * 0.8, `the New project button should sit in the bottom bar, not at y=${bar?.y}`);
  await screenshot(page, 'phone-projects-empty');

  // Sign out and back in; a wrong password is refused with a plain message.
  await signOut(page);
  await el(page, 'email').fill(user.email);
  await el(page, 'password').fill('not-the-password');
  await el(page, 'sign-in-submit').click();
  await seeText(page, 'Wrong e-mail or password.');
  await el(page, 'password').fill(user.password);
  await el(page, 'sign-in-submit').click();
  await seeText(page, 'No projects yet');

  // A project, made in the bottom sheet; an empty name is refused under the field.
  await el(page, 'new-project').click();
  await seeTestId(page, 'new-project-sheet');
  await el(page, 'project-submit').click();
  await seeText(page, 'Project name must not be empty');
  await el(page, 'project-name').fill('Maple Street service');
  await el(page, 'project-description').fill('200 A service, 120/240 V, detached garage subpanel');
  await screenshot(page, 'phone-new-project');
  await el(page, 'project-submit').click();

  await seeTestId(page, 'project-detail');
  await seeText(page, 'Maple Street service', { exact: true });
  await seeText(page, 'No sheets yet');
  await seeText(page, user.email); // the creator is listed as a member
  await seeTestId(page, 'delete-project'); // and, as the owner, may delete it

  // A sheet, then its new name.
  await el(page, 'new-sheet').click();
  await el(page, 'sheet-name').fill('Service entrance');
  await el(page, 'sheet-submit').click();
  await seeTestId(page, 'sheet-list');
  await seeText(page, 'Service entrance', { exact: true });
  await notSeeText(page, 'No sheets yet');
  const renameButton = byPrefix(page, 'rename-sheet-').first();
  await assertTouchTarget(renameButton, 'the rename button');
  await assertTouchTarget(byPrefix(page, 'delete-sheet-').first(), 'the delete button');
  await screenshot(page, 'phone-project');
  await renameButton.click();
  await seeTestId(page, 'rename-sheet-sheet');
  await el(page, 'sheet-name').fill('Service entrance and meter');
  await el(page, 'sheet-submit').click();
  await seeText(page, 'Service entrance and meter', { exact: true });
  await notSeeText(page, /^Service entrance$/);

  // The sheet's own page.
  await txt(page, 'Service entrance and meter').click();
  // The sheet opens in the editor; its details are one tap away.
  await el(page, 'editor-about').click();
  await seeTestId(page, 'sheet-detail');
  const madeBy = await (await seeTestId(page, 'sheet-created-by')).textContent();
  assert(madeBy === user.name, `the sheet says it was made by ${madeBy}`);
  await screenshot(page, 'phone-sheet');

  // Back up to the list: the project and its one sheet are counted there.
  await el(page, 'editor-back').click();
  await seeTestId(page, 'project-detail');
  await el(page, 'header-back').click();
  await seeTestId(page, 'project-list');
  await seeText(page, 'Maple Street service', { exact: true });
  await seeText(page, '1 sheet', { exact: true });
  await assertFontsLoaded(page);
  await screenshot(page, 'phone-projects');

  // Forgot the password: the reset link arrives in the local outbox and works once.
  await signOut(page);
  await el(page, 'go-forgot').click();
  await el(page, 'email').fill(user.email);
  await el(page, 'forgot-submit').click();
  await seeTestId(page, 'reset-sent');
  await el(page, 'open-outbox').click();
  await seeTestId(page, 'outbox-screen');
  await seeText(page, 'Reset your Phasewright password');
  await seeText(page, `To ${user.email}`);
  await screenshot(page, 'phone-outbox');
  const resetLink = el(page, 'outbox-message').first().locator('a[href*="reset-password"]').first();
  await resetLink.waitFor({ state: 'visible' });
  await resetLink.click();
  await seeTestId(page, 'reset-screen');
  assert(new URL(page.url()).searchParams.get('token'), `the reset page has no token: ${page.url()}`);
  const newPassword = 'neutral-bar-2026';
  await el(page, 'new-password').fill(newPassword);
  await el(page, 'confirm-password').fill('something-else');
  await el(page, 'reset-submit').click();
  await seeText(page, 'The two passwords differ');
  await el(page, 'confirm-password').fill(newPassword);
  await el(page, 'reset-submit').click();
  await seeTestId(page, 'reset-done');
  await signIn(page, server.url, user.email, newPassword);
  await seeText(page, 'Maple Street service', { exact: true });
  await signOut(page);

  // The demo owner sees Larkspur Row with its sheets and members.
  await signIn(page, server.url, 'owner@example.com', DEMO_PASSWORD);
  await seeText(page, 'Larkspur Row', { exact: true });
  await seeText(page, '2 sheets', { exact: true });
  await txt(page, 'Larkspur Row').click();
  await seeTestId(page, 'project-detail');
  await seeText(page, 'Building distribution', { exact: true });
  await seeText(page, 'editor@example.com');
  await seeText(page, 'viewer@example.com');
  await screenshot(page, 'phone-larkspur-owner');
  // The sheet's editor names it as the list does (its drawing was seeded from a fixture with a name of its own).
  await txt(page, 'Building distribution').click();
  const phoneTitle = await (await seeTestId(page, 'editor-sheet-name')).textContent();
  assert(phoneTitle === 'Building distribution', `the editor's top bar names the sheet ${phoneTitle}`);
  await seeTestId(page, 'link-connected');
  await screenshot(page, 'phone-editor-top-bar');
  await el(page, 'editor-back').click();
  await seeTestId(page, 'project-detail');
  await signOut(page);

  assert(problems.length === 0, `the browser reported problems:\n${problems.join('\n')}`);
  await context.close();
}

async function wideJourney(browser: Browser, server: ServerProcess) {
  const { context, page, problems } = await newPage(browser, WIDE);

  // A signed-out deep link into the app lands on sign-in; an unknown address gets the not-found page.
  await page.goto(`${server.url}/projects/${randomUUID()}`);
  await seeTestId(page, 'sign-in-screen');
  assert(new URL(page.url()).pathname === '/sign-in', `a signed-out deep link ended on ${page.url()}`);
  await screenshot(page, 'wide-sign-in');
  await page.goto(`${server.url}/no-such-page`);
  await seeText(page, 'Nothing at this address');

  // The owner: list and detail side by side; deleting a sheet asks first, and Cancel keeps it.
  await signIn(page, server.url, 'owner@example.com', DEMO_PASSWORD);
  await seeTestId(page, 'pick-project');
  await assertFontsLoaded(page);
  await seeText(page, 'Rosa Almeida'); // who is signed in, in the header
  await screenshot(page, 'wide-projects');
  await txt(page, 'Larkspur Row').click();
  await seeTestId(page, 'project-detail');
  await seeTestId(page, 'project-list'); // the list is still there beside the detail
  const list = await el(page, 'project-list').boundingBox();
  const detail = await el(page, 'project-name-heading').boundingBox();
  assert(list && detail && detail.x > list.x + list.width, 'the project detail should sit to the right of the list');
  await screenshot(page, 'wide-project-owner');
  await byPrefix(page, 'delete-sheet-').first().click();
  await seeTestId(page, 'delete-sheet-dialog');
  await seeText(page, 'Delete this sheet?');
  await screenshot(page, 'wide-delete-sheet-dialog');
  await el(page, 'delete-sheet-dialog-cancel').click();
  await notSeeText(page, 'Delete this sheet?');
  await seeText(page, 'Building distribution', { exact: true });
  // A project that does not exist (or is not yours) says so instead of failing.
  await page.goto(`${server.url}/projects/${randomUUID()}`);
  await seeTestId(page, 'project-missing');
  await seeText(page, 'Project not found');
  await signOut(page);

  // The viewer sees the same project without controls that change it.
  await signIn(page, server.url, 'viewer@example.com', DEMO_PASSWORD);
  await txt(page, 'Larkspur Row').click();
  await seeTestId(page, 'project-detail');
  await seeTestId(page, 'viewer-note');
  await seeText(page, 'Farm service, 120/240 V', { exact: true });
  await notSeeTestId(page, 'new-sheet');
  await notSeeTestId(page, 'delete-project');
  assert((await byPrefix(page, 'rename-sheet-').count()) === 0, 'a viewer should see no rename buttons');
  assert((await byPrefix(page, 'delete-sheet-').count()) === 0, 'a viewer should see no delete buttons');
  await screenshot(page, 'wide-project-viewer');
  await txt(page, 'Farm service, 120/240 V').click();
  const wideTitle = await (await seeTestId(page, 'editor-sheet-name')).textContent();
  assert(wideTitle === 'Farm service, 120/240 V', `the editor's top bar names the sheet ${wideTitle}`);
  await seeTestId(page, 'link-connected');
  await screenshot(page, 'wide-editor-top-bar');
  await el(page, 'editor-about').click();
  await seeTestId(page, 'sheet-detail');
  await seeText(page, 'Rosa Almeida');
  await screenshot(page, 'wide-sheet');
  await el(page, 'editor-back').click();
  await seeTestId(page, 'project-detail');
  await signOut(page);

  assert(problems.length === 0, `the browser reported problems:\n${problems.join('\n')}`);
  await context.close();
}

async function darkJourney(browser: Browser, server: ServerProcess) {
  const { context, page, problems } = await newPage(browser, PHONE, true);
  await signIn(page, server.url, 'editor@example.com', DEMO_PASSWORD);
  const ground = await el(page, 'projects-panel').evaluate((el) => getComputedStyle(el).backgroundColor);
  assert(ground === 'rgb(19, 26, 32)', `the dark theme's ground is ${ground}`);
  await screenshot(page, 'phone-dark-projects');
  await txt(page, 'Larkspur Row').click();
  await seeTestId(page, 'new-sheet'); // editors may add sheets
  await notSeeTestId(page, 'delete-project'); // but not delete the project
  await screenshot(page, 'phone-dark-project-editor');
  assert(problems.length === 0, `the browser reported problems:\n${problems.join('\n')}`);
  await context.close();
}

runBrowserTest('foundation', async (browser, server) => {
  await phoneJourney(browser, server);
  log('phone journey passed');
  await wideJourney(browser, server);
  log('wide journey passed');
  await darkJourney(browser, server);
  log('dark journey passed');
});
