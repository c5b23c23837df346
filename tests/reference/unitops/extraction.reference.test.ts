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

describe('cross-current extraction, fraction remaining against the IUPAC definition of the fraction extracted', () => {
  // Source: IUPAC Recommendations 1993, "Nomenclature for liquid–liquid distribution (solvent
  // extraction)", Pure Appl. Chem. 65, 2373 (p. 2384), term "fraction extracted", read in the
  // IUPAC Gold Book (doi 10.1351/goldbook.F02503): if the feed is extracted with n successive
  // portions of solvent at phase volume ratio r (solvent/feed), E_n = 1 − (rD + 1)^−n.
  // Case: D = 3 (a solute three times as concentrated in the added phase), 100 mL feed, either one
  // 500 mL portion (r = 5, n = 1) or five 100 mL portions (r = 1, n = 5).
  const iupacFractionExtracted = (r: number, D: number, n: number) => 1 - (r * D + 1) ** -n;

  it('one 500 mL portion leaves 1/16, five 100 mL portions leave 1/1024 (from the IUPAC expression)', () => {
    const one = crossCurrentFractionRemaining((3 * 500) / 100, 1);
    const five = crossCurrentFractionRemaining((3 * 100) / 100, 5);
    expect(one).toBeCloseTo(1 - iupacFractionExtracted(5, 3, 1), 12);
    expect(five).toBeCloseTo(1 - iupacFractionExtracted(1, 3, 5), 12);
    // The same numbers written out: 0.0625 and 0.0009765625.
    expect(one).toBeCloseTo(0.0625, 12);
    expect(five).toBeCloseTo(0.0009765625, 12);
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
