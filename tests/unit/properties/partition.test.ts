import { describe, expect, it } from 'vitest';
import {
  collanderLogK,
  distributionRatio,
  logDFromLogP,
  neutralFraction,
  partitionByActivity,
  setschenowFactor,
} from '@shared/engine/properties/partition';
import { EngineError } from '@shared/engine/errors';
import {
  saturatedPhasesWithWater,
  solventWaterPhase,
  V_WATER_M3MOL,
  WATER_GROUPS,
} from '@shared/engine/properties';
import { solventById } from '@shared/engine/data';
import type { UnifacGroups } from '@shared/engine/data/types';

describe('neutralFraction', () => {
  it('is 1 without ionisable sites', () => {
    expect(neutralFraction([], 7)).toBe(1);
  });
  it('is one half at pH = pKa for an acid and for a base', () => {
    expect(neutralFraction([{ value: 4.2, type: 'acid' }], 4.2)).toBeCloseTo(0.5, 12);
    expect(neutralFraction([{ value: 9.3, type: 'base' }], 9.3)).toBeCloseTo(0.5, 12);
  });
  it('moves in opposite directions with pH for acids and bases', () => {
    expect(neutralFraction([{ value: 4.2, type: 'acid' }], 6)).toBeLessThan(
      neutralFraction([{ value: 4.2, type: 'acid' }], 3),
    );
    expect(neutralFraction([{ value: 9.3, type: 'base' }], 6)).toBeLessThan(
      neutralFraction([{ value: 9.3, type: 'base' }], 11),
    );
  });
  it('multiplies independent sites (diprotic acid)', () => {
    const f = neutralFraction(
      [
        { value: 3, type: 'acid' },
        { value: 5, type: 'acid' },
      ],
      4,
    );
    expect(f).toBeCloseTo((1 / (1 + 10)) * (1 / (1 + 0.1)), 12);
  });
  it('refuses a pH outside −2 … 16 and a malformed site', () => {
    expect(() => neutralFraction([], 20)).toThrow(EngineError);
    expect(() => neutralFraction([{ value: NaN, type: 'acid' }], 7)).toThrow(/pKa/);
  });
});

describe('logDFromLogP', () => {
  it('subtracts log10 of the neutral fraction', () => {
    expect(logDFromLogP(2, [{ value: 5, type: 'acid' }], 5)).toBeCloseTo(2 - Math.log10(2), 12);
    expect(logDFromLogP(2, [], 7)).toBe(2);
  });
});

describe('setschenowFactor', () => {
  it('is 1 without salt and 10^(ks·Cs) otherwise; below 1 for salting-in', () => {
    expect(setschenowFactor(0.2, 0)).toBe(1);
    expect(setschenowFactor(0.2, 2)).toBeCloseTo(10 ** 0.4, 12);
    expect(setschenowFactor(-0.1, 1)).toBeLessThan(1);
  });
  it('refuses a negative concentration', () => {
    expect(() => setschenowFactor(0.2, -1)).toThrow(/Salt/);
  });
});

describe('collanderLogK', () => {
  it('is the identity for octanol itself', () => {
    expect(collanderLogK(1.7, '1-octanol').logK).toBeCloseTo(1.7, 12);
  });
  it('falls back to a = 1, b = 0 with a warning for an unknown solvent', () => {
    const r = collanderLogK(2, 'no-such-solvent');
    expect([r.a, r.b, r.logK]).toEqual([1, 0, 2]);
    expect(r.source.status).toBe('estimated');
    expect(r.warnings.join(' ')).toMatch(/No published Collander/);
  });
  it('says when its coefficients are from memory', () => {
    expect(collanderLogK(1, 'diethyl-ether').warnings.join(' ')).toMatch(/memory/);
  });
});

describe('partitionByActivity', () => {
  const ester = { 1: 1, 2: 1, 21: 1 };
  const water = { 16: 1 };
  it('gives Kx = 1 and Kc = V_aq/V_org for identical phases', () => {
    const phase = { groups: [ester, water], moleFractions: [0.5, 0.5], molarVolumeM3mol: 50e-6 };
    const r = partitionByActivity({
      soluteGroups: { 9: 6 },
      organic: phase,
      aqueous: { ...phase, molarVolumeM3mol: 25e-6 },
      T_K: 298.15,
    });
    expect(r.Kx).toBeCloseTo(1, 10);
    expect(r.Kc).toBeCloseTo(0.5, 10);
  });
  it('puts benzene in the ester phase', () => {
    const r = partitionByActivity({
      soluteGroups: { 9: 6 },
      organic: { groups: [ester, water], moleFractions: [0.87, 0.13], molarVolumeM3mol: 90e-6 },
      aqueous: { groups: [ester, water], moleFractions: [0.017, 0.983], molarVolumeM3mol: 19e-6 },
      T_K: 298.15,
    });
    expect(r.Kc).toBeGreaterThan(10);
    expect(r.gammaAqueous).toBeGreaterThan(r.gammaOrganic);
  });
  it('refuses a non-positive molar volume', () => {
    const phase = { groups: [water], moleFractions: [1], molarVolumeM3mol: 0 };
    expect(() =>
      partitionByActivity({ soluteGroups: { 9: 6 }, organic: phase, aqueous: phase, T_K: 298.15 }),
    ).toThrow(/Molar volume/);
  });
});

describe('distributionRatio', () => {
  const acid = [{ value: 4.2, type: 'acid' as const }];
  it('uses the measurement nearest in pH, and says so', () => {
    const r = distributionRatio({
      solute: {
        logP: 1.9,
        pKa: acid,
        measured: [
          { organicSolventId: 'ethyl-acetate', pH: 7, D: 0.02 },
          { organicSolventId: 'ethyl-acetate', pH: 2, D: 60, source: 'lab notebook 12' },
          { organicSolventId: 'toluene', pH: 2, D: 5 },
        ],
      },
      organic: { solventId: 'ethyl-acetate' },
      aqueous: { pH: 2 },
      T_K: 298.15,
    });
    expect(r.method).toBe('measured');
    expect(r.D).toBe(60);
    expect(r.source.ref).toBe('lab notebook 12');
    expect(r.warnings.join(' ')).toMatch(/nearest in pH/);
  });
  it('shifts a measurement to another pH with the pKa', () => {
    const r = distributionRatio({
      solute: { pKa: acid, measured: [{ organicSolventId: 'mtbe', pH: 2, D: 50 }] },
      organic: { solventId: 'mtbe' },
      aqueous: { pH: 4.2 },
      T_K: 298.15,
    });
    expect(r.D).toBeCloseTo(50 * (0.5 / (1 / (1 + 10 ** (2 - 4.2)))), 10);
    expect(r.warnings.join(' ')).toMatch(/shifted/);
  });
  it('estimates by Collander when logP is given and corrects for pH and salt', () => {
    const r = distributionRatio({
      solute: { logP: 1.88, pKa: acid },
      organic: { solventId: 'diethyl-ether' },
      aqueous: { pH: 4.2, salt: { ks_Lmol: 0.2, molar: 1 } },
      T_K: 298.15,
    });
    expect(r.method).toBe('Collander from logP');
    expect(r.logD).toBeCloseTo(1.13 * 1.88 - 0.17 + Math.log10(0.5) + 0.2, 10);
    expect(r.basis).toBe('molar-concentration');
  });
  it('uses UNIFAC when asked and the inputs are there, else falls back with a warning', () => {
    const g: UnifacGroups[] = [{ 1: 1, 2: 1, 21: 1 }, { 16: 1 }];
    const phases = {
      organic: {
        solventId: 'ethyl-acetate',
        groups: g,
        moleFractions: [0.87, 0.13],
        molarVolumeM3mol: 90e-6,
      },
      aqueous: { groups: g, moleFractions: [0.017, 0.983], molarVolumeM3mol: 19e-6 },
    };
    const act = distributionRatio({
      solute: { logP: 2.13, unifac: { 9: 6 } },
      ...phases,
      T_K: 298.15,
      prefer: 'activity',
    });
    expect(act.method).toBe('activity-coefficients (UNIFAC)');
    expect(act.source.status).toBe('estimated');
    const col = distributionRatio({
      solute: { logP: 2.13 },
      organic: { solventId: 'ethyl-acetate' },
      aqueous: {},
      T_K: 298.15,
      prefer: 'activity',
    });
    expect(col.method).toBe('Collander from logP');
    expect(col.warnings.join(' ')).toMatch(/Collander used/);
  });
  it('warns when an ionisable solute comes without a pH', () => {
    const r = distributionRatio({
      solute: { logP: 1, pKa: acid },
      organic: { solventId: '1-octanol' },
      aqueous: {},
      T_K: 298.15,
    });
    expect(r.logD).toBeCloseTo(1, 12);
    expect(r.warnings.join(' ')).toMatch(/no pH/);
  });
  it('refuses when there is nothing to estimate from', () => {
    expect(() =>
      distributionRatio({
        solute: {},
        organic: { solventId: 'toluene' },
        aqueous: {},
        T_K: 298.15,
      }),
    ).toThrow(/Cannot estimate/);
  });
});

describe('saturatedPhasesWithWater: the mutually saturated phases from the tabulated solubilities', () => {
  // Ethyl acetate–water as the library tabulates it (8 wt % ester in water, 3 wt % water in the
  // ester, 20 °C); mole fractions by hand from the masses: organic x_W = (3/18.015)/(3/18.015 +
  // 97/88.11) = 0.13139; aqueous x_S = (8/88.11)/(8/88.11 + 92/18.015) = 0.017469.
  const ester = solventById('ethyl-acetate')!;
  const phases = saturatedPhasesWithWater(ester);

  it('reads the compositions by hand, components ordered [solvent, water] and [water, solvent]', () => {
    expect(ester.waterMutualSolubility!.value).toMatchObject({
      solventInWaterWtPct: 8,
      waterInSolventWtPct: 3,
    });
    expect(phases.organic.moleFractions[1]).toBeCloseTo(0.13139, 4);
    expect(phases.aqueous.moleFractions[1]).toBeCloseTo(0.017469, 5);
    expect(phases.organic.groups).toEqual([ester.unifac.value, WATER_GROUPS]);
    expect(phases.aqueous.groups).toEqual([WATER_GROUPS, ester.unifac.value]);
    expect(phases.warnings).toEqual([]);
  });

  it('molar volumes by ideal mixing, between the pure liquids', () => {
    const vEster = (ester.molarMassGmol.value / ester.density.value.gPerMl) * 1e-6;
    const x = phases.organic.moleFractions[1];
    expect(phases.organic.molarVolumeM3mol).toBeCloseTo((1 - x) * vEster + x * V_WATER_M3MOL, 12);
    expect(phases.aqueous.molarVolumeM3mol).toBeGreaterThan(V_WATER_M3MOL);
    expect(phases.aqueous.molarVolumeM3mol).toBeLessThan(vEster);
  });

  it('pure phases with a warning when no mutual solubility is tabulated, and refuses water outside 0–100 wt %', () => {
    const bare = { ...ester, waterMutualSolubility: undefined };
    const p = saturatedPhasesWithWater(bare);
    expect(p.organic.moleFractions).toEqual([1, 0]);
    expect(p.aqueous.moleFractions).toEqual([1, 0]);
    expect(p.warnings[0]).toMatch(/No curated mutual solubility of Ethyl acetate with water/);
    expect(() => solventWaterPhase(ester, 101)).toThrow(EngineError);
  });
});
