/**
 * Partition checks: Henderson–Hasselbalch (definition), Setschenow
 * arithmetic, Collander relation.
 */
import { describe, expect, it } from 'vitest';
import {
  collanderLogK,
  logDFromLogP,
  neutralFraction,
  setschenowFactor,
} from '@shared/engine/properties';

describe('Henderson–Hasselbalch neutral fractions (definition; pKa values UNVERIFIED (memory))', () => {
  const benzoic = [{ value: 4.2, type: 'acid' as const }]; // benzoic acid pKa 4.20 (memory)
  it('benzoic acid at pH 2: 1/(1 + 10^−2.2) = 0.99373', () => {
    expect(neutralFraction(benzoic, 2)).toBeCloseTo(1 / (1 + 10 ** -2.2), 12);
    expect(neutralFraction(benzoic, 2)).toBeCloseTo(0.99373, 5);
  });
  it('benzoic acid at pH 4.2: 0.5', () => {
    expect(neutralFraction(benzoic, 4.2)).toBeCloseTo(0.5, 12);
  });
  it('benzoic acid at pH 7: 1/(1 + 10^2.8) = 1.582e−3', () => {
    expect(neutralFraction(benzoic, 7)).toBeCloseTo(1.5824e-3, 6);
  });
  it('pyridine (pKa of pyridinium 5.23) at pH 3, 5.23 and 7', () => {
    const py = [{ value: 5.23, type: 'base' as const }];
    expect(neutralFraction(py, 3)).toBeCloseTo(1 / (1 + 10 ** 2.23), 10);
    expect(neutralFraction(py, 5.23)).toBeCloseTo(0.5, 12);
    expect(neutralFraction(py, 7)).toBeCloseTo(0.9833, 4);
  });
  it('a zwitterion (glycine-like: acid 2.34, base 9.60): uncharged fraction is tiny at the isoelectric pH', () => {
    const z = [
      { value: 2.34, type: 'acid' as const },
      { value: 9.6, type: 'base' as const },
    ];
    const pI = (2.34 + 9.6) / 2;
    const f = neutralFraction(z, pI);
    expect(f).toBeCloseTo((1 / (1 + 10 ** (pI - 2.34))) * (1 / (1 + 10 ** (9.6 - pI))), 14);
    expect(f).toBeLessThan(1e-7);
    // the uncharged fraction peaks at the isoelectric point
    expect(f).toBeGreaterThan(neutralFraction(z, pI - 1));
    expect(f).toBeGreaterThan(neutralFraction(z, pI + 1));
  });
  it('log D of benzoic acid (log P 1.88, CRC compilation) at pH 7: −0.92', () => {
    expect(logDFromLogP(1.88, benzoic, 7)).toBeCloseTo(1.88 + Math.log10(1.5824e-3), 4);
    expect(logDFromLogP(1.88, benzoic, 7)).toBeCloseTo(-0.92, 2);
  });
});

describe('Setschenow factor, benzene in NaCl (ks ≈ 0.195 L/mol, UNVERIFIED (memory))', () => {
  it('1 M NaCl: 10^0.195 = 1.5668', () => {
    expect(setschenowFactor(0.195, 1)).toBeCloseTo(1.5668, 4);
  });
  it('saturated brine ≈ 5.4 M: 10^1.053 = 11.30', () => {
    expect(setschenowFactor(0.195, 5.4)).toBeCloseTo(11.298, 2);
  });
});

describe('Collander relation (Leo, Hansch & Elkins, Chem. Rev. 1971, 71, 525; coefficients UNVERIFIED (memory))', () => {
  it('diethyl ether: log K = 1.13·log P − 0.17', () => {
    // benzoic acid, log P 1.88 (CRC compilation) → 1.954
    const r = collanderLogK(1.88, 'diethyl-ether');
    expect(r.logK).toBeCloseTo(1.9544, 4);
    expect([r.a, r.b]).toEqual([1.13, -0.17]);
    expect(r.source.status).toBe('unverified-memory');
  });
  it('reproduces its own regression line within the stated scatter for phenol (ether/water log K ≈ 1.5, memory)', () => {
    const r = collanderLogK(1.48, 'diethyl-ether');
    expect(Math.abs(r.logK - 1.5)).toBeLessThan(2 * 0.2);
  });
  it('1-butanol compresses the scale (slope < 1): log K − log P shrinks for lipophilic solutes', () => {
    const lo = collanderLogK(0, '1-butanol').logK;
    const hi = collanderLogK(3, '1-butanol').logK;
    expect(hi - lo).toBeCloseTo(3 * 0.697, 10);
  });
});
