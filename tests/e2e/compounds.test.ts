import { describe, expect, it } from 'vitest';
import { Compound } from '../../server/models';
import { DEMO_PASSWORD } from '../../seeders/data/demo-accounts';
import { useBrowserFlows } from './browser';

const flows = await useBrowserFlows({ profile: 'per-file' });
const { base } = flows;

describe('compounds', () => {
  it('the demo chemist adds a compound from a SMILES, sees its structure, groups and estimates, saves it and finds it in the table', async () => {
    const { page, shot, problems } = flows.browser;
    await page.goto(base + '/');
    await page.getByLabel('E-mail').fill('chemist@example.com');
    await page.getByLabel('Password').fill(DEMO_PASSWORD);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page
      .getByRole('navigation', { name: 'Main' })
      .getByRole('link', { name: 'Compounds' })
      .click();
    await page.getByRole('heading', { level: 1, name: 'Compounds' }).waitFor();
    // The seeded, invented demo compounds are listed.
    await page.getByText('PW-417 amide (invented)', { exact: true }).waitFor();
    await shot('compounds-01-table');

    await page.getByRole('button', { name: 'Add a compound' }).first().click();
    const form = page.getByRole('form', { name: 'Add a compound' });
    await form.getByLabel('Name').fill('Propanoic acid impurity (test)');
    await form.getByLabel('Role').selectOption('impurity');

    // A broken SMILES gets a clear message naming the problem.
    await form.getByRole('textbox', { name: 'SMILES' }).fill('COc1ccc(CCC(=O)O)cc');
    await page.getByText('This structure cannot be read').waitFor();
    await expect(
      page.getByRole('alert').filter({ hasText: 'cannot be read' }).innerText(),
    ).resolves.toMatch(/SMILES/);
    await shot('compounds-02-unparsable');

    await form.getByRole('textbox', { name: 'SMILES' }).fill('COc1ccc(CCC(=O)O)cc1');
    await page.getByTestId('preview-formula').filter({ hasText: 'C10H12O3' }).waitFor();
    const preview = page.getByRole('region', { name: 'Structure preview' });
    await expect(preview.getByRole('img', { name: /Structure drawing/ }).isVisible()).resolves.toBe(
      true,
    );
    const groups = preview.getByRole('table', { name: 'UNIFAC groups' });
    await expect(groups.getByRole('cell', { name: 'COOH', exact: true }).isVisible()).resolves.toBe(
      true,
    );
    await expect(groups.getByRole('cell', { name: 'CH3O', exact: true }).isVisible()).resolves.toBe(
      true,
    );
    await expect(preview.getByText('estimate', { exact: true }).first().isVisible()).resolves.toBe(
      true,
    );
    await form.getByLabel('Melting point (°C)').fill('101');
    await form.getByRole('button', { name: 'Add a pKa' }).click();
    await form.getByLabel('pKa 1', { exact: true }).fill('4.6');
    await shot('compounds-03-preview');

    // An out-of-range value is marked on its field by the shared schema before anything is sent.
    await form.getByLabel('ΔHfus (kJ/mol)').fill('-3');
    await form.getByRole('button', { name: 'Save compound' }).click();
    await form.getByText('Must be positive.').waitFor();
    await form.getByText('Some fields need attention').waitFor();
    // The mark under its field in view, for the user guide's picture of it.
    await form.getByLabel('ΔHfus (kJ/mol)').evaluate((e) => e.scrollIntoView({ block: 'center' }));
    await shot('compounds-03b-marked');
    // Each problem goes as soon as its field is fixed, before the next save.
    await form.getByLabel('ΔHfus (kJ/mol)').fill('27');
    await expect.poll(() => form.getByText('Must be positive.').count()).toBe(0);
    await expect.poll(() => form.getByText('Some fields need attention').count()).toBe(0);
    await expect(form.getByLabel('ΔHfus (kJ/mol)').getAttribute('aria-invalid')).resolves.not.toBe(
      'true',
    );
    // A field still wrong keeps its mark while another is fixed.
    await form.getByLabel('Name').fill('');
    await form.getByLabel('Melting point (°C)').fill('9999');
    await form.getByRole('button', { name: 'Save compound' }).click();
    const nameError = form.locator('[id$="-error"]').filter({ hasText: /name/i });
    await nameError.waitFor();
    await form.getByLabel('Name').fill('Propanoic acid impurity (test)');
    await expect.poll(() => nameError.count()).toBe(0);
    await expect(form.getByLabel('Melting point (°C)').getAttribute('aria-invalid')).resolves.toBe(
      'true',
    );
    await form.getByLabel('Melting point (°C)').fill('101');
    await expect
      .poll(() => form.getByLabel('Melting point (°C)').getAttribute('aria-invalid'))
      .not.toBe('true');
    await form.getByRole('button', { name: 'Save compound' }).click();
    await page
      .getByRole('status')
      .filter({ hasText: 'Propanoic acid impurity (test) added.' })
      .waitFor();

    await page.getByLabel('Search compounds').fill('propanoic');
    const row = page.getByRole('row').filter({ hasText: 'Propanoic acid impurity (test)' });
    await row.waitFor();
    await expect(row.innerText()).resolves.toMatch(/C10H12O3/);
    await expect(row.innerText()).resolves.toMatch(/estimate/);
    // The search asks the server after a short pause; other compounds leave the table then.
    await expect
      .poll(() => page.getByRole('row').filter({ hasText: 'PW-417 amide' }).count())
      .toBe(0);
    await shot('compounds-04-saved');

    const stored = await Compound.findOne({ where: { name: 'Propanoic acid impurity (test)' } });
    expect(stored!.formula).toBe('C10H12O3');
    expect(stored!.pKa).toEqual([{ value: 4.6, type: 'acid' }]);
    expect(stored!.logP!.source).toBe('estimated');
    // The unparsable SMILES answered 422 on purpose; the flows.browser logs that fetch.
    expect(problems.filter((p) => !/status of 422/.test(p))).toEqual([]);
  });

  it('the solvent library sorts, searches and shows every value of a solvent with its source', async () => {
    const { page, shot, problems } = flows.browser;
    await page
      .getByRole('navigation', { name: 'Main' })
      .getByRole('link', { name: 'Solvent library' })
      .click();
    await page.getByRole('heading', { level: 1, name: 'Solvent library' }).waitFor();
    await page.getByRole('button', { name: /Tb/ }).click();
    const firstRow = page.getByRole('row').nth(1);
    // Lowest normal boiling point first: diethyl ether (34.6 °C) sorts before dichloromethane (39.6 °C).
    await expect(firstRow.innerText()).resolves.toMatch(/Diethyl ether/i);
    await page.getByLabel(/Search by name/).fill('toluene');
    await page.getByRole('button', { name: 'Toluene', exact: true }).click();
    const drawer = page.getByRole('dialog', { name: 'Toluene' });
    await drawer.getByRole('heading', { name: 'Antoine constants' }).waitFor();
    await expect(drawer.innerText()).resolves.toMatch(/Class 2, 890 ppm/);
    await expect(drawer.innerText()).resolves.toMatch(/Poling|NIST/);
    await shot('solvents-01-drawer');
    await page.keyboard.press('Escape');
    await expect(drawer.count()).resolves.toBe(0);
    // The unparsable SMILES answered 422 on purpose; the flows.browser logs that fetch.
    expect(problems.filter((p) => !/status of 422/.test(p))).toEqual([]);
  });
});
