/**
 * Enthalpy of vaporisation at the normal boiling point against Perry's Chemical
 * Engineers' Handbook, 8th ed., Table 2-150 (DIPPR equation 106,
 * ΔH = C1 (1 − Tr)^(C2 + C3 Tr + C4 Tr²)), as carried by CalebBell/chemicals
 * chemicals/Phase Change/Table 2-150 Heats of Vaporization of Inorganic and
 * Organic Liquids.tsv (C1 in J/mol). The coefficients are copied from that table.
 */
import { describe, expect, it } from 'vitest';
import { solventById } from '@shared/engine/data';

function dippr106(Tc: number, C1: number, C2: number, C3: number, C4: number, T: number): number {
  const Tr = T / Tc;
  return (C1 * (1 - Tr) ** (C2 + C3 * Tr + C4 * Tr * Tr)) / 1000;
}

// [id, Tc / K, C1, C2, C3, C4]
const READ_FROM_PERRY: Array<[string, number, number, number, number, number]> = [
  ['dmf', 649.6, 59217, 0.37996, 0, 0],
  ['1-octanol', 652.3, 72468, -1.2464, 3.6797, -2.0665],
];

// Values the library takes from the CRC table, cross-checked against Perry 2-150
const CRC_CROSS: Array<[string, number, number, number, number, number]> = [
  ['ethanol', 514, 55789, 0.31245, 0, 0],
  ['toluene', 591.75, 49507, 0.37742, 0, 0],
  ['acetonitrile', 545.5, 43511, 0.34765, 0, 0],
];

function tbK(id: string): number {
  return solventById(id)!.boilingPointC.value + 273.15;
}

describe('ΔvapH at Tb read from Perry 2-150', () => {
  it.each(READ_FROM_PERRY)('%s', (id, Tc, C1, C2, C3, C4) => {
    const h = solventById(id)!.enthalpyVapKJmol;
    expect(h, id).toBeDefined();
    expect(h!.source).toMatchObject({ ref: 'perry-8e-2-150-hvap', status: 'confirmed' });
    expect(Math.abs(h!.value - dippr106(Tc, C1, C2, C3, C4, tbK(id)))).toBeLessThan(0.05);
  });
});

describe('CRC ΔvapH at Tb agrees with Perry 2-150', () => {
  it.each(CRC_CROSS)('%s within 2 %', (id, Tc, C1, C2, C3, C4) => {
    const h = solventById(id)!.enthalpyVapKJmol!;
    expect(Math.abs(h.value - dippr106(Tc, C1, C2, C3, C4, tbK(id))) / h.value).toBeLessThan(0.02);
  });
});
