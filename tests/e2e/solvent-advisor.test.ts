import { describe, expect, it } from 'vitest';
import { DEMO_ROUTE_NAME } from '../../seeders/20261203000000-demo-route';
import { DEMO_PASSWORD } from '../../seeders/data/demo-accounts';
import { useBrowserFlows } from './browser';

const flows = await useBrowserFlows({ profile: 'per-flow', lastShot: 'solvent-advisor-last' });
const { base } = flows;

describe('which solvent could replace the swap solvent', () => {
  it('ranks the alternatives with ICH class and guide category, and tries one in a copy of the route', async () => {
    const { page, shot, problems } = flows.browser;
    await page.goto(base + '/sign-in');
    await page.getByLabel('E-mail').fill('chemist@example.com');
    await page.getByLabel('Password').fill(DEMO_PASSWORD);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.getByRole('link', { name: DEMO_ROUTE_NAME, exact: true }).click();
    await page.getByRole('heading', { level: 1, name: DEMO_ROUTE_NAME }).waitFor();
    await page.locator('[data-total="yield"]').filter({ hasText: /\d/ }).waitFor();
    await page.getByRole('button', { name: 'Fit view', exact: true }).first().click();
    const originalUrl = page.url();

    await page.getByRole('article', { name: /^Distillation: Solvent swap to 2-propanol/ }).click();
    const advisor = page.getByRole('region', { name: 'Solvent alternatives' });
    await advisor.getByLabel('Solvent to replace').selectOption('swap-target');
    await advisor.getByRole('button', { name: 'Suggest alternatives' }).click();
    const list = advisor.getByRole('list', { name: 'Ranked alternatives' });
    await list.waitFor({ timeout: 120_000 });
    await shot('solvent-advisor-list');

    expect(await list.locator(':scope > li').count()).toBeGreaterThan(10);
    // The current swap solvent is not offered; every line shows its ICH class and guide category.
    await expect
      .poll(() => list.getByRole('listitem', { name: '2-Propanol', exact: true }).count())
      .toBe(0);
    const first = list.locator(':scope > li').first();
    const firstText = (await first.textContent()) ?? '';
    expect(firstText).toMatch(/ICH class \d|No ICH Q3C class/);
    expect(firstText).toMatch(
      /Guide: (Recommended|Problematic|Hazardous|Highly hazardous|not in the guide)/,
    );
    expect(firstText).toMatch(/PMI \d/);
    // Every evaluated line, down to the last, shows the spread of its figures.
    const lines = list.locator(':scope > li');
    const n = await lines.count();
    for (const i of [0, Math.floor(n / 2), n - 1]) {
      const text = (await lines.nth(i).textContent()) ?? '';
      if (/cannot be evaluated/.test(text)) continue;
      expect(text).toMatch(/Spread p5–p95: PMI [\d.]+(–[\d.]+)?, yield/);
    }
    await first.getByText(/^Cautions/).click();
    await expect
      .poll(async () => (await first.textContent()) ?? '')
      .toMatch(/model result.*bench.*process-safety review/i);

    // Try the first one in a copy: a new route opens; the original keeps 2-propanol.
    const firstName = (await first.getAttribute('aria-label'))!;
    await first.getByRole('button', { name: `Try ${firstName} in a copy` }).click();
    await page
      .getByRole('heading', { level: 1, name: new RegExp(`${firstName} as swap solvent`) })
      .waitFor({ timeout: 60_000 });
    expect(page.url()).not.toBe(originalUrl);
    await page.getByRole('button', { name: 'Fit view', exact: true }).first().click();
    await page.getByRole('article', { name: /^Distillation: Solvent swap to 2-propanol/ }).click();
    const swapIn = async () =>
      (await page
        .getByRole('region', { name: 'Solvent alternatives' })
        .getByLabel('Solvent to replace')
        .locator('option[value="swap-target"]')
        .textContent()) ?? '';
    // The copy swaps to the substitute...
    await expect.poll(swapIn).toMatch(/^swap solvent \(/);
    expect(await swapIn()).not.toContain('2-propanol');
    await shot('solvent-advisor-copy');

    await page.goto(originalUrl);
    await page.getByRole('heading', { level: 1, name: DEMO_ROUTE_NAME }).waitFor();
    await page.getByRole('button', { name: 'Fit view', exact: true }).first().click();
    await page.getByRole('article', { name: /^Distillation: Solvent swap to 2-propanol/ }).click();
    const original = page.getByRole('region', { name: 'Solvent alternatives' });
    // ...and the original still swaps to 2-propanol.
    await original.waitFor();
    await expect.poll(swapIn).toBe('swap solvent (2-propanol)');
    expect(problems).toEqual([]);
  });
});
