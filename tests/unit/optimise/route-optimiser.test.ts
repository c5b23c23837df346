/**
 * The route optimiser on routes whose optimum is known by construction.
 */
import { describe, expect, it } from 'vitest';
import {
  checkOptimiseRequest,
  optimiseRoute,
  readParam,
  withParams,
  type OptimiseRequest,
} from '../../../shared/engine/optimise';
import { evaluateRoute } from '../../../shared/engine/route/evaluate';
import { demoAmideIsolation } from '../../fixtures/routes/demo-amide-isolation';
import { singleWashRoute } from './routes';
import type { RouteDocument } from '../../../shared/schemas/route';

const demo = JSON.parse(JSON.stringify(demoAmideIsolation)) as RouteDocument;

describe('single wash: the least water that meets an impurity limit', () => {
  // By hand: one cross-current stage leaves q = 1 / (1 + V/(D·V_org)) of a solute (D = 0.5 for the
  // impurity, 1000 for the product, V_org = 10 L). With 1 kg product and 0.05 kg impurity charged, the
  // impurity level L = m_i / (m_p + m_i) reaches r = L/(1 − L) = 0.05 (1 + V/10000) / (1 + V/5), so
  // V* = (0.05 − r) / (r/5 − 0.05/10000). PMI rises with the water charged, so V* is the optimum.
  const limitPct = 2;
  const r = limitPct / (100 - limitPct);
  const byHand = (0.05 - r) / (r / 5 - 0.05 / 10000);
  const request: OptimiseRequest = {
    document: singleWashRoute(20),
    free: [{ stepId: 'wash', param: 'addedLiquid.volume', min: 0.5, max: 30 }],
    objective: 'pmi',
    constraints: { maxImpurityPct: { imp: limitPct } },
    seed: 1,
    budget: { evaluations: 60 },
  };
  const result = optimiseRoute(request);
  const found = result.best.params['wash.addedLiquid.volume'];

  it('finds the wash volume within 1 % of the hand solution', () => {
    expect(byHand).toBeCloseTo(7.259, 2);
    expect(result.feasible).toBe(true);
    // Tolerance: 1 % — the wash model's water/toluene mutual solubility moves the level by about 0.1 %.
    expect(Math.abs(found - byHand) / byHand).toBeLessThan(0.01);
    expect(result.best.totals.impurityPct.imp).toBeLessThanOrEqual(limitPct);
    expect(result.best.totals.impurityPct.imp).toBeGreaterThan(limitPct * 0.98);
  });

  it('reports the chosen document with the volume set, the original left as it was', () => {
    expect(readParam(result.best.document, 'wash', 'addedLiquid.volume')).toBe(found);
    expect(readParam(request.document, 'wash', 'addedLiquid.volume')).toBe(20);
    expect(result.current?.params['wash.addedLiquid.volume']).toBe(20);
  });

  it('lists the candidates with their feasibility, the best feasible of them chosen', () => {
    const feasible = result.candidates.filter((c) => c.feasible);
    expect(feasible.length).toBeGreaterThan(3);
    expect(result.candidates.some((c) => !c.feasible)).toBe(true);
    for (const c of feasible) expect(c.totals.pmi!).toBeGreaterThanOrEqual(result.best.totals.pmi!);
  });

  it('the same seed gives the same answer', () => {
    const again = optimiseRoute(request);
    expect(again.best.params).toEqual(result.best.params);
    expect(again.candidates).toEqual(result.candidates);
  });

  it('constraints nothing in the bounds can meet: "no feasible route" with the closest candidate', () => {
    const none = optimiseRoute({ ...request, constraints: { maxImpurityPct: { imp: 0.15 } } });
    expect(none.feasible).toBe(false);
    expect(none.message).toMatch(/^No feasible route/);
    // The closest: the most water the bounds allow (the level falls as the volume rises).
    expect(none.best.params['wash.addedLiquid.volume']).toBeGreaterThan(29);
    expect(none.best.unmet.join(' ')).toMatch(/test impurity at .* % is above its 0\.15 % limit/);
  });
});

describe('cooling crystallisation: yield against purity is monotone', () => {
  // The demo route's cooling: a lower end temperature crystallises more product and more of the
  // deschloro impurity (checked on a grid below). Limiting the impurity to its level at an end
  // temperature of 10 °C makes 10 °C the least-PMI end temperature by construction.
  const at = (t: number) =>
    evaluateRoute(withParams(demo, [{ stepId: 'cool', param: 'mode.endC', value: t }])).totals;
  const level = (t: number) =>
    at(t).impurities.find((i) => i.componentId === 'deschloro-amide')!.levelPct;

  it('is monotone on a grid', () => {
    const grid = [-5, 5, 15, 25].map(at);
    for (let i = 1; i < grid.length; i++) {
      expect(grid[i].yieldPct!).toBeLessThan(grid[i - 1].yieldPct!);
      expect(grid[i].pmi!).toBeGreaterThan(grid[i - 1].pmi!);
    }
    expect(level(-5)).toBeGreaterThan(level(25));
  });

  it('the optimiser finds the end temperature within 0.5 °C', () => {
    const result = optimiseRoute({
      document: demo,
      free: [{ stepId: 'cool', param: 'mode.endC', min: -5, max: 30 }],
      objective: 'pmi',
      constraints: { maxImpurityPct: { 'deschloro-amide': level(10) } },
      seed: 9,
      budget: { evaluations: 60 },
    });
    expect(result.feasible).toBe(true);
    expect(Math.abs(result.best.params['cool.mode.endC'] - 10)).toBeLessThan(0.5);
    // The spread at the chosen point comes from the document's ± ranges (end temperature ± 2 °C).
    const u = result.best.uncertainty;
    expect(u.draws).toBeGreaterThan(0);
    expect(u.yieldPct.p95!).toBeGreaterThan(u.yieldPct.p5!);
    expect(u.impurityPct['deschloro-amide'].p50).not.toBeNull();
  });
});

describe('integers and request checks', () => {
  it('frees the number of put-and-take cycles as a whole number', () => {
    const result = optimiseRoute({
      document: demo,
      free: [{ stepId: 'swap', param: 'mode.cycles', min: 1, max: 6 }],
      objective: 'pmi',
      constraints: { ichResidualSolvents: true },
      seed: 2,
      budget: { evaluations: 12 },
    });
    for (const c of result.candidates)
      expect(Number.isInteger(c.params['swap.mode.cycles'])).toBe(true);
  });

  it('names every problem of a request in the chemist’s words', () => {
    const issues = checkOptimiseRequest({
      document: demo,
      free: [
        { stepId: 'nope', param: 'stages', min: 1, max: 2 },
        { stepId: 'acid-wash', param: 'mode.volume', min: 1, max: 2 },
        { stepId: 'acid-wash', param: 'addedLiquid.volume', min: 4, max: 2 },
        { stepId: 'swap', param: 'mode.cycles', min: 1, max: 40 },
      ],
      objective: 'pmi',
      constraints: { maxImpurityPct: { ghost: 1 } },
      seed: 1,
    });
    expect(issues).toEqual([
      { path: 'free.0.stepId', message: 'The route has no step “nope”.' },
      { path: 'free.1.param', message: expect.stringMatching(/has no number at “mode.volume”/) },
      {
        path: 'free.2.max',
        message: expect.stringMatching(
          /^The upper bound of the wash volume of step “1 M HCl wash .* is below its lower bound\.$/,
        ),
      },
      {
        path: 'free.3.max',
        message: expect.stringMatching(
          /upper bound 40 is outside what the put-and-take cycles of step/,
        ),
      },
      {
        path: 'constraints.maxImpurityPct.ghost',
        message: 'The route has no component “ghost” to limit.',
      },
    ]);
  });
});
