/**
 * Focused checks of pH adjustment, constant-volume and put-and-take solvent
 * swaps, against hand calculations that the tests spell out.
 */
import { describe, expect, it } from 'vitest';
import { evaluateRoute } from '../../../shared/engine/route/evaluate';
import {
  rayleighConstantAlphaResidueFraction,
  rayleighConstantVolume,
  rayleighConstantVolumeFeedRatio,
  rayleighToVolume,
} from '../../../shared/engine/unitops/rayleigh';
import type { RouteDocumentInput } from '../../../shared/schemas/route';

function constantAlpha(alpha: number) {
  return (m: Float64Array) => {
    const x = m[0] / (m[0] + m[1]);
    const y = (alpha * x) / (1 + (alpha - 1) * x);
    return { T_K: 350, P_Pa: 101325, y: [y, 1 - y] };
  };
}

describe('pH adjustment by charge balance', () => {
  // 0.1 mol citric acid (pKa 3.13, 4.76, 6.4; library) in 1 L water, 10 wt %
  // NaOH to pH 4.76 = pKa2. Henderson–Hasselbalch with the pKa values taken
  // one at a time: at pH = pKa2, H2Cit⁻ = HCit²⁻, i.e. 1.5 equivalents of
  // base. With all three equilibria the mean charge of citrate is
  //   z = (K1 H² + 2 K1K2 H + 3 K1K2K3) / (H³ + K1 H² + K1K2 H + K1K2K3) = 1.4996
  // (the H³ and K1K2K3 terms nearly cancel),
  // and the charge balance Na⁺ + H⁺ = z·C_cit + OH⁻ gives
  //   n_NaOH = n_cit · z − ([H⁺] − [OH⁻]) · V.
  const doc: RouteDocumentInput = {
    schemaVersion: 1,
    referenceInput: { componentId: 'p', massKg: 0.001 },
    components: [
      { kind: 'solvent', id: 'water', solventId: 'water' },
      { kind: 'aqueous-solute', soluteId: 'citric-acid' },
      { kind: 'aqueous-solute', soluteId: 'naoh' },
      {
        kind: 'compound',
        id: 'p',
        name: 'neutral test solute (invented)',
        role: 'product',
        molarMassGmol: 200,
      },
    ],
    steps: [
      {
        id: 'feed',
        kind: 'charge',
        name: 'citric acid in water',
        params: {
          temperatureC: 25,
          contents: [
            { kind: 'component', componentId: 'water', amount: 1, unit: 'L' },
            { kind: 'component', componentId: 'citric-acid', amount: 0.1 * 0.192123, unit: 'kg' },
            { kind: 'component', componentId: 'p', amount: 0.001, unit: 'kg' },
          ],
        },
      },
      {
        id: 'ph',
        kind: 'ph-adjust',
        name: 'NaOH to pH 4.76',
        params: { reagentSoluteId: 'naoh', wtPct: 10, targetPH: 4.76, temperatureC: 25 },
      },
    ],
    connections: [
      { id: 'c1', from: { stepId: 'feed', port: 'out' }, to: { stepId: 'ph', port: 'feed' } },
    ],
  };
  const r = evaluateRoute(doc);
  const res = r.steps['ph'];
  const naohMol = (res.addedKg['naoh'] ?? 0) / 0.039997;
  it('starts acidic and reaches the target pH', () => {
    // 0.1 M citric acid alone: pH about 2.1 (pKa1 3.13, weak-acid estimate ½(pKa1 − log C) = 2.07).
    expect(res.summary['start pH'] as number).toBeGreaterThan(1.9);
    expect(res.summary['start pH'] as number).toBeLessThan(2.3);
    expect(res.summary['final pH'] as number).toBeCloseTo(4.76, 2);
  });
  it('needs 1.5 equiv of NaOH (Henderson–Hasselbalch) — 1.4996 with all three pKa values', () => {
    const H = 10 ** -4.76;
    const [K1, K2, K3] = [10 ** -3.13, 10 ** -4.76, 10 ** -6.4];
    const z =
      (K1 * H * H + 2 * K1 * K2 * H + 3 * K1 * K2 * K3) /
      (H ** 3 + K1 * H * H + K1 * K2 * H + K1 * K2 * K3);
    expect(z).toBeCloseTo(1.4996, 4);
    const V = r.terminals[0].stream.volumeM3 * 1000; // L, the final aqueous volume
    const expected = 0.1 * z - (H - 1e-14 / H) * V;
    expect(naohMol / 0.1).toBeGreaterThan(1.49);
    expect(naohMol / 0.1).toBeLessThan(1.52);
    expect(naohMol).toBeCloseTo(expected, 4);
  });
  it('warns instead of adding when the reagent moves the pH the wrong way', () => {
    const d = structuredClone(doc);
    (d.steps[1].params as { targetPH: number }).targetPH = 1;
    const w = evaluateRoute(d).steps['ph'];
    expect(w.warnings.some((x) => x.code === 'wrong-direction')).toBe(true);
    expect(w.addedKg['naoh'] ?? 0).toBe(0);
  });
});

describe('constant-volume swap: closed form for constant α', () => {
  // Pot holdup N constant, feed of pure B at the distillate rate, A more
  // volatile by α. N dx = −y dF with y = αx/(1 + (α − 1)x) integrates to
  //   F/N = [ln(x₀/x) + (α − 1)(x₀ − x)] / α,
  // so x falls nearly as x₀·exp(−αF/N) once x is small. (Derived here; no printed source.)
  it('α = 1 (no enrichment): x = x₀ exp(−F/N), to 0.3 % adaptive to 1e-6 in x', () => {
    const r = rayleighConstantVolume(
      Float64Array.from([100, 0]),
      Float64Array.from([1, 1]),
      1,
      300,
      constantAlpha(1),
    );
    expect(Math.abs(r.moles[0] / (r.moles[0] + r.moles[1]) / Math.exp(-3) - 1)).toBeLessThan(3e-3);
    expect(r.moles[0] + r.moles[1]).toBeCloseTo(100, 9);
  });
  it.each([
    [2.5, 1, 3],
    [4, 0.8, 2],
    [1.6, 0.9, 4],
  ])('α = %f, x₀ = %f, F/N = %f: the integrated x satisfies the closed form', (alpha, x0, FN) => {
    const N = 100;
    const r = rayleighConstantVolume(
      Float64Array.from([N * x0, N * (1 - x0)]),
      Float64Array.from([1, 1]),
      1,
      FN * N,
      constantAlpha(alpha),
    );
    const x = r.moles[0] / (r.moles[0] + r.moles[1]);
    expect(rayleighConstantVolumeFeedRatio(alpha, x0, x) / FN).toBeCloseTo(1, 2);
    // Mass: A distilled + left = A charged; B left + distilled = B charged + fed.
    expect(r.moles[0] + r.distilled[0]).toBeCloseTo(N * x0, 9);
    expect(r.moles[1] + r.distilled[1]).toBeCloseTo(N * (1 - x0) + r.fedMoles, 9);
  });
  it('the residual falls roughly exponentially with the volume fed (slope near −α per pot volume)', () => {
    const alpha = 2.5;
    const xs = [1, 2, 3, 4].map((FN) => {
      const r = rayleighConstantVolume(
        Float64Array.from([50, 50]),
        Float64Array.from([1, 1]),
        1,
        FN * 100,
        constantAlpha(alpha),
      );
      return r.moles[0] / 100;
    });
    for (let i = 1; i < xs.length; i++) {
      const slope = Math.log(xs[i] / xs[i - 1]);
      expect(slope).toBeLessThan(-0.8 * alpha);
      expect(slope).toBeGreaterThan(-1.2 * alpha);
    }
  });
});

describe('put-and-take swap: residual against cycles, constant α', () => {
  // Each cycle: add B to the pot (N_t → N_t + N_add, x → x·N_t/(N_t + N_add)),
  // then simple Rayleigh distillation back to N_t: x_W from the constant-α
  // closed form W/F = N_t/(N_t + N_add), solved by bisection here.
  const alpha = 3;
  const Nt = 30;
  const Nadd = 50;
  function handCycle(x: number): number {
    const xF = (x * Nt) / (Nt + Nadd);
    let lo = 1e-12;
    let hi = xF;
    for (let i = 0; i < 200; i++) {
      const mid = 0.5 * (lo + hi);
      // W/F grows with x_W: residue fraction at mid vs the target.
      if (rayleighConstantAlphaResidueFraction(alpha, xF, mid) > Nt / (Nt + Nadd)) hi = mid;
      else lo = mid;
    }
    return 0.5 * (lo + hi);
  }
  it('each cycle matches the hand calculation, and the residual falls by a nearly constant factor', () => {
    let pot: Float64Array = Float64Array.from([0.5 * Nt, 0.5 * Nt]);
    let xHand = 0.5;
    const xs: number[] = [];
    for (let c = 0; c < 4; c++) {
      pot = Float64Array.from([pot[0], pot[1] + Nadd]);
      const r = rayleighToVolume(pot, Float64Array.from([1, 1]), 0, Nt, constantAlpha(alpha));
      pot = r.moles;
      const x = pot[0] / (pot[0] + pot[1]);
      xHand = handCycle(xHand);
      expect(Math.abs(x / xHand - 1)).toBeLessThan(2e-3);
      xs.push(x);
    }
    // Better than plain dilution (α > 1): every cycle removes more than Nadd/(Nt + Nadd) of A.
    for (let i = 1; i < xs.length; i++) expect(xs[i] / xs[i - 1]).toBeLessThan(Nt / (Nt + Nadd));
    // Nearly geometric once dilute: successive factors within 30 % of each other.
    expect(xs[3] / xs[2] / (xs[2] / xs[1])).toBeGreaterThan(0.7);
    expect(xs[3] / xs[2] / (xs[2] / xs[1])).toBeLessThan(1.3);
  });
});

describe('solvent swaps through the route model (UNIFAC VLE)', () => {
  const base = (mode: unknown): RouteDocumentInput => ({
    schemaVersion: 1,
    referenceInput: { componentId: 'p', massKg: 1 },
    components: [
      { kind: 'solvent', id: 'ethyl-acetate', solventId: 'ethyl-acetate' },
      { kind: 'solvent', id: 'toluene', solventId: 'toluene' },
      {
        kind: 'compound',
        id: 'p',
        name: 'test solute (invented)',
        role: 'product',
        molarMassGmol: 250,
        solubility: [
          {
            solventId: 'toluene',
            temperatureC: 20,
            value: 500,
            unit: 'g/L',
            source: 'invented test value',
          },
          {
            solventId: 'toluene',
            temperatureC: 80,
            value: 900,
            unit: 'g/L',
            source: 'invented test value',
          },
          {
            solventId: 'ethyl-acetate',
            temperatureC: 20,
            value: 500,
            unit: 'g/L',
            source: 'invented test value',
          },
          {
            solventId: 'ethyl-acetate',
            temperatureC: 80,
            value: 900,
            unit: 'g/L',
            source: 'invented test value',
          },
        ],
      },
    ],
    steps: [
      {
        id: 'feed',
        kind: 'charge',
        name: 'feed',
        params: {
          temperatureC: 20,
          contents: [
            { kind: 'component', componentId: 'ethyl-acetate', amount: 8, unit: 'vol' },
            { kind: 'component', componentId: 'p', amount: 1, unit: 'kg' },
          ],
        },
      },
      {
        id: 'swap',
        kind: 'distillation',
        name: 'swap',
        params: { mode, condition: { kind: 'pressure', pressureMbar: 400 } },
      } as RouteDocumentInput['steps'][number],
    ],
    connections: [
      { id: 'c1', from: { stepId: 'feed', port: 'out' }, to: { stepId: 'swap', port: 'feed' } },
    ],
  });
  const residual = (mode: unknown) =>
    (evaluateRoute(base(mode)).steps['swap'].details as { residualOriginalSolventWtPct: number })
      .residualOriginalSolventWtPct;
  it('constant volume: ethyl acetate left falls roughly exponentially with the toluene fed', () => {
    const rs = [8, 16, 24].map((v) =>
      residual({
        kind: 'constant-volume',
        addSolventId: 'toluene',
        addVolume: { value: v, unit: 'vol' },
      }),
    );
    expect(rs[0]).toBeLessThan(50);
    expect(rs[1]).toBeLessThan(rs[0]);
    expect(rs[2]).toBeLessThan(rs[1]);
    const f1 = rs[1] / rs[0];
    const f2 = rs[2] / rs[1];
    expect(f1).toBeLessThan(0.5);
    expect(f2 / f1).toBeGreaterThan(0.5);
    expect(f2 / f1).toBeLessThan(1.5);
  });
  it('put-and-take: the residual falls with every cycle, each better than plain dilution', () => {
    const rs = [1, 2, 3].map((cycles) =>
      residual({
        kind: 'put-and-take',
        cycles,
        targetVolume: { value: 3, unit: 'vol' },
        addSolventId: 'toluene',
        addVolume: { value: 5, unit: 'vol' },
      }),
    );
    // Plain dilution would keep 3/(3 + 5) of the ethyl acetate per cycle.
    for (let i = 1; i < rs.length; i++) expect(rs[i] / rs[i - 1]).toBeLessThan(3 / 8);
  });
  it('the constant-volume profile keeps the pot volume and reports the new solvent fed', () => {
    const r = evaluateRoute(
      base({
        kind: 'constant-volume',
        addSolventId: 'toluene',
        addVolume: { value: 16, unit: 'vol' },
      }),
    ).steps['swap'];
    const d = r.details as {
      profile: Array<{ potVolumeL: number; newSolventAddedL: number }>;
      newSolventAddedL: number;
    };
    const v0 = d.profile[0].potVolumeL;
    for (const p of d.profile) expect(Math.abs(p.potVolumeL / v0 - 1)).toBeLessThan(0.02);
    expect(d.profile[d.profile.length - 1].newSolventAddedL).toBeCloseTo(16, 6);
    for (let i = 1; i < d.profile.length; i++)
      expect(d.profile[i].newSolventAddedL).toBeGreaterThanOrEqual(
        d.profile[i - 1].newSolventAddedL,
      );
  });
  it('the constant-volume swap closes the mass balance of every component to 1e-9', () => {
    const res = evaluateRoute(
      base({
        kind: 'constant-volume',
        addSolventId: 'toluene',
        addVolume: { value: 16, unit: 'vol' },
      }),
    );
    const feed = res.streams['c1'].kg;
    const outs = res.terminals.filter((t) => t.stepId === 'swap');
    expect(outs.length).toBe(2);
    for (const id of ['ethyl-acetate', 'toluene', 'p']) {
      const out = outs.reduce((a, t) => a + t.stream.kg[id], 0);
      const inn = feed[id] + (res.steps['swap'].addedKg[id] ?? 0);
      expect(Math.abs(out - inn)).toBeLessThanOrEqual(1e-9 * Math.max(1, inn));
    }
  });
});
