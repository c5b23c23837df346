import { QueryTypes } from 'sequelize';
import { describe, expect, it } from 'vitest';
import { database } from '../../server/db/sequelize';
import { Membership, Workspace } from '../../server/models';
import { DEMO_PASSWORD } from '../../seeders/data/demo-accounts';
import { buildMember, buildWorkspace, DEFAULT_PASSWORD, signIn } from '../support/factories';
import { tokenFromLink, waitForMail } from '../support/mail';
import { useBrowserFlows } from './browser';

const DEMO_WORKSPACE = 'Demo process group (invented)';
const flows = await useBrowserFlows({ profile: 'per-flow' });
const { base } = flows;

async function demoWorkspace(): Promise<Workspace> {
  const workspace = await Workspace.findOne({ where: { name: DEMO_WORKSPACE } });
  if (!workspace) throw new Error('the demo workspace was not seeded');
  return workspace;
}

async function signInAs(email: string, password: string) {
  const { page } = flows.browser;
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
}

async function signOut() {
  const { page } = flows.browser;
  await page.getByRole('button', { name: 'Sign out' }).click();
  await page.getByRole('heading', { level: 1, name: 'Sign in' }).waitFor();
  // Signing out on purpose starts afresh: no page to return to, no notice.
  expect(new URL(page.url()).search).toBe('');
  await expect(page.getByText('Your session has ended').count()).resolves.toBe(0);
}

/** Signing in with this password is refused with the server's message, and the page stays on sign-in. */
async function expectSignInRefused(email: string, password: string) {
  const { page } = flows.browser;
  await signInAs(email, password);
  const alert = page.getByRole('alert');
  await alert.waitFor();
  await expect(alert.textContent()).resolves.toMatch(/incorrect/i);
  expect(new URL(page.url()).pathname).toBe('/sign-in');
}

/**
 * The page's problems, less the browser's own log line for a refused reset
 * link (404 or 410), which these flows expect.
 */
function problemsBesidesRefusedLink(): string[] {
  return flows.browser.problems.filter((p) => !/status of (404|410)/.test(p));
}

/** Ends every stored session of the user, as the server does on a reset or an admin would by hand. */
async function endSessionsOnServer(userId: string) {
  await database().query(`DELETE FROM session WHERE sess -> 'passport' ->> 'user' = :userId`, {
    replacements: { userId },
    type: QueryTypes.DELETE,
  });
}

describe('password reset', () => {
  it('sends a link by e-mail that sets a new password once; the old one stops working', async () => {
    const { page, shot } = flows.browser;
    const member = await buildMember(await demoWorkspace(), ['chemist'], {
      name: 'Forgetful Chemist (demo)',
    });
    const newPassword = 'a-brand-new-passphrase';

    await page.goto(base + '/sign-in');
    await page.getByRole('link', { name: /forgot/i }).click();
    await page.getByRole('heading', { level: 1, name: 'Reset your password' }).waitFor();
    const sentAfter = new Date();
    await page.getByLabel('E-mail').fill(member.email);
    await page.getByRole('button', { name: 'Send reset link' }).click();
    await page
      .getByRole('status')
      .filter({ hasText: `If an account exists for ${member.email}` })
      .waitFor();
    await shot('account-01-reset-requested');

    const mail = await waitForMail(member.email, { after: sentAfter, subject: /password/i });
    const token = tokenFromLink(mail.text, 'reset-password');
    const link = `${base}/reset-password/${token}`;
    expect(mail.text).toContain(link);

    await page.goto(link);
    await page.getByRole('heading', { level: 1, name: 'Choose a new password' }).waitFor();
    const password = page.getByLabel('New password', { exact: true });
    const repeat = page.getByLabel('Repeat new password');
    const submit = page.getByRole('button', { name: 'Set new password' });

    // Too short: the shared schema's message, on the field, before anything is sent.
    await password.fill('short');
    await repeat.fill('short');
    await submit.click();
    await page.getByText('Use at least 10 characters.').waitFor();
    await expect(password.getAttribute('aria-invalid')).resolves.toBe('true');
    await shot('account-02-reset-too-short');

    // Long enough, but the repeat differs.
    await password.fill(newPassword);
    await repeat.fill(newPassword + 'x');
    await submit.click();
    await page.getByText('The two passwords differ.').waitFor();
    await expect(repeat.getAttribute('aria-invalid')).resolves.toBe('true');
    await expect(page.getByText('Use at least 10 characters.').count()).resolves.toBe(0);

    await repeat.fill(newPassword);
    await submit.click();
    await page.getByRole('heading', { level: 1, name: 'Password changed' }).waitFor();
    await shot('account-03-reset-done');

    await page.getByRole('link', { name: 'Sign in' }).click();
    await page.getByRole('heading', { level: 1, name: 'Sign in' }).waitFor();
    await expectSignInRefused(member.email, DEFAULT_PASSWORD);
    await signInAs(member.email, newPassword);
    await page.getByRole('heading', { level: 1, name: 'Routes' }).waitFor();
    await signOut();

    // The link works once: a second use is refused in plain words, with a way to ask again.
    await page.goto(link);
    await page.getByLabel('New password', { exact: true }).fill('yet-another-passphrase');
    await page.getByLabel('Repeat new password').fill('yet-another-passphrase');
    await page.getByRole('button', { name: 'Set new password' }).click();
    const refused = page.getByRole('alert');
    await refused.waitFor();
    await expect(refused.textContent()).resolves.toMatch(/This reset link is not valid any more/);
    await expect(
      refused.getByRole('link', { name: 'Ask for a new link' }).isVisible(),
    ).resolves.toBe(true);
    await shot('account-04-reset-link-used');
    // The refused second use changed nothing.
    await page.goto(base + '/sign-in');
    await signInAs(member.email, newPassword);
    await page.getByRole('heading', { level: 1, name: 'Routes' }).waitFor();
    await signOut();
    expect(problemsBesidesRefusedLink()).toEqual([]);
  });

  it('answers a mistyped reset link with the same plain message', async () => {
    const { page } = flows.browser;
    for (const token of ['not-a-link-anyone-was-sent-0123456789', 'short']) {
      await page.goto(`${base}/reset-password/${token}`);
      await page.getByLabel('New password', { exact: true }).fill('a-long-enough-password');
      await page.getByLabel('Repeat new password').fill('a-long-enough-password');
      await page.getByRole('button', { name: 'Set new password' }).click();
      const refused = page.getByRole('alert');
      await refused.waitFor();
      const text = (await refused.textContent()) ?? '';
      expect(text).toMatch(/This reset link is not valid any more/);
      // Nothing technical: no field paths or codes.
      expect(text).not.toMatch(/token|not_found|validation/i);
    }
    expect(problemsBesidesRefusedLink()).toEqual([]);
  });
});

describe('changing the password on the Account page', () => {
  it('keeps the typed new password after a wrong current one, then changes it', async () => {
    const { page, shot } = flows.browser;
    const member = await buildMember(await demoWorkspace(), ['reviewer'], {
      name: 'Careful Reviewer (demo)',
    });
    const newPassword = 'reviewer-new-passphrase';

    await page.goto(base + '/account');
    await page.getByRole('heading', { level: 1, name: 'Sign in' }).waitFor();
    await signInAs(member.email, DEFAULT_PASSWORD);
    await page.getByRole('heading', { level: 1, name: 'Account' }).waitFor();

    const form = page.getByRole('form', { name: 'Change password' });
    const current = form.getByLabel('Current password');
    const fresh = form.getByLabel('New password', { exact: true });
    const repeat = form.getByLabel('Repeat new password');
    await current.fill('not-my-password');
    await fresh.fill(newPassword);
    await repeat.fill(newPassword);
    await form.getByRole('button', { name: 'Change password' }).click();
    // The server's message, on the field it is about; what was typed stays.
    await form.getByText('The current password is incorrect.').waitFor();
    await expect(current.getAttribute('aria-invalid')).resolves.toBe('true');
    // The field says it all: no vague banner above the form.
    await expect(form.getByRole('alert').count()).resolves.toBe(0);
    await expect(fresh.inputValue()).resolves.toBe(newPassword);
    await expect(repeat.inputValue()).resolves.toBe(newPassword);
    await shot('account-05-change-wrong-current');

    await current.fill(DEFAULT_PASSWORD);
    await expect(form.getByText('The current password is incorrect.').count()).resolves.toBe(0);
    await form.getByRole('button', { name: 'Change password' }).click();
    await form.getByRole('status').filter({ hasText: 'Your password was changed.' }).waitFor();
    // The form is emptied for the next change.
    await expect(current.inputValue()).resolves.toBe('');
    await expect(fresh.inputValue()).resolves.toBe('');
    await shot('account-06-changed');

    await signOut();
    await expectSignInRefused(member.email, DEFAULT_PASSWORD);
    await signInAs(member.email, newPassword);
    await page.getByRole('heading', { level: 1, name: 'Routes' }).waitFor();
    await signOut();
    expect(flows.browser.problems).toEqual([]);
  });
});

describe('joining a second workspace', () => {
  it('lets someone with an account accept with their password and switch between both workspaces', async () => {
    const { page, shot } = flows.browser;
    const demo = await demoWorkspace();
    const home = await buildWorkspace({ name: 'Kilo lab group (invented)' });
    const person = await buildMember(home, ['engineer'], { name: 'Travelling Engineer (demo)' });

    // The demo admin invites them as a reviewer (through the API, as the Members page does).
    const sentAfter = new Date();
    const admin = await signIn(flows.server.app, 'admin@example.com', DEMO_PASSWORD);
    const invited = await admin.agent
      .post(`/api/v1/workspaces/${demo.id}/invitations`)
      .set('X-CSRF-Token', admin.csrfToken)
      .send({ email: person.email, roles: ['reviewer'] });
    expect(invited.status).toBe(201);
    const mail = await waitForMail(person.email, { after: sentAfter });
    const token = tokenFromLink(mail.text, 'invitations');

    await page.goto(`${base}/invitations/${token}`);
    await page.getByRole('heading', { level: 1, name: `Join ${DEMO_WORKSPACE}` }).waitFor();
    await page.getByText('You already have a Phasewright account').waitFor();
    // An existing account is not asked for a name, and must give its current password.
    await expect(page.getByLabel('Your name').count()).resolves.toBe(0);
    await page.getByLabel('Your password').fill('not-my-password');
    await page.getByRole('button', { name: 'Accept and join' }).click();
    const alert = page.getByRole('alert');
    await alert.waitFor();
    await expect(alert.textContent()).resolves.toMatch(/incorrect/i);
    await shot('account-07-invitation-existing-account');

    await page.getByLabel('Your password').fill(DEFAULT_PASSWORD);
    await page.getByRole('button', { name: 'Accept and join' }).click();
    await page.getByRole('heading', { level: 1, name: 'Routes' }).waitFor();
    expect(new URL(page.url()).pathname).toBe(`/w/${demo.id}`);
    const header = page.locator('header');
    await expect(header.getByText('Reviewer', { exact: true }).isVisible()).resolves.toBe(true);
    const membership = await Membership.findOne({
      where: { userId: person.id, workspaceId: demo.id },
    });
    expect(membership?.roles).toEqual(['reviewer']);

    // The switcher offers both workspaces, the current one selected.
    const switcher = page.getByLabel('Workspace', { exact: true });
    const options = await switcher.locator('option').allTextContents();
    expect(options.sort()).toEqual([DEMO_WORKSPACE, home.name].sort());
    await expect(switcher.inputValue()).resolves.toBe(demo.id);
    // The rail is narrow: the full name of the current workspace is in the tooltip.
    await expect(switcher.getAttribute('title')).resolves.toBe(DEMO_WORKSPACE);
    await shot('account-08-switcher-two-workspaces');

    await switcher.selectOption({ label: home.name });
    await page.waitForURL(`${base}/w/${home.id}`);
    await page.getByRole('heading', { level: 1, name: 'Routes' }).waitFor();
    await header.getByText('Scale-up engineer', { exact: true }).waitFor();
    await expect(header.getByText('Reviewer', { exact: true }).count()).resolves.toBe(0);
    await expect(switcher.inputValue()).resolves.toBe(home.id);

    // Switching keeps the section: from the home group's members to the demo group's.
    await page.getByRole('link', { name: 'Members' }).click();
    await page.getByRole('heading', { level: 1, name: 'Members' }).waitFor();
    await page.getByRole('table').getByText(person.email).waitFor();
    await switcher.selectOption({ label: DEMO_WORKSPACE });
    await page.waitForURL(`${base}/w/${demo.id}/members`);
    await page.getByRole('table').getByText('chemist@example.com').waitFor();
    await shot('account-09-switched-members');

    // "/" opens the workspace worked in last.
    await switcher.selectOption({ label: home.name });
    await page.waitForURL(`${base}/w/${home.id}/members`);
    await page.goto(base + '/');
    await page.waitForURL(`${base}/w/${home.id}`);
    await signOut();
    expect(flows.browser.problems).toEqual([]);
  });
});

describe('a session ended on the server', () => {
  it('sends the next action to sign-in with a plain message, then back to the page', async () => {
    const { page, shot } = flows.browser;
    const member = await buildMember(await demoWorkspace(), ['chemist'], {
      name: 'Interrupted Chemist (demo)',
    });

    await page.goto(base + '/account');
    await signInAs(member.email, DEFAULT_PASSWORD);
    await page.getByRole('heading', { level: 1, name: 'Account' }).waitFor();
    // The page has finished loading (its token list answered) before the session ends, so the
    // first request to find it gone is the one the chemist makes below.
    await page.getByRole('heading', { name: 'No API tokens' }).waitFor();

    await endSessionsOnServer(member.id);
    // The page does not know yet; its next request finds the session gone.
    await page.getByLabel('Token name').fill('Nightly export');
    await page.getByRole('button', { name: 'Create token' }).click();
    await page.getByRole('heading', { level: 1, name: 'Sign in' }).waitFor();
    expect(new URL(page.url()).pathname).toBe('/sign-in');
    expect(new URL(page.url()).searchParams.get('next')).toBe('/account');
    await page.getByRole('status').filter({ hasText: 'Your session has ended' }).waitFor();
    await shot('account-10-session-ended');

    await signInAs(member.email, DEFAULT_PASSWORD);
    await page.getByRole('heading', { level: 1, name: 'Account' }).waitFor();
    expect(new URL(page.url()).pathname).toBe('/account');
    // The refused request created nothing.
    await page.getByRole('heading', { name: 'No API tokens' }).waitFor();
    await signOut();
    expect(flows.browser.problems).toEqual([]);
  });

  it('does the same after signing out in another tab, inside a workspace page', async () => {
    const { context, page } = flows.browser;
    const demo = await demoWorkspace();
    const member = await buildMember(demo, ['chemist'], { name: 'Two-tab Chemist (demo)' });
    const members = `/w/${demo.id}/members`;

    await page.goto(base + members);
    await signInAs(member.email, DEFAULT_PASSWORD);
    await page.getByRole('heading', { level: 1, name: 'Members' }).waitFor();

    const other = await context.newPage();
    await other.goto(base + '/account');
    await other.getByRole('heading', { level: 1, name: 'Account' }).waitFor();
    await other.getByRole('button', { name: 'Sign out' }).click();
    await other.getByRole('heading', { level: 1, name: 'Sign in' }).waitFor();
    await other.close();

    // Back in the first tab: moving to another page asks the server again.
    await page.getByRole('link', { name: 'Compounds' }).click();
    await page.getByRole('heading', { level: 1, name: 'Sign in' }).waitFor();
    await page.getByRole('status').filter({ hasText: 'Your session has ended' }).waitFor();
    const next = new URL(page.url()).searchParams.get('next');
    expect(next).toBe(`/w/${demo.id}/compounds`);

    await signInAs(member.email, DEFAULT_PASSWORD);
    await page.getByRole('heading', { level: 1, name: 'Compounds' }).waitFor();
    expect(new URL(page.url()).pathname).toBe(next);
    await signOut();
    expect(flows.browser.problems).toEqual([]);
  });
});
