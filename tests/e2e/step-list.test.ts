import { readFileSync } from 'node:fs';
import ExcelJS from 'exceljs';
import { describe, expect, it } from 'vitest';
import { stepListDocumentSchema } from '@shared/schemas/step-list';
import { DEMO_PASSWORD } from '../../seeders/data/demo-accounts';
import { DEMO_PLANT_ROUTE_NAME } from '../../seeders/20261203130200-demo-plant-route';
import { useBrowserFlows } from './browser';

const flows = await useBrowserFlows({ profile: 'per-file' });
const { base } = flows;

async function pdfText(pdf: Buffer): Promise<string> {
  const pdfjs = await import('pdfjs-dist/legacy/build/pdf.mjs');
  const document = await pdfjs.getDocument({ data: new Uint8Array(pdf) }).promise;
  const pages: string[] = [];
  for (let i = 1; i <= document.numPages; i++) {
    const content = await (await document.getPage(i)).getTextContent();
    pages.push(content.items.map((item) => ('str' in item ? item.str : '')).join(' '));
  }
  return pages.join('\n').replace(/\s+/g, ' ');
}

describe('plant step list', () => {
  it('the demo engineer opens the approved demo route, sets a 50 kg batch in the demo vessels, sees the vessel checks and downloads all four exports', async () => {
    const { page, shot, problems } = flows.browser;
    await page.goto(base + '/');
    await page.getByLabel('E-mail').fill('engineer@example.com');
    await page.getByLabel('Password').fill(DEMO_PASSWORD);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.getByRole('link', { name: DEMO_PLANT_ROUTE_NAME, exact: true }).click();
    await page.getByRole('link', { name: 'History' }).click();
    await page.getByRole('link', { name: 'Step list of revision 1' }).click();
    await page.getByRole('heading', { level: 1, name: 'Plant step list' }).waitFor();
    await page.getByText('Approved — signed by Tomas Lindqvist (demo reviewer)').waitFor();

    const form = page.getByRole('form', { name: 'Batch and equipment' });
    await form.getByLabel('Batch size (kg)').fill('50');
    const choose = async (step: string, item: string) => {
      const select = form.getByLabel(step, { exact: true });
      const value = await select.locator('option', { hasText: item }).first().getAttribute('value');
      await select.selectOption(value!);
    };
    await choose('Crude reaction mixture in 2-MeTHF', 'R-102 (invented)');
    await choose('1 M HCl wash (removes the amine)', 'R-102 (invented)');
    for (const step of [
      '8 % NaHCO3 wash (removes the acid)',
      '20 % brine wash',
      'Solvent swap to 2-propanol',
      'Heptane antisolvent at 60 °C, seeded',
      'Cool to 5 °C and age',
    ])
      await choose(step, 'R-101 (invented)');
    await choose('Filter, wash with cold heptane', 'F-301 Nutsche filter (invented)');
    await choose('Vacuum dry at 50 °C', 'D-401 Conical vacuum dryer (invented)');
    await form.getByRole('button', { name: 'Make the step list' }).click();

    const list = page.getByRole('region', { name: 'Step list' });
    await list.getByText('Charge 428 kg (500 L) of 2-Methyltetrahydrofuran at 20 °C.').waitFor();
    // The acid wash overfills R-102; the check says so and names a vessel that takes the step.
    await expect(list.getByRole('status').innerText()).resolves.toMatch(
      /operations? need another vessel or a smaller batch/,
    );
    const flagged = list.getByRole('listitem', { name: /^Operation \d+$/ }).filter({
      hasText: 'is above its maximum working volume of 560 L',
    });
    await expect(flagged.first().innerText()).resolves.toMatch(/Suggested: R-101 \(invented\)/);
    await expect(list.getByText('Vessel OK').first().isVisible()).resolves.toBe(true);
    await flagged.first().scrollIntoViewIfNeeded();
    await shot('step-list-01-checks');
    await page.evaluate(() => window.scrollTo(0, 0));
    await shot('step-list-00-form');

    const downloadAs = async (label: string) => {
      const [download] = await Promise.all([
        page.waitForEvent('download'),
        form.getByRole('button', { name: label }).click(),
      ]);
      const path = await download.path();
      return { name: download.suggestedFilename(), content: readFileSync(path!) };
    };
    const json = await downloadAs('JSON');
    expect(json.name).toMatch(/-rev1-50kg\.json$/);
    const parsed = stepListDocumentSchema.parse(JSON.parse(json.content.toString('utf8')));
    expect(parsed).toMatchObject({ revision: 1, draft: false, batchKg: 50, basis: 'input' });
    expect(parsed.operations.some((op) => op.vesselCheck?.ok === false)).toBe(true);

    const csv = await downloadAs('CSV');
    expect(csv.name).toMatch(/\.csv$/);
    expect(csv.content.toString('utf8')).toMatch(/^Plant step list\r\nRoute,/);

    const xlsx = await downloadAs('Excel (XLSX)');
    expect(xlsx.name).toMatch(/\.xlsx$/);
    const book = new ExcelJS.Workbook();
    await book.xlsx.load(xlsx.content as never);
    expect(book.getWorksheet('Step list')!.getCell('B2').value).toBe(DEMO_PLANT_ROUTE_NAME);

    const pdf = await downloadAs('PDF');
    expect(pdf.name).toMatch(/\.pdf$/);
    const text = await pdfText(pdf.content);
    expect(text).toMatch(/Plant step list/);
    expect(text).toMatch(/signed by Tomas Lindqvist \(demo reviewer\)/);
    expect(text).toMatch(/Charge 428 kg \(500 L\) of 2-Methyltetrahydrofuran/);

    // The printable page: navigation and the form are left out on paper.
    await page.emulateMedia({ media: 'print' });
    await expect(page.getByRole('navigation', { name: 'Main' }).isVisible()).resolves.toBe(false);
    await expect(form.isVisible()).resolves.toBe(false);
    await expect(list.isVisible()).resolves.toBe(true);
    await page.emulateMedia({ media: 'screen' });
    expect(problems).toEqual([]);
  });
});
