/**
 * Fine scans of the volumes an optimiser varies: the route's results must be
 * continuous in them, or say plainly why not. A jump between neighbouring
 * points is accepted only when the warnings of the step change with it (a
 * warning names the step and the cause); a yield of 0 without a warning is a
 * silent zero and fails.
 *
 * The defect this guards against: an evaporation to dryness left a dust of
 * water (1e-19 kg, the charge less the moles distilled) in the pot, which the
 * crystallisation read as the liquor; the product, without solubility data in
 * water, was then "assumed to stay dissolved" in it, and the yield fell from
 * 99.9 % to 0 at scattered wash volumes (8.90 L among them) with no warning of
 * the cause. Reference values are independently computed in the test (the
 * single-stage extraction by hand), not published ones.
 */
import { describe, expect, it } from 'vitest';
import { evaluateRoute } from '../../../shared/engine/route/evaluate';
import { withParams } from '../../../shared/engine/optimise';
import type { RouteDocument } from '../../../shared/schemas/route';
import { demoAmideIsolation } from '../../fixtures/routes/demo-amide-isolation';
import { singleWashRoute } from '../optimise/routes';

type StepWarning = ReturnType<typeof evaluateRoute>['warnings'][number];

interface Point {
  value: number;
  yieldPct: number | null;
  /** Warning codes (severity warning or hazard) of the scanned steps. */
  codes: string;
}

function scan(
  values: number[],
  build: (v: number) => RouteDocument,
  stepIds: string[],
): { points: Point[]; warningsAt: (v: number) => StepWarning[] } {
  const all = new Map<number, StepWarning[]>();
  const points = values.map((value) => {
    const r = evaluateRoute(build(value));
    const ws = r.warnings.filter(
      (w) => w.stepId !== null && stepIds.includes(w.stepId) && w.severity !== 'info',
    );
    all.set(value, ws);
    return {
      value,
      yieldPct: r.totals.yieldPct,
      codes: [...new Set(ws.map((w) => `${w.stepId}:${w.code}`))].sort().join(' '),
    };
  });
  return { points, warningsAt: (v) => all.get(v) ?? [] };
}

/** Neighbours whose yields differ by more than maxStepPct with the same warnings: unexplained jumps. */
function unexplainedJumps(points: Point[], maxStepPct: number): string[] {
  const out: string[] = [];
  for (let i = 1; i < points.length; i++) {
    const a = points[i - 1];
    const b = points[i];
    if (a.yieldPct === null || b.yieldPct === null) continue;
    if (Math.abs(b.yieldPct - a.yieldPct) > maxStepPct && a.codes === b.codes)
      out.push(
        `${a.value} → ${b.value}: yield ${a.yieldPct.toFixed(2)} → ${b.yieldPct.toFixed(2)} %`,
      );
  }
  return out;
}

/** Points with no yield, or a yield of 0, and no warning on the scanned steps: silent zeros. */
function silentZeros(points: Point[]): number[] {
  return points.filter((p) => !(p.yieldPct! > 0) && p.codes === '').map((p) => p.value);
}

const grid = (from: number, to: number, step: number) =>
  Array.from({ length: Math.round((to - from) / step) + 1 }, (_, k) =>
    Number((from + k * step).toFixed(6)),
  );

describe('a water wash then evaporation to dryness, scanned over the wash volume', () => {
  // 0.5–30 L every 0.05 L, with the volumes at which the yield used to fall to 0.
  const values = [...grid(0.5, 30, 0.05), 8.89, 17.45].sort((a, b) => a - b);
  const { points } = scan(values, singleWashRoute, ['wash', 'strip', 'filter']);

  it('never loses the product: yield within 0.2 % of the single-stage extraction by hand', () => {
    // The product stays in the toluene (D = 1000): one cross-current stage keeps
    // 1/(1 + V/(D·V_org)) of it, V_org = 10 L; the dried solid holds all of that.
    for (const p of points) {
      const byHand = 100 / (1 + p.value / (1000 * 10));
      expect(p.yieldPct, `wash ${p.value} L`).not.toBeNull();
      expect(Math.abs(p.yieldPct! - byHand), `wash ${p.value} L`).toBeLessThan(0.2);
    }
  });

  it('has no unexplained jump and no silent zero', () => {
    expect(unexplainedJumps(points, 0.05)).toEqual([]);
    expect(silentZeros(points)).toEqual([]);
  });

  it('leaves no solvent in a pot evaporated to dryness (not even a dust of 1e-19 kg)', () => {
    for (const v of [8.89, 8.9, 17.45]) {
      const r = evaluateRoute(singleWashRoute(v));
      const pot = r.streams.c3.kg;
      expect(pot.water, `wash ${v} L`).toBe(0);
      expect(pot.toluene, `wash ${v} L`).toBe(0);
    }
  });
});

describe('an evaporation scanned towards dryness, the product without solubility data', () => {
  // The product has no solubility data and no melting data: it is assumed dissolved, up to its own
  // mass of the liquor's solvents, so the yield rises smoothly to 100 % as the liquor goes to nothing.
  const build = (targetL: number) =>
    withParams(singleWashRoute(8.89), [
      { stepId: 'strip', param: 'mode.targetVolume', value: targetL },
    ]);
  const values = grid(0, 2.5, 0.02);
  const { points, warningsAt } = scan(values, build, ['strip', 'filter']);

  it('is continuous (under 3 % points per 0.02 L) from the dry pot to a liquor that holds everything', () => {
    expect(unexplainedJumps(points, 3)).toEqual([]);
    // 1.2 kg/L of product solids and toluene at 0.87 kg/L: by 2.2 L the liquor holds all of it.
    expect(points[0].yieldPct!).toBeGreaterThan(99.8);
    expect(points[points.length - 1].yieldPct!).toBe(0);
    expect(silentZeros(points)).toEqual([]);
  });

  it('says why the product stays dissolved: no solubility data, the assumption stated', () => {
    const last = points[points.length - 1];
    const ws = warningsAt(last.value);
    expect(
      ws.some(
        (w) =>
          w.stepId === 'strip' &&
          w.code === 'no-solubility-data' &&
          /test product: no solubility data; assumed to stay dissolved/.test(w.message),
      ),
    ).toBe(true);
    // Part-way, the assumption's bound is named with the share that comes out.
    const mid = points.find((p) => p.yieldPct! > 20 && p.yieldPct! < 80)!;
    expect(
      warningsAt(mid.value).some((w) =>
        /up to its own mass of the liquor's solvents \(50 wt %\), so \d/.test(w.message),
      ),
    ).toBe(true);
  });
});

describe('the demo route scanned over its wash and swap volumes', () => {
  const demo = JSON.parse(JSON.stringify(demoAmideIsolation)) as RouteDocument;
  const cases: Array<{ stepId: string; param: string; values: number[] }> = [
    { stepId: 'acid-wash', param: 'addedLiquid.volume', values: grid(1, 6, 0.25) },
    { stepId: 'swap', param: 'mode.addVolume', values: grid(4, 16, 0.5) },
    { stepId: 'swap', param: 'mode.targetVolume', values: grid(8, 20, 0.5) },
  ];
  for (const c of cases) {
    it(`${c.stepId} ${c.param}: no unexplained jump (over 1.5 % points a step), no silent zero`, () => {
      const { points } = scan(
        c.values,
        (v) => withParams(demo, [{ stepId: c.stepId, param: c.param, value: v }]),
        demo.steps.map((s) => s.id),
      );
      expect(unexplainedJumps(points, 1.5)).toEqual([]);
      expect(silentZeros(points)).toEqual([]);
      for (const p of points) expect(p.yieldPct!, `${c.param} ${p.value}`).toBeGreaterThan(50);
    });
  }
});
