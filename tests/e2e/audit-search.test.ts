import { describe, expect, it } from 'vitest';
import { signInAs, useBrowserFlows } from './browser';

const flows = await useBrowserFlows({ profile: 'per-file' });
const { base } = flows;

describe('audit trail search', () => {
  it('the admin searches the trail through the server: the last rows stay while it searches, then the matches, or a message when nothing matches', async () => {
    const { page, shot, problems } = flows.browser;
    await signInAs(page, base, 'admin@example.com');
    await page.getByRole('link', { name: 'Audit trail' }).click();
    await page.getByRole('heading', { level: 1, name: 'Audit trail' }).waitFor();
    const rows = page.locator('tbody tr[data-action]');
    await rows.first().waitFor();
    // The admin's own sign-in is on the trail, among other kinds of entry.
    await page.locator('tr[data-action="session.signed_in"]').first().waitFor();

    // Hold the search's reply a moment, to see what shows while it is on its way.
    let release: () => void = () => undefined;
    const held = new Promise<void>((resolve) => (release = resolve));
    await page.route(/\/api\/v1\/workspaces\/[^/]+\/audit\?.*q=signed/, async (route) => {
      await held;
      await route.continue();
    });
    await page.getByLabel('Search the trail').fill('signed');
    await page.getByRole('status').filter({ hasText: 'Searching…' }).waitFor();
    // The rows of the last search stay (dimmed) instead of a spinner over an empty page.
    expect(await rows.count()).toBeGreaterThan(0);
    await expect(page.locator('[aria-busy="true"]').count()).resolves.toBe(1);
    await shot('audit-search-01-searching');
    release();
    await page.locator('[aria-busy="false"]').waitFor();
    const actions = await rows.evaluateAll((trs) =>
      trs.map((tr) => tr.getAttribute('data-action')),
    );
    expect(actions.length).toBeGreaterThan(0);
    expect(actions.every((action) => action!.includes('signed'))).toBe(true);
    await shot('audit-search-02-matches');

    await page.getByLabel('Search the trail').fill('no such entry anywhere');
    await page.getByText('No entries match “no such entry anywhere”').waitFor();
    await page.getByText('Clear the search or a filter to see more of the trail.').waitFor();
    await shot('audit-search-03-nothing');

    await page.getByLabel('Search the trail').fill('');
    await rows.first().waitFor();
    expect(problems).toEqual([]);
  });
});
