import { describe, expect, it } from 'vitest';
import {
  hansenDistance,
  mixtureHansen,
  relativeEnergyDifference,
} from '@shared/engine/properties/hansen';
import { EngineError } from '@shared/engine/errors';

const toluene = { d: 18.0, p: 1.4, h: 2.0 };
const ethanol = { d: 15.8, p: 8.8, h: 19.4 };

describe('hansenDistance', () => {
  it('is zero for identical parameters and symmetric in its arguments', () => {
    expect(hansenDistance(toluene, toluene)).toBe(0);
    expect(hansenDistance(toluene, ethanol)).toBeCloseTo(hansenDistance(ethanol, toluene), 12);
  });
  it('weights the dispersion difference by 4 (factor 2 on δD)', () => {
    expect(hansenDistance({ d: 16, p: 0, h: 0 }, { d: 15, p: 0, h: 0 })).toBeCloseTo(2, 12);
    expect(hansenDistance({ d: 0, p: 1, h: 0 }, { d: 0, p: 0, h: 0 })).toBeCloseTo(1, 12);
    expect(hansenDistance({ d: 0, p: 0, h: 3 }, { d: 0, p: 0, h: 0 })).toBeCloseTo(3, 12);
  });
  it('refuses negative or non-finite parameters with a coded error', () => {
    expect(() => hansenDistance({ d: -1, p: 0, h: 0 }, toluene)).toThrow(EngineError);
    expect(() => hansenDistance({ d: NaN, p: 0, h: 0 }, toluene)).toThrow(/δD/);
  });
});

describe('relativeEnergyDifference', () => {
  it('is Ra / R0', () => {
    expect(relativeEnergyDifference(toluene, ethanol, 8)).toBeCloseTo(
      hansenDistance(toluene, ethanol) / 8,
      12,
    );
  });
  it('refuses R0 ≤ 0', () => {
    expect(() => relativeEnergyDifference(toluene, ethanol, 0)).toThrow(/R0/);
  });
});

describe('mixtureHansen', () => {
  it('returns the single part unchanged', () => {
    expect(mixtureHansen([{ params: toluene, volumeFraction: 1 }])).toEqual(toluene);
  });
  it('normalises fractions given as volumes', () => {
    const a = mixtureHansen([
      { params: toluene, volumeFraction: 30 },
      { params: ethanol, volumeFraction: 10 },
    ]);
    const b = mixtureHansen([
      { params: toluene, volumeFraction: 0.75 },
      { params: ethanol, volumeFraction: 0.25 },
    ]);
    expect(a.d).toBeCloseTo(b.d, 12);
    expect(a.h).toBeCloseTo(0.75 * 2 + 0.25 * 19.4, 12);
  });
  it('refuses an empty blend, negative fractions and a zero sum', () => {
    expect(() => mixtureHansen([])).toThrow(EngineError);
    expect(() => mixtureHansen([{ params: toluene, volumeFraction: -1 }])).toThrow(/fraction/);
    expect(() => mixtureHansen([{ params: toluene, volumeFraction: 0 }])).toThrow(/zero/);
  });
});
