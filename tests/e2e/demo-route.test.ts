import { describe, expect, it } from 'vitest';
import { DEMO_ROUTE_NAME } from '../../seeders/20261203000000-demo-route';
import { DEMO_PASSWORD } from '../../seeders/data/demo-accounts';
import { useBrowserFlows } from './browser';
import { demoRouteCopy } from './demo-copy';

const flows = await useBrowserFlows({ profile: 'per-flow', lastShot: 'demo-route-last' });
const { base } = flows;

const number = (text: string | null) => Number(/-?[\d.]+/.exec(text ?? '')?.[0] ?? NaN);

/** Opens the demo route, or a copy of it by name for a flow that changes it. */
async function openDemoRoute(name = DEMO_ROUTE_NAME) {
  const { page } = flows.browser;
  await page.goto(base + '/sign-in');
  await page.getByLabel('E-mail').fill('chemist@example.com');
  await page.getByLabel('Password').fill(DEMO_PASSWORD);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.getByRole('link', { name, exact: true }).click();
  await page.getByRole('heading', { level: 1, name }).waitFor();
  await page.locator('[data-total="yield"]').filter({ hasText: /\d/ }).waitFor();
}

describe('the demo route', () => {
  it('opens for the demo chemist; the antisolvent volume moves yield and purity; a wash is added; a reload keeps everything', async () => {
    const { page, shot } = flows.browser;
    // Its own copy: this flow changes the route, which other files read as seeded.
    const route = await demoRouteCopy('edited');
    await openDemoRoute(route);
    const yieldTotal = page.locator('[data-total="yield"]');
    const purityTotal = page.locator('[data-total="purity"]');
    const yieldBefore = number(await yieldTotal.textContent());
    const purityBefore = number(await purityTotal.textContent());
    const purityValue = () => purityTotal.getAttribute('data-value').then(Number);
    const purityExactBefore = await purityValue();
    expect(yieldBefore).toBeGreaterThan(30);
    expect(yieldBefore).toBeLessThanOrEqual(100);
    expect(purityBefore).toBeGreaterThan(80);
    expect(purityBefore).toBeLessThanOrEqual(100);
    const cards = await page.getByRole('article').count();
    await shot('demo-01-opened');

    // The route opens at a readable zoom on its start; Fit view shows all of it.
    await expect(page.getByRole('article', { name: /^Charge:/ }).isVisible()).resolves.toBe(true);
    await page.getByRole('button', { name: 'Fit view', exact: true }).first().click();

    // The antisolvent crystallisation: its settings, and the yield-against-end-temperature curve.
    await page.getByRole('article', { name: /^Crystallisation: Heptane antisolvent/ }).click();
    const settings = page.getByRole('form', { name: /Settings of Heptane antisolvent/ });
    const volume = settings.getByLabel('Antisolvent volume', { exact: true });
    await expect(volume.inputValue()).resolves.toMatch(/vol/);
    await page
      .getByRole('img', { name: 'Crystallisation yield against end temperature' })
      .locator('svg')
      .waitFor();
    await shot('demo-02-crystallisation');

    // Very large numbers in engineering notation, read back as typed: the filter medium's resistance.
    await page.getByRole('article', { name: /^Filtration:/ }).click();
    const medium = page
      .getByRole('form', { name: /Settings of Filter/ })
      .getByLabel('Filter-medium resistance (1/m)');
    await expect(medium.inputValue()).resolves.toBe('10 × 10⁹');
    await medium.fill('20 × 10⁹');
    await medium.press('Enter');
    await expect.poll(() => medium.inputValue()).toBe('20 × 10⁹');
    await expect(medium.getAttribute('aria-invalid')).resolves.not.toBe('true');
    await page.getByRole('article', { name: /^Crystallisation: Heptane antisolvent/ }).click();

    // Half the heptane: the yield and the purity both move, and the totals show by how much.
    await volume.fill('3 ± 0.5 vol');
    await volume.press('Enter');
    await expect.poll(async () => number(await yieldTotal.textContent())).not.toBe(yieldBefore);
    await expect.poll(purityValue).not.toBe(purityExactBefore);
    await page.locator('[data-delta="yield"]').filter({ hasText: /▼|▲/ }).waitFor();
    // The purity (solids basis, residual heptane included) moves by about 1e-8 wt % here, below
    // what the totals show as a change; the exact value moving is asserted above.
    const yieldAfter = number(await yieldTotal.textContent());
    expect(yieldAfter).toBeGreaterThan(0);
    expect(yieldAfter).toBeLessThanOrEqual(100);
    await shot('demo-03-less-antisolvent');

    // A wash after the acid wash, fed by its aqueous layer (a back-extraction).
    await page.getByRole('button', { name: 'Fit view', exact: true }).first().click();
    await page.getByRole('article', { name: /^Wash: 1 M HCl wash/ }).click();
    await page.getByRole('button', { name: 'Add Wash' }).click();
    await expect.poll(() => page.getByRole('article').count()).toBe(cards + 1);
    const added = page.getByRole('article', { name: /^Wash: Wash \d/ });
    await added.waitFor();
    const addedName = (await added.getAttribute('aria-label')) ?? '';
    await page.getByRole('form', { name: /Settings of Wash/ }).waitFor();
    // The wash's own plot: recovery against the number of stages.
    await page
      .getByRole('img', { name: 'Product recovery against number of stages' })
      .locator('svg')
      .waitFor();
    await shot('demo-04-wash-added');

    // The draft saves by itself; a reload brings back both changes. The new wash is in line
    // (it joins the acid wash's kept layer), so the yield after it is read once the totals settle.
    await page.locator('[data-save-state="saved"]').waitFor();
    const totalsStatus = page.getByRole('region', { name: 'Route totals' }).getByRole('status');
    let yieldWithWash = Number.NaN;
    await expect
      .poll(async () => {
        const first = await yieldTotal.getAttribute('data-value');
        await page.waitForTimeout(700);
        const settled =
          /^Updated/.test((await totalsStatus.textContent()) ?? '') &&
          (await yieldTotal.getAttribute('data-value')) === first;
        if (settled) yieldWithWash = number(await yieldTotal.textContent());
        return settled;
      })
      .toBe(true);
    await page.reload();
    await page.getByRole('heading', { level: 1, name: route }).waitFor();
    await expect.poll(() => page.getByRole('article').count()).toBe(cards + 1);
    await page.getByRole('article', { name: addedName }).waitFor();
    await page.locator('[data-total="yield"]').filter({ hasText: /\d/ }).waitFor();
    await expect.poll(async () => number(await yieldTotal.textContent())).toBe(yieldWithWash);
    await page.getByRole('button', { name: 'Fit view', exact: true }).first().click();
    await page.getByRole('article', { name: /^Crystallisation: Heptane antisolvent/ }).click();
    await expect(
      page
        .getByRole('form', { name: /Settings of Heptane antisolvent/ })
        .getByLabel('Antisolvent volume', { exact: true })
        .inputValue(),
    ).resolves.toBe('3 ± 0.5 vol');
    await shot('demo-05-after-reload');
    expect(flows.browser.problems).toEqual([]);
  });

  it('redraws only what an edit changes: no connection is taken down and put back, the cards before the edited step stay as they are', async () => {
    const { page } = flows.browser;
    const route = await demoRouteCopy('redraw');
    await openDemoRoute(route);
    await page.getByRole('button', { name: 'Fit view', exact: true }).first().click();
    const brine = page.getByRole('article', { name: /^Wash: 20 % brine wash/ });
    await brine.click();
    const volume = page
      .getByRole('form', { name: /Settings of 20 % brine wash/ })
      .getByLabel('Volume', { exact: true });
    const before = await brine.locator('[data-result]').allTextContents();
    const edgeCount = await page.locator('.react-flow__edge').count();
    expect(edgeCount).toBeGreaterThan(5);

    // Watch the connections and the three cards before the brine wash while the edit is evaluated.
    await page.evaluate(() => {
      const w = window as unknown as { __redraw: { edges: number; upstream: string[] } };
      w.__redraw = { edges: 0, upstream: [] };
      const isEdge = (n: Node) =>
        n instanceof Element &&
        (n.matches('.react-flow__edge') || !!n.querySelector('.react-flow__edge'));
      new MutationObserver((records) => {
        for (const r of records)
          if ([...r.addedNodes, ...r.removedNodes].some(isEdge)) w.__redraw.edges++;
      }).observe(document.querySelector('.react-flow__edges')!, { subtree: true, childList: true });
      for (const id of ['crude', 'acid-wash', 'base-wash']) {
        const card = document.querySelector(`article[data-step-id="${id}"]`)!;
        new MutationObserver(() => w.__redraw.upstream.push(id)).observe(card, {
          subtree: true,
          childList: true,
          characterData: true,
          attributes: true,
        });
      }
    });
    await volume.fill('6 vol');
    await volume.press('Enter');
    await expect.poll(() => brine.locator('[data-result]').allTextContents()).not.toEqual(before);
    // Let the canvas settle (measuring happens on the next frames), then read what changed.
    await page.evaluate(
      () => new Promise((resolve) => requestAnimationFrame(() => requestAnimationFrame(resolve))),
    );
    const seen = await page.evaluate(
      () => (window as unknown as { __redraw: { edges: number; upstream: string[] } }).__redraw,
    );
    expect(seen.edges, 'connections taken down or put back').toBe(0);
    expect(seen.upstream, 'cards before the edited step that changed').toEqual([]);
    await expect(page.locator('.react-flow__edge').count()).resolves.toBe(edgeCount);
    expect(flows.browser.problems).toEqual([]);
  });

  it('shows where the product goes and the purge per impurity, and runs a small uncertainty estimate to the end', async () => {
    const { page, shot } = flows.browser;
    await openDemoRoute();

    await page.getByRole('tab', { name: 'Product flow' }).click();
    await page
      .getByRole('img', { name: 'Where the product mass goes, step by step' })
      .locator('svg')
      .waitFor();
    await page.getByText(/Isolated [\d.]+ kg of [\d.]+ kg charged/).waitFor();
    await shot('demo-06-product-flow');

    await page.getByRole('tab', { name: 'Purge' }).click();
    await page
      .getByRole('img', { name: 'Purge factor of each impurity, log scale' })
      .locator('svg')
      .waitFor();
    await shot('demo-07-purge');

    // A distillation shows its profile.
    await page.getByRole('button', { name: 'Fit view', exact: true }).first().click();
    await page
      .getByRole('article', { name: /^Distillation:/ })
      .first()
      .click();
    await page
      .getByRole('img', {
        name: 'Pot temperature and original solvent left against distillate volume',
      })
      .locator('svg')
      .waitFor();

    await page.getByRole('tab', { name: 'Uncertainty' }).click();
    const run = page.getByRole('form', { name: 'Uncertainty run' });
    await run.getByLabel('Draws').fill('40');
    await run.getByLabel('Seed').fill('7');
    await run.getByRole('button', { name: 'Run uncertainty' }).click();
    const progress = page.getByRole('progressbar', { name: 'Uncertainty run progress' });
    await progress.waitFor();
    await page.locator('[role="progressbar"][data-status="done"]').waitFor({ timeout: 60_000 });
    await expect(progress.getAttribute('aria-valuenow')).resolves.toBe('100');
    const bands = page.getByRole('table', { name: 'Uncertainty bands' });
    const yieldRow = bands.getByRole('row', { name: /^Yield %/ });
    await yieldRow.waitFor();
    const [p5, p50, p95] = (await yieldRow.getByRole('cell').allTextContents())
      .slice(0, 3)
      .map(number);
    expect(p5).toBeLessThanOrEqual(p50);
    expect(p50).toBeLessThanOrEqual(p95);
    expect(p95).toBeLessThanOrEqual(100);
    await expect(bands.getByRole('row', { name: /^Purity wt %/ }).isVisible()).resolves.toBe(true);
    // One purge row per impurity, under the "Purge factor of" heading, each named after its compound.
    await expect(bands.getByRole('rowheader', { name: 'Purge factor of' }).count()).resolves.toBe(
      1,
    );
    await expect(
      bands.getByRole('row', { name: /^Des-chloro amide \(invented\)/ }).count(),
    ).resolves.toBe(1);
    await shot('demo-08-uncertainty');
    expect(flows.browser.problems).toEqual([]);
  });
});
