import { test, expect, signUp, signIn } from './fixtures';

// The client foundation end to end, in a real browser against the real server and database:
// accounts, a board, an invitation by e-mail read from the admin's outbox, and its acceptance.

const OWNER = { name: 'Mara Quinn', email: 'mara@larkspur.example', password: 'filament-warm-42' };
const INVITEE = { name: 'Ines Okafor', email: 'ines@larkspur.example', password: 'slate-cool-0917' };

test('owner invites an editor by e-mail; the invitee signs up from the mailed link and joins', async ({ page, browser, gatefold }) => {
  await page.goto('/signin');
  await expect(page.getByTestId('demo-sign-ins')).toBeVisible();
  await page.screenshot({ path: 'test-results/foundation-01-sign-in.png' });

  // The first account on an empty server is the site admin, so the Outbox is in its top bar.
  await signUp(page, OWNER);
  await expect(page).toHaveURL(/\/boards$/);
  await expect(page.getByTestId('current-user')).toContainText(OWNER.name);
  await expect(page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Outbox' })).toBeVisible();
  await expect(page.getByText('No boards yet')).toBeVisible();
  await page.screenshot({ path: 'test-results/foundation-02-boards-empty.png' });

  // A title that is only spaces is refused in the form, before any request.
  const create = page.getByRole('form', { name: 'New board' });
  await create.getByLabel('Title', { exact: true }).fill('   ');
  await create.getByRole('button', { name: 'Create board' }).click();
  await expect(create.getByRole('alert')).toHaveText('Title is required');

  await create.getByLabel('Title', { exact: true }).fill('Half adder');
  await create.getByRole('button', { name: 'Create board' }).click();
  await expect(page).toHaveURL(/\/boards\/\d+$/);
  const boardPath = new URL(page.url()).pathname;
  await expect(page.getByTestId('board-title')).toHaveText('Half adder');
  const header = page.getByTestId('board-page').locator('header');
  await expect(header.getByTestId('role-badge')).toHaveText('owner');
  await expect(page.getByTestId('member-list')).toContainText(OWNER.name);

  // Inline rename (owners and editors).
  await page.getByRole('button', { name: 'Rename board' }).click();
  await page.getByRole('textbox', { name: 'Board title' }).fill('Half adder, tube build');
  await page.getByRole('button', { name: 'Save' }).click();
  await expect(page.getByTestId('board-title')).toHaveText('Half adder, tube build');

  // A tube family shows the safety caution.
  await page.getByLabel('Bench logic family').selectOption('tube-drl-nor');
  await expect(page.getByTestId('safety-caution')).toContainText('local electrical codes');
  await page.screenshot({ path: 'test-results/foundation-03-board-owner.png' });

  // Invite an address that has no account yet.
  await header.getByRole('link', { name: 'Members' }).click();
  await expect(page).toHaveURL(`${boardPath}/members`);
  const add = page.getByRole('form', { name: 'Add member' });
  await add.getByLabel('E-mail', { exact: true }).fill('not an address');
  await add.getByRole('button', { name: 'Add member' }).click();
  await expect(add.getByRole('alert')).toHaveText('Enter a valid e-mail address');
  await add.getByLabel('E-mail', { exact: true }).fill(INVITEE.email);
  await add.getByLabel('Role', { exact: true }).selectOption('editor');
  await add.getByRole('button', { name: 'Add member' }).click();
  await expect(page.getByTestId('invitation-list')).toContainText(INVITEE.email);
  await expect(page.getByTestId('invitation-list').getByTestId('role-badge')).toHaveText('editor');
  await page.screenshot({ path: 'test-results/foundation-04-members-pending.png' });

  // Read the invitation in the outbox.
  await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Outbox' }).click();
  const row = page.getByTestId('outbox-row').filter({ hasText: INVITEE.email });
  await expect(row).toHaveCount(1);
  await page.screenshot({ path: 'test-results/foundation-05-outbox.png' });
  await row.getByRole('link').click();
  const invite = page.getByTestId('message-text').getByRole('link', { name: /\/invitations\// });
  await expect(invite).toHaveCount(1);
  const inviteUrl = await invite.getAttribute('href');
  expect(inviteUrl).toMatch(new RegExp(`^${gatefold.baseURL}/invitations/[^/\\s]+$`));
  await page.screenshot({ path: 'test-results/foundation-06-message.png', fullPage: true });

  // The invitee, in a browser of their own, follows the link while signed out.
  const other = await browser.newContext({ baseURL: gatefold.baseURL });
  const guest = await other.newPage();
  await guest.goto(inviteUrl!);
  await expect(guest.getByTestId('invitation-board')).toHaveText('Half adder, tube build');
  await expect(guest.getByText(OWNER.name)).toBeVisible();
  await guest.screenshot({ path: 'test-results/foundation-07-invitation-signed-out.png' });
  await guest.getByRole('link', { name: 'Create an account' }).click();
  await expect(guest).toHaveURL(/\/signup\?next=/);
  await expect(guest.getByLabel('E-mail', { exact: true })).toHaveValue(INVITEE.email);
  await signUp(guest, INVITEE, { goto: false });

  // Back on the invitation, signed in: the new account joins at once and lands on the board as an editor.
  await expect(guest).toHaveURL(boardPath);
  const guestHeader = guest.getByTestId('board-page').locator('header');
  await expect(guestHeader.getByTestId('role-badge')).toHaveText('editor');
  await expect(guest.getByTestId('board-title')).toHaveText('Half adder, tube build');
  await expect(guest.getByTestId('member-list')).toContainText(OWNER.name);
  await expect(guest.getByTestId('member-list')).toContainText(INVITEE.name);
  // Editors rename, but the owner-only actions are not offered.
  await expect(guest.getByRole('button', { name: 'Rename board' })).toBeVisible();
  await expect(guestHeader.getByRole('link', { name: 'Members' })).toHaveCount(0);
  await expect(guestHeader.getByRole('button', { name: 'Delete' })).toHaveCount(0);
  await guest.screenshot({ path: 'test-results/foundation-08-board-editor.png' });

  // Not an admin: no Outbox in the bar, and the page itself says so.
  await expect(guest.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Outbox' })).toHaveCount(0);
  await guest.goto('/outbox');
  await expect(guest.getByRole('heading', { name: 'Admins only' })).toBeVisible();
  await other.close();

  // The owner sees the new editor in the members table and no pending invitation.
  await page.goto(`${boardPath}/members`);
  const member = page.getByTestId('member-row').filter({ hasText: INVITEE.email });
  await expect(member.getByRole('combobox', { name: `Role of ${INVITEE.name}` })).toHaveValue('editor');
  await expect(page.getByText('No pending invitations.')).toBeVisible();
  await page.screenshot({ path: 'test-results/foundation-09-members-after.png' });

  // Owners change roles in the table; the change is stored (it survives a reload).
  await member.getByRole('combobox', { name: `Role of ${INVITEE.name}` }).selectOption('viewer');
  await expect(page.getByText(`${INVITEE.name} is now viewer`)).toBeVisible();
  await page.reload();
  await expect(page.getByTestId('member-row').filter({ hasText: INVITEE.email }).getByRole('combobox')).toHaveValue('viewer');

  // Deleting asks first; cancelling keeps the board, confirming removes it.
  await page.goto(boardPath);
  const ownerHeader = page.getByTestId('board-page').locator('header');
  await ownerHeader.getByRole('button', { name: 'Delete' }).click();
  const confirm = page.getByRole('dialog', { name: /Delete “Half adder, tube build”\?/ });
  await expect(confirm).toBeVisible();
  await confirm.getByRole('button', { name: 'Cancel' }).click();
  await expect(confirm).toBeHidden();
  await expect(page).toHaveURL(boardPath);
  await ownerHeader.getByRole('button', { name: 'Delete' }).click();
  await confirm.getByRole('button', { name: 'Delete board' }).click();
  await expect(page).toHaveURL(/\/boards$/);
  await expect(page.getByText('No boards yet')).toBeVisible();
});

test('server-side errors show in the form; sign-in returns to the page that asked for it', async ({ page }) => {
  await signUp(page, OWNER);
  await page.getByRole('button', { name: 'Sign out' }).click();
  await expect(page).toHaveURL(/\/signin$/);

  // Same address again: the server refuses (409), the form says why in place.
  await page.goto('/signup');
  const form = page.getByRole('form', { name: 'Sign up' });
  await form.getByLabel('Name', { exact: true }).fill('Someone Else');
  await form.getByLabel('E-mail', { exact: true }).fill(OWNER.email);
  await form.getByLabel('Password', { exact: true }).fill('another-password');
  await form.getByRole('button', { name: 'Create account' }).click();
  await expect(form.getByRole('alert')).toContainText('already exists');
  await expect(form.getByLabel('E-mail', { exact: true })).toHaveAttribute('aria-invalid', 'true');
  await expect(page).toHaveURL(/\/signup$/);

  // Wrong password: a form-wide message, and still on the sign-in page.
  await page.goto('/signin');
  const signin = page.getByRole('form', { name: 'Sign in' });
  await signin.getByLabel('E-mail', { exact: true }).fill(OWNER.email);
  await signin.getByLabel('Password', { exact: true }).fill('not-the-password');
  await signin.getByRole('button', { name: 'Sign in' }).click();
  await expect(signin.getByRole('alert')).toBeVisible();
  await page.screenshot({ path: 'test-results/foundation-10-bad-sign-in.png' });

  // A signed-out visit to a protected page goes to sign-in and comes back afterwards.
  await page.goto('/boards/999');
  await expect(page).toHaveURL(/\/signin\?next=%2Fboards%2F999$/);
  await signIn(page, OWNER.email, OWNER.password, { goto: false });
  await expect(page).toHaveURL(/\/boards\/999$/);
  await expect(page.getByRole('alert')).toContainText(/not found/i);

  // Unknown invitation token and unknown page: clear messages, not a blank screen.
  await page.goto('/invitations/no-such-token');
  await expect(page.getByRole('heading', { name: 'Invitation not found' })).toBeVisible();
  await page.goto('/no/such/page');
  await expect(page.getByRole('heading', { name: 'Page not found' })).toBeVisible();
});

test('a forgotten password is reset through the mailed link', async ({ page, browser, gatefold }) => {
  await signUp(page, OWNER);

  // Someone signed out asks for a reset of the admin's address.
  const other = await browser.newContext({ baseURL: gatefold.baseURL });
  const visitor = await other.newPage();
  await visitor.goto('/signin');
  await visitor.getByRole('link', { name: 'Forgot your password?' }).click();
  const request = visitor.getByRole('form', { name: 'Reset password' });
  await request.getByLabel('E-mail', { exact: true }).fill(OWNER.email);
  await request.getByRole('button', { name: 'Send reset link' }).click();
  await expect(visitor.getByRole('status').filter({ hasText: 'is on its way' })).toBeVisible();

  // The admin's outbox has the mail, its reset link masked; the local server prints the live link.
  await page.goto('/outbox');
  const row = page.getByTestId('outbox-row').filter({ hasText: OWNER.email });
  await expect(row).toHaveCount(1);
  await row.getByRole('link').click();
  await expect(page.getByTestId('message-text')).toContainText('/reset/hidden-see-server-console');
  const printed = new RegExp(`${gatefold.baseURL}/reset/(?!hidden-see-server-console)[A-Za-z0-9_-]+`);
  await expect.poll(() => printed.test(gatefold.logs())).toBe(true);
  const resetUrl = printed.exec(gatefold.logs())?.[0];
  expect(resetUrl).toMatch(new RegExp(`^${gatefold.baseURL}/reset/[^/\\s]+$`));

  // Too short is refused in place; a good one is saved and signs in.
  await visitor.goto(resetUrl!);
  const choose = visitor.getByRole('form', { name: 'Choose a new password' });
  await choose.getByLabel('New password', { exact: true }).fill('short');
  await choose.getByRole('button', { name: 'Save new password' }).click();
  await expect(choose.getByRole('alert')).toHaveText('Password must be at least 8 characters');
  await choose.getByLabel('New password', { exact: true }).fill('a-brand-new-passphrase');
  await choose.getByRole('button', { name: 'Save new password' }).click();
  await expect(visitor).toHaveURL(/\/signin$/);
  await signIn(visitor, OWNER.email, 'a-brand-new-passphrase', { goto: false });
  await expect(visitor).toHaveURL(/\/boards$/);

  // The link works once.
  await visitor.goto(resetUrl!);
  await choose.getByLabel('New password', { exact: true }).fill('yet-another-passphrase');
  await choose.getByRole('button', { name: 'Save new password' }).click();
  await expect(choose.getByRole('alert')).toContainText('unknown, used or expired');
  await other.close();
});

test.describe('with the demo data', () => {
  test.use({ seedDemo: true });

  test('a demo account signs in from the hint and sees its boards in the table', async ({ page }) => {
    await page.goto('/signin');
    await page.getByTestId('demo-sign-ins').getByRole('button', { name: /theo@larkspur\.example/ }).click();
    await page.getByRole('form', { name: 'Sign in' }).getByRole('button', { name: 'Sign in' }).click();
    await expect(page).toHaveURL(/\/boards$/);
    const rows = page.getByTestId('board-row');
    await expect(rows.filter({ hasText: 'Half adder' })).toHaveCount(1);
    await expect(rows.filter({ hasText: 'Half adder' }).getByTestId('role-badge')).toHaveText('owner');
    await expect(rows.filter({ hasText: 'Mux logic unit' }).getByTestId('role-badge')).toHaveText('editor');
    await page.screenshot({ path: 'test-results/foundation-11-demo-boards.png' });

    // Sorting by title puts the rows in alphabetical order.
    await page.getByRole('columnheader', { name: 'Title' }).getByRole('button').click();
    const titles = await rows.locator('td:first-child').allTextContents();
    expect(titles).toEqual([...titles].sort((a, b) => a.localeCompare(b)));
  });
});
