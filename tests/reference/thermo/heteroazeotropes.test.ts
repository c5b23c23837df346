/**
 * Heteroazeotropes of water at 101.325 kPa, from the liquid model regressed to
 * the library's tabulated mutual solubilities (UNIFAC + a regressed pair term, or
 * NRTL in UNIFAC's place for 2-MeTHF, thermo/nrtl.ts), computed as the three-phase boiling point of a feed inside
 * the miscibility gap (heterogeneousBubblePoint), against handbook tables.
 *
 * Table named per check:
 *  - [AZ-LANGE-CRC] "Azeotrope tables", Lange's Handbook of Chemistry 10th ed.
 *    and CRC Handbook of Chemistry and Physics 44th ed., as compiled on the
 *    public "Azeotrope (data)" page (stored copy read: water–ethyl acetate
 *    70.4 °C, 91.9 wt % ethyl acetate, two layers).
 *  - [CRC-AZ] CRC Handbook of Chemistry and Physics, "Azeotropic Data for
 *    Binary Mixtures" (J. Gmehling et al.): values recalled, not read — marked.
 *
 * The primary tables were searched for again (December 2026) and could not be
 * read: the stored copies of CRC "Azeotropic Data for Binary Mixtures" (the
 * publisher's online edition, 103rd ed., and a 6-210 page copy), of Lange's
 * Handbook Section 5 (Table 5.11 "Binary Azeotropic (Constant-Boiling)
 * Mixtures", whose copy shows only the section's table of contents), of
 * Horsley's "Table of Azeotropes and Nonazeotropes" (Anal. Chem., the
 * supplement; its water section begins past the stored text) and of Horsley's
 * "Azeotropic Data—II" return only their opening pages; the mirrors of the
 * "Azeotrope (data)" compilation stop at water–isopropyl acetate, whose row
 * cites neither handbook. No journal abstract stored states the
 * heteroazeotrope of water with 2-MeTHF, MTBE or isopropyl acetate. The
 * queries are listed in docs/data-sources.md ("Heteroazeotrope tables").
 *
 * Tolerance: 1.5 K on the temperature (the requirement). Each check
 * also pins this implementation's own value to 0.05 K (regression).
 */
import { describe, expect, it } from 'vitest';
import { SOLVENTS, solventById } from '@shared/engine/data';
import { solventVapourPressureData, vapourPressure } from '@shared/engine/thermo/antoine';
import { createVleSystem, heterogeneousBubblePoint } from '@shared/engine/thermo/vle';
import { mutualSolubilityPoint, vleComponentOf } from '@shared/engine/thermo/mutual-solubility';

const water = solventById('water')!;

function heteroazeotropeC(id: string): { T: number; phases: number; regressed: number } {
  const s = solventById(id)!;
  const sys = createVleSystem([vleComponentOf(water, water), vleComponentOf(s, water)]);
  const p = mutualSolubilityPoint(s, water)!;
  const z = 0.5 * (p.xSolventInWater + 1 - p.xWaterInSolvent);
  const r = heterogeneousBubblePoint(sys, [1 - z, z], 101325);
  return { T: r.T_K - 273.15, phases: r.liquidPhases, regressed: sys.regressedPairs.length };
}

const CASES: Array<[string, number, string, number]> = [
  // [solvent id, handbook °C, table, own value °C]
  ['ethyl-acetate', 70.4, '[AZ-LANGE-CRC] (read)', 69.69],
  ['isopropyl-acetate', 76.6, '[CRC-AZ] (recalled)', 76.12],
  ['toluene', 84.1, '[CRC-AZ] (recalled)', 84.41],
  ['n-heptane', 79.2, '[CRC-AZ] (recalled)', 79.21],
  ['mtbe', 52.6, '[CRC-AZ] (recalled)', 52.38],
];

describe('heteroazeotropes of water from the regressed liquid model', () => {
  // 2-MeTHF–water: no term added to UNIFAC reproduces the tabulated phases as a stable split, so
  // NRTL replaces UNIFAC for this binary, with τ = a + b/T fitted to the record's mutual
  // solubilities from 0 to 70.6 °C (thermo/nrtl.ts, regressReplacingWaterPair). The model's value
  // sits 1.5 K above the recalled 71 °C, at the edge of the tolerance: read the handbook table
  // before trusting the last kelvin.
  it('water–2-methyltetrahydrofuran: 71 °C [CRC-AZ] (recalled) within 1.5 K', () => {
    const r = heteroazeotropeC('2-methyltetrahydrofuran');
    expect(r.phases).toBe(2);
    expect(r.regressed).toBe(1);
    expect(r.T).toBeCloseTo(72.49, 1);
    expect(Math.abs(r.T - 71.0)).toBeLessThanOrEqual(1.5);
  });

  for (const [id, handbook, table, own] of CASES) {
    it(`water–${id}: ${handbook} °C ${table} within 1.5 K`, () => {
      const r = heteroazeotropeC(id);
      expect(r.phases).toBe(2);
      expect(r.regressed).toBe(1);
      expect(r.T).toBeCloseTo(own, 1);
      expect(Math.abs(r.T - handbook)).toBeLessThanOrEqual(1.5);
    });
  }
});

/**
 * A bracket computed here, independent of the activity model, for every water pair with tabulated
 * mutual solubilities: at the heteroazeotrope both liquids have the same activities, and in each
 * saturated phase the major component has x ≤ a ≤ 1 when the pair deviates positively from Raoult's
 * law (γ of the major component ≥ 1, as for every pair that splits into two liquids; Prausnitz,
 * Lichtenthaler & de Azevedo, Molecular Thermodynamics of Fluid-Phase Equilibria, ch. 6 — chapter
 * recalled). With the vapour pressures of the library (the same correlations the engine uses) the
 * boiling temperature therefore lies between
 *   T_immiscible:  P_w(T) + P_s(T) = P           (a = 1: mutually insoluble liquids, steam distillation)
 *   T_saturated:   P_w(T) x_w^aq + P_s(T) x_s^org = P   (a = x, with the engine's own phase compositions at T)
 * and it approaches both as the mutual solubilities vanish. A model whose activity of water in the
 * organic phase is wrong (as UNIFAC's was for 2-MeTHF, half the measured one) falls outside.
 */
describe('heteroazeotrope temperature between the insoluble-liquid and saturated-phase Raoult bounds', () => {
  const P = 101325;
  const psat = (id: string, T: number) => {
    const { sets, extra } = solventVapourPressureData(solventById(id)!);
    return vapourPressure(sets, T, extra).pressurePa;
  };
  /** Root of f(T) = 0 on [250 K, 420 K] by bisection (f increasing in T). */
  const solveT = (f: (T: number) => number) => {
    let lo = 250;
    let hi = 420;
    for (let k = 0; k < 80; k++) {
      const m = 0.5 * (lo + hi);
      if (f(m) > 0) hi = m;
      else lo = m;
    }
    return 0.5 * (lo + hi);
  };
  const withData = SOLVENTS.filter((s) => s.id !== 'water' && s.waterMutualSolubility);
  it('covers the heteroazeotrope pairs of the issue', () => {
    const ids = withData.map((s) => s.id);
    for (const id of [
      '2-methyltetrahydrofuran',
      'mtbe',
      'ethyl-acetate',
      'isopropyl-acetate',
      'toluene',
      'n-heptane',
    ])
      expect(ids).toContain(id);
  });
  for (const s of withData) {
    it(`water–${s.id}`, () => {
      const sys = createVleSystem([vleComponentOf(water, water), vleComponentOf(s, water)]);
      const p = mutualSolubilityPoint(s, water)!;
      const z = 0.5 * (p.xSolventInWater + 1 - p.xWaterInSolvent);
      const r = heterogeneousBubblePoint(sys, [1 - z, z], P);
      // Every tabulated pair is partly miscible: two liquids at the boiling point.
      expect(r.liquidPhases).toBe(2);
      const [aq, org] = r.phases!;
      const tImmiscible = solveT((T) => psat('water', T) + psat(s.id, T) - P);
      const tSaturated = solveT((T) => psat('water', T) * aq[0] + psat(s.id, T) * org[1] - P);
      expect(r.T_K).toBeGreaterThanOrEqual(tImmiscible - 1e-3);
      expect(r.T_K).toBeLessThanOrEqual(tSaturated + 1e-3);
    });
  }
});
