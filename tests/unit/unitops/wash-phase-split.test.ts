/**
 * Washes split the solvents by their own activities in the mutually saturated
 * phases: the measured mutual solubility is reproduced at its temperature, a
 * minor solvent does not follow the main one, and the split moves with the
 * wash temperature.
 */
import { describe, expect, it } from 'vitest';
import { runWaterWash } from '../../fixtures/routes/water-wash';
import { solventById } from '../../../shared/engine/data';

function run(methanolL: number, temperatureC: number) {
  return runWaterWash({
    coSolvent: { id: 'meoh', solventId: 'methanol', L: methanolL },
    waterL: 1,
    temperatureC,
  });
}

describe('wash phase split', () => {
  it('reproduces the tabulated ethyl acetate–water mutual solubility at its temperature (lever rule computed here)', () => {
    // Library data: 8 wt % ethyl acetate in water, 3 wt % water in ethyl acetate at 20 °C.
    const ms = solventById('ethyl-acetate')!.waterMutualSolubility!.value;
    expect(ms.temperatureC).toBe(20);
    const { org, aq } = run(0, 20);
    const W = org.water + aq.water;
    const O = org.etoac + aq.etoac;
    const ws = ms.solventInWaterWtPct / 100;
    const ww = ms.waterInSolventWtPct / 100;
    // Lever rule: W = A(1 − ws) + G ww, O = A ws + G(1 − ww).
    const det = (1 - ws) * (1 - ww) - ws * ww;
    const A = (W * (1 - ww) - O * ww) / det;
    const G = (O * (1 - ws) - W * ws) / det;
    expect(org.etoac / (G * (1 - ww))).toBeCloseTo(1, 2);
    expect(org.water / (G * ww)).toBeCloseTo(1, 2);
    expect(aq.etoac / (A * ws)).toBeCloseTo(1, 2);
  });

  it('a minor solvent (methanol, under 2 % of the organic) partitions by its own activity, not like the main solvent', () => {
    const { org, aq, step } = run(0.018, 20);
    const toAq = aq.meoh / (aq.meoh + org.meoh);
    const etoacToAq = aq.etoac / (aq.etoac + org.etoac);
    // Methanol is miscible with water and mostly leaves with it; ethyl acetate mostly stays.
    expect(toAq).toBeGreaterThan(0.7);
    expect(etoacToAq).toBeLessThan(0.15);
    expect(step.warnings.some((w) => w.code === 'minor-solvents-follow-main')).toBe(false);
  });

  it('uses the mutual solubility at the wash temperature, with a note away from the tabulated one', () => {
    const cold = run(0, 20);
    const warm = run(0, 50);
    const wOrg = (x: typeof cold) => x.org.water / (x.org.water + x.org.etoac);
    expect(Math.abs(wOrg(warm) - wOrg(cold)) / wOrg(cold)).toBeGreaterThan(0.02);
    expect(warm.step.warnings.some((w) => w.code === 'mutual-solubility-temperature')).toBe(true);
    expect(cold.step.warnings.some((w) => w.code === 'mutual-solubility-temperature')).toBe(false);
  });
});
