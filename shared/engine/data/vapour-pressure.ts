/**
 * Wide-range vapour-pressure correlations of the library solvents, keyed by
 * solvent id, with their coefficients exactly as published. Every row covers
 * the liquid from its triple (or melting) point to its critical point, so a
 * route never extrapolates beyond a fitted range in the liquid region.
 *
 * Sources: Perry's Chemical Engineers' Handbook, 8th ed., Table 2-8 (DIPPR
 * equation 101), read through CalebBell/chemicals `chemicals/Vapor
 * Pressure/Table 2-8 Vapor Pressure of Inorganic and Organic Liquids.tsv`; the
 * VDI Heat Atlas PPDS Wagner set, read through `chemicals/Vapor Pressure/VDI
 * PPDS Boiling temperatures at different pressures.tsv` (for the two library
 * solvents absent from Table 2-8 but present there). Solvents in neither
 * table (isopropyl acetate, 2-butanol, 2-MeTHF, DME, DMAc, NMP, CPME) use their
 * Antoine set joined to the normal boiling point (thermo/antoine.ts).
 */
import type { Sourced, VapourPressureCorrelation } from './types';
import { read } from './solvents/common';

/** DIPPR 101 row of Perry's Table 2-8: C1, C2, C3, C4, C5, Tmin [K], Tmax [K]. */
function perry(
  C1: number,
  C2: number,
  C3: number,
  C4: number,
  C5: number,
  TminK: number,
  TmaxK: number,
): Sourced<VapourPressureCorrelation> {
  return {
    value: { kind: 'dippr101', C1, C2, C3, C4, C5, TminK, TmaxK },
    source: read('perry-8e-2-8-vapour-pressure'),
  };
}

/**
 * A Perry row that misses the CRC normal boiling point by more than 0.5 K, anchored there: ln P is
 * corrected by dLnP·f(1/T) with f a quadratic in 1/T that is 1 at Tb and 0 at 25 °C and at Tc, so the
 * row's value at 25 °C and its critical point are kept and the correction is smooth (value and slope).
 * dLnP = ln(101 325 Pa) − ln P_row(Tb), from the DIPPR 101 form.
 */
function anchoredAtTb(
  row: Sourced<VapourPressureCorrelation>,
  TbK: number,
): Sourced<VapourPressureCorrelation> {
  const c = row.value;
  if (c.kind !== 'dippr101') return row;
  const lnRow = c.C1 + c.C2 / TbK + c.C3 * Math.log(TbK) + c.C4 * TbK ** c.C5;
  return {
    value: { ...c, anchor: { TbK, T1K: 298.15, dLnP: Math.log(101325) - lnRow } },
    source: read(
      'perry-8e-2-8-vapour-pressure',
      `anchored at the CRC normal boiling point ${(TbK - 273.15).toFixed(2)} °C (the row gives a boiling point more than 0.5 K away); unchanged at 25 °C and at Tc`,
    ),
  };
}

/** VDI PPDS Wagner row: Tm [K], Tc [K], Pc [Pa], A, B, C, D. */
function vdi(
  TmK: number,
  TcK: number,
  PcPa: number,
  A: number,
  B: number,
  C: number,
  D: number,
): Sourced<VapourPressureCorrelation> {
  return {
    value: { kind: 'wagner-2.5-5', TcK, PcPa, A, B, C, D, TminK: TmK, TmaxK: TcK },
    source: read('vdi-ppds-wagner'),
  };
}

export const VAPOUR_PRESSURE_CORRELATIONS: Readonly<
  Record<string, Sourced<VapourPressureCorrelation>>
> = Object.freeze({
  water: perry(73.649, -7258.2, -7.3037, 4.1653e-6, 2, 273.16, 647.096),
  methanol: perry(82.718, -6904.5, -8.8622, 7.4664e-6, 2, 175.47, 512.5),
  ethanol: perry(73.304, -7122.3, -7.1424, 2.8853e-6, 2, 159.05, 514),
  '1-propanol': perry(84.6642, -8307.2, -8.5767, 7.5091e-18, 6, 146.95, 536.8),
  // Anchored at the CRC Tb of the solvent record (82.21 °C); the row alone gives 81.61 °C.
  '2-propanol': anchoredAtTb(perry(96.094, -8575.4, -10.292, 1.6665e-17, 6, 185.26, 508.3), 355.36),
  '1-butanol': perry(106.295, -9866.4, -11.655, 1.0832e-17, 6, 183.85, 563.1),
  isobutanol: vdi(165.15, 547.75, 4300000, -7.8296, 0.4451, -5.32308, -10.00835),
  'tert-butanol': perry(172.27, -11589, -22.113, 1.3703e-5, 2, 298.97, 506.2),
  // Anchored at the CRC Tb of the solvent record (194.7 °C); the row alone gives 193.9 °C.
  '1-octanol': anchoredAtTb(perry(144.111, -13667, -16.826, 9.3666e-18, 6, 257.65, 652.3), 467.85),
  'ethyl-acetate': perry(66.824, -6227.6, -6.41, 1.7914e-17, 6, 189.6, 523.3),
  'n-butyl-acetate': perry(122.82, -9253.2, -14.99, 1.047e-5, 2, 199.65, 575.4),
  acetone: perry(69.006, -5599.6, -7.0985, 6.2237e-6, 2, 178.45, 508.2),
  '2-butanone': perry(72.698, -6143.6, -7.5779, 5.6476e-6, 2, 186.48, 535.5),
  mibk: perry(80.503, -7421.8, -8.379, 1.8114e-17, 6, 189.15, 574.6),
  thf: perry(54.898, -5305.4, -4.7627, 1.4291e-17, 6, 164.65, 540.15),
  mtbe: perry(57.1511, -5201.7, -5.1429, 1.6529e-17, 6, 164.55, 497.1),
  'diethyl-ether': perry(136.9, -6954.3, -19.254, 0.024508, 1, 156.85, 466.7),
  'diisopropyl-ether': perry(41.631, -4668.7, -2.8551, 0.00063693, 1, 187.65, 500.05),
  '1-4-dioxane': perry(44.494, -5406.7, -3.1287, 2.8913e-18, 6, 284.95, 587),
  anisole: perry(128.06, -9307.7, -16.693, 0.014919, 1, 235.65, 645.6),
  dichloromethane: perry(101.6, -6541.6, -12.247, 1.2311e-5, 2, 178.01, 510),
  chloroform: perry(146.43, -7792.3, -20.614, 0.024578, 1, 207.15, 536.4),
  chlorobenzene: perry(54.144, -6244.4, -4.5343, 4.703e-18, 6, 227.95, 632.35),
  'n-heptane': perry(87.829, -6996.4, -9.8802, 7.2099e-6, 2, 182.57, 540.2),
  'n-hexane': perry(104.65, -6995.5, -12.702, 1.2381e-5, 2, 177.83, 507.6),
  cyclohexane: perry(51.087, -5226.4, -4.2278, 9.7554e-18, 6, 279.69, 553.8),
  methylcyclohexane: perry(92.684, -7080.8, -10.695, 8.1366e-6, 2, 146.58, 572.1),
  toluene: perry(76.945, -6729.8, -8.179, 5.3017e-6, 2, 178.18, 591.75),
  'o-xylene': perry(90.405, -7955.2, -10.086, 5.9594e-6, 2, 247.98, 630.3),
  acetonitrile: perry(58.302, -5385.6, -5.4954, 5.3634e-6, 2, 229.32, 545.5),
  // Anchored at the CRC Tb of the solvent records (152.8 °C, 191.9 °C); the rows alone give 151.8 °C, 190.7 °C.
  dmf: anchoredAtTb(perry(82.762, -7955.5, -8.8038, 4.2431e-6, 2, 212.72, 649.6), 425.95),
  dmso: anchoredAtTb(perry(56.273, -7620.6, -4.6279, 4.3819e-7, 2, 291.67, 729), 465.05),
  'acetic-acid': perry(53.27, -6304.5, -4.2985, 8.8865e-18, 6, 289.81, 591.95),
  pyridine: vdi(231.45, 620, 5630000, -7.07868, 1.45189, -2.11714, -3.20359),
});
