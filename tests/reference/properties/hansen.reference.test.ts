/**
 * Hansen parameters, distances and blends.
 *
 * Source of the parameters: C. M. Hansen, Hansen Solubility Parameters: A
 * User's Handbook, 2nd ed., CRC 2007, as carried by the public data files
 * CalebBell/chemicals chemicals/Misc/hspipy_hansen_solubility_parameters.tsv
 * (HSPiPy data set), schrier_… and ruben_manuel_… (values read there and
 * collected in the project's reference-data §D; the attribution of the data
 * sets to the handbook is from memory, the numbers were read in the files).
 * Distances are computed by hand from the printed parameters with Hansen's
 * definition Ra² = 4ΔδD² + ΔδP² + ΔδH² (Hansen 2007, ch. 1).
 */
import { describe, expect, it } from 'vitest';
import { hansenDistance, mixtureHansen, relativeEnergyDifference } from '@shared/engine/properties';
import { SOLVENTS } from '@shared/engine/data';
import { estimateHansen } from '@shared/chemistry';

// reference-data §D, read in the named data files (MPa^0.5)
const PRINTED: Record<string, [number, number, number]> = {
  water: [15.5, 16, 42.3],
  methanol: [15.1, 12.3, 22.3],
  ethanol: [15.8, 8.8, 19.4],
  '2-propanol': [15.8, 6.1, 16.4],
  acetone: [15.5, 10.4, 7],
  'ethyl-acetate': [15.8, 5.3, 7.2],
  toluene: [18, 1.4, 2],
  'n-heptane': [15.3, 0, 0],
  'n-hexane': [14.9, 0, 0],
  thf: [16.8, 5.7, 8],
  mtbe: [14.8, 4.3, 5],
  dichloromethane: [18.2, 6.3, 6.1],
  acetonitrile: [15.3, 18, 6.1],
  dmf: [17.4, 13.7, 11.3],
  dmso: [18.4, 16.4, 10.2],
  '1-butanol': [16, 5.7, 15.8],
  'acetic-acid': [14.5, 8, 13.5],
};
const hsp = (k: string) => ({ d: PRINTED[k][0], p: PRINTED[k][1], h: PRINTED[k][2] });

describe('library Hansen parameters vs Hansen handbook values (data files above)', () => {
  for (const id of Object.keys(PRINTED)) {
    it(id, () => {
      const s = SOLVENTS.find((x) => x.id === id);
      expect(s, `library solvent ${id}`).toBeDefined();
      expect(s!.hansen.value).toEqual(hsp(id));
    });
  }
});

describe('Hansen distance Ra, computed by hand from the handbook parameters', () => {
  // toluene–ethanol: 4(18.0−15.8)² + (1.4−8.8)² + (2.0−19.4)² = 19.36 + 54.76 + 302.76 = 376.88 → 19.413
  it('toluene – ethanol: 19.41', () => {
    expect(hansenDistance(hsp('toluene'), hsp('ethanol'))).toBeCloseTo(Math.sqrt(376.88), 10);
    expect(hansenDistance(hsp('toluene'), hsp('ethanol'))).toBeCloseTo(19.41, 2);
  });
  // acetone–water: 4(0)² + (10.4−16)² + (7−42.3)² = 31.36 + 1246.09 = 1277.45 → 35.74
  it('acetone – water: 35.74', () => {
    expect(hansenDistance(hsp('acetone'), hsp('water'))).toBeCloseTo(35.74, 2);
  });
  // ethyl acetate–THF: 4(1.0)² + (0.4)² + (0.8)² = 4 + 0.16 + 0.64 = 4.80 → 2.191
  it('ethyl acetate – THF: 2.19', () => {
    expect(hansenDistance(hsp('ethyl-acetate'), hsp('thf'))).toBeCloseTo(2.191, 3);
  });
  // n-heptane–dichloromethane: 4(2.9)² + 6.3² + 6.1² = 33.64 + 39.69 + 37.21 = 110.54 → 10.514
  it('n-heptane – dichloromethane: 10.51', () => {
    expect(hansenDistance(hsp('n-heptane'), hsp('dichloromethane'))).toBeCloseTo(10.514, 3);
  });
  it('RED with R0 = 8: acetone – water 4.47', () => {
    expect(relativeEnergyDifference(hsp('acetone'), hsp('water'), 8)).toBeCloseTo(35.741 / 8, 3);
  });
});

describe('blend parameters by volume fraction (Hansen 2007, ch. 1)', () => {
  it('50:50 v/v toluene–ethanol: (16.9, 5.1, 10.7)', () => {
    const m = mixtureHansen([
      { params: hsp('toluene'), volumeFraction: 0.5 },
      { params: hsp('ethanol'), volumeFraction: 0.5 },
    ]);
    expect(m.d).toBeCloseTo(16.9, 10);
    expect(m.p).toBeCloseTo(5.1, 10);
    expect(m.h).toBeCloseTo(10.7, 10);
  });
  it('1:3 v/v water–acetone: (15.5, 11.8, 15.825)', () => {
    const m = mixtureHansen([
      { params: hsp('water'), volumeFraction: 1 },
      { params: hsp('acetone'), volumeFraction: 3 },
    ]);
    expect([m.d, m.p, m.h].map((v) => +v.toFixed(4))).toEqual([15.5, 11.8, 15.825]);
  });
});

describe('Hoftyzer–Van Krevelen estimate vs handbook values (screening accuracy)', () => {
  // Molar volumes from the library (M / ρ). Own values tight; handbook loosely:
  // every component within 3.5 MPa^0.5 and Ra(estimate, handbook) < 6.
  const cases: Array<[string, [number, number, number]]> = [
    ['ethanol', [15.42, 8.57, 18.51]],
    ['acetone', [15.26, 10.4, 5.2]],
    ['ethyl-acetate', [15.33, 5.01, 8.46]],
    ['toluene', [17.31, 1.03, 0]],
    ['n-hexane', [14.72, 0, 0]],
    ['1-butanol', [15.73, 5.46, 14.78]],
  ];
  for (const [id, own] of cases) {
    it(id, () => {
      const s = SOLVENTS.find((x) => x.id === id)!;
      const V = s.molarMassGmol.value / s.density.value.gPerMl;
      const r = estimateHansen({ smiles: s.smiles }, { kind: 'measured', cm3mol: V });
      expect(r.ok).toBe(true);
      if (!r.ok) return;
      expect(r.params.d).toBeCloseTo(own[0], 1);
      expect(r.params.p).toBeCloseTo(own[1], 1);
      expect(r.params.h).toBeCloseTo(own[2], 1);
      const ref = hsp(id);
      expect(Math.abs(r.params.d - ref.d)).toBeLessThan(3.5);
      expect(Math.abs(r.params.p - ref.p)).toBeLessThan(3.5);
      expect(Math.abs(r.params.h - ref.h)).toBeLessThan(3.5);
      expect(hansenDistance(r.params, ref)).toBeLessThan(6);
      expect(r.warnings.join(' ')).toMatch(/estimate/);
    });
  }
});
