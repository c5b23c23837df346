/**
 * Pure-component data for the thermodynamics reference checks, copied with
 * their sources from the project's reference-data notes (§C Antoine constants,
 * §H boiling points). Kept here so the checks do not depend on the solvent
 * library's editing; each number names where it was read.
 *
 * Antoine sources:
 *  POLING = Poling, Prausnitz & O'Connell, The Properties of Gases and Liquids,
 *    5th ed. (2001), Appendix A, as carried by CalebBell/chemicals
 *    "chemicals/Vapor Pressure/Antoine Collection Poling.tsv" (log10 bar, °C).
 *  NIST = NIST Chemistry WebBook, as carried by CalebBell/chemicals
 *    "chemicals/Misc/webbook_constants.tsv" (log10 bar, K).
 *  LANDOLT = Landolt-Börnstein IV/20 via chemicals "Landolt_antoine_V20.tsv" (log10 bar, K).
 * Tb: CRC Handbook of Chemistry and Physics, "Physical Constants of Organic
 *  Compounds", via chemicals "chemicals/Misc/Physical Constants of Organic
 *  Compounds.csv" (water: the inorganic-compounds file, 373.124 K).
 * UNIFAC groups: original-UNIFAC subgroup numbers (DDBST list); assignments are
 *  the usual ones (e.g. Poling et al. 5th ed. Table 8-23 examples) — common practice.
 */
import type { AntoineSet, Source } from '@shared/engine/data/types';
import type { VleComponent } from '@shared/engine/thermo/vle';

const POLING: Source = {
  ref: "Poling, Prausnitz & O'Connell, Properties of Gases and Liquids 5th ed., App. A (via CalebBell/chemicals Antoine Collection Poling.tsv)",
  status: 'confirmed',
};
const NIST: Source = {
  ref: 'NIST Chemistry WebBook (via CalebBell/chemicals webbook_constants.tsv)',
  status: 'confirmed',
};
const LANDOLT: Source = {
  ref: 'Landolt-Börnstein IV/20 (via CalebBell/chemicals Landolt_antoine_V20.tsv)',
  status: 'confirmed',
};

const degC = (A: number, B: number, C: number, TminK: number, TmaxK: number): AntoineSet => ({
  form: 'log10-bar-degC',
  A,
  B,
  C,
  TminK,
  TmaxK,
  source: POLING,
});
const kelvin = (
  A: number,
  B: number,
  C: number,
  TminK: number,
  TmaxK: number,
  source: Source = NIST,
): AntoineSet => ({
  form: 'log10-bar-K',
  A,
  B,
  C,
  TminK,
  TmaxK,
  source,
});

export interface ReferenceComponent extends VleComponent {
  name: string;
  /** CRC normal boiling point [°C] (reference-data §H, first value). */
  crcTbC: number;
}

export const water: ReferenceComponent = {
  name: 'water',
  antoine: [degC(5.11564, 1687.537, 230.17, 273.2, 473.2)],
  unifac: { 16: 1 },
  crcTbC: 99.97,
};
export const methanol: ReferenceComponent = {
  name: 'methanol',
  antoine: [degC(5.20277, 1580.08, 239.5, 262.59, 356)],
  unifac: { 15: 1 },
  crcTbC: 64.5,
};
export const ethanol: ReferenceComponent = {
  name: 'ethanol',
  antoine: [degC(5.33675, 1648.22, 230.918, 276.5, 369.54)],
  unifac: { 1: 1, 2: 1, 14: 1 },
  crcTbC: 78.24,
};
export const isopropanol: ReferenceComponent = {
  name: '2-propanol',
  antoine: [degC(5.24268, 1580.92, 219.61, 281.28, 373.46)],
  unifac: { 1: 2, 3: 1, 14: 1 },
  crcTbC: 82.21,
};
export const acetone: ReferenceComponent = {
  name: 'acetone',
  antoine: [degC(4.2184, 1197.01, 228.06, 247.38, 350.65)],
  unifac: { 1: 1, 18: 1 },
  crcTbC: 56.08,
};
export const ethylAcetate: ReferenceComponent = {
  name: 'ethyl acetate',
  antoine: [degC(4.13361, 1195.13, 212.47, 265.5, 372.51)],
  unifac: { 1: 1, 2: 1, 21: 1 },
  crcTbC: 77.1,
};
export const isopropylAcetate: ReferenceComponent = {
  name: 'isopropyl acetate',
  antoine: [kelvin(4.55172, 1490.877, -34.098, 234.9, 362)],
  unifac: { 1: 2, 3: 1, 21: 1 },
  crcTbC: 88.6,
};
export const toluene: ReferenceComponent = {
  name: 'toluene',
  antoine: [degC(4.05043, 1327.62, 217.625, 286.44, 409.61)],
  unifac: { 9: 5, 11: 1 },
  crcTbC: 110.6,
};
export const heptane: ReferenceComponent = {
  name: 'n-heptane',
  antoine: [degC(4.02023, 1263.909, 216.432, 277.71, 396.53)],
  unifac: { 1: 2, 2: 5 },
  crcTbC: 98.38,
};
export const hexane: ReferenceComponent = {
  name: 'n-hexane',
  antoine: [degC(4.00139, 1170.875, 224.317, 254.24, 365.25)],
  unifac: { 1: 2, 2: 4 },
  crcTbC: 68.72,
};
export const thf: ReferenceComponent = {
  name: 'tetrahydrofuran',
  antoine: [degC(4.12142, 1203.11, 226.355, 253.5, 361.71)],
  unifac: { 2: 3, 27: 1 },
  crcTbC: 66.0,
};
export const mtbe: ReferenceComponent = {
  name: 'MTBE',
  antoine: [kelvin(4.62562, 1454.276, -13.144, 287.0, 326.0, LANDOLT)],
  unifac: { 1: 3, 4: 1, 24: 1 },
  crcTbC: 55.1,
};
export const dichloromethane: ReferenceComponent = {
  name: 'dichloromethane',
  antoine: [degC(4.07622, 1070.07, 223.24, 235.2, 333.36)],
  unifac: { 47: 1 },
  crcTbC: 39.8,
};
export const acetonitrile: ReferenceComponent = {
  name: 'acetonitrile',
  antoine: [kelvin(4.27873, 1355.374, -37.853, 288.3, 362.3)],
  unifac: { 40: 1 },
  crcTbC: 81.6,
};
export const mibk: ReferenceComponent = {
  name: 'MIBK',
  antoine: [degC(3.8222, 1190.69, 195.45, 293.4, 415.85)],
  unifac: { 1: 2, 2: 1, 3: 1, 18: 1 },
  crcTbC: 115.7,
};
export const butanol: ReferenceComponent = {
  name: '1-butanol',
  antoine: [degC(4.6493, 1395.14, 182.739, 310.18, 411.26)],
  unifac: { 1: 1, 2: 3, 14: 1 },
  crcTbC: 117.6,
};
export const aceticAcid: ReferenceComponent = {
  name: 'acetic acid',
  antoine: [degC(4.54456, 1555.12, 224.65, 297.58, 414.97)],
  unifac: { 1: 1, 42: 1 },
  crcTbC: 117.9,
};
export const dmf: ReferenceComponent = {
  name: 'DMF',
  antoine: [kelvin(3.93068, 1337.716, -82.648, 303, 363)],
  unifac: { 72: 1 },
  crcTbC: 152.8,
};
export const dmso: ReferenceComponent = {
  name: 'DMSO',
  antoine: [kelvin(4.49107, 1807.002, -60.995, 325.49, 442.09)],
  unifac: { 67: 1 },
  crcTbC: 191.9,
};
