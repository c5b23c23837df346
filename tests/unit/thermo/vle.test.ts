import { describe, expect, it } from 'vitest';
import {
  bubblePoint,
  bubblePressure,
  createVleSystem,
  dewPoint,
  heterogeneousBubblePoint,
  heterogeneousBubblePressure,
  liquidLiquidSplit,
} from '@shared/engine/thermo/vle';
import { vapourPressure } from '@shared/engine/thermo/antoine';
import * as F from '../../reference/thermo/fixtures';

const P = 101325;

describe('bubblePoint', () => {
  it('of a pure component is its Antoine boiling point', () => {
    const sys = createVleSystem([F.water, F.ethanol]);
    const r = bubblePoint(sys, [1, 0], P);
    expect(vapourPressure(F.water.antoine, r.T_K).pressurePa).toBeCloseTo(P, 3);
    expect(r.y).toEqual([1, 0]);
    expect(r.warnings).toEqual([]);
  });

  it('is consistent with bubblePressure to 1e-8 relative', () => {
    const sys = createVleSystem([F.ethanol, F.water, F.acetone, F.ethylAcetate, F.toluene]);
    const x = [0.3, 0.3, 0.1, 0.2, 0.1];
    const r = bubblePoint(sys, x, P);
    const p = bubblePressure(sys, x, r.T_K);
    expect(Math.abs(p.P_Pa / P - 1)).toBeLessThan(1e-8);
    expect(r.y.reduce((a, b) => a + b, 0)).toBeCloseTo(1, 12);
    r.y.forEach((yi, i) => expect(yi).toBeCloseTo(p.y[i], 8));
  });

  it('converges from a poor starting temperature', () => {
    const sys = createVleSystem([F.ethanol, F.water]);
    const a = bubblePoint(sys, [0.5, 0.5], P);
    const b = bubblePoint(sys, [0.5, 0.5], P, { T0_K: 250 });
    expect(b.T_K).toBeCloseTo(a.T_K, 7);
  });

  it('meets P to 1e-9 from starts on either side where γ depends strongly on T (secant-corrected Newton)', () => {
    // Water with a little toluene and acetone: γ of toluene at high dilution in water is in the
    // thousands and falls with T, so the activity coefficients carry a large share of f'(T), the
    // share the plain Newton step leaves out and the secant through the previous residual supplies.
    const sys = createVleSystem([F.water, F.toluene, F.acetone]);
    const x = [0.9985, 0.0005, 0.001];
    const ref = bubblePoint(sys, x, P);
    for (const T0 of [ref.T_K - 30, ref.T_K - 0.01, ref.T_K + 0.01, ref.T_K + 30]) {
      const r = bubblePoint(sys, x, P, { T0_K: T0 });
      expect(r.warnings).toEqual([]);
      expect(Math.abs(bubblePressure(sys, x, r.T_K).P_Pa / P - 1)).toBeLessThan(1e-9);
      expect(Math.abs(r.T_K - ref.T_K)).toBeLessThan(1e-7);
    }
  });

  it('three-phase point started from a neighbour (secant-corrected Newton) equals the cold solve', () => {
    // Water, toluene and acetone boiling as two liquids: acetone moves between the liquids as T
    // changes, so the liquids' compositions and γ carry a share of f'(T) that the warm start's
    // Newton step takes from the secant. Each warm answer must be the cold one to the tolerances.
    const sys = createVleSystem([F.water, F.toluene, F.acetone]);
    let previous = heterogeneousBubblePoint(sys, [0.6, 0.35, 0.05], P);
    expect(previous.liquidPhases).toBe(2);
    for (let k = 1; k <= 8; k++) {
      const z = [0.6 - 0.01 * k, 0.35 - 0.005 * k, 0.05 + 0.015 * k];
      const warm = heterogeneousBubblePoint(sys, z, P, { previous });
      const cold = heterogeneousBubblePoint(sys, z, P);
      expect(warm.liquidPhases).toBe(2);
      expect(cold.liquidPhases).toBe(2);
      expect(Math.abs(warm.T_K - cold.T_K)).toBeLessThan(1e-7);
      for (let i = 0; i < 3; i++) expect(Math.abs(warm.y[i] - cold.y[i])).toBeLessThan(1e-7);
      previous = warm;
    }
  });

  it('gives y = 0 for a non-volatile solute, which still raises the boiling point via γ', () => {
    const solute = {
      name: 'non-volatile solute',
      antoine: [],
      unifac: { 9: 5, 10: 1, 42: 1 },
      nonVolatile: true,
    };
    const sys = createVleSystem([F.toluene, solute]);
    const r = bubblePoint(sys, [0.9, 0.1], P);
    expect(r.y[1]).toBe(0);
    expect(r.K[1]).toBe(0);
    expect(r.T_K).toBeGreaterThan(bubblePoint(sys, [1, 0], P).T_K);
  });

  it('warns when a vapour pressure is extrapolated', () => {
    const sys = createVleSystem([F.mtbe, F.toluene]); // MTBE set ends at 326 K
    const r = bubblePoint(sys, [0.3, 0.7], P);
    expect(r.warnings.some((w) => w.startsWith('MTBE:') && /Clausius–Clapeyron/.test(w))).toBe(
      true,
    );
  });

  it('refuses a liquid of non-volatile components only', () => {
    const solute = { antoine: [], unifac: { 9: 6 }, nonVolatile: true };
    const sys = createVleSystem([F.toluene, solute]);
    expect(() => bubblePoint(sys, [0, 1], P)).toThrowError(/no volatile/);
  });
});

describe('dewPoint', () => {
  it('inverts the bubble point: dew point of the bubble vapour returns the liquid', () => {
    const sys = createVleSystem([F.methanol, F.water, F.acetone]);
    const x = [0.3, 0.5, 0.2];
    const b = bubblePoint(sys, x, P);
    const d = dewPoint(sys, b.y, P);
    expect(d.T_K).toBeCloseTo(b.T_K, 6);
    d.x.forEach((xi, i) => expect(xi).toBeCloseTo(x[i], 6));
  });
  it('lies above the bubble point for the same composition', () => {
    const sys = createVleSystem([F.ethanol, F.water]);
    expect(dewPoint(sys, [0.3, 0.7], P).T_K).toBeGreaterThan(bubblePoint(sys, [0.3, 0.7], P).T_K);
  });
});

describe('liquidLiquidSplit', () => {
  it('finds no split for a miscible pair (ethanol–water)', () => {
    expect(liquidLiquidSplit(createVleSystem([F.ethanol, F.water]), [0.5, 0.5], 298.15).split).toBe(
      false,
    );
  });
  it('splits toluene–water into nearly pure phases with equal activities', () => {
    const sys = createVleSystem([F.toluene, F.water]);
    const r = liquidLiquidSplit(sys, [0.5, 0.5], 298.15);
    expect(r.split).toBe(true);
    if (!r.split) return;
    const [organic, aqueous] = r.phases;
    expect(organic[0]).toBeGreaterThan(0.95);
    expect(aqueous[1]).toBeGreaterThan(0.999);
    const gI = sys.unifac.gammas(organic, 298.15);
    const gII = sys.unifac.gammas(aqueous, 298.15);
    for (let i = 0; i < 2; i++)
      expect((organic[i] * gI[i]) / (aqueous[i] * gII[i])).toBeCloseTo(1, 8);
    // Material balance.
    for (let i = 0; i < 2; i++) {
      expect((1 - r.phaseFraction) * organic[i] + r.phaseFraction * aqueous[i]).toBeCloseTo(0.5, 8);
    }
  });
  it('reports a single phase outside the miscibility gap (a trace of toluene in water)', () => {
    const sys = createVleSystem([F.toluene, F.water]);
    expect(liquidLiquidSplit(sys, [1e-6, 1 - 1e-6], 298.15).split).toBe(false);
  });
  it('finds the same tie line from feeds on it close to either phase, and no split just beyond it', () => {
    // Water–ethyl acetate–ethanol: the stability trials that fall onto such a feed stop early (a
    // steady ratio of distances within 1e-3 of it); a feed with 0.3 % of one phase must still split
    // into the tie line's two liquids, in the lever-rule proportion.
    const sys = createVleSystem([F.water, F.ethylAcetate, F.ethanol]);
    const T = 298.15;
    const centre = liquidLiquidSplit(sys, [0.5, 0.4, 0.1], T);
    expect(centre.split).toBe(true);
    if (!centre.split) return;
    const [a, b] = centre.phases;
    const along = (t: number) => a.map((v, i) => v + t * (b[i] - v));
    for (const t of [0.003, 0.02, 0.98, 0.997]) {
      const r = liquidLiquidSplit(sys, along(t), T);
      expect(r.split).toBe(true);
      if (!r.split) continue;
      r.phases.forEach((x, k) =>
        x.forEach((v, i) => expect(Math.abs(v - [a, b][k][i])).toBeLessThan(1e-9)),
      );
      expect(Math.abs(r.phaseFraction - t)).toBeLessThan(1e-8);
    }
    for (const t of [-0.01, 1.05]) expect(liquidLiquidSplit(sys, along(t), T).split).toBe(false);
  });
});

describe('heterogeneousBubblePoint', () => {
  it('boils toluene–water below both pure boiling points, independent of the overall composition', () => {
    const sys = createVleSystem([F.toluene, F.water]);
    const a = heterogeneousBubblePoint(sys, [0.3, 0.7], P);
    const b = heterogeneousBubblePoint(sys, [0.7, 0.3], P);
    expect(a.liquidPhases).toBe(2);
    expect(a.T_K).toBeLessThan(370);
    expect(a.T_K).toBeCloseTo(b.T_K, 5);
    a.y.forEach((yi, i) => expect(yi).toBeCloseTo(b.y[i], 5));
  });
  it('equals the ordinary bubble point for a one-phase liquid', () => {
    const sys = createVleSystem([F.ethanol, F.water]);
    const h = heterogeneousBubblePoint(sys, [0.4, 0.6], P);
    expect(h.liquidPhases).toBe(1);
    expect(h.T_K).toBe(bubblePoint(sys, [0.4, 0.6], P).T_K);
  });
});

describe('heterogeneousBubblePressure', () => {
  // The pressure at a set temperature without a root search: the split at T and the bubble pressure
  // of one liquid. Checked against the root search it replaces: the heterogeneous bubble point at
  // that pressure must come back to the set temperature, with the same vapour.
  const T = 333.15;
  const sys = createVleSystem([F.ethylAcetate, F.water, F.ethanol]);
  const feeds: Array<[string, number[], number]> = [
    ['two liquids, mid-gap', [0.45, 0.5, 0.05], 2],
    ['two liquids, near the ester-rich edge of the gap', [0.7, 0.28, 0.02], 2],
    ['two liquids, water-rich', [0.06, 0.9, 0.04], 2],
    ['one liquid, just past the ester-rich edge', [0.8, 0.18, 0.02], 1],
    ['one liquid, ethanol-rich', [0.3, 0.3, 0.4], 1],
    ['one liquid, dry ester', [0.97, 0.02, 0.01], 1],
  ];
  for (const [what, z, phases] of feeds)
    it(`is the pressure whose heterogeneous bubble point is T (${what})`, () => {
      const r = heterogeneousBubblePressure(sys, z, T);
      expect(r.liquidPhases).toBe(phases);
      const back = heterogeneousBubblePoint(sys, z, r.P_Pa);
      expect(back.liquidPhases).toBe(phases);
      expect(Math.abs(back.T_K - T)).toBeLessThan(1e-7);
      r.y.forEach((yi, i) => expect(Math.abs(yi - back.y[i])).toBeLessThan(1e-9));
      if (phases === 1) expect(r.P_Pa).toBe(bubblePressure(sys, z, T).P_Pa);
    });

  it('gives the same answer when its flash starts from a neighbouring feed', () => {
    const a = heterogeneousBubblePressure(sys, [0.45, 0.5, 0.05], T);
    const next = [0.44, 0.5, 0.06];
    const cold = heterogeneousBubblePressure(sys, next, T);
    const warm = heterogeneousBubblePressure(sys, next, T, a.phases);
    expect(warm.liquidPhases).toBe(2);
    expect(Math.abs(warm.P_Pa / cold.P_Pa - 1)).toBeLessThan(1e-10);
    // A start that no longer applies (the feed has left the gap) is not taken.
    const single = heterogeneousBubblePressure(sys, [0.3, 0.3, 0.4], T, a.phases);
    expect(single.liquidPhases).toBe(1);
    expect(single.P_Pa).toBe(bubblePressure(sys, [0.3, 0.3, 0.4], T).P_Pa);
  });
});
