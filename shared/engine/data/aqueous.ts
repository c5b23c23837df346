/**
 * Aqueous media: solutes that are dissolved in water at a given wt % to make a
 * wash (brine, bicarbonate, carbonate, caustic, acid, citric acid, ammonium
 * chloride). Densities are points (wt %, g/mL at 20 °C) for interpolation; the
 * 0 wt % point is pure water.
 *
 * The pKa values of carbonic and citric acid were read in a reproduced table
 * (status 'secondary'). The density points of sodium chloride, bicarbonate,
 * carbonate and hydroxide, hydrochloric acid and ammonium chloride are computed
 * from Laliberté's published density model and coefficients (status 'estimated':
 * derived from the source's values). The potassium carbonate and citric acid
 * density tables, the ammonium pKa, the saturation limits and the Setschenow
 * coefficient were not read for this library: they are the values recalled from
 * the CRC Handbook tables named in each source, and are marked
 * 'unverified-memory'. docs/data-sources.md lists them for checking.
 */
import type { AqueousSoluteRecord } from './types';
import { derived, recalled, reproduced, sv } from './solvents/common';

const FORMULA = (f: string) =>
  derived('iupac-atomic-weights', `computed from ${f} with conventional standard atomic weights`);
/**
 * Density points computed at 20 °C from Laliberté's model (J. Chem. Eng. Data 2009, 54, 1725): ρ = 1/(w_w/ρ_w +
 * w/ρ_app), ρ_app = (c0 w + c1) exp(10⁻⁶ (t + c4)²)/(w + c2 + c3 t), with the solute's coefficients c0–c4 as
 * tabulated there; the 0 wt % point is the model's water (998.20 kg/m³ at 20 °C).
 */
const LALIBERTE = (note: string) =>
  derived(
    'laliberte-2009-density',
    `points at 20 °C computed from the model with the solute's coefficients (rounded to 4 decimals); ${note}`,
  );
const DENSITY = recalled(
  'crc-concentrative-properties',
  'points at 20 °C; the 0 wt % point is water (0.9982 g/mL at 20 °C, Tanaka et al. 2001)',
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
        [1, 1.0052],
        [2, 1.0123],
        [4, 1.0266],
        [6, 1.0411],
        [8, 1.0558],
        [10, 1.0708],
        [12, 1.0858],
        [14, 1.1011],
        [16, 1.1166],
        [18, 1.1323],
        [20, 1.1481],
        [22, 1.1641],
        [24, 1.1803],
        [26, 1.1967],
      ],
      LALIBERTE(
        'largest difference from the recalled CRC points 0.0005 g/mL (fitted range 0–140 °C, w ≤ 0.266, 869 points)',
      ),
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
        [1, 1.0055],
        [2, 1.0128],
        [4, 1.0272],
        [6, 1.0414],
        [8, 1.0557],
      ],
      LALIBERTE(
        'largest difference from the recalled CRC points 0.0014 g/mL, at 8 wt % (fitted range 0–125 °C, w ≤ 0.126)',
      ),
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
        [1, 1.0087],
        [2, 1.0192],
        [4, 1.0402],
        [6, 1.0612],
        [8, 1.0823],
        [10, 1.1036],
        [12, 1.1251],
        [14, 1.147],
        [16, 1.1692],
      ],
      LALIBERTE(
        'largest difference from the recalled CRC points 0.0010 g/mL (fitted range 0–100 °C, w ≤ 0.209)',
      ),
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
      recalled(
        'crc-concentrative-properties',
        "points at 20 °C; the 0 wt % point is water (0.9982 g/mL, recalled). Laliberté's density model (J. Chem. Eng. Data 2009, 54, 1725; fitted to w ≤ 0.361) gives 0.002–0.006 g/mL less at 6–30 wt % and cannot check the 40 and 50 wt % points, so these stay recalled",
      ),
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
        [1, 1.0092],
        [2, 1.0202],
        [4, 1.0422],
        [6, 1.0643],
        [8, 1.0864],
        [10, 1.1085],
        [12, 1.1307],
        [14, 1.1528],
        [16, 1.1749],
        [20, 1.2187],
        [24, 1.2621],
        [30, 1.3257],
        [40, 1.426],
        [50, 1.5163],
      ],
      LALIBERTE(
        'largest difference from the recalled CRC points 0.0008 g/mL up to 24 wt %, 0.009 g/mL at 50 wt % (recalled 1.5253), the edge of the fitted range (4–120 °C, w ≤ 0.503)',
      ),
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
        [1, 1.0031],
        [2, 1.0079],
        [4, 1.0177],
        [6, 1.0275],
        [8, 1.0374],
        [10, 1.0473],
        [12, 1.0572],
        [14, 1.0673],
        [16, 1.0773],
        [20, 1.0975],
        [24, 1.1178],
        [30, 1.1486],
        [36, 1.1794],
      ],
      LALIBERTE(
        'largest difference from the recalled CRC points 0.0009 g/mL (fitted range 5–99 °C, w ≤ 0.376)',
      ),
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
        [1, 1.0012],
        [2, 1.0041],
        [4, 1.01],
        [6, 1.0159],
        [8, 1.0217],
        [10, 1.0276],
        [12, 1.0334],
        [16, 1.0449],
        [20, 1.0563],
        [24, 1.0675],
      ],
      LALIBERTE(
        'largest difference from the recalled CRC points 0.0010 g/mL (fitted range 12.5–100 °C, w ≤ 0.40)',
      ),
    ),
    maxWtPct: 27.1, // saturated at 20 °C (37.2 g/100 g water; recalled)
  },
]);
