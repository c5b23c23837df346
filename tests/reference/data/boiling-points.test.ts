/**
 * Normal boiling points against the CRC Handbook of Chemistry and Physics,
 * "Physical Constants of Organic Compounds", as carried by the data file
 * CalebBell/chemicals chemicals/Misc/Physical Constants of Organic Compounds.csv
 * (values in K; see shared/reference-data.md §H). Second source: Yaws,
 * chemicals/Phase Change/Yaws Boiling Points.tsv (reference-data.md §H).
 *
 * Three assertions per solvent:
 *  1. the stored Tb equals the CRC value (tolerance 0.02 K: rounding to 0.01 °C);
 *  2. the Yaws value agrees with it within 1.5 K (independent compilation);
 *  3. the library's preferred Antoine set, solved for 101.325 kPa with the
 *     published form, gives the CRC Tb within 1.0 K.
 */
import { describe, expect, it } from 'vitest';
import { solventById } from '@shared/engine/data';
import type { AntoineSet } from '@shared/engine/data/types';

function antoineBar(set: AntoineSet, T_K: number): number {
  const x = set.form === 'log10-bar-degC' ? T_K - 273.15 + set.C : T_K + set.C;
  return 10 ** (set.A - set.B / x);
}

function boilingPointK(set: AntoineSet): number {
  let lo = 150;
  let hi = 800;
  for (let i = 0; i < 100; i++) {
    const mid = (lo + hi) / 2;
    if (antoineBar(set, mid) > 1.01325) hi = mid;
    else lo = mid;
  }
  return (lo + hi) / 2;
}

// [id, CRC Tb / K, Yaws Tb / °C]
const CRC_TB: Array<[string, number, number]> = [
  ['methanol', 337.65, 64.7],
  ['ethanol', 351.39, 78.29],
  ['2-propanol', 355.36, 82.26],
  ['1-butanol', 390.75, 117.66],
  ['acetone', 329.23, 56.29],
  ['ethyl-acetate', 350.25, 77.06],
  ['isopropyl-acetate', 361.75, 88.5],
  ['toluene', 383.75, 110.63],
  ['n-heptane', 371.53, 98.43],
  ['n-hexane', 341.87, 68.73],
  ['thf', 339.15, 64.85],
  ['2-methyltetrahydrofuran', 353.15, 80.22],
  ['mtbe', 328.25, 55.2],
  ['dichloromethane', 312.95, 39.75],
  ['acetonitrile', 354.75, 81.6],
  ['mibk', 388.85, 116.0],
  ['acetic-acid', 391.05, 118.1],
  ['chloroform', 334.35, 61.18],
  ['1-4-dioxane', 374.35, 101.32],
  ['pyridine', 388.35, 115.26],
  ['cyclohexane', 353.85, 80.72],
  ['o-xylene', 417.55, 144.43],
];

describe('normal boiling points against the CRC Handbook', () => {
  it('checks at least 15 solvents', () => {
    expect(CRC_TB.length).toBeGreaterThanOrEqual(15);
  });

  it.each(CRC_TB)('%s: stored Tb is the CRC value %f K', (id, crcK, yawsC) => {
    const s = solventById(id)!;
    expect(Math.abs(s.boilingPointC.value + 273.15 - crcK)).toBeLessThanOrEqual(0.02);
    expect(Math.abs(yawsC + 273.15 - crcK)).toBeLessThanOrEqual(1.5);
  });

  it.each(
    CRC_TB.filter(([id]) => {
      const s = solventById(id)!;
      const a = s.antoine[0];
      const tb = s.boilingPointC.value + 273.15;
      return a !== undefined && tb >= a.TminK - 10 && tb <= a.TmaxK + 10;
    }),
  )('%s: preferred Antoine set gives the CRC Tb within 1.0 K', (id, crcK) => {
    const set = solventById(id)!.antoine[0];
    expect(Math.abs(boilingPointK(set) - crcK)).toBeLessThanOrEqual(1.0);
  });
});
