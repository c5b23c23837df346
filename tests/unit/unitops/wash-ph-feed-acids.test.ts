/**
 * Wash pH with the acids the feed carries: a bicarbonate wash facing more
 * acid than base ends near the acid's pKa, purges less, and says so.
 */
import { describe, expect, it } from 'vitest';
import { evaluateRoute } from '../../../shared/engine/route/evaluate';
import type { RouteDocumentInput } from '../../../shared/schemas/route';

const M_ACID = 0.15; // kg/mol, invented acid
const M_NAHCO3 = 0.084007; // kg/mol

function doc(washL: number): RouteDocumentInput {
  return {
    schemaVersion: 1,
    referenceInput: { componentId: 'p', massKg: 0.01 },
    components: [
      { kind: 'solvent', id: 'water', solventId: 'water' },
      { kind: 'solvent', id: 'toluene', solventId: 'toluene' },
      { kind: 'aqueous-solute', soluteId: 'nahco3' },
      {
        kind: 'compound',
        id: 'p',
        name: 'neutral product (invented)',
        role: 'product',
        molarMassGmol: 300,
        logP: 3,
      },
      // Invented carboxylic acid: pKa 4.20, measured D(toluene/water) = 2 at pH 1 (invented value), so K = 2/f_n(1).
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
    steps: [
      {
        id: 'feed',
        kind: 'charge',
        name: 'feed',
        params: {
          temperatureC: 20,
          contents: [
            { kind: 'component', componentId: 'toluene', amount: 0.2, unit: 'L' },
            { kind: 'component', componentId: 'p', amount: 0.01, unit: 'kg' },
            { kind: 'component', componentId: 'ha', amount: 0.2 * M_ACID, unit: 'kg' },
          ],
        },
      },
      {
        id: 'w',
        kind: 'wash',
        name: '8 % NaHCO3',
        params: {
          addedLiquid: {
            kind: 'aqueous',
            soluteId: 'nahco3',
            wtPct: 8,
            volume: { value: washL, unit: 'L' },
          },
          stages: 1,
          mode: 'cross-current',
          temperatureC: 20,
          keep: 'organic',
        },
      },
    ],
    connections: [
      { id: 'c1', from: { stepId: 'feed', port: 'out' }, to: { stepId: 'w', port: 'feed' } },
    ],
  };
}

type Details = {
  aqueousPH: number;
  phaseVolumesL: { organic: number; aqueous: number };
  components: Record<string, { D: number | null }>;
};
const run = (washL: number) => {
  const r = evaluateRoute(doc(washL));
  const s = r.steps['w'];
  const org = r.terminals.find((t) => t.port === 'organic')!.stream;
  return {
    s,
    d: s.details as Details,
    nBase: (s.addedKg['nahco3'] ?? 0) / M_NAHCO3,
    acidLeft: org.kg['ha'] / (0.2 * M_ACID),
  };
};

describe('bicarbonate wash with too little base for the acid in the feed', () => {
  // About 0.1 mol NaHCO3 (8 wt %, 0.1 L) against 0.2 mol acid.
  const short = run(0.1);
  const ample = run(0.5);

  it('ends near the buffer pH of the half-neutralised acid (hand calculation)', () => {
    // HA + HCO3⁻ → A⁻ + H2CO3 goes to completion (pKa 4.2 ≪ 6.35), so A⁻ = n_b in the aqueous
    // phase and the remaining n_a − n_b of neutral HA distributes with K = c_org/c_aq:
    //   HA_aq = (n_a − n_b) V_a / (V_a + K V_o),   pH = pKa + log10(A⁻_aq / HA_aq)
    //       = pKa + log10( n_b (V_a + K V_o) / ((n_a − n_b) V_a) ).
    // K = 2 / f_n(pH 1) = 2 (1 + 10^(1 − 4.2)) = 2.00126. Bicarbonate left unprotonated at pH ≈ 4.5
    // (fraction 10^(pH − 6.35) ≈ 0.015) and [H⁺] (3e-5 M) shift this by less than 0.01.
    const K = 2 * (1 + 10 ** (1 - 4.2));
    const { organic: Vo, aqueous: Va } = short.d.phaseVolumesL;
    const nb = short.nBase;
    expect(nb).toBeGreaterThan(0.09);
    expect(nb).toBeLessThan(0.11);
    const hand = 4.2 + Math.log10((nb * (Va + K * Vo)) / ((0.2 - nb) * Va));
    expect(short.d.aqueousPH).toBeCloseTo(hand, 1);
    expect(Math.abs(short.d.aqueousPH - hand)).toBeLessThan(0.03);
    // The medium alone (8 % NaHCO3) is near pH 8.3; the feed's acid pulls it far down.
    expect(short.d.aqueousPH).toBeLessThan(5.5);
  });

  it('purges less than a wash with enough base', () => {
    expect(ample.nBase).toBeGreaterThan(0.2);
    expect(ample.d.aqueousPH).toBeGreaterThan(6.5);
    // With too little base about half the acid and its neutral part's share stays in toluene.
    expect(short.acidLeft).toBeGreaterThan(0.2);
    expect(ample.acidLeft).toBeLessThan(0.01);
    expect(short.acidLeft).toBeGreaterThan(20 * ample.acidLeft);
    // The distribution ratio of the acid follows the lower pH (D = K f_n).
    expect(short.d.components['ha'].D!).toBeCloseTo(
      (2 * (1 + 10 ** (1 - 4.2))) / (1 + 10 ** (short.d.aqueousPH - 4.2)),
      9,
    );
  });

  it('warns that the base is insufficient, with the equivalents', () => {
    const w = short.s.warnings.find((x) => x.code === 'base-insufficient');
    expect(w).toBeDefined();
    expect(w!.message).toContain(`(${(short.nBase / 0.2).toFixed(2)} equiv)`);
    expect(ample.s.warnings.some((x) => x.code === 'base-insufficient')).toBe(false);
  });
});
