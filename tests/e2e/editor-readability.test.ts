import { describe, expect, it } from 'vitest';
import { DEMO_PASSWORD } from '../../seeders/data/demo-accounts';
import { useBrowserFlows } from './browser';
import { demoRouteCopy } from './demo-copy';

const flows = await useBrowserFlows({ profile: 'per-file', lastShot: 'readability-last' });

type Box = { x: number; y: number; width: number; height: number };
const overlaps = (a: Box, b: Box) =>
  a.x < b.x + b.width && b.x < a.x + a.width && a.y < b.y + b.height && b.y < a.y + a.height;

/** The canvas as drawn: its zoom, the smallest text on a card in screen pixels, the pane, the mini-map and the cards. */
function measure() {
  return flows.browser.page.evaluate(() => {
    const box = (el: Element) => {
      const r = el.getBoundingClientRect();
      return { x: r.x, y: r.y, width: r.width, height: r.height };
    };
    const viewport = document.querySelector<HTMLElement>('.react-flow__viewport')!;
    const zoom = Number(/scale\(([\d.]+)\)/.exec(viewport.style.transform)?.[1] ?? 1);
    let smallest = { px: Infinity, text: '' };
    for (const el of document.querySelectorAll('.react-flow__node *')) {
      const own = [...el.childNodes].some((c) => c.nodeType === 3 && c.textContent?.trim());
      if (!own || el.closest('.sr-only')) continue;
      const px = parseFloat(getComputedStyle(el).fontSize) * zoom;
      if (px < smallest.px) smallest = { px, text: el.textContent ?? '' };
    }
    return {
      zoom,
      smallest,
      pane: box(document.querySelector('.react-flow')!),
      miniMap: box(document.querySelector('.react-flow__minimap')!),
      cards: [...document.querySelectorAll('.react-flow__node')].map(box),
    };
  });
}

/** Every card within the canvas's width, and the first row on screen at its top. */
function expectRowsInCanvas(drawn: Awaited<ReturnType<typeof measure>>) {
  const { pane, cards } = drawn;
  for (const card of cards) {
    expect(card.x).toBeGreaterThanOrEqual(pane.x);
    expect(card.x + card.width).toBeLessThanOrEqual(pane.x + pane.width);
  }
  const top = Math.min(...cards.map((c) => c.y));
  expect(top).toBeGreaterThanOrEqual(pane.y);
  expect(top).toBeLessThan(pane.y + pane.height);
}

describe('the route editor at 1280×800', () => {
  it('draws the demo route readably: cards at 11 px or more, the mini-map beside the canvas, Tidy layout in rows, focus visible and Tab from step to step', async () => {
    const { page, shot } = flows.browser;
    // Its own copy of the demo route: Tidy layout and the steps added below change it.
    const route = await demoRouteCopy('readability');
    await page.goto(flows.base + '/sign-in');
    await page.getByLabel('E-mail').fill('chemist@example.com');
    await page.getByLabel('Password').fill(DEMO_PASSWORD);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.getByRole('link', { name: route, exact: true }).click();
    await page.getByRole('heading', { level: 1, name: route }).waitFor();
    await page.locator('[data-total="yield"]').filter({ hasText: /\d/ }).waitFor();
    await page.getByRole('article', { name: /^Charge:/ }).waitFor();

    // The first view: no text on a card under 11 px, and the mini-map over none of the canvas.
    const first = await measure();
    expect(first.smallest.px, `“${first.smallest.text}”`).toBeGreaterThanOrEqual(11);
    expect(first.miniMap.width).toBeGreaterThan(0);
    expect(overlaps(first.miniMap, first.pane)).toBe(false);
    // (Cards beyond the canvas edge are hidden by it, so the mini-map outside the canvas covers none.)
    await expect(page.getByRole('article', { name: /^Charge:/ }).isVisible()).resolves.toBe(true);
    await shot('readability-01-opened');

    // Tidy layout: the steps wrap into rows like lines of text, no card on another, still readable.
    await page.getByRole('button', { name: 'Tidy layout' }).click();
    await expect
      .poll(async () => new Set((await measure()).cards.map((c) => Math.round(c.y))).size)
      .toBeGreaterThan(1);
    const tidy = await measure();
    expect(tidy.zoom).toBeGreaterThanOrEqual(0.92);
    expect(tidy.smallest.px).toBeGreaterThanOrEqual(11);
    const columns = new Set(tidy.cards.map((c) => Math.round(c.x))).size;
    expect(columns).toBeGreaterThan(1);
    expect(tidy.cards.length / columns).toBeLessThanOrEqual(4);
    tidy.cards.forEach((a, i) =>
      tidy.cards.slice(i + 1).forEach((b) => expect(overlaps(a, b)).toBe(false)),
    );
    expectRowsInCanvas(tidy);
    await shot('readability-02-tidy-layout');
    await page.getByRole('button', { name: 'Undo' }).click();

    // Keyboard: a card takes focus with a visible ring, is spoken by its step's name, and Tab goes to the next step (not to a connection).
    await page.locator('.react-flow__node').first().focus();
    const focused = () =>
      page.evaluate(() => {
        const el = document.activeElement as HTMLElement;
        const style = getComputedStyle(el);
        return {
          card: el.classList.contains('react-flow__node'),
          name: el.getAttribute('aria-label'),
          outline: `${style.outlineStyle} ${style.outlineWidth}`,
        };
      });
    await page.keyboard.press('Tab');
    await page.keyboard.press('Shift+Tab');
    const one = await focused();
    expect(one.card).toBe(true);
    expect(one.name).toMatch(/^Charge: /);
    expect(one.outline).toMatch(/^solid [1-9]/);
    await page.keyboard.press('Tab');
    const two = await focused();
    expect(two.card).toBe(true);
    expect(two.name).toMatch(/^Wash: 1 M HCl wash/);
    await shot('readability-03-focus');
    // Enter selects the focused step: its settings open beside the canvas.
    await page.keyboard.press('Enter');
    await page.getByRole('form', { name: /Settings of 1 M HCl wash/ }).waitFor();
    await shot('readability-04-step-selected');
    // Connections are named by their steps, never by internal ids.
    const streams = await page
      .locator('.react-flow__edge')
      .evaluateAll((els) => els.map((e) => e.getAttribute('aria-label') ?? ''));
    expect(streams.length).toBeGreaterThan(0);
    for (const s of streams) expect(s).toMatch(/^Stream from .+ \(\w+\) to .+ \(\w+\)$/);
    expect(streams.join(' ')).toContain('1 M HCl wash');

    // A longer route still tidies into rows that fit the canvas's width, its start on screen.
    await page.keyboard.press('Escape');
    await page
      .getByRole('article', { name: /^Wash: 20 % brine wash/ })
      .locator('header')
      .click();
    const before = await page.locator('.react-flow__node').count();
    for (let i = 0; i < 4; i++) await page.getByRole('button', { name: 'Add Wash' }).click();
    await expect.poll(() => page.locator('.react-flow__node').count()).toBe(before + 4);
    await page.getByRole('button', { name: 'Tidy layout' }).click();
    await expect
      .poll(async () => {
        const { cards, pane } = await measure();
        return cards.every((c) => c.x >= pane.x && c.x + c.width <= pane.x + pane.width);
      })
      .toBe(true);
    const longer = await measure();
    expect(longer.zoom).toBeGreaterThanOrEqual(0.92);
    expectRowsInCanvas(longer);
    await shot('readability-05-tidy-longer-route');
    expect(flows.browser.problems).toEqual([]);
  });
});
