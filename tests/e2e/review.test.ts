import { describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { DEMO_ROUTE_NAME } from '../../seeders/20261203000000-demo-route';
import { DEMO_PASSWORD } from '../../seeders/data/demo-accounts';
import { useBrowserFlows } from './browser';

const flows = await useBrowserFlows({ profile: 'per-file', lastShot: 'review-last' });
const { base } = flows;

async function signInAs(page: Page, email: string) {
  await page.goto(base + '/sign-in');
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(DEMO_PASSWORD);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.getByRole('heading', { level: 1, name: 'Routes' }).waitFor();
}

async function signOut(page: Page) {
  await page.evaluate(async () => {
    const session = await (await fetch('/api/v1/session')).json();
    await fetch('/api/v1/session', {
      method: 'DELETE',
      headers: { 'X-CSRF-Token': session.csrfToken },
    });
  });
}

describe('review of the demo route', () => {
  it('the chemist compares the two revisions and submits; the reviewer comments on the crystallisation and signs; the chemist sees the signed approval', async () => {
    const { page, shot, problems } = flows.browser;
    await signInAs(page, 'chemist@example.com');
    // By its exact name: other flows make copies whose names begin with the demo route's.
    await page.getByRole('link', { name: DEMO_ROUTE_NAME, exact: true }).click();
    await page.getByRole('link', { name: 'History' }).click();
    await page.getByRole('heading', { level: 1, name: /History of/ }).waitFor();
    await page.getByRole('link', { name: 'Revision 2' }).waitFor();
    await expect(page.getByRole('link', { name: /^Revision \d$/ }).count()).resolves.toBe(2);
    await page.getByLabel('Compare revision 1').check();
    await page.getByLabel('Compare revision 2').check();
    await shot('review-01-history');
    await page.getByRole('button', { name: 'Compare the two chosen' }).click();
    const changes = page.locator('[data-compare]');
    await changes.waitFor();
    await expect(
      changes.getByRole('table', { name: 'Changes in Cool to 5 °C and age' }).isVisible(),
    ).resolves.toBe(true);
    await expect(
      changes.getByRole('table', { name: 'Totals' }).getByText('Yield, %').isVisible(),
    ).resolves.toBe(true);
    await expect(page.locator('[data-change="changed"]').count()).resolves.toBeGreaterThanOrEqual(
      2,
    );
    await shot('review-02-compare');

    // Submit revision 2 to the reviewer.
    await page.getByRole('tab', { name: 'Review' }).click();
    await page.getByRole('checkbox', { name: /Tomas Lindqvist/ }).check();
    await page
      .getByLabel('Note for the reviewers')
      .fill('Please check the cooling end point and the cake washes.');
    await page.getByRole('button', { name: 'Send for review' }).click();
    await page.locator('[data-status="in_review"]').first().waitFor();
    await shot('review-03-submitted');
    await signOut(page);

    // The reviewer finds it in their list, comments on the crystallisation step and approves.
    await signInAs(page, 'reviewer@example.com');
    const attention = page.getByRole('list', { name: 'Needs your attention' });
    await attention.waitFor();
    await shot('review-04-reviewer-attention');
    await attention.getByRole('link', { name: /revision 2/ }).click();
    await page.locator('[data-review-panel]').waitFor();
    await page.getByRole('article', { name: /Cool to 5 °C and age/ }).click();
    await page.getByRole('tab', { name: 'Review' }).click();
    await page
      .getByLabel('New comment')
      .fill('Is 5 °C reachable in the plant jacket in under two hours?');
    await expect(page.getByText('On the step “Cool to 5 °C and age”').isVisible()).resolves.toBe(
      true,
    );
    await page.getByRole('button', { name: 'Add comment' }).click();
    await page.locator('[data-comment-marker="1"]').waitFor();
    // A wrong password signs nothing.
    await page.getByLabel('Your password (signs the decision)').fill('not-my-password');
    await page.getByRole('button', { name: 'Sign and approve' }).click();
    await page.getByText('The password is not correct, so nothing was signed.').waitFor();
    await page.getByLabel('Your password (signs the decision)').fill(DEMO_PASSWORD);
    await page.getByRole('button', { name: 'Sign and approve' }).click();
    await page.getByRole('figure', { name: /Signature of Tomas Lindqvist/ }).waitFor();
    await shot('review-05-reviewer-signed');
    await signOut(page);

    // The chemist sees the signed approval.
    await signInAs(page, 'chemist@example.com');
    await page
      .getByRole('list', { name: 'Needs your attention' })
      .getByRole('link', { name: /revision 2/ })
      .first()
      .click();
    const signature = page.getByRole('figure', { name: /Signature of Tomas Lindqvist/ });
    await signature.waitFor();
    const text = await signature.innerText();
    expect(text).toMatch(/Approved — signed by Tomas Lindqvist/);
    expect(text).toMatch(/Approved as technical reviewer/);
    expect(text).toMatch(/\d{4}-\d\d-\d\d \d\d:\d\d:\d\d UTC/);
    expect(text).toMatch(/Content hash [0-9a-f]{64}/);
    await expect(page.locator('[data-status="approved"]').first().isVisible()).resolves.toBe(true);
    await shot('review-06-chemist-sees-approval');
    await signOut(page);

    // The admin reads the trail of it all and checks the chain.
    await signInAs(page, 'admin@example.com');
    await page.getByRole('link', { name: 'Audit trail' }).click();
    await page.getByRole('heading', { level: 1, name: 'Audit trail' }).waitFor();
    await page.locator('tr[data-action="review.approve"]').waitFor();
    await page.getByRole('button', { name: 'Check the chain' }).click();
    await page.locator('[data-chain="ok"]').waitFor();
    await shot('review-07-audit-trail');
    expect(problems).toEqual([]);
  });
});
