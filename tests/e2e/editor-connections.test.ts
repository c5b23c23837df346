import { describe, expect, it } from 'vitest';
import { DEMO_ROUTE_NAME } from '../../seeders/20261203000000-demo-route';
import { DEMO_PASSWORD } from '../../seeders/data/demo-accounts';
import { useBrowserFlows } from './browser';

const flows = await useBrowserFlows({ profile: 'per-file', lastShot: 'connections-last' });

async function signIn() {
  const { page } = flows.browser;
  await page.goto(flows.base + '/sign-in');
  await page.getByLabel('E-mail').fill('chemist@example.com');
  await page.getByLabel('Password').fill(DEMO_PASSWORD);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.getByRole('heading', { level: 1, name: 'Routes' }).waitFor();
}

/** The streams on the canvas as their spoken names, sorted. */
const streams = () =>
  flows.browser.page
    .locator('.react-flow__edge')
    .evaluateAll((els) => els.map((e) => e.getAttribute('aria-label') ?? '').sort());

describe('joining steps on the canvas', () => {
  it('joins a new step to the selected step’s kept output, in line, and says why a connection is refused', async () => {
    const { page, shot } = flows.browser;
    await signIn();
    const name = `In-line joining ${Date.now().toString(36)}`;
    await page.getByRole('button', { name: 'New route' }).click();
    await page.getByLabel('Route name').fill(name);
    await page.getByRole('button', { name: 'Create and open' }).click();
    await page.getByRole('heading', { level: 1, name }).waitFor();

    // Charge, then a wash on the selected charge, then a second wash on the selected first wash:
    // it takes the organic layer the first wash keeps, never its aqueous layer.
    await page.getByRole('button', { name: 'Add Charge' }).click();
    await page.getByRole('button', { name: 'Add Wash' }).click();
    await page.getByRole('article', { name: /^Wash: Wash$/ }).waitFor();
    await page.getByRole('button', { name: 'Add Wash' }).click();
    await page.getByRole('article', { name: /^Wash: Wash 2$/ }).waitFor();
    await expect
      .poll(streams)
      .toEqual([
        'Stream from Charge (out) to Wash (feed)',
        'Stream from Wash (organic) to Wash 2 (feed)',
      ]);

    // With the first wash selected, a distillation goes in line: between the two washes.
    await page
      .getByRole('article', { name: /^Wash: Wash$/ })
      .locator('header')
      .click();
    await page.getByRole('button', { name: 'Add Distillation' }).click();
    await page.getByRole('article', { name: /^Distillation:/ }).waitFor();
    await expect
      .poll(streams)
      .toEqual([
        'Stream from Charge (out) to Wash (feed)',
        'Stream from Distillation (pot) to Wash 2 (feed)',
        'Stream from Wash (organic) to Distillation (feed)',
      ]);
    await shot('connections-01-in-line');

    // A filtration after the second wash, then a wash on the selected filtration: a cake cannot
    // feed a wash, and the chemist is told so instead of getting a stray step joined wrongly.
    await page
      .getByRole('article', { name: /^Wash: Wash 2$/ })
      .locator('header')
      .click();
    await page.getByRole('button', { name: 'Add Filtration' }).click();
    await page.getByRole('article', { name: /^Filtration:/ }).waitFor();
    await page.getByRole('button', { name: 'Add Wash' }).click();
    const notice = page.getByRole('alert').filter({ hasText: 'cannot feed' });
    await expect(notice.textContent()).resolves.toContain(
      "A filtration's cake cannot feed a wash: a wash takes a solution.",
    );
    expect((await streams()).filter((s) => s.includes('Wash 3'))).toEqual([]);
    await shot('connections-02-refused-from-palette');

    // Dragged by hand: the cake onto the new wash's feed is refused with the same reason.
    await page.getByRole('button', { name: 'Undo' }).click();
    await page
      .getByRole('button', { name: 'Add Wash' })
      .dragTo(page.locator('.react-flow').first(), { targetPosition: { x: 120, y: 520 } });
    const wash3 = page.getByRole('article', { name: /^Wash: Wash 3$/ });
    await wash3.waitFor();
    await expect(page.getByRole('alert').filter({ hasText: 'cannot feed' }).count()).resolves.toBe(
      0,
    );
    const card = (name: RegExp) =>
      page.locator('.react-flow__node', { has: page.getByRole('article', { name }) });
    const handle = (name: RegExp, id: string) =>
      card(name).locator(`.react-flow__handle[data-handleid="${id}"]`);
    await handle(/^Filtration:/, 'out:cake').dragTo(handle(/^Wash: Wash 3$/, 'in:feed'));
    await expect(notice.textContent()).resolves.toContain(
      "A filtration's cake cannot feed a wash: a wash takes a solution.",
    );
    // And onto an input that is already fed: the reason names the stream that feeds it.
    await page.getByRole('button', { name: 'Fit view', exact: true }).first().click();
    await handle(/^Filtration:/, 'out:filtrate').dragTo(handle(/^Distillation:/, 'in:feed'));
    await page
      .getByRole('alert')
      .filter({ hasText: 'Distillation is already fed by Wash' })
      .waitFor();
    await shot('connections-03-refused-drop');
    expect((await streams()).length).toBe(4);
    expect(flows.browser.problems).toEqual([]);
  });

  it('draws the solvent swap: pot temperature and original solvent left, with axis titles and units clear of the legend', async () => {
    const { page, shot } = flows.browser;
    await page.goto(flows.base + '/');
    await page.getByRole('heading', { level: 1, name: 'Routes' }).waitFor();
    await page.getByRole('link', { name: DEMO_ROUTE_NAME, exact: true }).click();
    await page.getByRole('heading', { level: 1, name: DEMO_ROUTE_NAME }).waitFor();
    await page
      .getByRole('article', { name: /^Distillation: Solvent swap/ })
      .locator('header')
      .click();
    const plot = page.getByTestId('plot-distillation');
    await plot.locator('svg').waitFor();
    await plot.scrollIntoViewIfNeeded();
    const drawn = await plot.evaluate((el) => {
      const texts = [...el.querySelectorAll('text')].map((t) => {
        const r = t.getBoundingClientRect();
        return { text: t.textContent ?? '', x: r.x, y: r.y, w: r.width, h: r.height };
      });
      // Each line series is one path; count the points of the dashed one (original solvent left).
      const dashed = [...el.querySelectorAll('path')].filter(
        (p) =>
          (p.getAttribute('stroke-dasharray') ?? 'none') !== 'none' &&
          p.getAttribute('fill') === 'none',
      );
      const points = Math.max(
        0,
        ...dashed.map((p) => (p.getAttribute('d')?.match(/[LC]/g) ?? []).length + 1),
      );
      return { texts, points };
    });
    const find = (t: string) => drawn.texts.find((x) => x.text === t);
    const titles = ['Distillate (L)', 'Pot temperature (°C)', 'Original solvent left (wt %)'];
    const legend = ['Pot temperature', 'Original solvent left'];
    for (const t of [...titles, ...legend]) expect(find(t), t).toBeDefined();
    const overlaps = (a: { x: number; y: number; w: number; h: number }, b: typeof a) =>
      a.x < b.x + b.w && b.x < a.x + a.w && a.y < b.y + b.h && b.y < a.y + a.h;
    for (const t of titles)
      for (const l of legend) expect(overlaps(find(t)!, find(l)!), `${t} on ${l}`).toBe(false);
    // The curve itself: a line through the profile's points, not a few hidden markers.
    expect(drawn.points).toBeGreaterThan(8);
    await shot('connections-04-swap-plot');
    expect(flows.browser.problems).toEqual([]);
  });

  it('says every problem in the chemist’s words, once, and keeps a refused value out of the draft', async () => {
    const { page, shot } = flows.browser;
    await page.goto(flows.base + '/');
    await page.getByRole('heading', { level: 1, name: 'Routes' }).waitFor();
    const name = `Messages ${Date.now().toString(36)}`;
    await page.getByRole('button', { name: 'New route' }).click();
    await page.getByLabel('Route name').fill(name);
    await page.getByRole('button', { name: 'Create and open' }).click();
    await page.getByRole('heading', { level: 1, name }).waitFor();

    // The first problem of a new route: what to do, not a path and an internal id.
    await page.getByRole('button', { name: 'Add Charge' }).click();
    await page.getByRole('tab', { name: /^Cautions/ }).click();
    const problems = page.getByRole('list', { name: 'Problems to fix' });
    await problems.getByText(/Charge the compound you isolate/).waitFor();
    const said = await problems.innerText();
    expect(said).not.toMatch(/referenceInput|componentId|Unknown component|params\./);
    await shot('messages-01-new-route');

    // A value out of range: one message under its field, in words; the route keeps its last
    // good value, so the draft still saves.
    await page.getByRole('tab', { name: 'Step' }).click();
    const settings = page.getByRole('form', { name: /Settings of Charge/ });
    const temperature = settings.getByLabel('Temperature', { exact: true });
    await temperature.fill('900 °C');
    await temperature.press('Enter');
    await settings.getByText('Enter at most 250.').waitFor();
    await expect(page.getByText('Enter at most 250.').count()).resolves.toBe(1);
    await expect(page.getByText(/params\.|Too big|expected number/).count()).resolves.toBe(0);
    await expect(temperature.getAttribute('aria-invalid')).resolves.toBe('true');
    await page.locator('[data-save-state="saved"]').waitFor();
    await shot('messages-02-out-of-range');
    // Fixed, the message goes.
    await temperature.fill('40 °C');
    await temperature.press('Enter');
    await expect.poll(() => page.getByText('Enter at most 250.').count()).toBe(0);
    await page.locator('[data-save-state="saved"]').waitFor();
    expect(flows.browser.problems).toEqual([]);
  });
});
