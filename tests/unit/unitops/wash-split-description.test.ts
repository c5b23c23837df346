/**
 * The phase split of a wash stage states its method, sources and notes; what depends only on the
 * solvents present is worked out once per evaluation and set of solvents. A liquid with other
 * solvents in the same evaluation must get its own statements, the ones a fresh evaluation gives.
 */
import { describe, expect, it } from 'vitest';
import { parseRoute } from '../../../shared/engine/route/evaluate';
import { buildContext } from '../../../shared/engine/route/context';
import { splitLiquid } from '../../../shared/engine/unitops/equilibria';
import type { EngineWarning, MethodUsed } from '../../../shared/engine/route/types';

const doc = parseRoute({
  schemaVersion: 1,
  referenceInput: { componentId: 'etoac', massKg: 1 },
  components: [
    { kind: 'solvent', id: 'water', solventId: 'water' },
    { kind: 'solvent', id: 'etoac', solventId: 'ethyl-acetate' },
    { kind: 'solvent', id: 'heptane', solventId: 'n-heptane' },
  ],
  steps: [
    {
      id: 'c',
      kind: 'charge',
      name: 'c',
      params: {
        temperatureC: 25,
        contents: [{ kind: 'component', componentId: 'etoac', amount: 1, unit: 'L' }],
      },
    },
  ],
  connections: [],
});

const liquids = [
  { water: 1, etoac: 0.9, heptane: 0 },
  { water: 1, etoac: 0, heptane: 0.7 },
  { water: 1, etoac: 0.5, heptane: 0.4 },
];

function statements(ctx: ReturnType<typeof buildContext>['ctx'], kg: Record<string, number>) {
  const warnings: EngineWarning[] = [];
  const methods: MethodUsed[] = [];
  const r = splitLiquid(ctx, kg, 298.15, warnings, methods);
  return { r, warnings, methods };
}

describe('the phase split of a wash stage', () => {
  it('states for each set of solvents what a fresh evaluation states', () => {
    const { ctx } = buildContext(doc);
    const inOne = liquids.map((kg) => statements(ctx, kg));
    liquids.forEach((kg, i) => {
      const fresh = statements(buildContext(doc).ctx, kg);
      expect(inOne[i]).toEqual(fresh);
    });
    // The three sets of solvents are stated differently (the test would not see a mix-up otherwise).
    const sources = inOne.map((s) => s.methods.map((m) => m.source).join('; '));
    expect(new Set(sources).size).toBe(3);
  });
});
