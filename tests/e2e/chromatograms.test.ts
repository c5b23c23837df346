import { describe, expect, it } from 'vitest';
import { DEMO_ROUTE_NAME } from '../../seeders/20261203000000-demo-route';
import { DEMO_PASSWORD } from '../../seeders/data/demo-accounts';
import { DEMO_PEAKS, gaussianCsv, gaussianPeakArea } from '../support/chromatograms';
import { useBrowserFlows } from './browser';

const flows = await useBrowserFlows({ profile: 'per-flow', lastShot: 'chromatograms-last' });
const { base } = flows;

const number = (text: string | null) => Number(/-?[\d.]+/.exec(text ?? '')?.[0] ?? NaN);

describe('IPC chromatograms on a step', () => {
  it('the demo chemist attaches a CSV chromatogram to the base wash, sees it integrated, assigns the impurity and sees measured beside predicted', async () => {
    const { page, shot, problems } = flows.browser;
    await page.goto(base + '/sign-in');
    await page.getByLabel('E-mail').fill('chemist@example.com');
    await page.getByLabel('Password').fill(DEMO_PASSWORD);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.getByRole('link', { name: DEMO_ROUTE_NAME, exact: true }).click();
    await page.getByRole('heading', { level: 1, name: DEMO_ROUTE_NAME }).waitFor();
    await page.locator('[data-total="yield"]').filter({ hasText: /\d/ }).waitFor();

    // The base wash and its list of samples: empty on a fresh seed, or holding the
    // wash calibration's samples when that browser test ran first on the same database.
    await page.getByRole('button', { name: 'Fit view', exact: true }).first().click();
    await page.getByRole('article', { name: /^Wash: 8 % NaHCO3 wash/ }).click();
    const samples = page.getByRole('region', { name: /IPC samples/ });
    const addSample = samples.getByRole('button', { name: 'Add sample' });
    await samples.getByText('No samples at this step yet.').or(addSample).waitFor();
    if (await addSample.isVisible()) await addSample.click();

    // A chromatogram made here: three Gaussian peaks (invented), the first the des-chloro impurity.
    const csv = gaussianCsv({ peaks: DEMO_PEAKS });
    await samples.getByLabel('Chromatogram or document').setInputFiles({
      name: 'ipc-after-base-wash.csv',
      mimeType: 'text/csv',
      buffer: Buffer.from(csv),
    });
    await samples.getByLabel('Sample name').fill('Organic layer after base wash');
    await samples.getByRole('button', { name: 'Upload sample' }).click();

    // The sample opens large: the plot and the peak table with three integrated peaks.
    const viewer = page.getByRole('dialog', { name: 'Organic layer after base wash' });
    await viewer
      .getByRole('img', { name: /Chromatogram of Organic layer after base wash/ })
      .waitFor();
    const rows = viewer.getByRole('table', { name: /Peak table/ }).locator('tbody tr');
    await expect.poll(() => rows.count()).toBe(3);
    const total = DEMO_PEAKS.reduce((s, p) => s + gaussianPeakArea(p), 0);
    const impurityPct = (100 * gaussianPeakArea(DEMO_PEAKS[0])) / total;
    const shown = number(await rows.nth(0).locator('[data-area-pct]').textContent());
    expect(Math.abs(shown - impurityPct)).toBeLessThan(0.05);
    await viewer.locator('canvas').first().waitFor();
    await shot('chromatograms-01-integrated');

    // Assign the impurity peak; its measured level appears beside the predicted one.
    await viewer
      .getByLabel(/Compound of peak 1 at 2\.50/)
      .selectOption({ label: 'Des-chloro amide (invented)' });
    const levels = viewer.getByRole('table', { name: /Measured and predicted levels/ });
    const row = levels.locator('tr[data-component="deschloro-amide"]');
    await row.waitFor();
    expect(
      Math.abs(number(await row.locator('[data-measured]').textContent()) - impurityPct),
    ).toBeLessThan(0.05);
    await expect
      .poll(async () => number(await row.locator('[data-predicted]').textContent()))
      .toBeGreaterThan(0);
    await shot('chromatograms-02-assigned');

    // Zoom from the keyboard, then close: the step shows the latest sample's levels.
    await viewer.getByRole('img', { name: /Chromatogram of/ }).press('+');
    await viewer.getByRole('button', { name: 'Close' }).click();
    const stepLevels = samples.getByRole('table', { name: /Measured and predicted levels at/ });
    await stepLevels.locator('tr[data-component="deschloro-amide"]').waitFor();
    await shot('chromatograms-03-step');
    expect(problems).toEqual([]);
  });
});
