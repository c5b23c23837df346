/**
 * Distribution ratios of a wash stage: the activity-coefficient estimate of each compound between
 * the stage's two liquids is kept with the described phases and reused (the neutral partition
 * coefficient of the charge balance, then the distribution at the stage's pH). A reused estimate
 * must be the one a fresh evaluation gives for that compound, phases and temperature.
 */
import { describe, expect, it } from 'vitest';
import { acidBaseInEthylAcetate } from '../../fixtures/routes/acid-base-wash';
import { buildContext } from '../../../shared/engine/route/context';
import {
  compoundDistribution,
  neutralPartitionCoefficient,
  splitLiquid,
} from '../../../shared/engine/unitops/equilibria';

// Two ionisable compounds with UNIFAC groups and no log P or measured D: both distribute by the
// UNIFAC estimate (invented test compounds; groups as in the UNIFAC subgroup table).
const doc = acidBaseInEthylAcetate;

const T = 298.15;
const liquid = { water: 1, etoac: 0.9 };

function stage() {
  const { ctx } = buildContext(doc);
  const sp = splitLiquid(ctx, liquid, T, [], []);
  return { ctx, phases: { organicKg: sp.organicKg, aqueousKg: sp.aqueousKg } };
}

describe('distribution ratios of a wash stage', () => {
  it('reuses no estimate across compounds, and equals a fresh evaluation', () => {
    const { ctx, phases } = stage();
    expect(phases.organicKg.etoac).toBeGreaterThan(0);
    // One context, as a wash stage asks: K of the charge balance for both, then D at pH 7 for both.
    const K = ['acid', 'amine'].map((id) =>
      neutralPartitionCoefficient(ctx, id, 'etoac', undefined, T, phases),
    );
    const D = ['acid', 'amine'].map(
      (id) => compoundDistribution(ctx, id, 'etoac', 7, undefined, T, [], phases).D,
    );
    expect(K[0]).not.toBe(K[1]);
    // Each alone in a fresh context (nothing kept from another request).
    ['acid', 'amine'].forEach((id, i) => {
      const a = stage();
      expect(compoundDistribution(a.ctx, id, 'etoac', 7, undefined, T, [], a.phases).D).toBe(D[i]);
      const b = stage();
      expect(neutralPartitionCoefficient(b.ctx, id, 'etoac', undefined, T, b.phases)).toBe(K[i]);
    });
    for (const d of D) expect(d > 0 && Number.isFinite(d)).toBe(true);
  });
});
