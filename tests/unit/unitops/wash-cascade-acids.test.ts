/**
 * Washes: acids among the solvents take part in the charge balance and their
 * CO₂ is counted; counter-current stages are solved stage by stage, each with
 * its own pH, and reduce to the Kremser equation for a constant ratio.
 */
import { describe, expect, it } from 'vitest';
import { evaluateRoute } from '../../../shared/engine/route/evaluate';
import { kremserFractionRemaining } from '../../../shared/engine/unitops/wash';
import type { RouteDocumentInput } from '../../../shared/schemas/route';

const M_ACOH = 0.060052; // kg/mol (C2H4O2, conventional atomic weights)
const M_NAHCO3 = 0.084007; // kg/mol (NaHCO3)

type Step = ReturnType<typeof evaluateRoute>['steps'][string];
type WashDetails = {
  aqueousPH: number;
  stagePH: number[];
  phaseVolumesL: { organic: number; aqueous: number };
};

function route(
  components: RouteDocumentInput['components'],
  contents: Array<{ componentId: string; amount: number; unit: 'L' | 'kg' }>,
  wash: Record<string, unknown>,
): RouteDocumentInput {
  return {
    schemaVersion: 1,
    referenceInput: { componentId: 'p', massKg: 0.01 },
    components,
    steps: [
      {
        id: 'feed',
        kind: 'charge',
        name: 'feed',
        params: {
          temperatureC: 20,
          contents: contents.map((c) => ({ kind: 'component' as const, ...c })),
        },
      },
      {
        id: 'w',
        kind: 'wash',
        name: 'wash',
        params: { temperatureC: 20, keep: 'organic', ...wash },
      },
    ] as RouteDocumentInput['steps'],
    connections: [
      { id: 'c1', from: { stepId: 'feed', port: 'out' }, to: { stepId: 'w', port: 'feed' } },
    ],
  };
}

const product = {
  kind: 'compound' as const,
  id: 'p',
  name: 'neutral product (invented)',
  role: 'product' as const,
  molarMassGmol: 300,
  partition: [{ organicSolventId: 'toluene', D: 1000, source: 'invented test value' }],
};

describe('acetic acid as a solvent in a bicarbonate wash', () => {
  const nAcid = 0.5;
  const doc = route(
    [
      { kind: 'solvent', id: 'water', solventId: 'water' },
      { kind: 'solvent', id: 'toluene', solventId: 'toluene' },
      { kind: 'solvent', id: 'acoh', solventId: 'acetic-acid' },
      { kind: 'aqueous-solute', soluteId: 'nahco3' },
      product,
    ],
    [
      { componentId: 'toluene', amount: 1, unit: 'L' },
      { componentId: 'acoh', amount: nAcid * M_ACOH, unit: 'kg' },
      { componentId: 'p', amount: 0.01, unit: 'kg' },
    ],
    {
      addedLiquid: {
        kind: 'aqueous',
        soluteId: 'nahco3',
        wtPct: 8,
        volume: { value: 1, unit: 'L' },
      },
      stages: 1,
      mode: 'cross-current',
    },
  );
  const r = evaluateRoute(doc);
  const s: Step = r.steps['w'];
  const d = s.details as WashDetails;
  const org = r.terminals.find((t) => t.port === 'organic')!.stream.kg;
  const nBase = (s.addedKg['nahco3'] ?? 0) / M_NAHCO3;

  it('is neutralised: the pH ends at the carbonic-acid buffer (hand calculation)', () => {
    // CH3COOH + HCO3⁻ → CH3COO⁻ + H2CO3 runs to completion (pKa 4.76 ≪ 6.35): n_a of H2CO3 and
    // n_b − n_a of HCO3⁻ remain, so pH = pKa1 + log10((n_b − n_a)/n_a) (closed system). Acetic acid
    // left neutral at that pH (10^(4.76 − 6.4) ≈ 2 %) shifts it by under 0.02.
    expect(nBase).toBeGreaterThan(0.9);
    const hand = 6.35 + Math.log10((nBase - nAcid) / nAcid);
    expect(Math.abs(d.aqueousPH - hand)).toBeLessThan(0.05);
  });

  it('takes the acid out of the toluene', () => {
    expect(org.acoh / (nAcid * M_ACOH)).toBeLessThan(0.01);
  });

  it('counts the CO₂ formed (about one mole per mole of acid) as a hazard', () => {
    const co2 = s.summary['CO₂ released mol'] as number;
    // Closed system: CO₂ formed = carbonate × α0(pH) ≈ n_a, less the medium's own (≈ 1 % of n_b at pH 8.3).
    expect(co2).toBeGreaterThan(0.44);
    expect(co2).toBeLessThan(0.51);
    expect(s.warnings.some((w) => w.code === 'gas-evolution' && w.severity === 'hazard')).toBe(
      true,
    );
  });
});

describe('counter-current cascade', () => {
  it('reduces to the Kremser equation for a constant distribution ratio and nearly immiscible liquids', () => {
    // Solute in 1 L water, 1 L n-heptane counter-current over 3 stages, measured D = 2 into heptane:
    // E = D V_o/V_a ≈ 2, φ = (E − 1)/(E^4 − 1) = 1/15 (hand calculation in extraction.reference.test.ts).
    const doc = route(
      [
        { kind: 'solvent', id: 'water', solventId: 'water' },
        { kind: 'solvent', id: 'hep', solventId: 'n-heptane' },
        {
          kind: 'compound',
          id: 'p',
          name: 'test solute (invented)',
          role: 'product',
          molarMassGmol: 150,
          partition: [{ organicSolventId: 'n-heptane', D: 2, source: 'invented test value' }],
        },
      ],
      [
        { componentId: 'water', amount: 1, unit: 'L' },
        { componentId: 'p', amount: 0.01, unit: 'kg' },
      ],
      {
        addedLiquid: { kind: 'solvent', solventId: 'hep', volume: { value: 1, unit: 'L' } },
        stages: 3,
        mode: 'counter-current',
      },
    );
    const r = evaluateRoute(doc);
    const left = r.terminals.find((t) => t.port === 'aqueous')!.stream.kg.p / 0.01;
    // Heptane and water dissolve each other by 0.01 wt % at most (library data), so the stage
    // volumes — and E — differ from 1 L and 2 by far less than 0.1 %.
    expect(Math.abs(left - kremserFractionRemaining(2, 3)) / (1 / 15)).toBeLessThan(2e-3);
    expect(r.steps['w'].warnings.some((w) => w.code === 'cascade-not-converged')).toBe(false);
  });

  it('gives every stage its own pH: the acid feed end is the most acidic', () => {
    const doc = route(
      [
        { kind: 'solvent', id: 'water', solventId: 'water' },
        { kind: 'solvent', id: 'toluene', solventId: 'toluene' },
        { kind: 'aqueous-solute', soluteId: 'nahco3' },
        product,
        {
          kind: 'compound',
          id: 'ha',
          name: 'carboxylic acid impurity (invented)',
          role: 'impurity',
          molarMassGmol: 150,
          pKa: [{ value: 4.2, type: 'acid' }],
          partition: [{ organicSolventId: 'toluene', pH: 1, D: 2, source: 'invented test value' }],
        },
      ],
      [
        { componentId: 'toluene', amount: 1, unit: 'L' },
        { componentId: 'p', amount: 0.01, unit: 'kg' },
        { componentId: 'ha', amount: 0.15 * 0.15, unit: 'kg' },
      ],
      {
        addedLiquid: {
          kind: 'aqueous',
          soluteId: 'nahco3',
          wtPct: 8,
          volume: { value: 0.3, unit: 'L' },
        },
        stages: 3,
        mode: 'counter-current',
      },
    );
    const r = evaluateRoute(doc);
    const d = r.steps['w'].details as WashDetails;
    expect(d.stagePH).toHaveLength(3);
    // Feed (acid) enters stage 1, fresh bicarbonate stage 3.
    expect(d.stagePH[0]).toBeLessThan(d.stagePH[1]);
    expect(d.stagePH[1]).toBeLessThan(d.stagePH[2]);
    expect(d.stagePH[2] - d.stagePH[0]).toBeGreaterThan(0.5);
    // Every component balances over the step (in = out).
    const out = (id: string) => r.terminals.reduce((a, t) => a + (t.stream.kg[id] ?? 0), 0);
    expect(out('ha') / (0.15 * 0.15)).toBeCloseTo(1, 9);
    expect(r.steps['w'].warnings.some((w) => w.code === 'cascade-not-converged')).toBe(false);
  });
});
