import { describe, expect, it } from 'vitest';
import { DEMO_ROUTE_NAME } from '../../seeders/20261203000000-demo-route';
import { DEMO_PLANT_ROUTE_NAME } from '../../seeders/20261203130200-demo-plant-route';
import { signInAs, useBrowserFlows } from './browser';

// Nothing is clipped or covered at 1280 × 800, measured by bounding boxes: the canvas stays in
// its own area (the navigation rail above it, whatever Fit view does), the routes table keeps
// each owner and date on one line, and no connection label sits under a card.
const flows = await useBrowserFlows({ profile: 'per-flow', lastShot: 'nothing-clipped-last' });

const signIn = () => signInAs(flows.browser.page, flows.base, 'chemist@example.com');

/**
 * Points of the navigation rail that a card or the canvas covers: for every card that reaches
 * into the rail's box, the element drawn at the middle of the overlap must belong to the rail.
 */
function railCovered() {
  return flows.browser.page.evaluate(() => {
    const rail = document.querySelector('aside[data-rail]')!.getBoundingClientRect();
    const covered: string[] = [];
    const probe = (x: number, y: number, what: string) => {
      const hit = document.elementFromPoint(x, y);
      if (hit && !hit.closest('aside[data-rail]')) covered.push(`${what} at ${x},${y}`);
    };
    for (const node of document.querySelectorAll('.react-flow__node')) {
      const r = node.getBoundingClientRect();
      const left = Math.max(r.left, rail.left);
      const right = Math.min(r.right, rail.right);
      const top = Math.max(r.top, rail.top);
      const bottom = Math.min(r.bottom, rail.bottom);
      if (right - left > 1 && bottom - top > 1)
        probe((left + right) / 2, (top + bottom) / 2, node.getAttribute('aria-label') ?? 'card');
    }
    // The rail's own links are where they are drawn.
    for (const link of document.querySelectorAll('aside[data-rail] nav a')) {
      const r = link.getBoundingClientRect();
      probe(r.left + r.width / 2, r.top + r.height / 2, link.textContent ?? 'link');
    }
    const pane = document.querySelector('.react-flow')!.getBoundingClientRect();
    return { covered, railRight: rail.right, paneLeft: pane.left };
  });
}

/** Connection labels that overlap a card (by more than a pixel each way). */
function labelsUnderCards() {
  return flows.browser.page.evaluate(() => {
    const cards = [...document.querySelectorAll('.react-flow__node')].map((n) =>
      n.getBoundingClientRect(),
    );
    const labels = [...document.querySelectorAll('[data-stream-label]')];
    const under: string[] = [];
    for (const label of labels) {
      const l = label.getBoundingClientRect();
      if (l.width === 0) continue;
      for (const c of cards)
        if (
          Math.min(l.right, c.right) - Math.max(l.left, c.left) > 1 &&
          Math.min(l.bottom, c.bottom) - Math.max(l.top, c.top) > 1
        )
          under.push(
            `${label.textContent}: label ${[l.left, l.right, l.top, l.bottom].map(Math.round).join(' ')} card ${[c.left, c.right, c.top, c.bottom].map(Math.round).join(' ')}`,
          );
    }
    return { count: labels.length, under };
  });
}

describe('nothing clipped at 1280 × 800', () => {
  it('the approved route and its revision keep the canvas off the navigation rail after Fit view', async () => {
    const { page, shot } = flows.browser;
    await signIn();
    await page.getByRole('link', { name: DEMO_PLANT_ROUTE_NAME, exact: true }).click();
    await page.getByRole('heading', { level: 1, name: DEMO_PLANT_ROUTE_NAME }).waitFor();
    await page.locator('.react-flow__node').first().waitFor();
    await page.getByRole('button', { name: 'Fit view', exact: true }).click();
    await page.waitForTimeout(400);
    await shot('clip-01-editor-fit');
    let m = await railCovered();
    expect(m.covered).toEqual([]);
    expect(m.paneLeft).toBeGreaterThanOrEqual(m.railRight - 1);

    // The approved revision, opened from the route's revisions.
    const here = new URL(page.url());
    await page.goto(`${flows.base}${here.pathname}/revisions/1`);
    await page.locator('.react-flow__node').first().waitFor();
    await page.getByRole('button', { name: 'Fit view', exact: true }).click();
    await page.waitForTimeout(400);
    await shot('clip-02-revision-fit');
    // The header's revision words each stay on one line.
    for (const words of ['Revision 1', 'read only']) {
      const box = await page.getByText(words, { exact: true }).first().boundingBox();
      expect(box!.height, words).toBeLessThan(28);
    }
    m = await railCovered();
    expect(m.covered).toEqual([]);
    expect(m.paneLeft).toBeGreaterThanOrEqual(m.railRight - 1);
  }, 120_000);

  it('no connection label sits under a card on the demo route', async () => {
    const { page, shot } = flows.browser;
    await signIn();
    await page.getByRole('link', { name: DEMO_ROUTE_NAME, exact: true }).click();
    await page.locator('.react-flow__node').first().waitFor();
    await page.locator('[data-stream-label]').first().waitFor();
    for (const fit of [false, true]) {
      if (fit) {
        await page.getByRole('button', { name: 'Fit view', exact: true }).click();
        await page.waitForTimeout(400);
      }
      const { count, under } = await labelsUnderCards();
      // At the opening zoom the labels show (below LABEL_ZOOM they show on hover only).
      if (!fit) expect(count).toBeGreaterThan(3);
      expect(under).toEqual([]);
    }
    await shot('clip-03-edge-labels');
  }, 120_000);

  it('the routes list keeps owner and dates on one line', async () => {
    const { page, shot } = flows.browser;
    await signIn();
    await page.getByRole('link', { name: DEMO_ROUTE_NAME, exact: true }).waitFor();
    await shot('clip-04-routes-list');
    // Lines of text in each cell but the route's name (a link, which may wrap): the distinct
    // tops of the text's line boxes.
    const wrapped = await page.locator('table tbody td').evaluateAll((cells) =>
      cells
        .filter((c) => !c.querySelector('a, button'))
        .filter((c) => {
          const tops = new Set<number>();
          const walk = document.createTreeWalker(c, NodeFilter.SHOW_TEXT);
          for (let t = walk.nextNode(); t; t = walk.nextNode()) {
            const range = document.createRange();
            range.selectNodeContents(t);
            for (const r of range.getClientRects()) tops.add(Math.round(r.top));
          }
          return tops.size > 1;
        })
        .map((c) => c.textContent),
    );
    expect(wrapped).toEqual([]);
    // Nothing spills past the page to the right.
    const overflow = await page.evaluate(
      () => document.documentElement.scrollWidth - document.documentElement.clientWidth,
    );
    expect(overflow).toBeLessThanOrEqual(0);
    // Nor inside the table's frame: every action of every row is in view without scrolling it.
    const frame = page.locator('table').first().locator('xpath=..');
    const hidden = await frame.evaluate((el) => {
      const box = el.getBoundingClientRect();
      return {
        scroll: el.scrollWidth - el.clientWidth,
        outside: [...el.querySelectorAll('button')]
          .filter((b) => b.getBoundingClientRect().right > box.right + 1)
          .map((b) => b.getAttribute('aria-label') ?? b.textContent),
      };
    });
    expect(hidden).toEqual({ scroll: 0, outside: [] });
  }, 120_000);
});
