import { randomBytes } from 'node:crypto';
import { describe, expect, it } from 'vitest';
import { Membership, Workspace } from '../../server/models';
import { buildMember } from '../support/factories';
import { DEMO_ROUTE_NAME } from '../../seeders/20261203000000-demo-route';
import { tokenFromLink, waitForMail } from '../support/mail';
import { DEMO_PASSWORD } from '../../seeders/data/demo-accounts';
import { useBrowserFlows } from './browser';

const DEMO_WORKSPACE = 'Demo process group (invented)';
const flows = await useBrowserFlows({ profile: 'per-flow' });
const { base } = flows;

async function signInAs(email: string, password = DEMO_PASSWORD) {
  const { page } = flows.browser;
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
}

async function signOut() {
  const { page } = flows.browser;
  await page.getByRole('button', { name: 'Sign out' }).click();
  await page.getByRole('heading', { level: 1, name: 'Sign in' }).waitFor();
}

describe('signing in', () => {
  it('takes the chemist to the routes list with the demo route, and signs out', async () => {
    const { page, shot } = flows.browser;
    await page.goto(base + '/');
    // Signed out: the app shows the sign-in page.
    await page.getByRole('heading', { level: 1, name: 'Sign in' }).waitFor();
    await shot('01-sign-in');

    await signInAs('chemist@example.com');
    await page.getByRole('heading', { level: 1, name: 'Routes' }).waitFor();
    expect(new URL(page.url()).pathname).toMatch(/^\/w\/[^/]+$/);
    await expect(page.getByText(DEMO_WORKSPACE).first().isVisible()).resolves.toBe(true);
    // The demo workspace holds the seeded demo route; a chemist may start a new one.
    await page.getByRole('link', { name: DEMO_ROUTE_NAME, exact: true }).waitFor();
    await expect(page.getByRole('button', { name: 'New route' }).isEnabled()).resolves.toBe(true);
    // The chemist's role is shown; admin-only places are not offered.
    await expect(
      page.locator('header').getByText('Chemist', { exact: true }).isVisible(),
    ).resolves.toBe(true);
    await expect(page.getByRole('link', { name: 'Outbox' }).count()).resolves.toBe(0);
    await expect(page.getByRole('link', { name: 'Members' }).isVisible()).resolves.toBe(true);
    await shot('02-routes-list');

    await signOut();
    await shot('03-signed-out');
    // The session really ended: a signed-in page sends the visitor back to sign in.
    await page.goto(base + '/account');
    await page.getByRole('heading', { level: 1, name: 'Sign in' }).waitFor();
    expect(new URL(page.url()).searchParams.get('next')).toBe('/account');
    expect(flows.browser.problems).toEqual([]);
  });

  it('returns to the page asked for after signing in', async () => {
    const { page } = flows.browser;
    await page.goto(base + '/account');
    await page.getByRole('heading', { level: 1, name: 'Sign in' }).waitFor();
    await signInAs('chemist@example.com');
    await page.getByRole('heading', { level: 1, name: 'Account' }).waitFor();
    expect(new URL(page.url()).pathname).toBe('/account');
    await signOut();
  });

  it('shows the server’s message for a wrong password and stays on the sign-in page', async () => {
    const { page, shot } = flows.browser;
    await page.goto(base + '/sign-in');
    await signInAs('chemist@example.com', 'not-the-password');
    const alert = page.getByRole('alert');
    await alert.waitFor();
    await expect(alert.textContent()).resolves.toMatch(/incorrect/i);
    expect(new URL(page.url()).pathname).toBe('/sign-in');
    // The password field is emptied for the next try; the e-mail stays.
    await expect(page.getByLabel('Password').inputValue()).resolves.toBe('');
    await expect(page.getByLabel('E-mail').inputValue()).resolves.toBe('chemist@example.com');
    await shot('04-wrong-password');
  });

  it('checks the form with the shared schema before sending', async () => {
    const { page } = flows.browser;
    await page.goto(base + '/sign-in');
    await page.getByLabel('E-mail').fill('not-an-address');
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.getByText('Enter a valid e-mail address.').waitFor();
    await expect(page.getByText('Enter your password.').isVisible()).resolves.toBe(true);
    await expect(page.getByLabel('E-mail').getAttribute('aria-invalid')).resolves.toBe('true');
  });
});

describe('inviting a member', () => {
  it('lets the admin invite a reviewer, shows the e-mail in the outbox, and the link lets them join', async () => {
    const { page, shot } = flows.browser;
    const invitee = `new-reviewer-${randomBytes(3).toString('hex')}@example.com`;
    const sentAfter = new Date();

    await page.goto(base + '/sign-in');
    await signInAs('admin@example.com');
    await page.getByRole('heading', { level: 1, name: 'Routes' }).waitFor();
    await page.getByRole('link', { name: 'Members' }).click();
    await page.getByRole('heading', { level: 1, name: 'Members' }).waitFor();
    await page.getByRole('table').getByText('chemist@example.com').waitFor();

    const form = page.getByRole('form', { name: 'Invite a member' });
    await form.getByLabel('E-mail address').fill(invitee);
    await form.getByLabel('Chemist').uncheck();
    await form.getByLabel('Reviewer').check();
    await form.getByRole('button', { name: 'Send invitation' }).click();
    await page
      .getByRole('status')
      .filter({ hasText: `Invitation sent to ${invitee}` })
      .waitFor();
    await expect(form.getByLabel('E-mail address').inputValue()).resolves.toBe('');
    await shot('05-members-invited');

    // The mail goes through the job queue; wait for the fake to hold it, then read it in the app.
    const mail = await waitForMail(invitee, { after: sentAfter });
    const token = tokenFromLink(mail.text, 'invitations');
    await page.getByRole('link', { name: 'Outbox' }).click();
    await page.getByRole('heading', { level: 1, name: 'Outbox' }).waitFor();
    const message = page
      .getByRole('list', { name: 'E-mails' })
      .getByRole('button')
      .filter({ hasText: invitee });
    await message.click();
    const article = page.getByRole('article');
    await article.getByText(invitee).first().waitFor();
    const link = article.getByRole('link', { name: new RegExp(`/invitations/${token}$`) });
    await expect(link.getAttribute('href')).resolves.toBe(`${base}/invitations/${token}`);
    await shot('06-outbox');

    await signOut();
    await page.goto(`${base}/invitations/${token}`);
    await page.getByRole('heading', { level: 1, name: `Join ${DEMO_WORKSPACE}` }).waitFor();
    await expect(page.getByText(invitee).isVisible()).resolves.toBe(true);
    await page.getByLabel('Your name').fill('Invited Reviewer (demo)');
    await page.getByLabel('Choose a password').fill('a-long-enough-password');
    await page.getByRole('button', { name: 'Accept and join' }).click();
    await page.getByRole('heading', { level: 1, name: 'Routes' }).waitFor();
    await expect(
      page.locator('header').getByText('Reviewer', { exact: true }).isVisible(),
    ).resolves.toBe(true);
    await shot('07-joined');
    await signOut();
    expect(flows.browser.problems).toEqual([]);
  });
});

describe('managing members', () => {
  it('lists pending invitations for the admin, sends one again with a new link and revokes another', async () => {
    const { page, shot } = flows.browser;
    const tag = randomBytes(3).toString('hex');
    const resent = `pending-resent-${tag}@example.com`;
    const revoked = `pending-revoked-${tag}@example.com`;
    await page.goto(base + '/sign-in');
    await signInAs('admin@example.com');
    await page.getByRole('heading', { level: 1, name: 'Routes' }).waitFor();
    await page.getByRole('link', { name: 'Members' }).click();
    await page.getByRole('heading', { level: 1, name: 'Members' }).waitFor();
    const form = page.getByRole('form', { name: 'Invite a member' });
    for (const email of [resent, revoked]) {
      await form.getByLabel('E-mail address').fill(email);
      await form.getByRole('button', { name: 'Send invitation' }).click();
      await page
        .getByRole('status')
        .filter({ hasText: `Invitation sent to ${email}` })
        .waitFor();
    }
    const pending = page.getByRole('table', { name: 'Invitations not yet accepted' });
    await pending.getByText(resent).waitFor();
    await pending.getByText(revoked).waitFor();
    await expect(pending.getByRole('row').filter({ hasText: resent }).innerText()).resolves.toMatch(
      /by Demo Admin|by .+, /,
    );
    await shot('pending-invitations-01-listed');

    // Send again: a new e-mail with a new link; the first link no longer opens the invitation.
    const firstToken = tokenFromLink((await waitForMail(resent)).text, 'invitations');
    const resentAfter = new Date();
    await pending.getByRole('button', { name: `Send the invitation to ${resent} again` }).click();
    await page
      .getByRole('status')
      .filter({ hasText: `Invitation sent to ${resent} again` })
      .waitFor();
    const secondToken = tokenFromLink(
      (await waitForMail(resent, { after: resentAfter })).text,
      'invitations',
    );
    expect(secondToken).not.toBe(firstToken);

    // Revoke, after a question: gone from the list, and its link says it has expired.
    const revokedToken = tokenFromLink((await waitForMail(revoked)).text, 'invitations');
    await pending.getByRole('button', { name: `Revoke the invitation to ${revoked}` }).click();
    const dialog = page.getByRole('dialog', { name: `Revoke the invitation to ${revoked}?` });
    await dialog.getByRole('button', { name: 'Revoke invitation' }).click();
    await page
      .getByRole('status')
      .filter({ hasText: `The invitation to ${revoked} was revoked.` })
      .waitFor();
    await expect.poll(() => pending.getByText(revoked).count()).toBe(0);
    await expect(pending.getByText(resent).count()).resolves.toBe(1);
    await shot('pending-invitations-02-revoked');
    const reply = await page.evaluate(
      (url) => fetch(url).then((r) => r.status),
      `/api/v1/invitations/${revokedToken}`,
    );
    expect(reply).toBe(410);
    expect(flows.browser.problems.filter((p) => !/status of 410/.test(p))).toEqual([]);
  });

  it('shows no pending invitations to a chemist', async () => {
    const { page } = flows.browser;
    await page.goto(base + '/sign-in');
    await signInAs('chemist@example.com');
    await page.getByRole('heading', { level: 1, name: 'Routes' }).waitFor();
    await page.getByRole('link', { name: 'Members' }).click();
    await page.getByRole('heading', { level: 1, name: 'Members' }).waitFor();
    await page.getByRole('table').getByText('chemist@example.com').waitFor();
    await expect(page.getByRole('heading', { name: 'Pending invitations' }).count()).resolves.toBe(
      0,
    );
    expect(flows.browser.problems).toEqual([]);
  });

  it('lets the admin change a member’s roles and remove them after confirming', async () => {
    const { page, shot } = flows.browser;
    const workspace = await Workspace.findOne({ where: { name: DEMO_WORKSPACE } });
    if (!workspace) throw new Error('the demo workspace was not seeded');
    const member = await buildMember(workspace, ['chemist'], { name: 'Temporary Chemist (demo)' });

    await page.goto(base + '/sign-in');
    await signInAs('admin@example.com');
    await page.getByRole('heading', { level: 1, name: 'Routes' }).waitFor();
    await page.getByRole('link', { name: 'Members' }).click();
    const row = page.getByRole('row').filter({ hasText: member.email });
    await row.waitFor();

    await row.getByRole('button', { name: 'Change roles of Temporary Chemist (demo)' }).click();
    const editor = page.getByRole('group', { name: 'Roles of Temporary Chemist (demo)' });
    await editor.getByLabel('Scale-up engineer').check();
    await page.getByRole('button', { name: 'Save' }).click();
    await page
      .getByRole('status')
      .filter({ hasText: 'Roles of Temporary Chemist (demo) saved.' })
      .waitFor();
    await expect(row.getByText('Scale-up engineer', { exact: true }).isVisible()).resolves.toBe(
      true,
    );
    await member.reload();
    const membership = await Membership.findOne({
      where: { userId: member.id, workspaceId: workspace.id },
    });
    expect([...(membership?.roles ?? [])].sort()).toEqual(['chemist', 'engineer']);

    await row.getByRole('button', { name: 'Remove Temporary Chemist (demo)' }).click();
    const dialog = page.getByRole('dialog', { name: 'Remove Temporary Chemist (demo)?' });
    await dialog.waitFor();
    await shot('08-remove-member');
    // Cancel first: nothing changes.
    await dialog.getByRole('button', { name: 'Cancel' }).click();
    await expect(row.isVisible()).resolves.toBe(true);
    await row.getByRole('button', { name: 'Remove Temporary Chemist (demo)' }).click();
    await dialog.getByRole('button', { name: 'Remove member' }).click();
    await page
      .getByRole('status')
      .filter({ hasText: 'Temporary Chemist (demo) was removed' })
      .waitFor();
    await row.waitFor({ state: 'detached' });
    await expect(
      Membership.count({ where: { userId: member.id, workspaceId: workspace.id } }),
    ).resolves.toBe(0);
    await signOut();
    expect(flows.browser.problems).toEqual([]);
  });
});

describe('API tokens', () => {
  it('creates a token shown once with a copy button, which then authenticates until revoked', async () => {
    const { page, context, shot } = flows.browser;
    await context.grantPermissions(['clipboard-read', 'clipboard-write'], { origin: base });
    await page.goto(base + '/account');
    await page.getByRole('heading', { level: 1, name: 'Sign in' }).waitFor();
    await signInAs('engineer@example.com');
    await page.getByRole('heading', { level: 1, name: 'Account' }).waitFor();
    await page.getByRole('heading', { name: 'No API tokens' }).waitFor();

    await page.getByLabel('Token name').fill('Plant export script');
    await page.getByRole('button', { name: 'Create token' }).click();
    const secret = page.getByLabel('New API token');
    await secret.waitFor();
    const token = (await secret.textContent()) ?? '';
    expect(token.length).toBeGreaterThan(20);
    await page.getByRole('button', { name: 'Copy', exact: true }).click();
    await page.getByRole('button', { name: 'Copied' }).waitFor();
    await expect(page.evaluate(() => navigator.clipboard.readText())).resolves.toBe(token);
    await shot('09-token-created');

    const row = page.getByRole('row').filter({ hasText: 'Plant export script' });
    await row.waitFor();
    await expect(row.getByText('Never').isVisible()).resolves.toBe(true);
    const bearer = { headers: { Authorization: `Bearer ${token}` } };
    expect((await fetch(`${base}/api/v1/tokens`, bearer)).status).toBe(200);

    // Once dismissed, the secret is gone from the page.
    await page.getByRole('button', { name: 'Done' }).click();
    await expect(secret.count()).resolves.toBe(0);

    await row.getByRole('button', { name: 'Revoke Plant export script' }).click();
    await page.getByRole('dialog').getByRole('button', { name: 'Revoke token' }).click();
    await page.getByRole('heading', { name: 'No API tokens' }).waitFor();
    expect((await fetch(`${base}/api/v1/tokens`, bearer)).status).toBe(401);
    await signOut();
    expect(flows.browser.problems).toEqual([]);
  });
});
