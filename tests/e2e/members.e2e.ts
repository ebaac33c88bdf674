// Members, invitations and viewer links in a real browser: the demo owner invites a new address as editor, the
// invitation link is read from the local outbox, a fresh browser makes an account with that address and accepts,
// the owner turns the new member into a viewer (and the activity says so), makes a viewer link for a sheet, sees
// it listed, revokes it and sees it revoked. Pictures at 390x844 and 1440x900 (members-*).
import type { Browser, Page } from 'playwright-core';
import {
  assert,
  byPrefix,
  closeAll,
  el,
  linkFromOutbox,
  newBrowserPage as newPage,
  openDemoProject as openLarkspur,
  PHONE,
  runBrowserTest,
  screenshot,
  seeTestId,
  seeText,
  signInWithForm as signIn,
  WIDE,
  type ServerProcess,
} from './harness';

/** The radio of a member's (or the invite form's) role picker that is checked. */
async function checkedRole(page: Page, pickerTestId: string): Promise<string | null> {
  const checked = el(page, pickerTestId).locator('[aria-checked="true"]');
  return checked.getAttribute('data-testid');
}

async function run(browser: Browser, server: ServerProcess) {
  const stamp = Date.now().toString(36);
  const invited = { name: 'Keon Hartley', email: `dev.${stamp}@example.com`, password: 'panel-check-2026' };

  // The owner, on a wide screen: members as a table, the invite form, the record of changes.
  const owner = await newPage(browser, WIDE);
  await signIn(owner.page, server.url, 'owner@example.com');
  const projectPath = await openLarkspur(owner.page);
  await seeTestId(owner.page, 'member-table');
  await seeText(owner.page, 'editor@example.com');

  // Sorting by role puts the owner first; by name turned round puts the Zs first.
  await el(owner.page, 'sort-members-role').click();
  const firstByRole = await byPrefix(owner.page, 'member-row-').first().textContent();
  assert(firstByRole?.includes('owner@example.com'), `sorted by role, the first row is ${firstByRole}`);
  await el(owner.page, 'sort-members-name').click();
  const namesUp = await byPrefix(owner.page, 'member-row-').allTextContents();
  await el(owner.page, 'sort-members-name').click();
  const namesDown = await byPrefix(owner.page, 'member-row-').allTextContents();
  assert(namesUp.length > 1 && namesUp.join('|') === [...namesDown].reverse().join('|'), `sorting by name twice should reverse the rows: ${namesUp} / ${namesDown}`);

  // A bad address is refused under the field before anything is sent.
  await el(owner.page, 'invite-email').fill('not-an-address');
  await el(owner.page, 'invite-submit').click();
  await seeText(owner.page, 'Enter a valid e-mail address');
  // An address already on the project: the server's 409 goes under the field.
  await el(owner.page, 'invite-email').fill('editor@example.com');
  await el(owner.page, 'invite-submit').click();
  await seeText(owner.page, 'editor@example.com is already a member of this project');

  await el(owner.page, 'invite-email').fill(invited.email);
  await el(owner.page, 'invite-role-editor').click();
  assert((await checkedRole(owner.page, 'invite-role')) === 'invite-role-editor', 'the invite form should have Editor chosen');
  await el(owner.page, 'invite-submit').click();
  await seeText(owner.page, `Invitation sent to ${invited.email}.`);
  await seeTestId(owner.page, `invitation-${invited.email}`);
  await seeText(owner.page, `Rosa Almeida invited ${invited.email} as editor`);
  await el(owner.page, 'invite-section').scrollIntoViewIfNeeded();
  await screenshot(owner.page, 'members-wide-owner-invited');

  // The e-mail, caught by the local sink, carries the link.
  const inviteUrl = await linkFromOutbox(owner.page, server.url, invited.email, '/invite/');
  assert(inviteUrl && inviteUrl.startsWith(`${server.url}/invite/`), `the invitation mail links to ${inviteUrl}`);

  // A fresh browser on a phone: the invitation shows before sign-in, with the address filled in.
  const guest = await newPage(browser, PHONE);
  await guest.page.goto(inviteUrl);
  await seeTestId(guest.page, 'invite-screen');
  await seeText(guest.page, 'Join Larkspur Row');
  await seeText(guest.page, 'Rosa Almeida invited you to this project on Phasewright.');
  const prefilled = await el(guest.page, 'email').inputValue();
  assert(prefilled === invited.email, `the e-mail field holds ${prefilled}, not the invited address`);
  await screenshot(guest.page, 'members-phone-invite-signed-out');
  await el(guest.page, 'name').fill(invited.name);
  await el(guest.page, 'password').fill(invited.password);
  await el(guest.page, 'sign-up-submit').click();
  await seeTestId(guest.page, 'accept-invitation');
  assert(new URL(guest.page.url()).pathname.startsWith('/invite/'), `after making the account the page is ${guest.page.url()}`);
  await screenshot(guest.page, 'members-phone-invite-accept');
  await el(guest.page, 'accept-invitation').click();
  await seeTestId(guest.page, 'project-detail');
  assert(new URL(guest.page.url()).pathname === projectPath, `after accepting the page is ${guest.page.url()}, not ${projectPath}`);
  const joinedRole = await (await seeTestId(guest.page, 'project-role')).textContent();
  assert(joinedRole === 'Editor', `the new member's role reads ${joinedRole}`);
  await seeTestId(guest.page, 'new-sheet'); // editors may add sheets
  await screenshot(guest.page, 'members-phone-joined-editor');

  // The link worked once: opened again it says so plainly.
  await guest.page.goto(inviteUrl);
  await seeTestId(guest.page, 'invite-gone');
  await seeText(guest.page, 'This invitation was already used');

  // The owner makes the new member a viewer; the record says so and the member sees it.
  await owner.page.goto(`${server.url}${projectPath}`);
  await seeTestId(owner.page, `member-role-${invited.email}`);
  await el(owner.page, `member-role-${invited.email}-viewer`).click();
  await seeText(owner.page, `Rosa Almeida made ${invited.email} viewer`);
  await seeText(owner.page, `${invited.name} joined as editor`);
  assert(
    (await checkedRole(owner.page, `member-role-${invited.email}`)) === `member-role-${invited.email}-viewer`,
    'the member row should show Viewer chosen',
  );
  // The last owner cannot step down: the server's refusal is shown.
  await el(owner.page, 'member-role-owner@example.com-editor').click();
  await seeText(owner.page, 'A project keeps at least one owner');
  await el(owner.page, 'activity-section').scrollIntoViewIfNeeded();
  await screenshot(owner.page, 'members-wide-owner-activity');

  await guest.page.goto(`${server.url}${projectPath}`);
  await seeTestId(guest.page, 'viewer-note');
  const nowRole = await (await seeTestId(guest.page, 'project-role')).textContent();
  assert(nowRole === 'Viewer', `after the change the member's role reads ${nowRole}`);

  // A viewer link for the first sheet: made, its address shown once, listed, revoked.
  await byPrefix(owner.page, 'share-sheet-').first().click();
  await seeTestId(owner.page, 'share-sheet');
  await el(owner.page, 'link-days').fill('400');
  await el(owner.page, 'link-submit').click();
  await seeText(owner.page, 'From 1 to 365 days, or leave it empty');
  await el(owner.page, 'link-label').fill('For the building owner');
  await el(owner.page, 'link-days').fill('30');
  await el(owner.page, 'link-submit').click();
  await seeTestId(owner.page, 'new-link');
  await seeText(owner.page, 'it will not be shown again');
  const linkUrl = await el(owner.page, 'new-link-url').inputValue();
  assert(linkUrl.startsWith(`${server.url}/view/`), `the new link's address is ${linkUrl}`);
  await screenshot(owner.page, 'members-wide-share-new-link');
  await el(owner.page, 'new-link-done').click();
  const row = owner.page.locator('[data-testid^="link-row-"]').filter({ hasText: 'For the building owner' }).filter({ visible: true }).first();
  await row.waitFor({ state: 'visible' });
  const linkId = (await row.getAttribute('data-testid'))!.replace('link-row-', '');
  const stateNow = await el(owner.page, `link-state-${linkId}`).textContent();
  // The state's icon is a font glyph in the same element: compare the words only.
  assert(stateNow?.includes('Active'), `the new link should be active, it reads ${stateNow}`);
  await notSeeAddress(owner.page, linkUrl);
  await el(owner.page, `revoke-link-${linkId}`).click();
  await seeTestId(owner.page, 'revoke-link-dialog');
  await screenshot(owner.page, 'members-wide-revoke-dialog');
  await el(owner.page, 'revoke-link-dialog-confirm').click();
  await owner.page.waitForFunction(
    (id) => document.querySelector(`[data-testid="link-state-${id}"]`)?.textContent?.includes('Revoked') === true,
    linkId,
    { timeout: 15_000 },
  );
  await screenshot(owner.page, 'members-wide-share-revoked');
  // The revoked link no longer opens the sheet.
  const viewStatus = (await fetch(`${server.url}/api/view/${linkUrl.split('/view/')[1]}`)).status;
  assert(viewStatus === 410, `a revoked link's look-up answered ${viewStatus}, not 410`);
  await el(owner.page, 'share-sheet-close').click();

  // The pin e-mail switch is the person's own and survives a reload.
  const pinSwitch = () => el(owner.page, 'pin-emails-switch').locator('input[type="checkbox"]').first();
  assert(await pinSwitch().isChecked(), 'pin e-mails should start on');
  await pinSwitch().click({ force: true });
  await owner.page.waitForResponse((r) => r.url().endsWith('/api/me/preferences') && r.request().method() === 'PATCH');
  await owner.page.reload();
  await seeTestId(owner.page, 'pin-emails-switch');
  await owner.page.waitForFunction(() => {
    const box = document.querySelector('[data-testid="pin-emails-switch"] input[type="checkbox"]') as HTMLInputElement | null;
    return box !== null && !box.disabled;
  });
  assert(!(await pinSwitch().isChecked()), 'pin e-mails should stay off after a reload');

  // The owner on a phone: members as cards with the same controls.
  const ownerPhone = await newPage(browser, PHONE);
  await signIn(ownerPhone.page, server.url, 'owner@example.com');
  await openLarkspur(ownerPhone.page);
  await seeTestId(ownerPhone.page, 'member-cards');
  await el(ownerPhone.page, 'member-cards').scrollIntoViewIfNeeded();
  await screenshot(ownerPhone.page, 'members-phone-owner-cards');
  await el(ownerPhone.page, 'invite-section').scrollIntoViewIfNeeded();
  await screenshot(ownerPhone.page, 'members-phone-owner-invite');
  await byPrefix(ownerPhone.page, 'share-sheet-').first().click();
  await seeTestId(ownerPhone.page, 'share-sheet');
  await seeText(ownerPhone.page, 'Revoked');
  await screenshot(ownerPhone.page, 'members-phone-share');

  await closeAll([['owner', owner], ['invited', guest], ['owner on a phone', ownerPhone]]);
}

async function notSeeAddress(page: Page, url: string) {
  const shown = await page.getByText(url).filter({ visible: true }).count();
  const inField = await page.locator('input').evaluateAll((nodes, u) => nodes.some((n) => (n as HTMLInputElement).value === u), url);
  assert(shown === 0 && !inField, 'after Done the link address should not be shown again');
}

runBrowserTest('members', run);
