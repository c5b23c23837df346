/**
 * The lever-rule fallback of the wash phase split (unitops/equilibria.ts
 * splitLiquid): when no liquid model can be built for the wash liquid, the
 * main organic solvent's tabulated mutual solubility with water is used as it
 * stands, and the other organic solvents split like it.
 *
 * It is reached by real library solvents, not only by a constructed one:
 * UNIFAC (Hansen et al., Ind. Eng. Chem. Res. 1991, 30, 2352) publishes no
 * interaction parameters for the ester (CCOO) – amide main-group pairs, so an
 * ethyl acetate solution carrying N,N-dimethylacetamide or NMP — the usual
 * case of washing a dipolar aprotic solvent out with water — has no activity
 * model, and the split falls back to the lever rule on ethyl acetate's
 * tabulated mutual solubility (library record: 8 wt % ethyl acetate in water,
 * 3 wt % water in ethyl acetate, 20 °C).
 *
 * Hand calculation (mass balance, no source needed): with W kg water, O kg of
 * organic solvents, w_s the solvent fraction of the aqueous phase and w_w the
 * water fraction of the organic phase,
 *   W = A(1 − w_s) + G w_w,   O = A w_s + G(1 − w_w)
 * gives the aqueous and organic phase masses
 *   A = (W(1 − w_w) − O w_w)/D,  G = (O(1 − w_s) − W w_s)/D,  D = (1 − w_s)(1 − w_w) − w_s w_w,
 * and each organic solvent i (k_i kg) sends A w_s k_i/O kg to the aqueous phase.
 * Worked through for the numbers of the test below in the test itself.
 */
import { describe, expect, it } from 'vitest';
import { runWaterWash } from '../../fixtures/routes/water-wash';
import { solventById } from '../../../shared/engine/data';
import { createVleSystem } from '../../../shared/engine/thermo/vle';
import { vleComponentOf } from '../../../shared/engine/thermo/mutual-solubility';

function run(amideId: string, amideL: number, waterL: number) {
  return runWaterWash({
    coSolvent: { id: 'amide', solventId: amideId, L: amideL },
    waterL,
    temperatureC: 20,
  });
}

describe('wash phase split: lever-rule fallback on tabulated mutual solubilities', () => {
  it('is reached: no UNIFAC parameters for ethyl acetate with DMAc', () => {
    const water = solventById('water')!;
    expect(() =>
      createVleSystem([
        vleComponentOf(water, water),
        vleComponentOf(solventById('ethyl-acetate')!, water),
        vleComponentOf(solventById('dmac')!, water),
      ]),
    ).toThrow(/no published interaction parameters/);
  });

  it('splits by the lever rule, as worked by hand, and says why and what it assumes', () => {
    const { org, aq, step } = run('dmac', 0.1, 1);
    // Inputs: 1 L water, 1 L ethyl acetate, 0.1 L DMAc at 20 °C (library densities 0.99821,
    // 0.9003 and 0.9372 g/mL), so W = 0.99821 kg and O = 0.9003 + 0.09372 = 0.99402 kg.
    expect(step.balance!.water.inKg).toBeCloseTo(0.99821, 5);
    expect(step.balance!.etoac.inKg).toBeCloseTo(0.9003, 5);
    expect(step.balance!.amide.inKg).toBeCloseTo(0.09372, 5);
    // By hand, w_s = 0.08, w_w = 0.03:
    //   D = 0.92 · 0.97 − 0.08 · 0.03 = 0.8900
    //   A = (0.99821 · 0.97 − 0.99402 · 0.03)/0.89 = (0.968264 − 0.029821)/0.89 = 1.054430 kg
    //   G = (0.99402 · 0.92 − 0.99821 · 0.08)/0.89 = (0.914498 − 0.079857)/0.89 = 0.937800 kg
    //   solvent in the aqueous phase A · 0.08 = 0.084354 kg, shared by mass:
    //   ethyl acetate 0.084354 · 0.9003/0.99402 = 0.076401 kg, DMAc 0.084354 · 0.09372/0.99402 = 0.007953 kg
    //   water in the aqueous phase A · 0.92 = 0.970076 kg, in the organic 0.99821 − 0.970076 = 0.028134 kg
    expect(aq.etoac).toBeCloseTo(0.076401, 5);
    expect(aq.amide).toBeCloseTo(0.007953, 5);
    expect(aq.water).toBeCloseTo(0.970076, 5);
    expect(org.water).toBeCloseTo(0.028134, 5);
    expect(org.etoac + org.amide + org.water).toBeCloseTo(0.9378, 4); // = G
    const split = step.methods.find((m) => m.what === 'phase split')!;
    expect(split.method).toMatch(/lever rule/);
    expect(split.method).toMatch(/UNIFAC has no parameters/);
    const w = step.warnings.find((x) => x.code === 'mutual-solubility-not-fitted')!;
    // DMAc is miscible with water; splitting it like ethyl acetate is an assumption the chemist must see.
    expect(w.severity).toBe('warning');
    expect(w.message).toMatch(/assumed to split like Ethyl acetate/);
    expect(w.message).toMatch(/water-miscible/);
  });

  it('without enough water for a second phase, everything stays in one organic phase', () => {
    // A ≤ 0 when W(1 − w_w) ≤ O w_w: with O = 0.99402 kg and w_w = 0.03, W ≤ 0.03074 kg stays dissolved.
    const { org, aq, step } = run('dmac', 0.1, 0.02);
    expect(aq.water ?? 0).toBe(0);
    expect(org.water).toBeCloseTo(0.02 * 0.99821, 6);
    expect(step.warnings.some((x) => x.code === 'no-phase-split')).toBe(true);
  });

  it('NMP with ethyl acetate takes the same path (same missing ester–amide parameters)', () => {
    const { step } = run('nmp', 0.1, 1);
    expect(step.methods.find((m) => m.what === 'phase split')!.method).toMatch(/lever rule/);
  });
});
