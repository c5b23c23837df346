import { describe, expect, it } from 'vitest';
import {
  activityCorrectedSolubility,
  fitApelblat,
  fitVantHoff,
  gramsPerLitreToMoleFraction,
  idealSolubility,
  jouybanAcree,
  moleFractionToGramsPerLitre,
} from '@shared/engine/properties/solubility';
import { EngineError } from '@shared/engine/errors';

describe('idealSolubility', () => {
  it('is 1 with a warning at and above the melting point', () => {
    const r = idealSolubility({ meltingPointK: 350, enthalpyFusionJmol: 20000, T_K: 360 });
    expect(r.moleFraction).toBe(1);
    expect(r.warnings.join(' ')).toMatch(/above the melting point/);
  });
  it('falls with falling temperature and rising enthalpy of fusion', () => {
    const a = idealSolubility({
      meltingPointK: 400,
      enthalpyFusionJmol: 20000,
      T_K: 300,
    }).moleFraction;
    const b = idealSolubility({
      meltingPointK: 400,
      enthalpyFusionJmol: 20000,
      T_K: 280,
    }).moleFraction;
    const c = idealSolubility({
      meltingPointK: 400,
      enthalpyFusionJmol: 30000,
      T_K: 300,
    }).moleFraction;
    expect(b).toBeLessThan(a);
    expect(c).toBeLessThan(a);
  });
  it('warns far below the melting point (ΔCp neglected)', () => {
    expect(
      idealSolubility({ meltingPointK: 450, enthalpyFusionJmol: 30000, T_K: 298 }).warnings.join(
        ' ',
      ),
    ).toMatch(/heat-capacity/);
  });
  it('refuses non-physical inputs', () => {
    expect(() => idealSolubility({ meltingPointK: -1, enthalpyFusionJmol: 1, T_K: 300 })).toThrow(
      EngineError,
    );
    expect(() =>
      idealSolubility({ meltingPointK: 300, enthalpyFusionJmol: NaN, T_K: 300 }),
    ).toThrow(/fusion/);
  });
});

describe('activityCorrectedSolubility', () => {
  const base = { meltingPointK: 353.35, enthalpyFusionJmol: 18980, T_K: 298.15 };
  it('equals the ideal solubility when solute and solvent have the same groups (γ = 1)', () => {
    const r = activityCorrectedSolubility({
      ...base,
      soluteGroups: { 9: 6 },
      solventGroups: [{ 9: 6 }],
      solventMoleFractions: [1],
    });
    expect(r.gamma).toBeCloseTo(1, 10);
    expect(r.moleFraction).toBeCloseTo(r.idealMoleFraction, 9);
  });
  it('satisfies x·γ = x_ideal at the returned point', () => {
    const r = activityCorrectedSolubility({
      ...base,
      soluteGroups: { 9: 8, 10: 2 },
      solventGroups: [{ 1: 2, 2: 4 }],
      solventMoleFractions: [1],
    });
    expect(r.moleFraction * r.gamma).toBeCloseTo(r.idealMoleFraction, 8);
    expect(r.moleFraction).toBeLessThan(r.idealMoleFraction);
  });
  it('gives the same answer for a solvent listed twice as halves', () => {
    const one = activityCorrectedSolubility({
      ...base,
      soluteGroups: { 9: 8, 10: 2 },
      solventGroups: [{ 1: 1, 2: 1, 14: 1 }],
      solventMoleFractions: [1],
    });
    const two = activityCorrectedSolubility({
      ...base,
      soluteGroups: { 9: 8, 10: 2 },
      solventGroups: [
        { 1: 1, 2: 1, 14: 1 },
        { 1: 1, 2: 1, 14: 1 },
      ],
      solventMoleFractions: [0.5, 0.5],
    });
    expect(two.moleFraction).toBeCloseTo(one.moleFraction, 10);
  });
  it('refuses solvent fractions that do not sum to 1', () => {
    expect(() =>
      activityCorrectedSolubility({
        ...base,
        soluteGroups: { 9: 6 },
        solventGroups: [{ 9: 6 }],
        solventMoleFractions: [0.8],
      }),
    ).toThrow(/sum to 1/);
  });
  it('warns outside the UNIFAC temperature range', () => {
    const r = activityCorrectedSolubility({
      ...base,
      T_K: 260,
      soluteGroups: { 9: 6 },
      solventGroups: [{ 9: 6 }],
      solventMoleFractions: [1],
    });
    expect(r.warnings.join(' ')).toMatch(/275–425 K/);
  });
});

describe('fitVantHoff / fitApelblat', () => {
  const truthVH = (T: number) => Math.exp(5 - 2500 / T);
  const truthAp = (T: number) => Math.exp(-60 + 1500 / T + 9.5 * Math.log(T));
  const Ts = [283.15, 293.15, 303.15, 313.15, 323.15];
  it("recovers exact van 't Hoff parameters from noise-free points", () => {
    const f = fitVantHoff(Ts.map((T) => ({ T_K: T, moleFraction: truthVH(T) })));
    expect(f.a).toBeCloseTo(5, 8);
    expect(f.b).toBeCloseTo(-2500, 5);
    expect(f.rmseLn).toBeLessThan(1e-10);
    expect(f.predict(300)).toBeCloseTo(truthVH(300), 12);
    expect([f.TminK, f.TmaxK]).toEqual([283.15, 323.15]);
  });
  it('recovers exact Apelblat parameters from noise-free points', () => {
    const f = fitApelblat(Ts.map((T) => ({ T_K: T, moleFraction: truthAp(T) })));
    expect(f.A).toBeCloseTo(-60, 4);
    expect(f.B).toBeCloseTo(1500, 2);
    expect(f.C).toBeCloseTo(9.5, 5);
    expect(f.predict(298.15)).toBeCloseTo(truthAp(298.15), 10);
  });
  it('reports a positive residual for scattered points, and notes an exact two-point fit', () => {
    const pts = Ts.map((T, i) => ({ T_K: T, moleFraction: truthVH(T) * (i % 2 ? 1.05 : 0.95) }));
    expect(fitVantHoff(pts).rmseLn).toBeGreaterThan(0.01);
    expect(fitVantHoff(pts.slice(0, 2)).warnings.join(' ')).toMatch(/exactly/);
  });
  it('refuses too few points, repeated temperatures and mole fractions outside (0, 1]', () => {
    expect(() => fitVantHoff([{ T_K: 300, moleFraction: 0.1 }])).toThrow(/at least 2/);
    expect(() =>
      fitApelblat([
        { T_K: 300, moleFraction: 0.1 },
        { T_K: 300, moleFraction: 0.1 },
        { T_K: 310, moleFraction: 0.2 },
      ]),
    ).toThrow(/distinct/);
    expect(() =>
      fitVantHoff([
        { T_K: 300, moleFraction: 0 },
        { T_K: 310, moleFraction: 0.2 },
      ]),
    ).toThrow(/\(0, 1\]/);
  });
});

describe('jouybanAcree', () => {
  it('reduces to the log-linear model without interaction terms', () => {
    expect(
      jouybanAcree({ lnSolubilities: [-2, -8], fractions: [0.5, 0.5], T_K: 298.15 }),
    ).toBeCloseTo(-5, 12);
    expect(
      jouybanAcree({ lnSolubilities: [-2, -4, -6], fractions: [0.2, 0.3, 0.5], T_K: 298.15 }),
    ).toBeCloseTo(-0.4 - 1.2 - 3, 12);
  });
  it('adds f1·f2/T·ΣJi(f1−f2)^i', () => {
    const J = { J0: 500, J1: 100, J2: 50 };
    const f1 = 0.3;
    const f2 = 0.7;
    const expected =
      f1 * -2 + f2 * -8 + ((f1 * f2) / 300) * (500 + 100 * (f1 - f2) + 50 * (f1 - f2) ** 2);
    expect(
      jouybanAcree({ lnSolubilities: [-2, -8], fractions: [f1, f2], T_K: 300, interaction: J }),
    ).toBeCloseTo(expected, 12);
  });
  it('gives the neat-solvent value at the ends, whatever J', () => {
    expect(
      jouybanAcree({
        lnSolubilities: [-2, -8],
        fractions: [1, 0],
        T_K: 300,
        interaction: { J0: 900, J1: 1, J2: 1 },
      }),
    ).toBeCloseTo(-2, 12);
  });
  it('refuses J for three solvents and fractions not summing to 1', () => {
    expect(() =>
      jouybanAcree({
        lnSolubilities: [-1, -2, -3],
        fractions: [0.2, 0.3, 0.5],
        T_K: 300,
        interaction: { J0: 1, J1: 0, J2: 0 },
      }),
    ).toThrow(/binary/);
    expect(() =>
      jouybanAcree({ lnSolubilities: [-1, -2], fractions: [0.2, 0.3], T_K: 300 }),
    ).toThrow(/sum to 1/);
  });
});

describe('unit helpers', () => {
  const args = {
    soluteMolarMassGmol: 128.17,
    solventMolarMassGmol: 92.14,
    solventDensityGmL: 0.8623,
  };
  it('converts x to g per litre of solvent (worked example in the doc comment)', () => {
    expect(moleFractionToGramsPerLitre({ ...args, moleFraction: 0.1 })).toBeCloseTo(
      (0.1 / 0.9) * ((1000 * 0.8623) / 92.14) * 128.17,
      10,
    );
    expect(moleFractionToGramsPerLitre({ ...args, moleFraction: 0 })).toBe(0);
  });
  it('round-trips', () => {
    for (const x of [1e-6, 0.01, 0.3, 0.9]) {
      const c = moleFractionToGramsPerLitre({ ...args, moleFraction: x });
      expect(gramsPerLitreToMoleFraction({ ...args, gramsPerLitre: c })).toBeCloseTo(x, 12);
    }
  });
  it('refuses x ≥ 1 and negative concentrations', () => {
    expect(() => moleFractionToGramsPerLitre({ ...args, moleFraction: 1 })).toThrow(EngineError);
    expect(() => gramsPerLitreToMoleFraction({ ...args, gramsPerLitre: -1 })).toThrow(
      /Concentration/,
    );
  });
});
