import { describe, expect, it } from 'vitest';
import { evaluateRoute } from '../../../shared/engine/route/evaluate';
import { demoAmideIsolation } from '../../fixtures/routes/demo-amide-isolation';
import { liquorBoiling, sweepFor } from '../../../src/features/editor/sweep';
import type { StepInput } from '../../../src/features/editor/document';

const doc = JSON.parse(JSON.stringify(demoAmideIsolation));
const result = evaluateRoute(doc);
const step = (id: string) => doc.steps.find((s: { id: string }) => s.id === id) as StepInput;

describe('the yield-against-end-temperature sweep stays in the reachable range', () => {
  it('the antisolvent step: liquor of 2-propanol and heptane, bounded by 2-propanol (82 °C, CRC normal boiling point)', () => {
    const b = liquorBoiling(step('antisolvent'), doc, result)!;
    expect(b.solvent).toMatch(/2-Propanol/i);
    expect(b.temperatureC).toBeGreaterThan(81);
    expect(b.temperatureC).toBeLessThan(83);
    // Unbounded the sweep ran to 90 °C (60 + 30); now it stops 2 K below the boiling point.
    expect(Math.max(...sweepFor(step('antisolvent'))!.values)).toBe(90);
    const values = sweepFor(step('antisolvent'), b.temperatureC)!.values;
    expect(Math.max(...values)).toBeLessThan(b.temperatureC);
    expect(values).toHaveLength(11);
  });

  it('keeps a set value beyond the boiling point so the plot can flag it', () => {
    const s = step('antisolvent');
    const hot = {
      ...s,
      params: { ...s.params, mode: { ...(s.params as { mode: object }).mode, temperatureC: 95 } },
    } as StepInput;
    expect(Math.max(...sweepFor(hot, 82)!.values)).toBe(95);
  });

  it('no bound without a result or for another step kind', () => {
    expect(liquorBoiling(step('antisolvent'), doc, null)).toBeNull();
    expect(liquorBoiling(step('acid-wash'), doc, result)).toBeNull();
  });
});
