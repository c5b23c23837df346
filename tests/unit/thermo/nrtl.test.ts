import { describe, expect, it } from 'vitest';
import { solventById } from '@shared/engine/data';
import { addPairLnGammas, binaryStableAt, type RegressedPair } from '@shared/engine/thermo/nrtl';
import { createUnifac } from '@shared/engine/thermo/unifac';
import { createVleSystem, liquidLiquidSplit } from '@shared/engine/thermo/vle';
import {
  mutuallySaturatedPhases,
  mutualSolubilityPoint,
  vleComponentOf,
} from '@shared/engine/thermo/mutual-solubility';

const water = solventById('water')!;

/** ln γ of the pair terms alone at x. */
function pairLnGammas(x: number[], T: number, pairs: RegressedPair[]): Float64Array {
  const out = new Float64Array(x.length);
  addPairLnGammas(x, T, pairs, out);
  return out;
}

describe('pair terms (NRTL and Margules)', () => {
  it('binary NRTL matches the two-component formula of Renon & Prausnitz (1968)', () => {
    const T = 300;
    const [t12, t21, a] = [1.2, 0.4, 0.3];
    const pair: RegressedPair = {
      water: 0,
      solvent: 1,
      kind: 'nrtl',
      p1: t12 * T,
      p2: t21 * T,
      alpha: a,
    };
    const x1 = 0.3;
    const x2 = 0.7;
    const G12 = Math.exp(-a * t12);
    const G21 = Math.exp(-a * t21);
    const ln1 = x2 ** 2 * (t21 * (G21 / (x1 + x2 * G21)) ** 2 + (t12 * G12) / (x2 + x1 * G12) ** 2);
    const ln2 = x1 ** 2 * (t12 * (G12 / (x2 + x1 * G12)) ** 2 + (t21 * G21) / (x1 + x2 * G21) ** 2);
    const r = pairLnGammas([x1, x2], T, [pair]);
    expect(r[0]).toBeCloseTo(ln1, 12);
    expect(r[1]).toBeCloseTo(ln2, 12);
  });

  it.each(['nrtl', 'margules'] as const)(
    '%s terms obey Gibbs–Duhem in a ternary (Σ x_i d ln γ_i = 0, finite differences)',
    (kind) => {
      const T = 320;
      const pairs: RegressedPair[] = [
        { water: 0, solvent: 1, kind, p1: 700, p2: 300, alpha: kind === 'nrtl' ? 0.2 : 0 },
        { water: 0, solvent: 2, kind, p1: -200, p2: 900, alpha: kind === 'nrtl' ? 0.3 : 0 },
      ];
      const x = [0.2, 0.5, 0.3];
      const h = 1e-6;
      const base = pairLnGammas(x, T, pairs);
      // Move along x0 ↑, x1 ↓ (keeping Σx = 1).
      const moved = pairLnGammas([x[0] + h, x[1] - h, x[2]], T, pairs);
      let s = 0;
      for (let i = 0; i < 3; i++) s += x[i] * (moved[i] - base[i]);
      expect(Math.abs(s / h)).toBeLessThan(1e-5);
    },
  );
});

describe('regression to tabulated mutual solubilities', () => {
  it.each(['ethyl-acetate', 'isopropyl-acetate', 'mtbe', 'toluene', 'n-heptane', '1-butanol'])(
    '%s–water: the flash of the fitted model returns the tabulated phases at their temperature',
    (id) => {
      const s = solventById(id)!;
      const p = mutualSolubilityPoint(s, water)!;
      const r = mutuallySaturatedPhases(s, water, p.T_K);
      expect(r.basis).toBe('regressed');
      if (!r.split) throw new Error('no split');
      const ms = s.waterMutualSolubility!.value;
      expect(r.aqueous.solventWtPct / ms.solventInWaterWtPct).toBeCloseTo(1, 2);
      expect(r.organic.waterWtPct / ms.waterInSolventWtPct).toBeCloseTo(1, 2);
    },
  );

  it('UNIFAC alone misses the MTBE–water phases by a factor of 3–8; the regressed model does not', () => {
    const s = solventById('mtbe')!;
    const p = mutualSolubilityPoint(s, water)!;
    const plain = createVleSystem([
      { ...vleComponentOf(water), isWater: false },
      { ...vleComponentOf(s), mutualSolubilityWithWater: undefined },
    ]);
    const z = 0.5 * (p.xSolventInWater + 1 - p.xWaterInSolvent);
    const u = liquidLiquidSplit(plain, [1 - z, z], p.T_K);
    if (!u.split) throw new Error('UNIFAC predicts no split');
    expect(u.phases[1][0] / p.xWaterInSolvent).toBeGreaterThan(3);
  });

  it('the fitted binaries are globally stable at their tabulated phases', () => {
    for (const id of ['ethyl-acetate', 'mtbe', 'toluene']) {
      const s = solventById(id)!;
      const p = mutualSolubilityPoint(s, water)!;
      const sys = createVleSystem([vleComponentOf(water, water), vleComponentOf(s, water)]);
      expect(binaryStableAt(sys.unifac, p.xSolventInWater, 1 - p.xWaterInSolvent, p.T_K)).toBe(
        true,
      );
      // …and plain UNIFAC is not at the same phases (the test can tell them apart).
      const u = createUnifac([water.unifac.value, s.unifac.value]);
      expect(binaryStableAt(u, p.xSolventInWater, 1 - p.xWaterInSolvent, p.T_K)).toBe(false);
    }
  });
});
