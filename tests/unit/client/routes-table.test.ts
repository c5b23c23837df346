import { describe, expect, it } from 'vitest';
import { ENGINE_VERSION } from '@shared/engine/version';
import { figuresFromEarlierEngine } from '@/features/routes/components/routes-table';
import type { RouteSummary } from '@/features/routes/api/schemas';

// The routes list shows figures stored when each route was last saved. After an upgrade of the
// calculations, a route not saved since keeps the old figures: the list marks them rather than
// show them beside today's as if alike.
const route = (engineVersion: string | null, withTotals = true) =>
  ({
    id: 'r1',
    name: 'Route (invented)',
    totals: withTotals ? { yieldPct: 90.2, purityPct: 99.5, pmi: 62, engineVersion } : null,
  }) as unknown as RouteSummary;

describe('routes list figures', () => {
  it("marks figures computed by an engine other than today's", () => {
    expect(figuresFromEarlierEngine(route('1.1.0'))).toBe(true);
    expect(figuresFromEarlierEngine(route(null))).toBe(true);
  });

  it("leaves today's figures, and a route without figures, unmarked", () => {
    expect(figuresFromEarlierEngine(route(ENGINE_VERSION))).toBe(false);
    expect(figuresFromEarlierEngine(route(null, false))).toBe(false);
  });
});
