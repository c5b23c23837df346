import { describe, expect, it } from 'vitest';
import { DEMO_PASSWORD } from '../../seeders/data/demo-accounts';
import { useBrowserFlows } from './browser';

const flows = await useBrowserFlows({ profile: 'per-file', lastShot: 'editor-last' });
const { base } = flows;

describe('route editor', () => {
  it('builds a 4-step route on an empty canvas with mouse and keyboard, shows results live, undoes, and keeps the draft over a reload', async () => {
    const { page, shot } = flows.browser;
    const name = `Amide isolation ${Date.now().toString(36)}`;
    await page.goto(base + '/sign-in');
    await page.getByLabel('E-mail').fill('chemist@example.com');
    await page.getByLabel('Password').fill(DEMO_PASSWORD);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.getByRole('heading', { level: 1, name: 'Routes' }).waitFor();
    await shot('editor-01-routes-list');

    // Create a route: the editor opens on an empty canvas.
    await page.getByRole('button', { name: 'New route' }).click();
    await page.getByLabel('Route name').fill(name);
    await page.getByLabel('Project (optional)').fill('PW-418 programme (invented)');
    await page.getByRole('button', { name: 'Create and open' }).click();
    await page.getByRole('heading', { level: 1, name }).waitFor();
    await page.getByText('An empty canvas — start with a Charge').waitFor();
    const routeUrl = page.url();

    // 1. Charge, with the mouse; its product is picked from the workspace compounds.
    await page.getByRole('button', { name: 'Add Charge' }).click();
    const panel = page.getByRole('form', { name: /Settings of Charge/ });
    await panel.waitFor();
    await panel.getByRole('button', { name: 'Add an item' }).click();
    await panel
      .getByLabel('Item 2', { exact: true })
      .selectOption({ label: 'PW-417 amide (invented) (product)' });
    await panel.getByLabel('Amount of item 2 (kg)', { exact: true }).fill('1');
    await panel.getByLabel('Amount of item 2 (kg)', { exact: true }).press('Enter');

    // 2. Wash, from the keyboard: A goes to the step list, Enter adds; it joins the selected Charge.
    await page
      .locator('body')
      .click({ position: { x: 5, y: 5 } })
      .catch(() => {});
    await page.getByRole('button', { name: 'Add Charge' }).focus();
    await page.keyboard.press('Tab');
    await expect(
      page.evaluate(() => document.activeElement?.getAttribute('aria-label')),
    ).resolves.toBe('Add Wash');
    await page.getByRole('article', { name: /Charge:/ }).click();
    await page.keyboard.press('a');
    await page.keyboard.press('Tab');
    await page.keyboard.press('Enter');
    const wash = page.getByRole('article', { name: /Wash:/ });
    await wash.waitFor();

    // 3. Crystallisation, dragged onto the canvas, then connected with the mouse from the wash's organic output.
    await page
      .getByRole('button', { name: 'Add Crystallisation' })
      .dragTo(page.locator('.react-flow').first(), { targetPosition: { x: 350, y: 560 } });
    const cryst = page.getByRole('article', { name: /Crystallisation:/ });
    await cryst.waitFor();
    await page
      .locator('.react-flow__handle[data-handleid="out:organic"]')
      .first()
      .dragTo(cryst.locator('.react-flow__handle[data-handleid="in:feed"]'));
    await page.locator('.react-flow__edge').nth(1).waitFor();

    // 4. Filtration, keyboard again, joined to the selected crystallisation.
    await cryst.click();
    await page.keyboard.press('a');
    for (let i = 0; i < 5; i++) await page.keyboard.press('Tab');
    await expect(
      page.evaluate(() => document.activeElement?.getAttribute('aria-label')),
    ).resolves.toBe('Add Filtration');
    await page.keyboard.press('Enter');
    await page.getByRole('article', { name: /Filtration:/ }).waitFor();
    await expect(page.locator('.react-flow__edge').count()).resolves.toBe(3);

    // The route evaluates: the wash card shows the product recovery, the crystallisation its yield, the totals a yield.
    await wash.locator('[data-result="product recovery %"]').filter({ hasText: /\d/ }).waitFor();
    const crystYield = cryst.locator('[data-result="yield %"]');
    await crystYield.filter({ hasText: /\d/ }).waitFor();
    const totalYield = page.locator('[data-total="yield"]');
    await totalYield.filter({ hasText: /\d/ }).waitFor();
    const before = (await crystYield.textContent()) ?? '';
    const totalBefore = (await totalYield.getAttribute('data-value')) ?? '';
    await shot('editor-02-four-steps');

    // Crystallise to a warmer end temperature: more product stays in the liquor, so the yield falls.
    await page.keyboard.press('f');
    await cryst.locator('header').click();
    const endT = page
      .getByRole('form', { name: /Settings of Crystallisation/ })
      .getByLabel('End temperature', { exact: true });
    await endT.fill('40 °C');
    await endT.press('Enter');
    await expect.poll(() => crystYield.textContent()).not.toBe(before);
    const changed = (await crystYield.textContent()) ?? '';
    expect(Number(changed)).toBeLessThan(Number(before));
    await expect.poll(() => totalYield.getAttribute('data-value')).not.toBe(totalBefore);
    expect(Number(await totalYield.getAttribute('data-value'))).toBeLessThan(Number(totalBefore));
    await shot('editor-03-end-temperature-changed');

    // A wrong unit is refused inline and changes nothing.
    await endT.fill('2 kg');
    await endT.press('Enter');
    await page.getByText('“2 kg” is not a temperature').waitFor();
    await expect(endT.getAttribute('aria-invalid')).resolves.toBe('true');
    await shot('editor-04-unit-error');

    // The cautions sit behind their own tab with their count and worst severity; identical ones are one entry listing its steps.
    const cautionsTab = page.getByRole('tab', { name: /Cautions/ });
    await expect(
      cautionsTab.locator('[data-caution-count]').getAttribute('data-worst'),
    ).resolves.toMatch(/hazard|warning|advisory|info/);
    await cautionsTab.click();
    const cautions = page.getByRole('list', { name: 'Cautions' });
    await cautions.waitFor();
    const shared = cautions.locator('li[data-steps]:not([data-steps="1"])').first();
    await shared.waitFor();
    await page
      .locator('[data-process-safety-note]')
      .filter({ hasText: 'process-safety review' })
      .waitFor();
    await shot('editor-04b-cautions');
    await shared.getByRole('button', { name: 'Wash', exact: true }).click();
    await expect
      .poll(() =>
        wash.evaluate(
          (el) => el.closest('.react-flow__node')?.classList.contains('selected') ?? false,
        ),
      )
      .toBe(true);
    await cryst.locator('header').click();
    await page.getByRole('form', { name: /Settings of Crystallisation/ }).waitFor();
    await endT.press('Escape');
    await expect(crystYield.textContent()).resolves.toBe(changed);

    // Undo brings the first yield back, on the card and in the totals.
    await page.getByRole('button', { name: 'Undo' }).click();
    await expect.poll(() => crystYield.textContent()).toBe(before);
    await expect.poll(() => totalYield.getAttribute('data-value')).toBe(totalBefore);

    // The draft saves by itself; after a reload it is all there.
    await page.locator('[data-save-state="saved"]').waitFor();
    await page.goto(routeUrl);
    await page.getByRole('heading', { level: 1, name }).waitFor();
    await expect.poll(() => page.getByRole('article').count()).toBe(4);
    await page
      .getByRole('article', { name: /Crystallisation:/ })
      .locator('[data-result="yield %"]')
      .filter({ hasText: before })
      .waitFor();
    // Arrow keys move the selected card a grid step, Shift five; Undo puts it back.
    const filtration = page.getByRole('article', { name: /Filtration:/ });
    await filtration.locator('header').click();
    const position = () =>
      filtration.evaluate((el) => {
        const m = new DOMMatrixReadOnly(
          getComputedStyle(el.closest('.react-flow__node')!).transform,
        );
        return [m.m41, m.m42];
      });
    const [x0, y0] = await position();
    await page.keyboard.press('ArrowRight');
    await expect.poll(position).toEqual([x0 + 20, y0]);
    await page.keyboard.press('Shift+ArrowDown');
    await expect.poll(position).toEqual([x0 + 20, y0 + 100]);
    await page.keyboard.press('Control+z');
    await page.keyboard.press('Control+z');
    await expect.poll(position).toEqual([x0, y0]);
    await page.getByRole('button', { name: 'Shortcuts' }).click();
    await page.getByRole('region', { name: 'Keyboard shortcuts' }).waitFor();
    await shot('editor-05-after-reload');
    expect(flows.browser.problems).toEqual([]);
  });
});
