import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  activityCoefficients,
  createUnifac,
  unifacGroupsSummary,
} from '@shared/engine/thermo/unifac';
import { referenceLnGammas } from '@shared/engine/thermo/unifac-reference';
import { UnifacParameterError } from '@shared/engine/errors';
import {
  UNIFAC_INTERACTION_COUNT,
  UNIFAC_SUBGROUPS,
  mainGroupInteraction,
} from '@shared/engine/data/unifac';

const ethanol = { 1: 1, 2: 1, 14: 1 };
const water = { 16: 1 };
const toluene = { 9: 5, 11: 1 };
const acetone = { 1: 1, 18: 1 };
const ethylAcetate = { 1: 1, 2: 1, 21: 1 };
const heptane = { 1: 2, 2: 5 };
const thf = { 2: 3, 27: 1 };
const dcm = { 47: 1 };
const acetonitrile = { 40: 1 };
const isopropanol = { 1: 2, 3: 1, 14: 1 };
const ten = [
  ethanol,
  water,
  toluene,
  acetone,
  ethylAcetate,
  heptane,
  thf,
  dcm,
  acetonitrile,
  isopropanol,
];

describe('UNIFAC parameter table', () => {
  it('holds all 1270 entries of the data file with spot values (fingerprint)', () => {
    expect(UNIFAC_INTERACTION_COUNT).toBe(1270);
    expect(mainGroupInteraction(1, 7)).toBe(1318);
    expect(mainGroupInteraction(7, 1)).toBe(300);
    expect(mainGroupInteraction(13, 7)).toBe(-314.7);
    expect(mainGroupInteraction(7, 38)).toBeUndefined();
    expect(UNIFAC_SUBGROUPS.get(85)!.R).toBe(3.981);
  });
});

describe('createUnifac', () => {
  it('agrees with the term-by-term reference implementation to 1e-12', () => {
    const model = createUnifac(ten);
    fc.assert(
      fc.property(
        fc.array(fc.double({ min: 0.001, max: 1, noNaN: true }), { minLength: 10, maxLength: 10 }),
        fc.double({ min: 270, max: 450, noNaN: true }),
        (raw, T) => {
          const sum = raw.reduce((a, b) => a + b, 0);
          const x = raw.map((v) => v / sum);
          const fast = model.lnGammas(x, T);
          const slow = referenceLnGammas(ten, x, T);
          slow.forEach((v, i) => expect(Math.abs(fast[i] - v)).toBeLessThan(1e-12));
        },
      ),
      { numRuns: 200 },
    );
  });

  it('gives γ = 1 for a pure component (x_i = 1)', () => {
    const model = createUnifac([ethanol, water, toluene]);
    for (let i = 0; i < 3; i++) {
      const x = [0, 0, 0];
      x[i] = 1;
      expect(model.gammas(x, 320)[i]).toBeCloseTo(1, 13);
    }
  });

  it('satisfies Gibbs–Duhem: Σ x_i d ln γ_i = 0 by central finite differences', () => {
    const model = createUnifac([ethanol, water, toluene, acetone]);
    const x = [0.2, 0.3, 0.1, 0.4];
    const h = 1e-6;
    for (let j = 0; j < 4; j++) {
      // Move along a direction that keeps Σ x = 1: +h on j, −h on the next component.
      const k = (j + 1) % 4;
      const xp = [...x];
      const xm = [...x];
      xp[j] += h;
      xp[k] -= h;
      xm[j] -= h;
      xm[k] += h;
      const gp = model.lnGammas(xp, 330);
      const gm = model.lnGammas(xm, 330);
      const sum = x.reduce((acc, xi, i) => acc + (xi * (gp[i] - gm[i])) / (2 * h), 0);
      expect(Math.abs(sum)).toBeLessThan(1e-7);
    }
  });

  it('uses the cached Ψ(T) correctly when T changes back and forth', () => {
    const model = createUnifac([ethanol, water]);
    const a = Array.from(model.lnGammas([0.3, 0.7], 300));
    model.lnGammas([0.3, 0.7], 350);
    expect(Array.from(model.lnGammas([0.3, 0.7], 300))).toEqual(a);
  });

  it('writes into a given output array and returns it', () => {
    const model = createUnifac([ethanol, water]);
    const out = new Float64Array(2);
    expect(model.gammas([0.5, 0.5], 300, out)).toBe(out);
    expect(out[0]).toBeGreaterThan(1);
  });

  it('names main-group pairs without parameters (H2O–ACF) in a UnifacParameterError', () => {
    const fluorobenzene = { 9: 5, 71: 1 };
    try {
      createUnifac([water, fluorobenzene]);
      expect.unreachable();
    } catch (e) {
      expect(e).toBeInstanceOf(UnifacParameterError);
      const err = e as UnifacParameterError;
      expect(err.code).toBe('unifac-missing-parameters');
      expect(err.gap.missingPairs).toEqual([
        { mainGroupA: 7, mainGroupB: 38, names: ['H2O', 'ACF'] },
      ]);
      expect(err.message).toMatch(/H2O \(7\) – ACF \(38\)/);
    }
  });

  it('refuses an unknown subgroup', () => {
    expect(() => createUnifac([{ 999: 1 }, water])).toThrowError(
      /unknown UNIFAC subgroup\(s\) 999/,
    );
  });

  it('refuses compositions that do not sum to 1, negative or NaN entries, wrong length', () => {
    const model = createUnifac([ethanol, water]);
    expect(() => model.gammas([0.5, 0.6], 300)).toThrowError(/sum to/);
    expect(() => model.gammas([-0.1, 1.1], 300)).toThrowError(/≥ 0/);
    expect(() => model.gammas([NaN, 1], 300)).toThrowError();
    expect(() => model.gammas([1], 300)).toThrowError(/entries/);
    expect(() => model.gammas([0.5, 0.5], -1)).toThrowError(/kelvin/);
  });

  it('activityCoefficients matches the model', () => {
    expect(activityCoefficients([ethanol, water], [0.4, 0.6], 310)).toEqual(
      Array.from(createUnifac([ethanol, water]).gammas([0.4, 0.6], 310)),
    );
  });
});

describe('unifacGroupsSummary', () => {
  it('lists the groups of ethanol with names and main groups', () => {
    expect(unifacGroupsSummary(ethanol)).toEqual([
      { subgroup: 1, name: 'CH3', mainGroup: 1, mainGroupName: 'CH2', count: 1 },
      { subgroup: 2, name: 'CH2', mainGroup: 1, mainGroupName: 'CH2', count: 1 },
      { subgroup: 14, name: 'OH', mainGroup: 5, mainGroupName: 'OH', count: 1 },
    ]);
  });
});
