import { randomBytes } from 'node:crypto';
import { describe, expect, it } from 'vitest';
import { DEMO_PROJECT_NAME, DEMO_ROUTE_NAME } from '../../seeders/20261203000000-demo-route';
import { DEMO_PASSWORD } from '../../seeders/data/demo-accounts';
import { useBrowserFlows } from './browser';

const flows = await useBrowserFlows({ profile: 'per-flow', lastShot: 'routes-list-last' });
const { base } = flows;

async function signInAs(email: string) {
  const { page } = flows.browser;
  await page.goto(base + '/sign-in');
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(DEMO_PASSWORD);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.getByRole('heading', { level: 1, name: 'Routes' }).waitFor();
}

const percent = (text: string | null) => Number(/([\d.]+)\s*%/.exec(text ?? '')?.[1] ?? NaN);

describe('routes list', () => {
  it('lists the demo route with its totals, and lets the chemist create, rename, duplicate and archive routes', async () => {
    const { page, shot } = flows.browser;
    const suffix = randomBytes(3).toString('hex');
    const name = `Ester isolation ${suffix}`;
    const renamed = `Ester isolation, reworked ${suffix}`;
    await signInAs('chemist@example.com');

    // The seeded demo route, in its project, with yield, purity and PMI worked out.
    const demo = page
      .getByRole('row')
      .filter({ has: page.getByRole('link', { name: DEMO_ROUTE_NAME, exact: true }) });
    await demo.waitFor();
    const cells = demo.getByRole('cell');
    const texts = await cells.allTextContents();
    expect(texts).toContain(DEMO_PROJECT_NAME);
    const yieldPct = percent(texts.find((t) => /%/.test(t)) ?? null);
    expect(yieldPct).toBeGreaterThan(30);
    expect(yieldPct).toBeLessThanOrEqual(100);
    const purity = percent(texts.filter((t) => /%/.test(t))[1] ?? null);
    expect(purity).toBeGreaterThan(80);
    expect(purity).toBeLessThanOrEqual(100);
    expect(texts).toContain('Draft');
    await shot('routes-01-list');

    // Create: the editor opens on the new, empty route; back to the list, it is there.
    await page.getByRole('button', { name: 'New route' }).click();
    await page.getByLabel('Route name').fill(name);
    await page.getByRole('button', { name: 'Create and open' }).click();
    await page.getByRole('heading', { level: 1, name }).waitFor();
    await page.getByRole('link', { name: 'Routes', exact: true }).first().click();
    await page.getByRole('link', { name, exact: true }).waitFor();

    // Rename.
    await page.getByRole('button', { name: `Rename ${name}`, exact: true }).click();
    const form = page.getByRole('form', { name: 'Rename route' });
    // Checked as New route checks a name: an empty or overlong name is said under the field,
    // in words, and nothing is sent.
    await form.getByLabel('New name').fill('   ');
    await form.getByRole('button', { name: 'Save name' }).click();
    await form.getByText('Give the route a name.').waitFor();
    await form.getByLabel('New name').fill('x'.repeat(10_000));
    await expect(form.getByText('Give the route a name.').count()).resolves.toBe(0);
    await form.getByRole('button', { name: 'Save name' }).click();
    await form.getByText('Keep the name under 200 characters.').waitFor();
    await expect(form.getByText(/not valid/).count()).resolves.toBe(0);
    await shot('routes-02a-rename-refused');
    await expect(page.getByRole('link', { name, exact: true }).count()).resolves.toBe(1);
    await form.getByLabel('New name').fill(renamed);
    await shot('routes-02-rename');
    await form.getByRole('button', { name: 'Save name' }).click();
    await page.getByRole('link', { name: renamed, exact: true }).waitFor();
    await expect(page.getByRole('link', { name, exact: true }).count()).resolves.toBe(0);

    // Duplicate: a second route appears beside the first.
    await page.getByRole('button', { name: `Duplicate ${renamed}`, exact: true }).click();
    await page.getByRole('status').filter({ hasText: 'Duplicated as' }).waitFor();
    await expect.poll(() => page.getByRole('link', { name: new RegExp(renamed) }).count()).toBe(2);

    // Search (done by the server) narrows the table to the matching routes.
    await page.getByLabel('Search routes').fill(suffix);
    await expect
      .poll(() => page.getByRole('link', { name: DEMO_ROUTE_NAME, exact: true }).count())
      .toBe(0);
    await expect.poll(() => page.getByRole('link', { name: new RegExp(renamed) }).count()).toBe(2);
    await page.getByLabel('Search routes').fill('');
    await page.getByRole('link', { name: DEMO_ROUTE_NAME, exact: true }).waitFor();

    // Sorting by name asks the server for that order.
    await page.getByRole('button', { name: /^Route/ }).click();
    await expect
      .poll(() => page.getByRole('columnheader', { name: /^Route/ }).getAttribute('aria-sort'))
      .toBe('ascending');
    await page.getByRole('link', { name: DEMO_ROUTE_NAME, exact: true }).waitFor();

    // Archive: gone from the current routes, found under "Archived", where it can be restored.
    await page.getByRole('button', { name: `Archive ${renamed}`, exact: true }).click();
    await page.getByRole('status').filter({ hasText: 'archived' }).waitFor();
    await expect.poll(() => page.getByRole('link', { name: renamed, exact: true }).count()).toBe(0);
    await page.getByRole('button', { name: 'Archived' }).click();
    const archivedRow = page
      .getByRole('row')
      .filter({ has: page.getByRole('link', { name: renamed, exact: true }) });
    await archivedRow.waitFor();
    await expect(
      archivedRow.getByRole('cell', { name: 'Archived', exact: true }).isVisible(),
    ).resolves.toBe(true);
    await expect(
      page.getByRole('link', { name: DEMO_ROUTE_NAME, exact: true }).count(),
    ).resolves.toBe(0);
    await shot('routes-03-archived');
    expect(flows.browser.problems).toEqual([]);
  });

  it('shows the reviewer the routes read-only', async () => {
    const { page, shot } = flows.browser;
    await signInAs('reviewer@example.com');
    await page.getByRole('link', { name: DEMO_ROUTE_NAME, exact: true }).waitFor();
    await expect(page.getByRole('button', { name: 'New route' }).count()).resolves.toBe(0);
    await expect(
      page.getByRole('button', { name: /^(Rename|Duplicate|Archive) / }).count(),
    ).resolves.toBe(0);
    await shot('routes-04-reviewer');

    // The editor opens the route read-only, too.
    await page.getByRole('link', { name: DEMO_ROUTE_NAME, exact: true }).click();
    await page.getByRole('heading', { level: 1, name: DEMO_ROUTE_NAME }).waitFor();
    await page.getByText('Read only — you can look but not change this route').waitFor();
    // Nothing offers a change: no step list to add from, a greyed-out settings form, no tidy-up.
    await expect(page.getByRole('navigation', { name: 'Add a step' }).count()).resolves.toBe(0);
    await expect(page.getByRole('button', { name: 'Tidy layout' }).isDisabled()).resolves.toBe(
      true,
    );
    await page.locator('.react-flow__node').first().click();
    await expect(page.getByLabel('Step name').isEditable()).resolves.toBe(false);
    // And looks it: sunken, not the raised white of a field that takes typing, no edit cursor.
    const look = await page.getByLabel('Step name').evaluate((el) => {
      const probe = document.createElement('input');
      probe.className = el.className;
      document.body.append(probe);
      const editable = getComputedStyle(probe).backgroundColor;
      probe.remove();
      const style = getComputedStyle(el);
      return { background: style.backgroundColor, editable, cursor: style.cursor };
    });
    expect(look.background).not.toBe(look.editable);
    expect(look.cursor).toBe('not-allowed');
    // A keyboard edit is refused with a plain note, and the route keeps its steps.
    const steps = await page.locator('.react-flow__node').count();
    await page.keyboard.press('Delete');
    await expect(page.locator('.react-flow__node').count()).resolves.toBe(steps);
    await shot('routes-05-reviewer-editor');
    expect(flows.browser.problems).toEqual([]);
  });

  it('answers a route that is not there with where to go, not “Try again”', async () => {
    const { page, shot } = flows.browser;
    await signInAs('chemist@example.com');
    const demo = page.getByRole('link', { name: DEMO_ROUTE_NAME, exact: true });
    const href = (await demo.getAttribute('href'))!;
    // The same workspace, a route id that names nothing.
    await page.goto(
      base + href.replace(/routes\/[^/]+$/, 'routes/00000000-0000-4000-8000-000000000000'),
    );
    const notice = page.getByRole('alert').filter({ hasText: 'The route was not found' });
    await notice.waitFor();
    await expect(notice.innerText()).resolves.toMatch(/mistyped|workspace/);
    await expect(notice.getByRole('button', { name: 'Try again' }).count()).resolves.toBe(0);
    await shot('routes-06-route-not-found');
    await notice.getByRole('link', { name: 'Go to your routes' }).click();
    await page.getByRole('heading', { level: 1, name: 'Routes' }).waitFor();
    // The browser logs the 404 of the missing route; that answer is the point of this flow.
    expect(flows.browser.problems.filter((p) => !/status of 404/.test(p))).toEqual([]);
  });
});
