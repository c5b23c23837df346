import { describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import {
  evaluateRoute,
  ENGINE_VERSION,
  PROCESS_SAFETY_NOTE,
} from '../../../shared/engine/route/evaluate';
import { demoAmideIsolation } from '../../fixtures/routes/demo-amide-isolation';

const json = JSON.parse(
  readFileSync(
    fileURLToPath(new URL('../../fixtures/routes/demo-amide-isolation.json', import.meta.url)),
    'utf8',
  ),
);

describe('demo amide isolation', () => {
  const r = evaluateRoute(json);
  it('the JSON fixture is the builder written out', () => {
    expect(json).toEqual(JSON.parse(JSON.stringify(demoAmideIsolation)));
  });
  it('evaluates with plausible totals', () => {
    expect(r.engineVersion).toBe(ENGINE_VERSION);
    // A cooling + antisolvent crystallisation leaves part of the product in the
    // mother liquor: isolated yields of 80–92 % are usual (common practice).
    expect(r.totals.yieldPct!).toBeGreaterThan(80);
    expect(r.totals.yieldPct!).toBeLessThan(92);
    expect(r.totals.purityWtPct!).toBeGreaterThanOrEqual(99);
    // Regression values of this engine version for the invented demo data
    // (re-pinned deliberately when the demo data were tuned: 90.2 % yield,
    // purity 99.50 wt %, capped by the 0.5 % loss on drying; 90.5 % since the
    // 2-MeTHF–water pair is fitted (NRTL in UNIFAC's place): the swap strips water
    // and 2-MeTHF faster, so less of the product stays in the liquor). Re-pin only
    // on purpose, with the reason in the commit.
    expect(r.totals.yieldPct!).toBeCloseTo(90.5, 0);
    expect(r.totals.purityWtPct!).toBeCloseTo(99.5, 1);
    // The acid wash takes the amine, the base wash the acid.
    expect(r.totals.purge['pw417-amine'].purgeFactor!).toBeGreaterThan(1000);
    expect(r.totals.purge['pw417-acid'].purgeFactor!).toBeGreaterThan(100);
    expect(r.totals.pmi!).toBeGreaterThan(r.totals.eFactor!);
    expect(r.processSafetyNote).toBe(PROCESS_SAFETY_NOTE);
  });
  it('puts the cautions on their steps', () => {
    expect(
      r.steps['base-wash'].warnings.some(
        (w) => w.code === 'gas-evolution' && w.severity === 'hazard',
      ),
    ).toBe(true);
    // The swap is held at 14 vol so that the product stays dissolved at the pot temperature.
    expect(r.steps['swap'].warnings.some((w) => w.code === 'solubility-crossed')).toBe(false);
    expect(r.warnings.every((w) => w.stepId === null || r.steps[w.stepId])).toBe(true);
  });
  it('swaps the solvent: little 2-MeTHF left, profile reported', () => {
    const d = r.steps['swap'].details as {
      residualOriginalSolventWtPct: number;
      profile: Array<{ potTemperatureC: number }>;
    };
    // 4 × 10 vol of 2-propanol against a 14 vol pot leaves about 1.5 wt % 2-MeTHF
    // (was < 2 with 3 × 5 vol to 4 vol, which crashed the product out). It was 2.3 wt %
    // while the 2-MeTHF–water pair stayed on UNIFAC, which gives water in 2-MeTHF half the
    // activity the measured mutual solubility implies: the fitted pair strips the water
    // (0.038 → 0.013 kg left) and, with it, more 2-MeTHF.
    expect(d.residualOriginalSolventWtPct).toBeCloseTo(1.46, 1);
    expect(d.residualOriginalSolventWtPct).toBeGreaterThan(0.5);
    expect(d.profile.length).toBeGreaterThan(10);
    // 2-MeTHF / 2-propanol boil near 60–70 °C at 600 mbar (2-propanol about 69–70 °C).
    for (const p of d.profile) expect(p.potTemperatureC).toBeGreaterThan(50);
    expect(r.steps['swap'].summary['final pot °C'] as number).toBeGreaterThan(65);
    expect(r.steps['swap'].summary['final pot °C'] as number).toBeLessThan(73);
  });
  it('each wash purges its target: the amine by the acid wash, the acid by the bicarbonate wash', () => {
    const kg = (conn: string, id: string) => r.streams[conn].kg[id];
    // c1 → acid wash → c2 → base wash → c3
    expect(kg('c2', 'pw417-amine') / kg('c1', 'pw417-amine')).toBeLessThan(1e-4);
    expect(kg('c2', 'pw417-acid') / kg('c1', 'pw417-acid')).toBeGreaterThan(0.95);
    // Re-pinned with engine 1.0.2: the acid the feed carries now takes part in the wash's charge
    // balance; its neutralisation turns bicarbonate into carbonic acid, which stays dissolved (closed
    // system), so the pH is 7.6–7.8 rather than the 8.3 of the medium alone and about 17 % of the acid
    // stays in the organic phase (was under 10 %). The later steps still purge it more than 1000-fold.
    expect(kg('c3', 'pw417-acid') / kg('c2', 'pw417-acid')).toBeLessThan(0.25);
    expect(kg('c3', 'pw417-acid') / kg('c2', 'pw417-acid')).toBeGreaterThan(0.05);
  });
  it('the crystallisation leaves the impurities in the liquor and loses some product to it', () => {
    expect(r.steps['cool'].warnings.some((w) => w.code === 'co-precipitation')).toBe(false);
    const sat = (r.steps['cool'].details as { saturationKg: Record<string, number> }).saturationKg;
    // Mother-liquor capacity for the product at 5 °C: 5–15 % of the 1 kg charged.
    expect(sat['pw417-amide']).toBeGreaterThan(0.05);
    expect(sat['pw417-amide']).toBeLessThan(0.15);
  });
  it('the cake washes purge what a real cake wash can: thousands, not tens of millions', () => {
    // Two washes of 4.38 retained volumes each. The unbounded washing curve gave
    // 0.2^4.38 = 8.6e-4 per wash and a filtration purge factor of 5.6e7; the stagnant
    // liquor (φ = 0.05, common practice) levels each wash off at
    // R = 0.05 + 0.95 × 0.2^4.38, so the factor is (V_liquor / V_retained) / R².
    const f = r.steps['filter'];
    const d = f.details as {
      retainedLiquorL: number;
      filtrateVolumeL: number;
      washes: Array<{ washRatio: number }>;
    };
    expect(d.washes).toHaveLength(2);
    const R = 0.05 + 0.95 * 0.2 ** d.washes[0].washRatio;
    const hand = (d.retainedLiquorL + d.filtrateVolumeL) / d.retainedLiquorL / R ** 2;
    const factor = f.purge!['deschloro-amide'].purgeFactor!;
    expect(factor).toBeCloseTo(hand, -1);
    expect(factor).toBeGreaterThan(1e3);
    expect(factor).toBeLessThan(1e5);
  });
  it('the acid wash is acidic, the base wash basic', () => {
    expect(r.steps['acid-wash'].summary['pH'] as number).toBeLessThan(1);
    expect(r.steps['base-wash'].summary['pH'] as number).toBeGreaterThan(7.5);
  });
});
