import { describe, expect, it } from 'vitest';
import { DEMO_ROUTE_NAME } from '../../seeders/20261203000000-demo-route';
import { DEMO_PASSWORD } from '../../seeders/data/demo-accounts';
import { useBrowserFlows } from './browser';

const flows = await useBrowserFlows({ profile: 'per-file', lastShot: 'editor-header-last' });

/** Number of text lines an element takes (its height over its line height). */
const linesOf = (selector: string) =>
  flows.browser.page.locator(selector).evaluateAll((els) =>
    els.map((e) => {
      const style = getComputedStyle(e);
      const line = parseFloat(style.lineHeight) || parseFloat(style.fontSize) * 1.5;
      return Math.round(e.getBoundingClientRect().height / line);
    }),
  );

describe('the editor header at 1280 × 800', () => {
  it('keeps the route name, project and save state on one line each, with the full text as a tooltip, and the limit badges unwrapped', async () => {
    const { page, shot } = flows.browser;
    await page.goto(flows.base + '/sign-in');
    await page.getByLabel('E-mail').fill('chemist@example.com');
    await page.getByLabel('Password').fill(DEMO_PASSWORD);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.getByRole('heading', { level: 1, name: 'Routes' }).waitFor();
    await page.getByRole('link', { name: DEMO_ROUTE_NAME, exact: true }).click();
    const heading = page.getByRole('heading', { level: 1, name: DEMO_ROUTE_NAME });
    await heading.waitFor();
    await expect(heading.getAttribute('title')).resolves.toBe(DEMO_ROUTE_NAME);
    await page.locator('[data-limit]').first().waitFor();
    // The longest save state a chemist sees while editing.
    await page
      .locator('[data-save-state]')
      .evaluate((e) => (e.textContent = 'Not saved yet — kept on this computer (offline)'));
    await shot('editor-header');
    await expect(linesOf('header h1')).resolves.toEqual([1]);
    await expect(linesOf('[data-save-state]')).resolves.toEqual([1]);
    const badges = await linesOf('[data-limit]');
    expect(badges.length).toBeGreaterThan(0);
    expect(badges.every((n) => n === 1)).toBe(true);
  }, 120_000);
});
