import type { Server } from 'node:http';
import { afterAll, afterEach, beforeAll, describe, expect, it } from 'vitest';
import { useTestServer } from '../support/app';
import { assertClientBuilt, closeServer, freePort, launchBrowser, listen, type Browser } from './browser';

const DEMO_PASSWORD = 'phasewright-demo';

const port = await freePort();
const base = `http://127.0.0.1:${port}`;
const server = useTestServer({ APP_URL: base, PHASEWRIGHT_SEED_DEMO: '1' });

let http: Server | undefined;
let browser: Browser;

beforeAll(async () => {
  assertClientBuilt();
  http = await listen(server.app, port);
  browser = await launchBrowser();
});

// The last screen of each flow, kept for looking at when something fails.
afterEach(async () => {
  await browser?.shot('editor-last');
});

afterAll(async () => {
  await browser?.close();
  await closeServer(http);
});

describe('route editor', () => {
  it('builds a 4-step route on an empty canvas with mouse and keyboard, shows results live, undoes, and keeps the draft over a reload', async () => {
    const { page, shot } = browser;
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
    await panel.getByLabel('Item 2', { exact: true }).selectOption({ label: 'PW-417 amide (invented) (product)' });
    await panel.getByLabel('Amount of item 2 (kg)', { exact: true }).fill('1');
    await panel.getByLabel('Amount of item 2 (kg)', { exact: true }).press('Enter');

    // 2. Wash, from the keyboard: A goes to the step list, Enter adds; it joins the selected Charge.
    await page.locator('body').click({ position: { x: 5, y: 5 } }).catch(() => {});
    await page.getByRole('button', { name: 'Add Charge' }).focus();
    await page.keyboard.press('Tab');
    await expect(page.evaluate(() => document.activeElement?.getAttribute('aria-label'))).resolves.toBe('Add Wash');
    await page.getByRole('article', { name: /Charge:/ }).click();
    await page.keyboard.press('a');
    await page.keyboard.press('Tab');
    await page.keyboard.press('Enter');
    const wash = page.getByRole('article', { name: /Wash:/ });
    await wash.waitFor();

    // 3. Crystallisation, dragged onto the canvas, then connected with the mouse from the wash's organic output.
    await page.getByRole('button', { name: 'Add Crystallisation' }).dragTo(page.locator('.react-flow').first(), { targetPosition: { x: 350, y: 560 } });
    const cryst = page.getByRole('article', { name: /Crystallisation:/ });
    await cryst.waitFor();
    await page.locator('.react-flow__handle[data-handleid="out:organic"]').first().dragTo(cryst.locator('.react-flow__handle[data-handleid="in:feed"]'));
    await page.locator('.react-flow__edge').nth(1).waitFor();

    // 4. Filtration, keyboard again, joined to the selected crystallisation.
    await cryst.click();
    await page.keyboard.press('a');
    for (let i = 0; i < 5; i++) await page.keyboard.press('Tab');
    await expect(page.evaluate(() => document.activeElement?.getAttribute('aria-label'))).resolves.toBe('Add Filtration');
    await page.keyboard.press('Enter');
    await page.getByRole('article', { name: /Filtration:/ }).waitFor();
    await expect(page.locator('.react-flow__edge').count()).resolves.toBe(3);

    // The route evaluates: the wash card shows the product recovery, the totals a yield.
    const recovery = wash.locator('[data-result="product recovery %"]');
    await recovery.waitFor();
    await page.locator('[data-total="yield"]').filter({ hasText: /\d/ }).waitFor();
    const before = (await recovery.textContent()) ?? '';
    await shot('editor-02-four-steps');

    // Change the wash volume in its settings: the recovery moves.
    await wash.click();
    const volume = page.getByRole('form', { name: /Settings of Wash/ }).getByLabel('Volume', { exact: true });
    await volume.fill('60 vol');
    await volume.press('Enter');
    await expect.poll(() => recovery.textContent()).not.toBe(before);
    const changed = await recovery.textContent();
    await shot('editor-03-wash-changed');

    // A wrong unit is refused inline and changes nothing.
    await volume.fill('2 kg');
    await volume.press('Enter');
    await page.getByText('“2 kg” is not a volume').waitFor();
    await expect(volume.getAttribute('aria-invalid')).resolves.toBe('true');
    await shot('editor-04-unit-error');
    await volume.press('Escape');

    // Undo brings the first recovery back.
    await page.getByRole('button', { name: 'Undo' }).click();
    await expect.poll(() => recovery.textContent()).toBe(before);
    expect(changed).not.toBe(before);

    // The draft saves by itself; after a reload it is all there.
    await page.locator('[data-save-state="saved"]').waitFor();
    await page.goto(routeUrl);
    await page.getByRole('heading', { level: 1, name }).waitFor();
    await expect.poll(() => page.getByRole('article').count()).toBe(4);
    await page.getByRole('article', { name: /Wash:/ }).locator('[data-result="product recovery %"]').filter({ hasText: before }).waitFor();
    await page.getByRole('button', { name: 'Shortcuts' }).click();
    await page.getByRole('region', { name: 'Keyboard shortcuts' }).waitFor();
    await shot('editor-05-after-reload');
    expect(browser.problems).toEqual([]);
  });
});
