import { describe, expect, it } from 'vitest';
import { evaluateRoute } from '../../../shared/engine/route/evaluate';
import type { RouteDocumentInput } from '../../../shared/schemas/route';

/**
 * A concentrate whose target volume lies above the feed's volume distils nothing. The pot's
 * solvent goes through moles and back (kg / M · M), which need not give the same kilograms to
 * the last bit; that difference must not turn up as a distillate (a composition of 100 % of a
 * solvent with 0 L distilled).
 */
function nothingToDistil(waterL: number, tolueneL: number): RouteDocumentInput {
  return {
    schemaVersion: 1,
    referenceInput: { componentId: 'w', massKg: 1 },
    components: [
      { kind: 'solvent', id: 'w', solventId: 'water' },
      { kind: 'solvent', id: 'tol', solventId: 'toluene' },
    ],
    steps: [
      {
        id: 'c',
        kind: 'charge',
        name: 'feed',
        params: {
          temperatureC: 20,
          contents: [
            { kind: 'component', componentId: 'w', amount: waterL, unit: 'L' },
            { kind: 'component', componentId: 'tol', amount: tolueneL, unit: 'L' },
          ],
        },
      },
      {
        id: 'd',
        kind: 'distillation',
        name: 'concentrate',
        params: {
          mode: { kind: 'concentrate', targetVolume: { value: 50, unit: 'L' } },
          condition: { kind: 'pot-temperature', potTemperatureC: 49 },
        },
      },
    ],
    connections: [
      { id: 'a', from: { stepId: 'c', port: 'out' }, to: { stepId: 'd', port: 'feed' } },
    ],
  };
}

describe('distillation: a step that distils nothing', () => {
  it('has no distillate, no distillate composition, and says that nothing is distilled', () => {
    for (let k = 0; k < 24; k++) {
      const waterL = 0.3 + 0.137 * k;
      const r = evaluateRoute(nothingToDistil(waterL, k % 3 === 0 ? 0 : 0.01 * k));
      const d = r.steps.d;
      expect(d.summary['distillate L']).toBe(0);
      expect((d.details as { distillateComposition: object }).distillateComposition).toEqual({});
      const distillate = r.terminals.find((t) => t.stepId === 'd' && t.port === 'distillate');
      expect(Object.values(distillate!.stream.kg).every((kg) => kg === 0)).toBe(true);
      // The pot keeps the feed to the bit.
      const pot = r.terminals.find((t) => t.stepId === 'd' && t.port === 'pot');
      expect(pot!.stream.kg).toEqual(r.streams['a'].kg);
      expect(d.warnings.some((w) => w.code === 'nothing-distilled')).toBe(true);
    }
  });
});
