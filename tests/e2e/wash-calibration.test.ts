import { describe, expect, it } from 'vitest';
import { DEMO_PASSWORD } from '../../seeders/data/demo-accounts';
import { DEMO_PEAKS, gaussianCsv, type GaussianPeak } from '../support/chromatograms';
import { useBrowserFlows } from './browser';
import { demoRouteCopy } from './demo-copy';

const flows = await useBrowserFlows({ profile: 'per-flow', lastShot: 'wash-calibration-last' });
const { base } = flows;

// Before the base wash (after the acid wash): the same impurity and product, five times the acid.
const BEFORE: GaussianPeak[] = [DEMO_PEAKS[0], DEMO_PEAKS[1], { ...DEMO_PEAKS[2], h: 40 }];

describe('a distribution ratio from the levels before and after a wash', () => {
  it('back-calculates D of the acid across the base wash and keeps it as measured data of the route', async () => {
    const { page, shot, problems } = flows.browser;
    // Its own copy: the measured D is saved into the route, which other files read as seeded.
    const route = await demoRouteCopy('wash calibration');
    await page.goto(base + '/sign-in');
    await page.getByLabel('E-mail').fill('chemist@example.com');
    await page.getByLabel('Password').fill(DEMO_PASSWORD);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.getByRole('link', { name: route, exact: true }).click();
    await page.getByRole('heading', { level: 1, name: route }).waitFor();
    await page.locator('[data-total="yield"]').filter({ hasText: /\d/ }).waitFor();
    await page.getByRole('button', { name: 'Fit view', exact: true }).first().click();

    const upload = async (step: RegExp, name: string, peaks: GaussianPeak[]) => {
      await page.getByRole('article', { name: step }).click();
      const samples = page.getByRole('region', { name: /IPC samples/ });
      const add = samples.getByRole('button', { name: 'Add sample' });
      if (await add.isVisible()) await add.click();
      await samples.getByLabel('Chromatogram or document').setInputFiles({
        name: `${name}.csv`,
        mimeType: 'text/csv',
        buffer: Buffer.from(gaussianCsv({ peaks })),
      });
      await samples.getByLabel('Sample name').fill(name);
      await samples.getByRole('button', { name: 'Upload sample' }).click();
      const viewer = page.getByRole('dialog', { name });
      await viewer.getByRole('table', { name: /Peak table/ }).waitFor();
      return viewer;
    };
    const assign = async (
      viewer: ReturnType<typeof page.getByRole>,
      peak: number,
      label: string,
    ) => {
      const select = viewer.getByLabel(new RegExp(`^Compound of peak ${peak} `));
      await expect.poll(() => select.isEnabled()).toBe(true);
      await select.selectOption({ label });
      await expect
        .poll(async () => (await select.locator('option:checked').textContent()) ?? '')
        .toBe(label);
    };

    // Before: at the acid wash, every peak assigned by hand.
    // Names of this flow's own: other test files may leave samples on the demo route's washes.
    const before = await upload(/^Wash: 1 M HCl wash/, 'Calibration, before base wash', BEFORE);
    await assign(before, 1, 'Des-chloro amide (invented)');
    await assign(before, 2, 'PW-417 amide (invented)');
    await assign(before, 3, 'PW-417 acid (invented)');
    await before.getByRole('button', { name: 'Close' }).click();

    // After: at the base wash; the peaks are assigned by their retention times.
    const after = await upload(
      /^Wash: 8 % NaHCO3 wash/,
      'Calibration, after base wash',
      DEMO_PEAKS,
    );
    await expect
      .poll(() =>
        after
          .getByLabel(/^Compound of peak 3 /)
          .locator('option:checked')
          .textContent(),
      )
      .toBe('PW-417 acid (invented)');
    await after.getByRole('button', { name: 'Close' }).click();

    const samples = page.getByRole('region', { name: /IPC samples/ });
    await samples.getByText('Distribution ratio from this wash').click();
    // Each list offers every assigned sample of the steps concerned; choose this flow's by name.
    const choose = async (list: string, name: string) => {
      const select = samples.getByLabel(list);
      const options = await select
        .locator('option')
        .evaluateAll((all) =>
          all.map((o) => ({ value: (o as HTMLOptionElement).value, text: o.textContent ?? '' })),
        );
      const option = options.find((o) => o.text.startsWith(name));
      expect(option, `${list}: ${name}`).toBeDefined();
      await select.selectOption(option!.value);
    };
    await choose('Before the wash', 'Calibration, before base wash');
    await choose('After the wash', 'Calibration, after base wash');
    await expect(
      samples.getByLabel('Before the wash').locator('option:checked').textContent(),
    ).resolves.toMatch(/^Calibration, before base wash/);
    await samples.getByLabel('Compound').selectOption({ label: 'PW-417 acid (invented)' });
    const d = Number(await samples.locator('[data-d]').textContent());
    // A fifth of the acid stays (ratio to the product): D = (f/(1 − f))·(V_aq/V_org) with f ≈ 0.2.
    expect(d).toBeGreaterThan(0);
    expect(d).toBeLessThan(1);
    await shot('wash-calibration-01');
    await samples.getByRole('button', { name: /^Save D = .* as measured for PW-417 acid/ }).click();
    await samples.getByRole('status').filter({ hasText: 'marked as measured' }).waitFor();

    // The draft keeps it as a measured partition point of the acid, and saves it.
    await page.getByText(/^Draft saved/).waitFor();
    await expect
      .poll(async () => {
        const routeId = /routes\/([0-9a-f-]{36})/.exec(page.url())?.[1];
        const workspaceId = /\/w\/([0-9a-f-]{36})/.exec(page.url())?.[1];
        const reply = await page.evaluate(
          (url) => fetch(url).then((r) => r.json()),
          `/api/v1/workspaces/${workspaceId}/routes/${routeId}`,
        );
        const acid = reply.draft.document.components.find(
          (c: { id?: string }) => c.id === 'pw417-acid',
        );
        return (acid.partition ?? []).some((p: { source?: string }) =>
          /back-calculated from IPC samples/.test(p.source ?? ''),
        );
      })
      .toBe(true);
    expect(problems).toEqual([]);
  });
});
