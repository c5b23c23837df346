import { describe, expect, it } from 'vitest';
import { evaluateRoute } from '../../../shared/engine/route/evaluate';
import type { RouteDocumentInput } from '../../../shared/schemas/route';

/**
 * Isopropyl acetate concentrated out of toluene at atmospheric pressure: the pot runs from
 * about 89 °C (above the top of isopropyl acetate's Antoine range, 362 K) towards toluene's
 * boiling point, so the integrator meets dozens of temperatures beyond that solvent's data.
 */
function concentrate(targetL: number): RouteDocumentInput {
  return {
    schemaVersion: 1,
    referenceInput: { componentId: 'ipac', massKg: 4.4 },
    components: [
      { kind: 'solvent', id: 'ipac', solventId: 'isopropyl-acetate' },
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
            { kind: 'component', componentId: 'ipac', amount: 5, unit: 'L' },
            { kind: 'component', componentId: 'tol', amount: 5, unit: 'L' },
          ],
        },
      },
      {
        id: 'd',
        kind: 'distillation',
        name: 'concentrate',
        params: {
          mode: { kind: 'concentrate', targetVolume: { value: targetL, unit: 'L' } },
          condition: { kind: 'pressure', pressureMbar: 1013.25 },
        },
      },
    ],
    connections: [
      { id: 'a', from: { stepId: 'c', port: 'out' }, to: { stepId: 'd', port: 'feed' } },
    ],
  };
}

describe('distillation: data used beyond its range is said once per solvent, with the range met', () => {
  it('gives one vapour-pressure line for isopropyl acetate over many temperatures, with the range in °C', () => {
    const r = evaluateRoute(concentrate(4));
    const vle = r.steps.d.warnings.filter((w) => w.code === 'vle').map((w) => w.message);
    const ipac = vle.filter((m) => m.startsWith('Isopropyl acetate:'));
    expect(ipac).toHaveLength(1);
    const m = /beyond its data from (\d+\.\d) to (\d+\.\d) °C/.exec(ipac[0]);
    expect(m).not.toBeNull();
    const [lo, hi] = [Number(m![1]), Number(m![2])];
    // Above the top of the Antoine range (362 K = 88.85 °C), and more than one temperature met.
    expect(lo).toBeGreaterThan(88.8);
    expect(hi).toBeGreaterThan(lo + 1);
    expect(ipac[0]).toContain('outside the Antoine range 234.9–362 K');
    // No line per temperature in kelvin is left (the single-temperature wording).
    expect(vle.some((w) => / K is outside the Antoine range/.test(w))).toBe(false);
    expect(ipac[0]).toContain('by Clausius–Clapeyron from 362 K');
  });

  it('says nothing of the kind when the pot stays inside the data', () => {
    const inside = concentrate(4);
    const d = inside.steps[1] as { params: { condition: unknown } };
    d.params.condition = { kind: 'pressure', pressureMbar: 300 };
    const r = evaluateRoute(inside);
    const vle = r.steps.d.warnings.filter((w) => w.code === 'vle').map((w) => w.message);
    expect(vle.some((m) => m.includes('beyond its data'))).toBe(false);
  });
});
