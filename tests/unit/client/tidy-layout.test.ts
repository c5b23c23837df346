import { describe, expect, it } from 'vitest';
import type { EditorDoc } from '@/features/editor/document';
import { FIT_MARGIN, READABLE_ZOOM, tidyLayout } from '@/features/editor/layout';
import { demoAmideIsolation } from '../../../seeders/data/demo-route';

const CARD = { width: 240, height: 200 };
/** The canvas of the editor at 1280×800 (palette and side panel beside it). */
const PANE = { width: 760, height: 640 };

/** The demo route with `extra` washes added one after another at its end. */
function demoWith(extra: number): EditorDoc {
  const doc = structuredClone(demoAmideIsolation) as unknown as EditorDoc;
  let last = doc.steps.at(-1)!.id;
  for (let i = 0; i < extra; i++) {
    const id = `extra-${i}`;
    doc.steps.push({ id, kind: 'wash', name: `Extra ${i}` } as never);
    doc.connections.push({
      id: `c-${id}`,
      from: { stepId: last, port: 'out' },
      to: { stepId: id, port: 'feed' },
    } as never);
    last = id;
  }
  return doc;
}

function extent(positions: Record<string, { x: number; y: number }>) {
  const xs = Object.values(positions).map((p) => p.x);
  const ys = Object.values(positions).map((p) => p.y);
  return {
    width: Math.max(...xs) + CARD.width - Math.min(...xs),
    height: Math.max(...ys) + CARD.height - Math.min(...ys),
    columns: new Set(xs).size,
    rows: new Set(ys).size,
  };
}

describe('Tidy layout', () => {
  it('wraps the demo route into rows that fit the canvas at a readable zoom', () => {
    const doc = demoWith(0);
    const out = extent(tidyLayout(doc, { pane: PANE }));
    expect(out.rows).toBeGreaterThan(1);
    expect(out.columns).toBeGreaterThan(1);
    expect(out.width * READABLE_ZOOM).toBeLessThanOrEqual(PANE.width * FIT_MARGIN);
  });

  it('keeps every row within the canvas width at a readable zoom however many steps the route has', () => {
    for (const extra of [1, 2, 5, 12, 30]) {
      const doc = demoWith(extra);
      const positions = tidyLayout(doc, { pane: PANE });
      expect(Object.keys(positions)).toHaveLength(doc.steps.length);
      const out = extent(positions);
      expect(out.width * READABLE_ZOOM, `${extra} steps added`).toBeLessThanOrEqual(
        PANE.width * FIT_MARGIN,
      );
      // A longer route runs on in more rows, never into one long row.
      expect(out.rows).toBeGreaterThan(1);
    }
  });

  it('puts no card on another', () => {
    const positions = Object.values(tidyLayout(demoWith(7), { pane: PANE }));
    positions.forEach((a, i) =>
      positions.slice(i + 1).forEach((b) => {
        const apart = Math.abs(a.x - b.x) >= CARD.width || Math.abs(a.y - b.y) >= CARD.height;
        expect(apart).toBe(true);
      }),
    );
  });

  it('gives a narrow canvas one column rather than cards off its edge', () => {
    const out = extent(tidyLayout(demoWith(3), { pane: { width: 200, height: 600 } }));
    expect(out.columns).toBe(1);
  });
});
