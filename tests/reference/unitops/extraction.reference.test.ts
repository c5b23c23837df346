/**
 * Multiple-batch extraction and the Kremser equation.
 */
import { describe, expect, it } from 'vitest';
import {
  crossCurrentFractionRemaining,
  kremserFractionRemaining,
} from '../../../shared/engine/unitops/wash';
import { evaluateRoute } from '../../../shared/engine/route/evaluate';
import type { RouteDocumentInput } from '../../../shared/schemas/route';

describe('cross-current extraction, fraction remaining q^n (Harris-style worked example)', () => {
  // Source status: the problem and its printed answers were found on a stored
  // public question-and-answer page (justaaa.com, "Solute A has a K = 3 for an
  // extraction between water (phase 1) and benzene (phase 2)"), which does not
  // name the book. Its wording matches the extraction-efficiency example of
  // Harris, Quantitative Chemical Analysis, chapter "Introduction to Analytical
  // Separations" — that attribution, the edition and the example's place in
  // the book are UNVERIFIED (memory). Printed answers on that page: fraction
  // left in the water q = 0.062 after one 500 mL benzene extraction of 100 mL
  // water, q = 0.00098 after five 100 mL extractions; q = [V1/(V1 + K V2)]^n.
  it('one 500 mL portion leaves 0.062, five 100 mL portions leave 0.00098 (printed, 2 significant figures)', () => {
    const one = crossCurrentFractionRemaining((3 * 500) / 100, 1);
    const five = crossCurrentFractionRemaining((3 * 100) / 100, 5);
    // Regression (tight): the closed form of this implementation.
    expect(one).toBeCloseTo(100 / (100 + 3 * 500), 12);
    expect(five).toBeCloseTo(0.25 ** 5, 12);
    // Validity: the printed values within half a unit of their last digit.
    expect(Math.abs(one - 0.062)).toBeLessThanOrEqual(0.0005 + 1e-12);
    expect(Math.abs(five - 0.00098)).toBeLessThanOrEqual(0.000005);
  });

  // The same example through the wash model: a solute with measured D = 3
  // (toluene/water) in 0.1 L water, five 0.1 L toluene stages. Toluene and
  // water are nearly immiscible (library mutual solubilities), so the model
  // must land within 3 % of q^5.
  it('the wash model reproduces q^n for a nearly immiscible pair', () => {
    const doc: RouteDocumentInput = {
      schemaVersion: 1,
      referenceInput: { componentId: 'solute', massKg: 0.001 },
      components: [
        { kind: 'solvent', id: 'water', solventId: 'water' },
        { kind: 'solvent', id: 'toluene', solventId: 'toluene' },
        {
          kind: 'compound',
          id: 'solute',
          name: 'test solute',
          role: 'product',
          molarMassGmol: 150,
          partition: [{ organicSolventId: 'toluene', D: 3 }],
        },
      ],
      steps: [
        {
          id: 'feed',
          kind: 'charge',
          name: 'feed',
          params: {
            temperatureC: 25,
            contents: [
              { kind: 'component', componentId: 'water', amount: 0.1, unit: 'L' },
              { kind: 'component', componentId: 'solute', amount: 0.001, unit: 'kg' },
            ],
          },
        },
        {
          id: 'x',
          kind: 'extraction',
          name: 'extract',
          params: {
            addedLiquid: {
              kind: 'solvent',
              solventId: 'toluene',
              volume: { value: 0.1, unit: 'L' },
            },
            stages: 5,
            mode: 'cross-current',
            temperatureC: 25,
            keep: 'organic',
          },
        },
      ],
      connections: [
        { id: 'c', from: { stepId: 'feed', port: 'out' }, to: { stepId: 'x', port: 'feed' } },
      ],
    };
    const r = evaluateRoute(doc);
    const aq = r.terminals.find((t) => t.port === 'aqueous')!.stream.kg.solute / 0.001;
    expect(aq).toBeGreaterThan(0.25 ** 5 * 0.97);
    expect(aq).toBeLessThan(0.25 ** 5 * 1.03);
  });
});

describe('counter-current cascade (Kremser equation)', () => {
  // Kremser equation φ = (E − 1)/(E^{N+1} − 1), as given in Wankat, Separation
  // Process Engineering, 3rd edition, chapter 13 (extraction; its summary,
  // seen on a stored publisher page, names the McCabe–Thiele and Kremser
  // methods for immiscible extraction) and Seader, Henley & Roper, Separation Process Principles.
  // UNVERIFIED (memory): no printed Kremser extraction example with its answer
  // could be found in the stored references, so none is asserted. The check is
  // against an independent stage-by-stage solution of the cascade's
  // equilibrium and balance equations, a hand calculation, and the E = 1
  // limit φ = 1/(N + 1).
  it('hand calculation: E = 2, N = 3 leaves (2 − 1)/(2^4 − 1) = 1/15', () => {
    // Stage by stage with y = K x, E = K S/F: x3 = 1/15, x2 = 3/15, x1 = 7/15
    // (each x_{n-1} = (1 + E) x_n − E x_{n+1}, x4 ≡ 0).
    expect(kremserFractionRemaining(2, 3)).toBeCloseTo(1 / 15, 12);
  });
  function stageByStage(E: number, N: number): number {
    // Feed phase F enters stage 1, solvent S enters stage N; y_n = K x_n, E = K S/F.
    // Solve the tridiagonal balance F x_{n-1} + S y_{n+1} = F x_n + S y_n with x_0 = 1, y_{N+1} = 0
    // by Gauss–Seidel iteration to convergence.
    const x = new Array(N + 2).fill(0);
    x[0] = 1;
    for (let it = 0; it < 20000; it++) {
      for (let n = 1; n <= N; n++) {
        const xin = x[n - 1];
        const yin = n < N ? E * x[n + 1] : 0; // in units of F: S·y = E·x
        x[n] = (xin + yin) / (1 + E);
      }
    }
    return x[N];
  }
  it.each([
    [0.5, 3],
    [2, 3],
    [1.5, 6],
    [4, 2],
  ])('E = %f, N = %i matches the stage-by-stage solution', (E, N) => {
    expect(kremserFractionRemaining(E, N)).toBeCloseTo(stageByStage(E, N), 10);
  });
  it('E = 1 gives 1/(N + 1); E = 0 leaves everything', () => {
    expect(kremserFractionRemaining(1, 4)).toBeCloseTo(0.2, 12);
    expect(kremserFractionRemaining(0, 4)).toBe(1);
    expect(kremserFractionRemaining(1e6, 3)).toBeLessThan(1e-17);
  });
  it('counter-current beats cross-current with the same total solvent', () => {
    // Same total solvent split over 3 cross-current stages vs 3 counter-current stages.
    const E = 3;
    expect(kremserFractionRemaining(E, 3)).toBeLessThan(crossCurrentFractionRemaining(E / 3, 3));
  });
});
