import { describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { evaluateRoute, ENGINE_VERSION, PROCESS_SAFETY_NOTE } from '../../../shared/engine/route/evaluate';
import { demoAmideIsolation } from '../../fixtures/routes/demo-amide-isolation';

const json = JSON.parse(readFileSync(fileURLToPath(new URL('../../fixtures/routes/demo-amide-isolation.json', import.meta.url)), 'utf8'));

describe('demo amide isolation', () => {
  const r = evaluateRoute(json);
  it('the JSON fixture is the builder written out', () => {
    expect(json).toEqual(JSON.parse(JSON.stringify(demoAmideIsolation)));
  });
  it('evaluates with plausible totals', () => {
    expect(r.engineVersion).toBe(ENGINE_VERSION);
    expect(r.totals.yieldPct!).toBeGreaterThan(80);
    expect(r.totals.yieldPct!).toBeLessThan(100);
    expect(r.totals.purityWtPct!).toBeGreaterThan(98);
    // The acid wash takes the amine, the base wash the acid.
    expect(r.totals.purge['pw417-amine'].purgeFactor!).toBeGreaterThan(1000);
    expect(r.totals.purge['pw417-acid'].purgeFactor!).toBeGreaterThan(100);
    expect(r.totals.pmi!).toBeGreaterThan(r.totals.eFactor!);
    expect(r.processSafetyNote).toBe(PROCESS_SAFETY_NOTE);
  });
  it('puts the cautions on their steps', () => {
    expect(r.steps['base-wash'].warnings.some((w) => w.code === 'gas-evolution' && w.severity === 'hazard')).toBe(true);
    expect(r.steps['swap'].warnings.some((w) => w.code === 'solubility-crossed')).toBe(true);
    expect(r.warnings.every((w) => w.stepId === null || r.steps[w.stepId])).toBe(true);
  });
  it('swaps the solvent: little 2-MeTHF left, profile reported', () => {
    const d = r.steps['swap'].details as { residualOriginalSolventWtPct: number; profile: Array<{ potTemperatureC: number }> };
    expect(d.residualOriginalSolventWtPct).toBeLessThan(2);
    expect(d.profile.length).toBeGreaterThan(10);
    // 2-MeTHF / 2-propanol boil near 35–50 °C at 200 mbar.
    for (const p of d.profile) expect(p.potTemperatureC).toBeGreaterThan(20);
  });
  it('the acid wash is acidic, the base wash basic', () => {
    expect(r.steps['acid-wash'].summary['pH'] as number).toBeLessThan(1);
    expect(r.steps['base-wash'].summary['pH'] as number).toBeGreaterThan(7.5);
  });
});
