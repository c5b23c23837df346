/**
 * Crystallisation and filtration where the models used to break: a minor
 * solvent without solubility data, Jouyban–Acree interaction terms, oiling
 * out far from the melting point, cake-wash displacement beyond one retained
 * volume, and the wash's rate of dissolving the cake. Every compound here is
 * invented.
 */
import { describe, expect, it } from 'vitest';
import { evaluateRoute, parseRoute } from '../../../shared/engine/route/evaluate';
import { buildContext } from '../../../shared/engine/route/context';
import { solubilityIn } from '../../../shared/engine/unitops/solubility-model';
import {
  approachToSaturation,
  washRemainingFraction,
} from '../../../shared/engine/unitops/filtration';
import {
  activityCorrectedSolubility,
  jouybanAcree,
  solveActivitySolubility,
} from '../../../shared/engine/properties/solubility';
import type { RouteDocumentInput } from '../../../shared/schemas/route';
import type { EngineWarning, MethodUsed } from '../../../shared/engine/route/types';

type Compound = Extract<RouteDocumentInput['components'][number], { kind: 'compound' }>;
type Step = RouteDocumentInput['steps'][number];

/** Invented product measured only in ethyl acetate: 150 g/L at 60 °C, 16 g/L at 5 °C; no melting data. */
const product: Compound = {
  kind: 'compound',
  id: 'p',
  name: 'product (invented)',
  role: 'product',
  molarMassGmol: 300,
  densityGmL: 1.25,
  solubility: [
    { solventId: 'ethyl-acetate', temperatureC: 60, value: 150, unit: 'g/L' },
    { solventId: 'ethyl-acetate', temperatureC: 5, value: 16, unit: 'g/L' },
    { solventId: 'n-heptane', temperatureC: 5, value: 2, unit: 'g/L' },
  ],
};

function coolingRoute(waterVol: number, extra: Step[] = [], p: Compound = product) {
  const contents: Array<Record<string, unknown>> = [
    { kind: 'component', componentId: 'ethyl-acetate', amount: 10, unit: 'vol' },
    { kind: 'component', componentId: 'p', amount: 1, unit: 'kg' },
  ];
  if (waterVol > 0)
    contents.push({ kind: 'component', componentId: 'water', amount: waterVol, unit: 'vol' });
  const doc = {
    schemaVersion: 1,
    referenceInput: { componentId: 'p', massKg: 1 },
    components: [
      { kind: 'solvent', id: 'ethyl-acetate', solventId: 'ethyl-acetate' },
      { kind: 'solvent', id: 'water', solventId: 'water' },
      { kind: 'solvent', id: 'n-heptane', solventId: 'n-heptane' },
      p,
    ],
    steps: [
      { id: 'c', kind: 'charge', name: 'c', params: { temperatureC: 60, contents } },
      {
        id: 'x',
        kind: 'crystallisation',
        name: 'x',
        params: { mode: { kind: 'cooling', startC: 60, endC: 5 }, seeded: true },
      },
      ...extra,
    ],
    connections: [
      { id: 'k1', from: { stepId: 'c', port: 'out' }, to: { stepId: 'x', port: 'feed' } },
      ...(extra.length
        ? [{ id: 'k2', from: { stepId: 'x', port: 'slurry' }, to: { stepId: 'f', port: 'slurry' } }]
        : []),
    ],
  } as RouteDocumentInput;
  return evaluateRoute(doc);
}

describe('a minor solvent without solubility data', () => {
  // By hand: 10 L ethyl acetate dissolve 16 g/L × 10 L = 0.16 kg at 5 °C, so 0.84 of the 1 kg
  // crystallises (the van 't Hoff line through the two points gives 16 g/L at 5 °C exactly; the
  // g/L are per litre of solvent).
  const dry = coolingRoute(0);
  const wet = coolingRoute(0.2); // 2 vol % water left from the washes
  it('gives the hand-calculated yield without the water', () => {
    expect(dry.steps.x.summary['yield %']).toBeCloseTo(84, 0);
  });
  it('does not collapse the yield when 2 vol % water has no data; it states the assumption', () => {
    const y = wet.steps.x.summary['yield %'] as number;
    // The water is assumed to dissolve the product per litre like ethyl acetate: 0.2 L more
    // solvent, 0.16 × 10.2/10 = 0.1632 kg dissolved, 83.68 % yield.
    expect(y).toBeCloseTo(83.68, 1);
    const w = wet.steps.x.warnings.find((x) => x.code === 'solubility-solvent-assumed');
    expect(w?.severity).toBe('warning');
    expect(w?.message).toMatch(/Water/);
    expect(w?.message).toMatch(/vol %/);
  });
  it('keeps a compound with no data in any solvent dissolved, and says so', () => {
    const bare: Compound = { ...product, solubility: [] };
    const r = coolingRoute(0, [], bare);
    expect(r.steps.x.summary['yield %']).toBe(0);
    expect(r.steps.x.warnings.some((x) => x.code === 'no-solubility-data')).toBe(true);
  });
});

describe('Jouyban–Acree with the chemist’s interaction terms', () => {
  const withJ: Compound = {
    ...product,
    solubility: [
      { solventId: 'ethanol', temperatureC: 25, value: 0.02, unit: 'mole-fraction' },
      { solventId: 'water', temperatureC: 25, value: 1e-5, unit: 'mole-fraction' },
    ],
    cosolvency: [{ solventIds: ['ethanol', 'water'], J0: 800, J1: -300, J2: 100, basis: 'mass' }],
  };
  const doc = parseRoute({
    schemaVersion: 1,
    referenceInput: { componentId: 'p', massKg: 1 },
    components: [
      { kind: 'solvent', id: 'ethanol', solventId: 'ethanol' },
      { kind: 'solvent', id: 'water', solventId: 'water' },
      withJ,
    ],
    steps: [
      {
        id: 'c',
        kind: 'charge',
        name: 'c',
        params: {
          temperatureC: 25,
          contents: [{ kind: 'component', componentId: 'p', amount: 1, unit: 'kg' }],
        },
      },
    ],
    connections: [],
  });
  const { ctx } = buildContext(doc);
  it('uses the J terms on their fraction basis (mass): the hand formula', () => {
    const W: EngineWarning[] = [];
    const M: MethodUsed[] = [];
    const kg = { ethanol: 3, water: 1, p: 0 };
    const s = solubilityIn(ctx, 'p', kg, 298.15, W, M)!;
    const f1 = 0.75;
    const f2 = 0.25;
    const lnX =
      f1 * Math.log(0.02) +
      f2 * Math.log(1e-5) +
      ((f1 * f2) / 298.15) * (800 - 300 * (f1 - f2) + 100 * (f1 - f2) ** 2);
    expect(Math.log(s.x)).toBeCloseTo(lnX, 9);
    expect(s.method).toMatch(/interaction terms \(mass fractions\)/);
    // Without the J terms the blend is log-linear on volume fractions: a different number.
    const plain = jouybanAcree({
      lnSolubilities: [Math.log(0.02), Math.log(1e-5)],
      fractions: [0.5, 0.5],
      T_K: 298.15,
    });
    expect(Math.abs(Math.log(s.x) - plain)).toBeGreaterThan(0.1);
  });
});

describe('oiling out from the liquid–liquid split, far from the melting point', () => {
  // An invented greasy aryl-alkyl compound (Tm 150 °C) in methanol at 20 °C, 130 K below its
  // melting point: UNIFAC splits its subcooled liquid from methanol.
  const greasy: Compound = {
    kind: 'compound',
    id: 'g',
    name: 'greasy aryl alkane (invented)',
    role: 'product',
    molarMassGmol: 260,
    meltingPointC: 150,
    enthalpyFusionKJmol: 30,
    unifac: { '9': 9, '10': 1, '11': 1, '2': 6, '1': 1 },
  };
  function route(kgProduct: number, startC = 60) {
    return evaluateRoute({
      schemaVersion: 1,
      referenceInput: { componentId: 'g', massKg: 1 },
      components: [{ kind: 'solvent', id: 'methanol', solventId: 'methanol' }, greasy],
      steps: [
        {
          id: 'c',
          kind: 'charge',
          name: 'c',
          params: {
            temperatureC: startC,
            contents: [
              { kind: 'component', componentId: 'methanol', amount: 10, unit: 'vol' },
              { kind: 'component', componentId: 'g', amount: kgProduct, unit: 'kg' },
            ],
          },
        },
        {
          id: 'x',
          kind: 'crystallisation',
          name: 'x',
          params: { mode: { kind: 'cooling', startC, endC: 20 }, seeded: false },
        },
      ],
      connections: [
        { id: 'k', from: { stepId: 'c', port: 'out' }, to: { stepId: 'x', port: 'feed' } },
      ],
    } as RouteDocumentInput);
  }
  it('warns when the liquor would pass the solvent-rich binodal', () => {
    // 3 kg in 10 L methanol: x = 0.045 in all, beyond the solvent-rich binodal (x ≈ 0.033).
    const r = route(3);
    const w = r.steps.x.warnings.filter((x) => x.code === 'oiling-out');
    expect(w).toHaveLength(1);
    expect(w[0].severity).toBe('warning');
    expect(w[0].message).toMatch(/liquid–liquid split/);
    expect(w[0].message).not.toMatch(/melting point/);
  });
  it('stays quiet for a dilute liquor below the binodal', () => {
    const r = route(0.01);
    expect(r.steps.x.warnings.some((x) => x.code === 'oiling-out')).toBe(false);
  });
  it('says when the test cannot be made (no UNIFAC groups)', () => {
    const r = coolingRoute(0);
    expect(r.steps.x.warnings.some((x) => x.code === 'oiling-out-not-tested')).toBe(true);
  });
  it('the calculation API and the unit operation solve the same solubility', () => {
    const api = activityCorrectedSolubility({
      meltingPointK: 423.15,
      enthalpyFusionJmol: 30000,
      T_K: 293.15,
      soluteGroups: { 9: 9, 10: 1, 11: 1, 2: 6, 1: 1 },
      solventGroups: [{ 15: 1 }],
      solventMoleFractions: [1],
    });
    const { ctx } = buildContext(
      parseRoute({
        schemaVersion: 1,
        referenceInput: { componentId: 'g', massKg: 1 },
        components: [{ kind: 'solvent', id: 'methanol', solventId: 'methanol' }, greasy],
        steps: [
          {
            id: 'c',
            kind: 'charge',
            name: 'c',
            params: {
              temperatureC: 20,
              contents: [{ kind: 'component', componentId: 'g', amount: 1, unit: 'kg' }],
            },
          },
        ],
        connections: [],
      }),
    );
    const unitop = solubilityIn(ctx, 'g', { methanol: 1, g: 0 }, 293.15, [], [])!;
    expect(unitop.x).toBeCloseTo(api.moleFraction, 12);
    expect(api.oilingOut.kind).toBe('metastable');
  });
  it('a temperature started from one already solved gives the solubility of a cold solve to the bit', () => {
    // The greasy solute in methanol has a liquid–liquid split in its supersaturated region (above);
    // one context solves each temperature of a sweep down and up, starting from the nearest one
    // solved (as Monte Carlo draws of the end temperature do); a fresh context solves it cold.
    const doc = () =>
      parseRoute({
        schemaVersion: 1,
        referenceInput: { componentId: 'g', massKg: 1 },
        components: [{ kind: 'solvent', id: 'methanol', solventId: 'methanol' }, greasy],
        steps: [
          {
            id: 'c',
            kind: 'charge',
            name: 'c',
            params: {
              temperatureC: 20,
              contents: [{ kind: 'component', componentId: 'g', amount: 1, unit: 'kg' }],
            },
          },
        ],
        connections: [],
      });
    const { ctx } = buildContext(doc());
    const temps: number[] = [];
    for (let T = 335; T >= 275; T -= 0.61) temps.push(T);
    for (let T = 275.3; T <= 335; T += 0.83) temps.push(T);
    for (const T of temps) {
      const warm = solubilityIn(ctx, 'g', { methanol: 1, g: 0 }, T, [], [])!;
      const cold = solubilityIn(buildContext(doc()).ctx, 'g', { methanol: 1, g: 0 }, T, [], [])!;
      expect(warm.x, `T = ${T} K`).toBe(cold.x);
    }
  });
});

describe('the shared solubility root on a model with a liquid–liquid split', () => {
  // Two-suffix Margules ln γ = A(1 − x)², A = 3: a split with binodal x ≈ 0.0707 / 0.9293
  // (symmetric; ln(x/(1 − x)) = A(2x − 1)) and solute activity 0.944 there.
  const lnG = (x: number) => 3 * (1 - x) ** 2;
  it('finds one root when the solid is less soluble than the split (metastable oil)', () => {
    const r = solveActivitySolubility(lnG, 0.5);
    expect(r.signChanges).toBe(1);
    expect(Math.log(r.x) + lnG(r.x)).toBeCloseTo(Math.log(0.5), 10);
  });
  it('finds three sign changes and reports the lowest root when the oil is stable', () => {
    const r = solveActivitySolubility(lnG, 0.95);
    expect(r.signChanges).toBe(3);
    // On the dilute branch: between the binodal (0.0707) and the spinodal (0.211).
    expect(r.x).toBeGreaterThan(0.0707);
    expect(r.x).toBeLessThan(0.211);
    expect(Math.log(r.x) + lnG(r.x)).toBeCloseTo(Math.log(0.95), 10);
  });
});

describe('cake wash', () => {
  it('without a stagnant fraction the mobile liquor follows R(W) = max(1 − W, (1 − E)^W)', () => {
    expect(washRemainingFraction(1, 0.8, 0)).toBeCloseTo(0.2, 12);
    expect(washRemainingFraction(2, 0.8, 0)).toBeCloseTo(0.04, 12);
    expect(washRemainingFraction(5, 0.8, 0)).toBeCloseTo(0.2 ** 5, 12);
    // Plug-flow bound: half a retained volume cannot displace more than half.
    expect(washRemainingFraction(0.5, 0.8, 0)).toBeCloseTo(0.5, 12);
    expect(washRemainingFraction(0, 0.8, 0)).toBe(1);
  });
  it('levels off at the stagnant fraction however large the wash (R = φ + (1 − φ) R_mobile)', () => {
    // Hand values with φ = 0.05, E = 0.8: R(1) = 0.05 + 0.95 × 0.2 = 0.24; R(2) = 0.05 + 0.95 × 0.04.
    expect(washRemainingFraction(1, 0.8)).toBeCloseTo(0.24, 12);
    expect(washRemainingFraction(2, 0.8)).toBeCloseTo(0.088, 12);
    expect(washRemainingFraction(0, 0.8)).toBe(1);
    // Large washes: 20, 100 and infinitely many retained volumes all leave φ (the old curve
    // gave 0.2^20 = 1e-14 and 0.2^100 = 1e-70).
    expect(washRemainingFraction(20, 0.8)).toBeCloseTo(0.05, 12);
    expect(washRemainingFraction(100, 0.8)).toBe(0.05);
    expect(washRemainingFraction(Infinity, 0.8)).toBe(0.05);
    // Steep case: perfect displacement (E = 1) of the mobile liquor still leaves φ.
    expect(washRemainingFraction(1.5, 1)).toBe(0.05);
    expect(washRemainingFraction(1.5, 1, 0.2)).toBe(0.2);
    // Continuous and non-increasing in W over a fine scan, never below φ.
    let last = 1;
    for (let W = 0; W <= 30; W += 0.01) {
      const R = washRemainingFraction(W, 0.8);
      expect(R).toBeLessThanOrEqual(last + 1e-15);
      expect(last - R).toBeLessThan(0.011);
      expect(R).toBeGreaterThanOrEqual(0.05);
      last = R;
    }
  });
  it('the approach to saturation falls with crystal size and rises with contact time', () => {
    const base = {
      solidVolumeM3: 8e-4,
      poreVolumeM3: 5e-4,
      residenceTimeS: 60,
      T_K: 278.15,
      viscosityPaS: 5e-4,
      soluteMolarVolumeM3: 2.4e-4,
    };
    const fine = approachToSaturation({ ...base, crystalSizeM: 20e-6 });
    const coarse = approachToSaturation({ ...base, crystalSizeM: 2000e-6 });
    expect(fine).toBeGreaterThan(0.99);
    expect(coarse).toBeLessThan(0.3);
    // Hand value: D = kT/(6πμr), r = (3Vm/4πNA)^(1/3); η = 1 − exp(−(2D/d)(6Vs/(d Vr)) τ).
    const r = Math.cbrt((3 * 2.4e-4) / (4 * Math.PI * 6.02214076e23));
    const D = (1.380649e-23 * 278.15) / (6 * Math.PI * 5e-4 * r);
    const eta = 1 - Math.exp(-((2 * D) / 2000e-6) * ((6 * 8e-4) / (2000e-6 * 5e-4)) * 60);
    expect(coarse).toBeCloseTo(eta, 12);
    expect(
      approachToSaturation({ ...base, crystalSizeM: 2000e-6, residenceTimeS: 600 }),
    ).toBeGreaterThan(coarse);
  });

  function filtered(
    washVol: number,
    crystalSizeUm?: number,
    more: { undisplacedFraction?: number; washes?: number } = { undisplacedFraction: 0 },
  ) {
    return coolingRoute(0, [
      {
        id: 'f',
        kind: 'filtration',
        name: 'f',
        params: {
          cakeWash: {
            solventId: 'n-heptane',
            volume: { value: washVol, unit: 'vol' },
            washes: more.washes ?? 1,
            temperatureC: 5,
            ...(crystalSizeUm ? { crystalSizeUm } : {}),
            ...(more.undisplacedFraction !== undefined
              ? { undisplacedFraction: more.undisplacedFraction }
              : {}),
          },
        },
      },
    ]);
  }
  it('a wash of three retained volumes leaves less mother liquor than one', () => {
    // 0.84 kg solid × 0.5 L/kg = 0.42 L retained; 1.26 L is three retained volumes.
    const one = filtered(0.42);
    const three = filtered(1.26);
    const liquorIn = (r: ReturnType<typeof filtered>) =>
      r.terminals.find((t) => t.port === 'cake')!.stream.kg['ethyl-acetate'];
    expect(liquorIn(three) / liquorIn(one)).toBeCloseTo(0.2 ** 3 / 0.2, 3);
    const washes = three.steps.f.details.washes as Array<{ displacedPct: number }>;
    expect(washes[0].displacedPct).toBeCloseTo(100 * (1 - 0.2 ** 3), 2);
  });
  it('many large washes level off: the cake keeps at least φ per wash of the mother liquor', () => {
    const liquorIn = (r: ReturnType<typeof filtered>) =>
      r.terminals.find((t) => t.port === 'cake')!.stream.kg['ethyl-acetate'];
    // Default φ = 0.05 (common practice), with an information note saying it was assumed.
    const big = filtered(20, 100, { washes: 3 });
    const huge = filtered(200, 100, { washes: 3 });
    expect(big.steps.f.warnings.some((w) => w.code === 'wash-floor-assumed')).toBe(true);
    // 48 and 480 retained volumes per wash leave the same: φ³ of the retained liquor
    // (0.42 L of ethyl acetate mother liquor at 5 °C, less what the heptane keeps).
    expect(liquorIn(huge) / liquorIn(big)).toBeCloseTo(1, 6);
    const unwashed = coolingRoute(0, [{ id: 'f', kind: 'filtration', name: 'f', params: {} }]);
    const ratio = liquorIn(big) / liquorIn(unwashed);
    expect(ratio).toBeGreaterThan(0.05 ** 3 * 0.999);
    expect(ratio).toBeLessThan(0.05 ** 3 * 1.01);
    // With the floor switched off (φ = 0) the same washes remove essentially everything:
    // the old, unbounded curve.
    expect(liquorIn(filtered(20, 100, { washes: 3, undisplacedFraction: 0 }))).toBeLessThan(1e-30);
  });
  it('warns that the crystal size is assumed, and reports the approach to saturation', () => {
    const r = filtered(1);
    expect(r.steps.f.warnings.some((w) => w.code === 'crystal-size-assumed')).toBe(true);
    const given = filtered(1, 100);
    expect(given.steps.f.warnings.some((w) => w.code === 'crystal-size-assumed')).toBe(false);
    const rec = (given.steps.f.details.washes as Array<{ approachToSaturationPct: number }>)[0];
    expect(rec.approachToSaturationPct).toBeGreaterThan(0);
    expect(rec.approachToSaturationPct).toBeLessThanOrEqual(100);
  });
});
