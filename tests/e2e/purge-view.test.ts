import { describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { DEMO_ROUTE_NAME } from '../../seeders/20261203000000-demo-route';
import { DEMO_PASSWORD } from '../../seeders/data/demo-accounts';
import { useBrowserFlows } from './browser';

const flows = await useBrowserFlows({ profile: 'per-flow', lastShot: 'purge-view-last' });
const { base } = flows;

describe('purity and purge as a chemist reads them', () => {
  it('the demo chemist sees the solvent-free purity, each impurity against its limit, and which step removed each', async () => {
    const { page, shot } = flows.browser;
    await page.goto(base + '/sign-in');
    await page.getByLabel('E-mail').fill('chemist@example.com');
    await page.getByLabel('Password').fill(DEMO_PASSWORD);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.getByRole('link', { name: DEMO_ROUTE_NAME, exact: true }).click();
    await page.getByRole('heading', { level: 1, name: DEMO_ROUTE_NAME }).waitFor();

    // Totals: the solvent-free purity beside the assay, and each impurity against its limit.
    const solventFree = page.locator('[data-total="solvent-free-purity"]');
    await solventFree.filter({ hasText: /\d/ }).waitFor();
    const assay = Number(await page.locator('[data-total="purity"]').getAttribute('data-value'));
    expect(Number(await solventFree.getAttribute('data-value'))).toBeGreaterThan(assay);
    const chips = page.getByRole('list', { name: 'Impurities against their limits' });
    await expect(chips.getByRole('listitem').count()).resolves.toBe(4);
    await expect(chips.locator('[data-limit="pass"]').count()).resolves.toBe(4);
    // The isolating step's card says it too.
    await page
      .locator('[data-isolation-purity]')
      .getByText(/4 within limits/)
      .waitFor();
    await shot('purge-01-totals');

    // The Purge tab: the step that removed each impurity, and the full purge view.
    await page.getByRole('tab', { name: 'Purge' }).click();
    const table = page.getByRole('table', { name: 'Impurities in the isolated solid' });
    const mainStep = (id: string) =>
      table.locator(`[data-impurity="${id}"] [data-main-step]`).textContent();
    await expect(mainStep('pw417-amine')).resolves.toBe('1 M HCl wash (removes the amine)');
    await expect(mainStep('coupling-urea')).resolves.toBe('1 M HCl wash (removes the amine)');
    await expect(mainStep('pw417-acid')).resolves.toBe('8 % NaHCO3 wash (removes the acid)');
    await expect(mainStep('deschloro-amide')).resolves.toBe('Filter, wash with cold heptane');
    await shot('purge-02-tab');

    await page.getByRole('button', { name: 'Open purge view' }).click();
    const view = page.getByRole('dialog', { name: 'Purge view' });
    await view.waitFor();
    const section = view.getByRole('region', { name: 'Coupling-agent urea (invented)' });
    await section
      .locator('[data-main-step]')
      .getByText('1 M HCl wash (removes the amine)')
      .waitFor();
    await section.locator('svg').first().waitFor();
    // One row per impurity per step the product passes (the demo route has nine, or more once edited).
    const stepRows = await view.locator('tbody tr').count();
    expect(stepRows).toBeGreaterThanOrEqual(4 * 9);
    await shot('purge-03-view');

    // Exported as CSV: one row per impurity per step, cells guarded against formula injection.
    const [download] = await Promise.all([
      page.waitForEvent('download'),
      view.getByRole('button', { name: 'Download CSV' }).click(),
    ]);
    const csv = readFileSync((await download.path())!, 'utf8')
      .trim()
      .split('\r\n');
    expect(csv[0]).toBe(
      'impurity,step,in_kg,with_product_kg,step_purge_factor,cumulative_purge_factor',
    );
    expect(csv.length).toBe(1 + stepRows);
    expect(csv.some((l) => l.startsWith('Coupling-agent urea (invented),1 M HCl wash'))).toBe(true);

    await page.keyboard.press('Escape');
    await view.waitFor({ state: 'detached' });
    expect(flows.browser.problems).toEqual([]);
  });
});
