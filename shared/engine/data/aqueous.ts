/**
 * Aqueous media: solutes that are dissolved in water at a given wt % to make a
 * wash (brine, bicarbonate, carbonate, caustic, acid, citric acid, ammonium
 * chloride). Densities are points (wt %, g/mL at 20 °C) for interpolation; the
 * 0 wt % point is pure water.
 *
 * The pKa values of carbonic and citric acid were read in a reproduced table
 * (status 'secondary'); none of the density tables, the ammonium pKa, the
 * saturation limits or the Setschenow coefficient below was read for this
 * library: they are the values recalled from the CRC Handbook tables named in
 * each source, and are marked 'unverified-memory'. docs/data-sources.md lists
 * them for checking.
 */
import type { AqueousSoluteRecord } from './types';
import { derived, recalled, reproduced, sv } from './solvents/common';

const FORMULA = (f: string) =>
  derived('iupac-atomic-weights', `computed from ${f} with conventional standard atomic weights`);
const DENSITY = recalled(
  'crc-concentrative-properties',
  'points at 20 °C; the 0 wt % point is water (0.9982 g/mL, IAPWS-95, recalled)',
);
const CARBONIC = sv(
  [6.35, 10.33],
  reproduced(
    'libretexts-e1-acid-dissociation',
    'carbonic acid pKa1 (H2CO3*/HCO3−) 6.35 and pKa2 (HCO3−/CO3 2−) 10.33 at 25 °C as printed (Ka 4.5e-7, 4.7e-11); the same values had been recalled from the CRC Handbook',
  ),
);

export const AQUEOUS_SOLUTES: readonly AqueousSoluteRecord[] = Object.freeze([
  {
    id: 'nacl',
    name: 'Sodium chloride (brine)',
    formula: 'NaCl',
    smiles: '[Na+].[Cl-]',
    cas: '7647-14-5',
    molarMassGmol: sv(58.44, FORMULA('NaCl')),
    acidBase: { kind: 'neutral' },
    densityPoints: sv<Array<[number, number]>>(
      [
        [0, 0.9982],
        [1, 1.0053],
        [2, 1.0125],
        [4, 1.0268],
        [6, 1.0413],
        [8, 1.0559],
        [10, 1.0707],
        [12, 1.0857],
        [14, 1.1009],
        [16, 1.1162],
        [18, 1.1319],
        [20, 1.1478],
        [22, 1.164],
        [24, 1.1804],
        [26, 1.1972],
      ],
      DENSITY,
    ),
    setschenowKs: sv(
      0.2,
      recalled(
        'setschenow-review-memory',
        'typical magnitude for small neutral organic solutes in NaCl (about 0.15–0.3 L/mol); measured values should override',
      ),
    ),
    maxWtPct: 26.4, // saturated at 20 °C (35.9 g/100 g water; recalled, CRC aqueous solubility table)
  },
  {
    id: 'nahco3',
    name: 'Sodium bicarbonate',
    formula: 'NaHCO3',
    smiles: '[Na+].OC([O-])=O',
    cas: '144-55-8',
    molarMassGmol: sv(84.006, FORMULA('NaHCO3')),
    acidBase: { kind: 'amphoteric-salt', pKa: CARBONIC },
    densityPoints: sv<Array<[number, number]>>(
      [
        [0, 0.9982],
        [1, 1.0054],
        [2, 1.0127],
        [4, 1.0274],
        [6, 1.0422],
        [8, 1.0571],
      ],
      DENSITY,
    ),
    maxWtPct: 8.7, // saturated at 20 °C (9.6 g/100 g water; recalled)
  },
  {
    id: 'na2co3',
    name: 'Sodium carbonate',
    formula: 'Na2CO3',
    smiles: '[Na+].[Na+].[O-]C([O-])=O',
    cas: '497-19-8',
    molarMassGmol: sv(105.988, FORMULA('Na2CO3')),
    acidBase: { kind: 'weak-base', pKa: CARBONIC },
    densityPoints: sv<Array<[number, number]>>(
      [
        [0, 0.9982],
        [1, 1.0086],
        [2, 1.019],
        [4, 1.0398],
        [6, 1.0606],
        [8, 1.0816],
        [10, 1.1029],
        [12, 1.1244],
        [14, 1.1463],
        [16, 1.1682],
      ],
      DENSITY,
    ),
    maxWtPct: 17.9, // saturated at 20 °C (21.8 g/100 g water; recalled)
  },
  {
    id: 'k2co3',
    name: 'Potassium carbonate',
    formula: 'K2CO3',
    smiles: '[K+].[K+].[O-]C([O-])=O',
    cas: '584-08-7',
    molarMassGmol: sv(138.204, FORMULA('K2CO3')),
    acidBase: { kind: 'weak-base', pKa: CARBONIC },
    densityPoints: sv<Array<[number, number]>>(
      [
        [0, 0.9982],
        [2, 1.0164],
        [4, 1.0348],
        [6, 1.0534],
        [8, 1.0722],
        [10, 1.0904],
        [20, 1.1898],
        [30, 1.2979],
        [40, 1.4141],
        [50, 1.5404],
      ],
      DENSITY,
    ),
    maxWtPct: 52.5, // saturated at 20 °C (111 g/100 g water; recalled)
  },
  {
    id: 'naoh',
    name: 'Sodium hydroxide',
    formula: 'NaOH',
    smiles: '[Na+].[OH-]',
    cas: '1310-73-2',
    molarMassGmol: sv(39.997, FORMULA('NaOH')),
    acidBase: { kind: 'strong-base', hydroxides: 1 },
    densityPoints: sv<Array<[number, number]>>(
      [
        [0, 0.9982],
        [1, 1.0095],
        [2, 1.0207],
        [4, 1.0428],
        [6, 1.0648],
        [8, 1.0869],
        [10, 1.1089],
        [12, 1.1309],
        [14, 1.153],
        [16, 1.1751],
        [20, 1.2191],
        [24, 1.2629],
        [30, 1.3279],
        [40, 1.43],
        [50, 1.5253],
      ],
      DENSITY,
    ),
    maxWtPct: 50, // usual commercial liquor; saturation is about 52 wt % at 20 °C (recalled)
  },
  {
    id: 'hcl',
    name: 'Hydrochloric acid',
    formula: 'HCl',
    smiles: 'Cl',
    cas: '7647-01-0',
    molarMassGmol: sv(36.458, FORMULA('HCl')),
    acidBase: { kind: 'strong-acid', protons: 1 },
    densityPoints: sv<Array<[number, number]>>(
      [
        [0, 0.9982],
        [1, 1.0032],
        [2, 1.0082],
        [4, 1.0181],
        [6, 1.0279],
        [8, 1.0376],
        [10, 1.0474],
        [12, 1.0574],
        [14, 1.0675],
        [16, 1.0776],
        [20, 1.098],
        [24, 1.1187],
        [30, 1.1493],
        [36, 1.1789],
      ],
      DENSITY,
    ),
    maxWtPct: 37, // concentrated hydrochloric acid
  },
  {
    id: 'citric-acid',
    name: 'Citric acid',
    formula: 'C6H8O7',
    smiles: 'OC(=O)CC(O)(CC(=O)O)C(=O)O',
    cas: '77-92-9',
    molarMassGmol: sv(192.123, FORMULA('C6H8O7')),
    acidBase: {
      kind: 'weak-acid',
      pKa: sv(
        [3.13, 4.76, 6.4],
        reproduced(
          'libretexts-e1-acid-dissociation',
          'pKa1–pKa3 3.13, 4.76, 6.40 at 25 °C as printed (Ka 7.4e-4, 1.7e-5, 4.0e-7); the same values had been recalled',
        ),
      ),
    },
    densityPoints: sv<Array<[number, number]>>(
      [
        [0, 0.9982],
        [2, 1.0057],
        [4, 1.0132],
        [6, 1.0209],
        [8, 1.0287],
        [10, 1.0367],
        [20, 1.0793],
        [30, 1.1257],
        [40, 1.176],
        [50, 1.2306],
      ],
      DENSITY,
    ),
    maxWtPct: 59, // saturated at 20 °C (about 147 g/100 g water; recalled)
  },
  {
    id: 'nh4cl',
    name: 'Ammonium chloride',
    formula: 'NH4Cl',
    smiles: '[NH4+].[Cl-]',
    cas: '12125-02-9',
    molarMassGmol: sv(53.489, FORMULA('NH4Cl')),
    acidBase: {
      kind: 'weak-acid',
      pKa: sv([9.25], recalled('crc-dissociation-constants', 'NH4+ at 25 °C')),
    },
    densityPoints: sv<Array<[number, number]>>(
      [
        [0, 0.9982],
        [1, 1.0013],
        [2, 1.0045],
        [4, 1.0107],
        [6, 1.0168],
        [8, 1.0227],
        [10, 1.0286],
        [12, 1.0344],
        [16, 1.0457],
        [20, 1.0567],
        [24, 1.0674],
      ],
      DENSITY,
    ),
    maxWtPct: 27.1, // saturated at 20 °C (37.2 g/100 g water; recalled)
  },
]);
