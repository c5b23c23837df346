/**
 * Heteroazeotropes of water at 101.325 kPa, from the liquid model regressed to
 * the library's tabulated mutual solubilities (UNIFAC + a regressed pair term,
 * thermo/nrtl.ts), computed as the three-phase boiling point of a feed inside
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
 * Tolerance: 1.5 K on the temperature (the requirement). Each check
 * also pins this implementation's own value to 0.05 K (regression).
 */
import { describe, expect, it } from 'vitest';
import { solventById } from '@shared/engine/data';
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
  // Known failure, kept visible: no two-parameter term added to UNIFAC reproduces the tabulated
  // 2-MeTHF–water phases as a stable split (UNIFAC's own curve for the pair is too far off), so the
  // pair stays on UNIFAC and boils at 76.7 °C against about 71 °C. This test passes while that is so.
  // Measured here (20 °C, the library's 14.4 wt % solvent in water, 4.4 wt % water in solvent):
  // UNIFAC puts water's activity at 0.98 in the water-rich phase but 0.50 in the solvent-rich one
  // (γ_w = 2.75 at x_w = 0.18), so the term must double it there. The two equal-activity equations
  // have roots for NRTL α = 0.1 and 0.15 and for three-suffix Margules (none for α ≥ 0.2, starts
  // −2400…4800 K), but every fitted binary is unstable at the tabulated phases: its Gibbs energy of
  // mixing falls 0.09 RT below their common tangent near x_solvent = 0.995, a second, spurious
  // split. A temperature-dependent fit (the record's inverse solubility, 21.0 % at 0 °C to 6.0 % at
  // 70.6 °C, τ = a + b/T) needs a form that is stable at one temperature first; a pair model that
  // replaces UNIFAC for the binary (rather than adding to it) is the likely way, not done yet.
  it.fails(
    'water–2-methyltetrahydrofuran: 71 °C [CRC-AZ] (recalled) within 1.5 K — known failure',
    () => {
      const r = heteroazeotropeC('2-methyltetrahydrofuran');
      expect(r.regressed).toBe(1);
      expect(Math.abs(r.T - 71.0)).toBeLessThanOrEqual(1.5);
    },
  );

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
