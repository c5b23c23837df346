import { describe, expect, it } from 'vitest';
import { backCalculateD, kremserRemaining } from '@shared/chromatography';
import {
  crossCurrentFractionRemaining,
  kremserFractionRemaining,
} from '@shared/engine/unitops/wash';

describe('apparent distribution ratio from levels before and after a wash', () => {
  it('one stage, worked by hand: half remains with equal volumes, so D = 1', () => {
    const r = backCalculateD({ beforePct: 2, afterPct: 1, organicL: 10, aqueousL: 10 });
    expect(r.ok && r.D).toBeCloseTo(1, 12);
  });

  it('one stage: D = (f/(1 − f))·(Vaq/Vorg) inverts the forward mass balance', () => {
    // Forward: D = 2, Vorg = 10 L, Vaq = 3 L → f = 20/23 = 0.869565…
    const f = (2 * 10) / (2 * 10 + 3);
    const r = backCalculateD({ beforePct: 1, afterPct: f, organicL: 10, aqueousL: 3 });
    expect(r.ok).toBe(true);
    if (r.ok) {
      expect(r.D).toBeCloseTo(2, 10);
      expect(r.formula).toMatch(/f\/\(1 − f\)/);
      expect(r.warnings).toEqual([]);
    }
  });

  it('cross-current stages invert the engine’s own cross-current model', () => {
    const D = 0.3;
    const E = 5 / (D * 12); // extraction factor toward water, Vaq = 5 L per stage, Vorg = 12 L
    const f = crossCurrentFractionRemaining(E, 3);
    const r = backCalculateD({ beforePct: 1, afterPct: f, organicL: 12, aqueousL: 5, stages: 3 });
    expect(r.ok && r.D).toBeCloseTo(D, 10);
  });

  it('counter-current stages invert the engine’s Kremser equation, also for a steep case', () => {
    for (const D of [0.01, 0.5, 3]) {
      const E = 4 / (D * 10);
      const f = kremserFractionRemaining(E, 4);
      expect(kremserRemaining(E, 4)).toBeCloseTo(f, 12);
      const r = backCalculateD({
        beforePct: 1,
        afterPct: f,
        organicL: 10,
        aqueousL: 4,
        stages: 4,
        mode: 'counter-current',
      });
      expect(r.ok).toBe(true);
      if (r.ok) expect(Math.abs(r.D / D - 1)).toBeLessThan(1e-8);
    }
  });

  it('uses the ratio to the product when the product is assigned in both samples', () => {
    // The impurity falls from 1.0 to 0.5 area %, but the product rose from 95 to 97.5 %:
    // relative to the product the impurity kept (0.5/97.5)/(1/95) = 0.48718.
    const r = backCalculateD({
      beforePct: 1,
      afterPct: 0.5,
      productBeforePct: 95,
      productAfterPct: 97.5,
      organicL: 10,
      aqueousL: 10,
    });
    expect(r.ok).toBe(true);
    if (r.ok) {
      expect(r.basis).toBe('ratio to product');
      expect(r.fractionRemaining).toBeCloseTo(0.487179, 5);
    }
  });

  it('refuses what cannot be measured this way, in plain words', () => {
    const none = backCalculateD({ beforePct: 1, afterPct: 0, organicL: 1, aqueousL: 1 });
    expect(none.ok).toBe(false);
    if (!none.ok) expect(none.reason).toMatch(/not found after the wash/);
    const up = backCalculateD({ beforePct: 1, afterPct: 1.2, organicL: 1, aqueousL: 1 });
    expect(up.ok).toBe(false);
    if (!up.ok) expect(up.reason).toMatch(/did not fall/);
    const zero = backCalculateD({ beforePct: 0, afterPct: 1, organicL: 1, aqueousL: 1 });
    expect(zero.ok).toBe(false);
  });

  it('warns where the result is sensitive to small errors in the levels', () => {
    const r = backCalculateD({ beforePct: 1, afterPct: 0.97, organicL: 1, aqueousL: 1 });
    expect(r.ok && r.warnings.join(' ')).toMatch(/small errors/);
    const low = backCalculateD({ beforePct: 1, afterPct: 0.01, organicL: 1, aqueousL: 1 });
    expect(low.ok && low.warnings.join(' ')).toMatch(/reporting limit/);
  });
});
