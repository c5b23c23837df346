import { describe, expect, it } from 'vitest';
import { Equipment } from '../../server/models';
import { DEMO_PASSWORD } from '../../seeders/data/demo-accounts';
import { useBrowserFlows } from './browser';

const flows = await useBrowserFlows({ profile: 'per-file' });
const { base } = flows;

describe('equipment', () => {
  it('the demo engineer sees the invented vessels, adds one with a mistake the form names, fixes it, edits and deletes it', async () => {
    const { page, shot, problems } = flows.browser;
    await page.goto(base + '/');
    await page.getByLabel('E-mail').fill('engineer@example.com');
    await page.getByLabel('Password').fill(DEMO_PASSWORD);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page
      .getByRole('navigation', { name: 'Main' })
      .getByRole('link', { name: 'Equipment' })
      .click();
    await page.getByRole('heading', { level: 1, name: 'Equipment' }).waitFor();
    await page.getByRole('cell', { name: 'R-101 (invented)', exact: true }).waitFor();
    await page
      .getByRole('cell', { name: 'F-301 Nutsche filter (invented)', exact: true })
      .waitFor();
    await shot('equipment-01-table');

    await page.getByRole('button', { name: 'Add equipment' }).first().click();
    const form = page.getByRole('form', { name: 'Add equipment' });
    await form.getByLabel('Name').fill('R-999 (test)');
    await form.getByLabel('Nominal volume (L)').fill('250');
    await form.getByLabel('Minimum stirrable volume (L)').fill('240');
    await form.getByLabel('Maximum working volume (L)').fill('220');
    await form.getByLabel('Lowest temperature (°C)').fill('-10');
    await form.getByLabel('Highest temperature (°C)').fill('130');
    await form.getByLabel('Lowest pressure (mbar)').fill('30');
    await form.getByLabel('Highest pressure (mbar)').fill('3000');
    await form.getByLabel('Material of construction').fill('Glass-lined steel');
    await form.getByRole('button', { name: 'Add the vessel' }).click();
    await form
      .getByText('The minimum stirrable volume must be below the maximum working volume.')
      .waitFor();
    await shot('equipment-02-mistake');
    await form.getByLabel('Minimum stirrable volume (L)').fill('25');
    await form.getByRole('button', { name: 'Add the vessel' }).click();
    await page.getByRole('status').filter({ hasText: 'R-999 (test) added.' }).waitFor();
    const row = page.getByRole('row').filter({ hasText: 'R-999 (test)' });
    await expect(row.innerText()).resolves.toMatch(/25 L – 220 L/);

    await row.getByRole('button', { name: 'Edit R-999 (test)' }).click();
    const edit = page.getByRole('form', { name: 'Equipment R-999 (test)' });
    await edit.getByLabel('Maximum working volume (L)').fill('230');
    await edit.getByRole('button', { name: 'Save changes' }).click();
    await page.getByRole('status').filter({ hasText: 'R-999 (test) saved.' }).waitFor();
    await expect(row.innerText()).resolves.toMatch(/25 L – 230 L/);
    expect((await Equipment.findOne({ where: { name: 'R-999 (test)' } }))?.maxWorkingL).toBe(230);

    await row.getByRole('button', { name: 'Edit R-999 (test)' }).click();
    await page.getByRole('button', { name: 'Delete' }).click();
    await page.getByRole('dialog').getByRole('button', { name: 'Delete' }).click();
    await page.getByRole('status').filter({ hasText: 'R-999 (test) deleted.' }).waitFor();
    expect(await Equipment.count({ where: { name: 'R-999 (test)' } })).toBe(0);
    expect(problems).toEqual([]);
  });
});
