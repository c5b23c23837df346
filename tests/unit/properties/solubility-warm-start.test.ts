/**
 * The activity-corrected solubility of one liquid solved at many temperatures
 * (createActivitySolubilitySolver), each started from the nearest temperature
 * already solved, against the cold solve (the full scan of
 * solveActivitySolubility) at every temperature, on steep cases near oiling
 * out: where the lowest root jumps between the dilute branch and the
 * solute-rich branch of a liquid–liquid split from one temperature to the
 * next, a warm start from the wrong branch would return the wrong root. And
 * the oiling-out test's flash started from the two liquids of a neighbouring
 * temperature (as Monte Carlo draws do) against the full method.
 */
import { describe, expect, it } from 'vitest';
import {
  createActivitySolubilitySolver,
  idealSolubility,
  liquidPhaseSeparation,
  solveActivitySolubility,
} from '../../../shared/engine/properties/solubility';
import { createUnifacModelCache } from '../../../shared/engine/thermo/unifac';
import { R_J_PER_MOL_K } from '../../../shared/engine/units';

/** Temperatures swept down then up (uneven steps, so no temperature repeats exactly) [K]. */
function sweep(from: number, to: number, down: number, up: number): number[] {
  const t: number[] = [];
  for (let T = to; T >= from; T -= down) t.push(T);
  for (let T = from + 0.1; T <= to; T += up) t.push(T);
  return t;
}

function compare(
  lnGamma: (x: number, T: number) => number,
  xIdeal: (T: number) => number,
  temps: number[],
) {
  const solver = createActivitySolubilitySolver(lnGamma);
  let threeRoots = 0;
  let largestJump = 0;
  let previous = NaN;
  for (const T of temps) {
    const cold = solveActivitySolubility((x) => lnGamma(x, T), xIdeal(T));
    if (cold.signChanges === 3) threeRoots++;
    if (Math.abs(cold.x - previous) > largestJump) largestJump = Math.abs(cold.x - previous);
    previous = cold.x;
    expect(solver.solve(T, xIdeal(T)), `T = ${T} K`).toBe(cold.x);
  }
  return { threeRoots, largestJump, counts: solver.counts };
}

describe('warm-started activity-corrected solubility', () => {
  it('matches the cold solve through a liquid–liquid split that opens with falling temperature (Margules)', () => {
    // Two-suffix Margules ln γ = (660 K / T)(1 − x)²: a split below 330 K (A = 2). Steep ideal
    // solubility, ΔHfus/R = 5000 K, Tm = 302.3 K: near 300 K the solid's activity crosses the split's
    // and the lowest root jumps between x ≈ 0.29 and x ≈ 0.86.
    const r = compare(
      (x, T) => (660 / T) * (1 - x) ** 2,
      (T) => Math.exp(-5000 * (1 / T - 1 / 302.3)),
      sweep(270, 302, 0.53, 0.37),
    );
    expect(r.threeRoots).toBeGreaterThan(0);
    expect(r.largestJump).toBeGreaterThan(0.5);
    expect(r.counts.warm).toBeGreaterThan(5 * r.counts.cold);
  });

  it('matches the cold solve for an aromatic alcohol in water–ethanol near oiling out (UNIFAC)', () => {
    // Solute with ACH ×5, AC, CH2, OH subgroups (benzyl-alcohol-like), in water–ethanol 85:15 mol;
    // Tm 360 K, ΔHfus 30 kJ/mol (solubility rising about 4 %/K at 300 K). Between 275 and 359 K
    // the dilution line has three roots at some temperatures and the lowest root jumps.
    const model = createUnifacModelCache().model([
      { 9: 5, 10: 1, 2: 1, 14: 1 },
      { 16: 1 },
      { 1: 1, 2: 1, 14: 1 },
    ]);
    const xs = new Float64Array(3);
    const buf = new Float64Array(3);
    const r = compare(
      (x, T) => {
        xs[0] = x;
        xs[1] = (1 - x) * 0.85;
        xs[2] = (1 - x) * 0.15;
        return model.lnGammas(xs, T, buf)[0];
      },
      (T) => Math.exp(-(30000 / R_J_PER_MOL_K) * (1 / T - 1 / 360)),
      sweep(275, 359.5, 0.43, 0.71),
    );
    expect(r.threeRoots).toBeGreaterThan(0);
    expect(r.largestJump).toBeGreaterThan(0.1);
    expect(r.counts.warm).toBeGreaterThan(r.counts.cold);
  });

  it('solves a liquid above its melting point as x = 1 and a far temperature cold', () => {
    const lnG = (x: number, T: number) => (300 / T) * (1 - x) ** 2;
    const solver = createActivitySolubilitySolver(lnG);
    expect(solver.solve(300, 1)).toBe(1);
    solver.solve(300, 0.1);
    solver.solve(320, 0.2);
    expect(solver.counts).toEqual({ cold: 2, warm: 0 });
    expect(solver.solve(301, 0.11)).toBe(solveActivitySolubility((x) => lnG(x, 301), 0.11).x);
    expect(solver.counts).toEqual({ cold: 2, warm: 1 });
  });
});

describe('oiling-out test started from a neighbouring split', () => {
  // The greasy solute of the crystallisation tests (UNIFAC ACH ×9, AC, ACCH2, CH2 ×6, CH3;
  // Tm 150 °C, ΔHfus 30 kJ/mol): a liquid–liquid split in the supersaturated region in methanol.
  const solute = { 9: 9, 10: 1, 11: 1, 2: 6, 1: 1 };
  const models = createUnifacModelCache();
  const test = (
    z: number[],
    T: number,
    start?: [number[], number[]],
    onSplit?: (p: [number[], number[]]) => void,
  ) =>
    liquidPhaseSeparation({
      soluteGroups: solute,
      solventGroups: [{ 15: 1 }, { 16: 1 }],
      solventMoleFractions: z,
      T_K: T,
      xIdeal: idealSolubility({ meltingPointK: 423.15, enthalpyFusionJmol: 30000, T_K: T })
        .moleFraction,
      models,
      start,
      onSplit,
    });

  it('finds the split of a cold start at every temperature of a sweep, to the flash tolerance', () => {
    let start: [number[], number[]] | undefined;
    let started = 0;
    for (const z of [
      [1, 0],
      [0.8, 0.2],
    ])
      for (let T = 275; T <= 380; T += 1.7) {
        const cold = test(z, T);
        if (start) started++;
        const warm = test(z, T, start, (p) => (start = p));
        expect(warm.kind, `T = ${T} K`).toBe(cold.kind);
        expect(cold.kind).toBe('metastable');
        expect(Math.abs(Math.log(warm.solventRichX! / cold.solventRichX!))).toBeLessThan(1e-8);
        expect(Math.abs(Math.log(warm.soluteRichX! / cold.soluteRichX!))).toBeLessThan(1e-8);
      }
    expect(started).toBeGreaterThan(100);
  });

  it('finds no split from a start where the liquor has none', () => {
    // Methanol–toluene: a split in methanol alone, none with 20 mol % toluene.
    const withToluene = (z: number[], start?: [number[], number[]]) =>
      liquidPhaseSeparation({
        soluteGroups: solute,
        solventGroups: [{ 15: 1 }, { 9: 5, 11: 1 }],
        solventMoleFractions: z,
        T_K: 300,
        xIdeal: 0.05,
        models,
        start,
        onSplit: (p) => (split = p),
      });
    let split: [number[], number[]] | undefined;
    expect(withToluene([1, 0]).kind).toBe('metastable');
    expect(split).toBeDefined();
    expect(withToluene([0.8, 0.2]).kind).toBe('none');
    expect(withToluene([0.8, 0.2], split).kind).toBe('none');
  });
});
