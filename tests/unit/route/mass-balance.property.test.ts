import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { evaluateRoute, MASS_BALANCE_TOLERANCE } from '../../../shared/engine/route/evaluate';
import { generateRoute } from '../../fixtures/routes/generate';

/** Random valid routes: every component balance closes at every step, no stream goes negative. */
describe('mass balance on random valid routes', () => {
  it('closes to 1e-9 relative for every component at every step', () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 2 ** 31 - 1 }), fc.integer({ min: 5, max: 24 }), fc.integer({ min: 1, max: 5 }), fc.boolean(), (seed, steps, compounds, distillation) => {
        const r = evaluateRoute(generateRoute({ seed, steps, compounds, distillation }));
        for (const id of r.order) {
          const s = r.steps[id];
          expect(s.balance, id).toBeDefined();
          for (const [c, b] of Object.entries(s.balance!)) {
            expect(b.relativeError, `${id} ${c}`).toBeLessThanOrEqual(MASS_BALANCE_TOLERANCE);
          }
          expect(s.warnings.some((w) => w.code === 'mass-balance'), id).toBe(false);
        }
        for (const st of Object.values(r.streams)) {
          for (const [c, kg] of Object.entries(st.kg)) {
            expect(kg, c).toBeGreaterThanOrEqual(-1e-12);
            expect(st.solidKg[c]).toBeLessThanOrEqual(kg + 1e-12);
          }
        }
        // Route level: all that is charged (plus formed − consumed) leaves through the terminal outputs.
        for (const c of Object.keys(r.terminals[0].stream.kg)) {
          let inKg = 0;
          for (const s of Object.values(r.steps)) inKg += (s.addedKg[c] ?? 0) + (s.generatedKg[c] ?? 0) - (s.consumedKg[c] ?? 0);
          const outKg = r.terminals.reduce((a, t) => a + t.stream.kg[c], 0);
          expect(Math.abs(inKg - outKg)).toBeLessThanOrEqual(1e-9 * Math.max(inKg, outKg, 1e-12) + 1e-15);
        }
        if (r.totals.yieldPct !== null) {
          expect(r.totals.yieldPct).toBeGreaterThanOrEqual(0);
          expect(r.totals.yieldPct).toBeLessThanOrEqual(100 + 1e-9);
        }
      }),
      { numRuns: 40, seed: 20240611 },
    );
  });

  it('gives the same numbers for the same document (deterministic)', () => {
    const doc = generateRoute({ seed: 7, steps: 20, compounds: 4 });
    expect(JSON.stringify(evaluateRoute(doc))).toBe(JSON.stringify(evaluateRoute(structuredClone(doc))));
  });
});
