/**
 * Solid solubility: ideal and UNIFAC-corrected, naphthalene.
 *
 * Ideal solubility of naphthalene: J. M. Prausnitz, R. N. Lichtenthaler,
 * E. G. de Azevedo, Molecular Thermodynamics of Fluid-Phase Equilibria, 3rd
 * ed., Prentice Hall 1999, §11.2 — the worked discussion of naphthalene
 * (Tm = 80.2 °C, ΔHfus ≈ 18.98 kJ/mol, x_ideal ≈ 0.30 at 25 °C). The input
 * values and the printed x ≈ 0.30 are UNVERIFIED (memory): the book was not
 * at hand.
 *
 * Measured naphthalene solubilities at 20 °C (mole fraction) in benzene,
 * toluene, CCl4 and n-hexane as tabulated in Prausnitz et al. 1999, Table
 * 11-1 (after Hildebrand & Scott): UNVERIFIED (memory) — values 0.241,
 * 0.224, 0.205, 0.090. The check is loose: UNIFAC within a factor 1.5 of each.
 */
import { describe, expect, it } from 'vitest';
import { activityCorrectedSolubility, idealSolubility } from '@shared/engine/properties';
import { assignUnifacGroups } from '@shared/chemistry';

const NAPHTHALENE = { meltingPointK: 80.2 + 273.15, enthalpyFusionJmol: 18980 };

describe('ideal solubility of naphthalene (Prausnitz et al. 1999, §11.2; memory)', () => {
  it('25 °C: x = 0.302 (own), ≈ 0.30 printed', () => {
    const r = idealSolubility({ ...NAPHTHALENE, T_K: 298.15 });
    expect(r.moleFraction).toBeCloseTo(0.30238, 4);
    expect(Math.abs(r.moleFraction - 0.3)).toBeLessThan(0.01);
    expect(r.method).toMatch(/Schröder/);
  });
  it('20 °C: x = 0.265 (own)', () => {
    expect(idealSolubility({ ...NAPHTHALENE, T_K: 293.15 }).moleFraction).toBeCloseTo(0.26536, 4);
  });
});

describe('UNIFAC-corrected solubility of naphthalene at 20 °C vs measured (Prausnitz et al. 1999, Table 11-1; memory)', () => {
  const solute = assignUnifacGroups({ smiles: 'c1ccc2ccccc2c1' }).groups;
  const cases: Array<[string, string, number, number]> = [
    // solvent, SMILES, own value, printed (memory)
    ['benzene', 'c1ccccc1', 0.2719, 0.241],
    ['toluene', 'Cc1ccccc1', 0.2643, 0.224],
    ['carbon tetrachloride', 'ClC(Cl)(Cl)Cl', 0.2241, 0.205],
    ['n-hexane', 'CCCCCC', 0.1224, 0.09],
  ];
  for (const [name, smiles, own, printed] of cases) {
    it(`${name}: own ${own}, measured ${printed}`, () => {
      const r = activityCorrectedSolubility({
        ...NAPHTHALENE,
        T_K: 293.15,
        soluteGroups: solute,
        solventGroups: [assignUnifacGroups({ smiles }).groups],
        solventMoleFractions: [1],
      });
      expect(r.moleFraction).toBeCloseTo(own, 3);
      expect(Math.abs(Math.log(r.moleFraction / printed))).toBeLessThan(Math.log(1.5));
    });
  }
  it('orders the solvents as measured: aromatic > CCl4 > hexane', () => {
    const x = (smiles: string) =>
      activityCorrectedSolubility({
        ...NAPHTHALENE,
        T_K: 293.15,
        soluteGroups: solute,
        solventGroups: [assignUnifacGroups({ smiles }).groups],
        solventMoleFractions: [1],
      }).moleFraction;
    expect(x('Cc1ccccc1')).toBeGreaterThan(x('ClC(Cl)(Cl)Cl'));
    expect(x('ClC(Cl)(Cl)Cl')).toBeGreaterThan(x('CCCCCC'));
  });
});
