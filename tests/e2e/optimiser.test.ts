import { describe, expect, it } from 'vitest';
import { DEMO_ROUTE_NAME } from '../../seeders/20261203000000-demo-route';
import { DEMO_PASSWORD } from '../../seeders/data/demo-accounts';
import { useBrowserFlows } from './browser';

const flows = await useBrowserFlows({ profile: 'per-flow', lastShot: 'optimiser-last' });
const { base } = flows;

describe('optimising the demo route', () => {
  it('frees washes, swap cycles and antisolvent, finds the least PMI at ≥ 99.5 % purity and opens it as a copy', async () => {
    const { page, shot, problems } = flows.browser;
    await page.setViewportSize({ width: 1280, height: 800 });
    await page.goto(base + '/sign-in');
    await page.getByLabel('E-mail').fill('chemist@example.com');
    await page.getByLabel('Password').fill(DEMO_PASSWORD);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.getByRole('link', { name: DEMO_ROUTE_NAME, exact: true }).click();
    await page.getByRole('heading', { level: 1, name: DEMO_ROUTE_NAME }).waitFor();
    const originalUrl = page.url();

    await page.getByRole('button', { name: 'Optimise', exact: true }).click();
    await page.getByRole('heading', { level: 1, name: `Optimise ${DEMO_ROUTE_NAME}` }).waitFor();

    // An empty run is refused beside the field, in words, not paths.
    await page.getByRole('button', { name: 'Start optimising' }).click();
    await page
      .getByText('Free at least one parameter for the optimiser to vary.')
      .first()
      .waitFor();

    const free = async (step: RegExp, param: RegExp) => {
      const stepSelect = page.getByLabel('Step', { exact: true });
      const stepValue = await stepSelect
        .locator('option')
        .filter({ hasText: step })
        .first()
        .getAttribute('value');
      await stepSelect.selectOption(stepValue!);
      const paramSelect = page.getByLabel('Parameter', { exact: true });
      const paramValue = await paramSelect
        .locator('option')
        .filter({ hasText: param })
        .first()
        .getAttribute('value');
      await paramSelect.selectOption(paramValue!);
      await page.getByRole('button', { name: 'Free this parameter' }).click();
    };
    await free(/HCl wash/, /^wash volume/);
    await free(/NaHCO3 wash/, /^wash volume/);
    await free(/brine wash/, /^wash volume/);
    await free(/Solvent swap/, /^put-and-take cycles/);
    await free(/antisolvent/i, /^antisolvent volume/);
    const table = page.getByRole('table', { name: 'Free parameters' });
    expect(await table.locator('tbody tr').count()).toBe(5);
    await expect
      .poll(async () => (await table.textContent()) ?? '')
      .toMatch(/put-and-take cycles of Solvent swap to 2-propanol · whole number/);

    // A bound outside what the field accepts is named on its field.
    const from = page.getByLabel(/^From: wash volume of 1 M HCl wash/);
    await from.fill('-3');
    await page.getByRole('button', { name: 'Start optimising' }).click();
    await table.getByText(/lower bound -3 is outside what the wash volume of step/).waitFor();
    expect(await from.getAttribute('aria-invalid')).toBe('true');
    await from.fill('1');

    await page.getByLabel('Objective', { exact: true }).selectOption('pmi');
    await page.getByLabel('Least solvent-free purity (%)').fill('99.5');
    await page.getByLabel('Seed', { exact: true }).fill('7');
    await page.getByLabel('Evaluations', { exact: true }).fill('30');
    await page.getByRole('button', { name: 'Start optimising' }).click();

    // Progress is shown while it runs, brought into view (it sits below the form), then the picture.
    await page.getByRole('progressbar', { name: 'Optimisation progress' }).waitFor();
    await expect
      .poll(async () => {
        const box = await page
          .getByRole('progressbar', { name: 'Optimisation progress' })
          .boundingBox();
        return box !== null && box.y >= 0 && box.y + box.height <= 800;
      })
      .toBe(true);
    const result = page.getByTestId('optimiser-result');
    await result.waitFor({ timeout: 180_000 });
    await expect
      .poll(() =>
        page
          .getByRole('progressbar', { name: 'Optimisation progress' })
          .getAttribute('data-status'),
      )
      .toBe('done');
    const chart = page.getByTestId('trade-off-chart');
    await chart.locator('svg').waitFor();
    expect(await chart.getAttribute('aria-label')).toMatch(
      /^Trade-off of PMI against .*: 3\d candidates/,
    );
    await expect.poll(() => chart.locator('svg path').count()).toBeGreaterThan(20);
    await expect
      .poll(async () => (await result.textContent()) ?? '')
      .toMatch(/Best route found: PMI \d/);
    const chosen = page.getByRole('table', { name: 'Chosen parameters' });
    expect(await chosen.locator('tbody tr').count()).toBe(5);
    const cycles = chosen.locator('tbody tr', { hasText: 'put-and-take cycles' }).locator('td');
    expect(await cycles.last().textContent()).toMatch(/^\d+$/); // a whole number of cycles
    expect(await page.getByTestId('optimiser-uncertainty').textContent()).toMatch(
      /Spread over \d+ seeded draws/,
    );
    expect(await result.textContent()).toMatch(
      /bench and through the site’s process-safety review/,
    );
    // Purity is written as the totals card writes it: never "100.00" for a solid with impurities.
    const figures = page.getByRole('table', { name: /Figures/ });
    expect(await figures.textContent()).not.toMatch(/100\.00/);
    await page.evaluate(() =>
      document.getElementById('optimiser-run')?.scrollIntoView({ block: 'start' }),
    );
    await shot('optimiser-result');
    // Yield against PMI: the same candidates, the other trade-off.
    await result.getByLabel('Plot against').selectOption('yieldPct');
    await expect
      .poll(() => chart.getAttribute('aria-label'))
      .toMatch(/^Trade-off of PMI against yield/);
    await shot('optimiser-yield');

    // Open the best as a copy: a new route opens; the original is not changed.
    const originalDraft = await page.evaluate(async (url) => {
      const m = /\/w\/([^/]+)\/routes\/([^/]+)/.exec(new URL(url).pathname)!;
      const r = await fetch(`/api/v1/workspaces/${m[1]}/routes/${m[2]}`);
      return (await r.json()) as { draft: { version: number; document: unknown } };
    }, originalUrl);
    await page.getByRole('button', { name: 'Open as a copy' }).click();
    await page
      .getByRole('heading', { level: 1, name: `${DEMO_ROUTE_NAME} — optimised for least PMI` })
      .waitFor({ timeout: 60_000 });
    expect(page.url()).not.toBe(originalUrl);
    const copyUrl = page.url();
    const [copy, original] = await page.evaluate(
      async ([a, b]) =>
        Promise.all(
          [a, b].map(async (url) => {
            const m = /\/w\/([^/]+)\/routes\/([^/]+)/.exec(new URL(url).pathname)!;
            const r = await fetch(`/api/v1/workspaces/${m[1]}/routes/${m[2]}`);
            return (await r.json()) as {
              id: string;
              draft: { version: number; document: { steps: { id: string; params: unknown }[] } };
            };
          }),
        ),
      [copyUrl, originalUrl] as const,
    );
    expect(copy.id).not.toBe(original.id);
    // The original's draft is exactly as it was; the copy carries the chosen volumes.
    expect(original.draft).toEqual(originalDraft.draft);
    const antisolvent = (d: typeof copy) =>
      JSON.stringify(d.draft.document.steps.find((s) => s.id === 'antisolvent')?.params);
    const washes = (d: typeof copy) =>
      ['acid-wash', 'base-wash', 'brine-wash', 'swap']
        .map((id) => JSON.stringify(d.draft.document.steps.find((s) => s.id === id)?.params))
        .join();
    expect(washes(copy) + antisolvent(copy)).not.toBe(washes(original) + antisolvent(original));
    expect(problems).toEqual([]);
  });

  it('says "No feasible route" with the closest candidate and what it misses, in words', async () => {
    const { page, problems } = flows.browser;
    await page.goto(base + '/sign-in');
    await page.getByLabel('E-mail').fill('chemist@example.com');
    await page.getByLabel('Password').fill(DEMO_PASSWORD);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.getByRole('link', { name: DEMO_ROUTE_NAME, exact: true }).click();
    await page.getByRole('heading', { level: 1, name: DEMO_ROUTE_NAME }).waitFor();
    await page.getByRole('button', { name: 'Optimise', exact: true }).click();
    await page.getByRole('heading', { level: 1, name: `Optimise ${DEMO_ROUTE_NAME}` }).waitFor();

    // Keyboard only: choose the antisolvent step and free its volume.
    const step = page.getByLabel('Step', { exact: true });
    const value = await step
      .locator('option')
      .filter({ hasText: /antisolvent/i })
      .first()
      .getAttribute('value');
    await step.selectOption(value!);
    await page.getByLabel('Parameter', { exact: true }).selectOption('mode.volume');
    await page.getByRole('button', { name: 'Free this parameter' }).focus();
    await page.keyboard.press('Enter');
    await page.getByRole('table', { name: 'Free parameters' }).waitFor();
    // No route of this one keeps 99.9 % of the product in the solid.
    await page.getByLabel('Least yield (%)').fill('99.9');
    await page.getByLabel('Evaluations', { exact: true }).fill('10');
    await page.getByRole('button', { name: 'Start optimising' }).focus();
    await page.keyboard.press('Enter');

    const alert = page.getByRole('alert').filter({ hasText: 'No feasible route' });
    await alert.waitFor({ timeout: 180_000 });
    expect(await alert.textContent()).toMatch(
      /Yield \d+(\.\d)? % is below the 99\.9 % asked for\./,
    );
    expect(await alert.textContent()).not.toMatch(/constraints\.|minYieldPct/);
    await page.getByRole('heading', { name: 'Closest candidate' }).waitFor();
    expect(
      await page.getByRole('table', { name: 'Chosen parameters' }).locator('tbody tr').count(),
    ).toBe(1);
    await page.getByTestId('trade-off-chart').locator('svg').waitFor();
    expect(problems).toEqual([]);
  });
});
