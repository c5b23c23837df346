import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { evaluateRoute, MASS_BALANCE_TOLERANCE } from '../../../shared/engine/route/evaluate';
import { generateRoute } from '../../fixtures/routes/generate';
import type { RouteDocumentInput } from '../../../shared/schemas/route';

/** Every step kind and mode a document uses, as labels ("distillation:constant-volume", "charge:wt%", ...). */
export function stepLabels(doc: RouteDocumentInput): Set<string> {
  const out = new Set<string>();
  for (const s of doc.steps) {
    out.add(s.kind);
    switch (s.kind) {
      case 'wash':
      case 'extraction':
        out.add(`${s.kind}:${s.params.addedLiquid.kind}`);
        out.add(`${s.kind}:${s.params.mode}`);
        break;
      case 'distillation':
        out.add(`distillation:${s.params.mode.kind}`);
        out.add(`distillation:${s.params.condition.kind}`);
        break;
      case 'crystallisation':
        out.add(`crystallisation:${s.params.mode.kind}`);
        break;
      case 'filtration':
        out.add(`filtration:${s.params.cakeWash ? 'cake-wash' : 'no-wash'}`);
        break;
      case 'drying':
        out.add(`drying:${s.params.target.kind}`);
        break;
      case 'charge':
        for (const c of s.params.contents)
          out.add(`charge:${c.kind === 'aqueous' ? 'aqueous' : c.unit}`);
        break;
    }
  }
  for (const c of doc.connections) if (c.to.port === 'c') out.add('merge:c');
  return out;
}

/** What the generated routes must cover between them: every kind and every mode. */
const ALL_LABELS = [
  'charge',
  'charge:kg',
  'charge:L',
  'charge:vol',
  'charge:wt%',
  'charge:equiv',
  'charge:aqueous',
  'wash',
  'wash:aqueous',
  'wash:solvent',
  'wash:cross-current',
  'wash:counter-current',
  'extraction',
  'extraction:cross-current',
  'extraction:counter-current',
  'distillation',
  'distillation:concentrate',
  'distillation:put-and-take',
  'distillation:constant-volume',
  'distillation:pressure',
  'distillation:pot-temperature',
  'crystallisation:cooling',
  'crystallisation:antisolvent',
  'crystallisation:evaporative',
  'filtration:cake-wash',
  'filtration:no-wash',
  'drying:lod',
  'drying:residual',
  'quench',
  'ph-adjust',
  'carbon-treatment',
  'polish-filtration',
  'split',
  'merge',
  'merge:c',
];

/** Random valid routes: every component balance closes at every step, no stream goes negative. */
describe('mass balance on random valid routes', () => {
  it('closes to 1e-9 relative for every component at every step', () => {
    const seen = new Set<string>();
    fc.assert(
      fc.property(
        fc.integer({ min: 1, max: 2 ** 31 - 1 }),
        fc.integer({ min: 5, max: 24 }),
        fc.integer({ min: 1, max: 5 }),
        fc.boolean(),
        (seed, steps, compounds, distillation) => {
          const doc = generateRoute({ seed, steps, compounds, distillation });
          for (const l of stepLabels(doc)) seen.add(l);
          const r = evaluateRoute(doc);
          for (const id of r.order) {
            const s = r.steps[id];
            expect(s.balance, id).toBeDefined();
            for (const [c, b] of Object.entries(s.balance!)) {
              expect(b.relativeError, `${id} ${c}`).toBeLessThanOrEqual(MASS_BALANCE_TOLERANCE);
            }
            expect(
              s.warnings.some((w) => w.code === 'mass-balance'),
              id,
            ).toBe(false);
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
            for (const s of Object.values(r.steps))
              inKg += (s.addedKg[c] ?? 0) + (s.generatedKg[c] ?? 0) - (s.consumedKg[c] ?? 0);
            const outKg = r.terminals.reduce((a, t) => a + t.stream.kg[c], 0);
            expect(Math.abs(inKg - outKg)).toBeLessThanOrEqual(
              1e-9 * Math.max(inKg, outKg, 1e-12) + 1e-15,
            );
          }
          if (r.totals.yieldPct !== null) {
            expect(r.totals.yieldPct).toBeGreaterThanOrEqual(0);
            expect(r.totals.yieldPct).toBeLessThanOrEqual(100 + 1e-9);
          }
        },
      ),
      { numRuns: 60, seed: 20240611 },
    );
    // The runs met every step kind and mode (else the property says nothing about the missing ones).
    expect(ALL_LABELS.filter((l) => !seen.has(l))).toEqual([]);
    // 60 full route evaluations: allow for a loaded machine (correctness, not speed, is tested here).
  }, 60_000);

  it('gives the same numbers for the same document (deterministic)', () => {
    const doc = generateRoute({ seed: 7, steps: 20, compounds: 4 });
    expect(JSON.stringify(evaluateRoute(doc))).toBe(
      JSON.stringify(evaluateRoute(structuredClone(doc))),
    );
  });
});
