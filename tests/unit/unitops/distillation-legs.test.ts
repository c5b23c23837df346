import { describe, expect, it } from 'vitest';
import { evaluateRoute } from '../../../shared/engine/route/evaluate';
import type { RouteDocumentInput } from '../../../shared/schemas/route';

/**
 * A put-and-take swap from a poor solvent (n-heptane) into a good one (DMF): the product
 * crosses its solubility at the bottom of the first leg, then redissolves once DMF is in.
 * The crash-out caution must come from that first leg, not only from the end of the step.
 * Solubility points are invented for the test.
 */
function swapRoute(cycles: number, productKg = 0.03): RouteDocumentInput {
  return {
    schemaVersion: 1,
    referenceInput: { componentId: 'p', massKg: 0.03 },
    components: [
      { kind: 'solvent', id: 'hep', solventId: 'n-heptane' },
      { kind: 'solvent', id: 'dmf', solventId: 'dmf' },
      {
        kind: 'compound',
        id: 'p',
        name: 'Product P',
        role: 'product',
        molarMassGmol: 250,
        solubility: [
          { solventId: 'n-heptane', temperatureC: 20, value: 2, unit: 'g/L' },
          { solventId: 'n-heptane', temperatureC: 80, value: 6, unit: 'g/L' },
          { solventId: 'dmf', temperatureC: 20, value: 300, unit: 'g/L' },
          { solventId: 'dmf', temperatureC: 80, value: 500, unit: 'g/L' },
        ],
      },
    ],
    steps: [
      {
        id: 'c',
        kind: 'charge',
        name: 'feed',
        params: {
          temperatureC: 20,
          contents: [
            { kind: 'component', componentId: 'hep', amount: 10, unit: 'L' },
            { kind: 'component', componentId: 'p', amount: productKg, unit: 'kg' },
          ],
        },
      },
      {
        id: 'd',
        kind: 'distillation',
        name: 'swap',
        params: {
          mode: {
            kind: 'put-and-take',
            targetVolume: { value: 2, unit: 'L' },
            addSolventId: 'dmf',
            addVolume: { value: 6, unit: 'L' },
            cycles,
          },
          condition: { kind: 'pressure', pressureMbar: 200 },
        },
      },
    ],
    connections: [
      { id: 'a', from: { stepId: 'c', port: 'out' }, to: { stepId: 'd', port: 'feed' } },
    ],
  };
}

describe('distillation: crash-out caution after every leg of a put-and-take swap', () => {
  it('warns for the first leg, where the product exceeds its solubility in concentrated heptane', () => {
    const r = evaluateRoute(swapRoute(2));
    const crossed = r.steps.d.warnings.filter((w) => w.code === 'solubility-crossed');
    expect(crossed.some((w) => w.message.startsWith('leg 1 of 3:'))).toBe(true);
    // At the end the pot is mostly DMF: no caution from the final check.
    expect(crossed.every((w) => w.message.startsWith('leg '))).toBe(true);
  });

  it('says nothing when the swap never concentrates the product beyond its solubility', () => {
    const r = evaluateRoute(swapRoute(2, 0.004));
    expect(r.steps.d.warnings.some((w) => w.code === 'solubility-crossed')).toBe(false);
  });
});

describe('distillation at a set pot temperature of a pot that splits into two liquids', () => {
  it('says that two liquids boil together, as at a set pressure', () => {
    const route: RouteDocumentInput = {
      schemaVersion: 1,
      referenceInput: { componentId: 'tol', massKg: 8.7 },
      components: [
        { kind: 'solvent', id: 'tol', solventId: 'toluene' },
        { kind: 'solvent', id: 'w', solventId: 'water' },
      ],
      steps: [
        {
          id: 'c',
          kind: 'charge',
          name: 'wet toluene',
          params: {
            temperatureC: 20,
            contents: [
              { kind: 'component', componentId: 'tol', amount: 10, unit: 'L' },
              { kind: 'component', componentId: 'w', amount: 0.5, unit: 'L' },
            ],
          },
        },
        {
          id: 'd',
          kind: 'distillation',
          name: 'dry by distillation',
          params: {
            mode: { kind: 'concentrate', targetVolume: { value: 8, unit: 'L' } },
            condition: { kind: 'pot-temperature', potTemperatureC: 60 },
          },
        },
      ],
      connections: [
        { id: 'a', from: { stepId: 'c', port: 'out' }, to: { stepId: 'd', port: 'feed' } },
      ],
    };
    const r = evaluateRoute(route);
    const notes = r.steps.d.warnings.filter((w) => w.code === 'vle').map((w) => w.message);
    expect(notes).toContain('Two liquid phases boil together (heterogeneous boiling).');
    // While both layers are present the pot boils near the sum of the two vapour pressures at
    // 60 °C (about 200 mbar water + 139 mbar toluene, values from memory), above either alone.
    const profile = r.steps.d.details.profile as Array<{ pressureMbar: number }>;
    expect(profile[0].pressureMbar).toBeGreaterThan(300);
  });
});
