import { describe, expect, it } from 'vitest';
import { buildContext } from '../../../shared/engine/route/context';
import { parseRoute } from '../../../shared/engine/route/evaluate';
import { aqueousPH } from '../../../shared/engine/unitops/equilibria';
import { cakeFiltrationTime, lewisSquires } from '../../../shared/engine/unitops/filtration';

const { ctx } = buildContext(
  parseRoute({
    schemaVersion: 1,
    referenceInput: { componentId: 'p', massKg: 1 },
    components: [
      { kind: 'solvent', id: 'water', solventId: 'water' },
      { kind: 'aqueous-solute', soluteId: 'hcl' },
      { kind: 'aqueous-solute', soluteId: 'nahco3' },
      { kind: 'compound', id: 'p', name: 'p', role: 'product', molarMassGmol: 100 },
    ],
    steps: [
      {
        id: 'c',
        kind: 'charge',
        name: 'c',
        params: {
          temperatureC: 20,
          contents: [{ kind: 'component', componentId: 'p', amount: 1, unit: 'kg' }],
        },
      },
    ],
    connections: [],
  }),
);

describe('aqueous pH by charge balance', () => {
  it('0.1 M HCl is pH 1', () => {
    const kg = { water: 1, hcl: 0.1 * 0.03646, nahco3: 0, p: 0 };
    expect(aqueousPH(ctx, { volumeM3: 0.001, kg, includeCompounds: false })!).toBeCloseTo(1, 3);
  });
  it('bicarbonate solution is near (pKa1 + pKa2)/2 ≈ 8.3', () => {
    const kg = { water: 1, hcl: 0, nahco3: 0.084, p: 0 };
    const pH = aqueousPH(ctx, { volumeM3: 0.001, kg, includeCompounds: false })!;
    expect(pH).toBeGreaterThan(8.1);
    expect(pH).toBeLessThan(8.5);
  });
  it('pure water is pH 7', () => {
    expect(
      aqueousPH(ctx, {
        volumeM3: 0.001,
        kg: { water: 1, hcl: 0, nahco3: 0, p: 0 },
        includeCompounds: false,
      })!,
    ).toBeCloseTo(7, 4);
  });
});

describe('filtration helpers', () => {
  it('Lewis–Squires returns the 25 °C value at 25 °C and falls with temperature', () => {
    expect(lewisSquires(0.89, 298.15).muMPas).toBeCloseTo(0.89, 10);
    expect(lewisSquires(0.89, 323.15).muMPas).toBeLessThan(0.89);
  });
  it('Lewis–Squires says when it has no solution (far below 25 °C) instead of inventing a value', () => {
    const cold = lewisSquires(0.89, 40);
    expect(cold.inRange).toBe(false);
    expect(cold.T_K).toBeGreaterThan(40);
    // At its limit the correlation gives 1000 × the 25 °C viscosity.
    expect(cold.muMPas).toBeCloseTo(890, 6);
    expect(lewisSquires(0.89, cold.T_K + 1).inRange).toBe(true);
  });
  it('cake-filtration time is quadratic in V without medium resistance', () => {
    const base = { muPaS: 1e-3, alphaMPerKg: 1e10, cKgM3: 100, areaM2: 0.1, dPPa: 8e4, RmPerM: 0 };
    const t1 = cakeFiltrationTime({ ...base, VM3: 0.01 });
    expect(cakeFiltrationTime({ ...base, VM3: 0.02 })).toBeCloseTo(4 * t1, 9);
    expect(t1).toBeCloseTo((1e-3 * 1e10 * 100 * 1e-4) / (2 * 0.01 * 8e4), 9);
  });
});
