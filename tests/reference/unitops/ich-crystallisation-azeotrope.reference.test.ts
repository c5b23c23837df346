import { describe, expect, it } from 'vitest';
import { evaluateRoute, parseRoute } from '../../../shared/engine/route/evaluate';
import { buildContext } from '../../../shared/engine/route/context';
import { ichResidualSolventFlags } from '../../../shared/engine/unitops/drying';
import type { RouteDocumentInput } from '../../../shared/schemas/route';
import type { EngineWarning } from '../../../shared/engine/route/types';

describe('ICH Q3C residual-solvent flags', () => {
  // ICH Q3C(R9) Option 1 limits: toluene class 2, 890 ppm; ethanol class 3,
  // 5000 ppm (values as carried by the solvent library with its sources).
  const doc = parseRoute({
    schemaVersion: 1,
    referenceInput: { componentId: 'api', massKg: 1 },
    components: [
      { kind: 'solvent', id: 'toluene', solventId: 'toluene' },
      { kind: 'solvent', id: 'ethanol', solventId: 'ethanol' },
      { kind: 'compound', id: 'api', name: 'api', role: 'product', molarMassGmol: 300 },
    ],
    steps: [
      {
        id: 'c',
        kind: 'charge',
        name: 'c',
        params: {
          temperatureC: 20,
          contents: [{ kind: 'component', componentId: 'api', amount: 1, unit: 'kg' }],
        },
      },
    ],
    connections: [],
  });
  const { ctx } = buildContext(doc);
  it('flags toluene above 890 ppm and not ethanol below 5000 ppm', () => {
    const w: EngineWarning[] = [];
    const flags = ichResidualSolventFlags(ctx, { api: 1, toluene: 0.001, ethanol: 0.004 }, w);
    const tol = flags.find((f) => f.componentId === 'toluene')!;
    expect(tol.limitPpm).toBe(890);
    expect(tol.ppm).toBeCloseTo(1e6 * (0.001 / 1.005), 6);
    expect(tol.exceeds).toBe(true);
    expect(flags.find((f) => f.componentId === 'ethanol')!.exceeds).toBe(false);
    expect(w.filter((x) => x.code === 'ich-limit-exceeded')).toHaveLength(1);
  });
  it('does not flag toluene at 800 ppm', () => {
    const w: EngineWarning[] = [];
    const flags = ichResidualSolventFlags(ctx, { api: 1, toluene: 0.0008, ethanol: 0 }, w);
    expect(flags[0].exceeds).toBe(false);
    expect(w.filter((x) => x.severity !== 'info')).toHaveLength(0);
    // The one note says where the limit was read (a reproduction of the guideline's table).
    expect(w.map((x) => x.code)).toEqual(['ich-limit-source']);
  });
});

describe('cooling crystallisation yield from a published solubility curve', () => {
  // Potassium nitrate in water: 110 g/100 g water at 60 °C and 31.6 g/100 g
  // water at 20 °C (CRC Handbook of Chemistry and Physics, "Aqueous
  // solubility of inorganic compounds at various temperatures" — values cited
  // from memory). By hand: 100 g water saturated at 60 °C holds 110 g; at
  // 20 °C 31.6 g stay dissolved, 78.4 g crystallise: yield 78.4/110 = 71.27 %.
  // The two points are entered as wt %: 110/210 = 52.381 %, 31.6/131.6 = 24.012 %.
  it('reproduces the hand calculation', () => {
    const doc: RouteDocumentInput = {
      schemaVersion: 1,
      referenceInput: { componentId: 'kno3', massKg: 0.11 },
      components: [
        { kind: 'solvent', id: 'water', solventId: 'water' },
        {
          kind: 'compound',
          id: 'kno3',
          name: 'potassium nitrate',
          role: 'product',
          molarMassGmol: 101.1,
          densityGmL: 2.11,
          solubility: [
            { solventId: 'water', temperatureC: 60, value: (110 / 210) * 100, unit: 'wt%' },
            { solventId: 'water', temperatureC: 20, value: (31.6 / 131.6) * 100, unit: 'wt%' },
          ],
        },
      ],
      steps: [
        {
          id: 'c',
          kind: 'charge',
          name: 'c',
          params: {
            temperatureC: 60,
            contents: [
              { kind: 'component', componentId: 'water', amount: 0.1, unit: 'kg' },
              { kind: 'component', componentId: 'kno3', amount: 0.11, unit: 'kg' },
            ],
          },
        },
        {
          id: 'x',
          kind: 'crystallisation',
          name: 'cool',
          params: { mode: { kind: 'cooling', startC: 60, endC: 20 }, seeded: false },
        },
      ],
      connections: [
        { id: 'a', from: { stepId: 'c', port: 'out' }, to: { stepId: 'x', port: 'feed' } },
      ],
    };
    const r = evaluateRoute(doc);
    expect(r.steps.x.summary['yield %'] as number).toBeCloseTo((78.4 / 110) * 100, 1);
  });
});

describe('water/toluene heteroazeotrope: drying toluene by distillation', () => {
  // Handbook heteroazeotrope of toluene and water at 1 atm: boiling point
  // 84.1 °C, about 13.5 wt % water in the vapour (CRC Handbook, "Azeotropic
  // data for binary mixtures" — values cited from memory). The engine has no
  // special case: the pot boils at the heterogeneous bubble point from UNIFAC
  // and the Antoine constants while two liquids are present.
  const doc: RouteDocumentInput = {
    schemaVersion: 1,
    referenceInput: { componentId: 'api', massKg: 1 },
    components: [
      { kind: 'solvent', id: 'water', solventId: 'water' },
      { kind: 'solvent', id: 'toluene', solventId: 'toluene' },
      { kind: 'compound', id: 'api', name: 'api', role: 'product', molarMassGmol: 300 },
    ],
    steps: [
      {
        id: 'c',
        kind: 'charge',
        name: 'wet toluene',
        params: {
          temperatureC: 20,
          contents: [
            { kind: 'component', componentId: 'toluene', amount: 10, unit: 'L' },
            { kind: 'component', componentId: 'water', amount: 0.2, unit: 'kg' },
            { kind: 'component', componentId: 'api', amount: 1, unit: 'kg' },
          ],
        },
      },
      {
        id: 'd',
        kind: 'distillation',
        name: 'azeotropic drying',
        params: {
          mode: { kind: 'concentrate', targetVolume: { value: 7, unit: 'L' } },
          condition: { kind: 'pressure', pressureMbar: 1013.25 },
        },
      },
    ],
    connections: [
      { id: 'a', from: { stepId: 'c', port: 'out' }, to: { stepId: 'd', port: 'feed' } },
    ],
  };
  const r = evaluateRoute(doc);
  const prof = r.steps.d.details.profile as Array<{ potTemperatureC: number }>;
  it('the pot first boils near 84 °C (within 2.5 K)', () => {
    expect(Math.abs(prof[0].potTemperatureC - 84.1)).toBeLessThan(2.5);
  });
  it('the water leaves first: the pot is dried, and the pot then heads to the toluene boiling point', () => {
    const pot = r.terminals.find((t) => t.port === 'pot')!.stream;
    expect(pot.kg.water).toBeLessThan(0.2 * 0.05);
    expect(prof[prof.length - 1].potTemperatureC).toBeGreaterThan(100);
  });
});
