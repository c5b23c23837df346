/**
 * Water and alcohols: curated solvent records. Every value carries its source; see
 * shared/engine/data/sources.ts for the full citations and docs/data-sources.md
 * for how the values were chosen. Antoine constants are kept in the published
 * form (see AntoineSet in ../types.ts).
 */
import type { SolventBaseRecord } from '../types';
import { antoine, ASSIGNED, derived, read, recalled, sv } from './common';

export const WATER_ALCOHOLS_SOLVENTS: readonly SolventBaseRecord[] = [
  {
    id: 'water',
    name: 'Water',
    synonyms: ['H2O'],
    smiles: 'O',
    cas: '7732-18-5',
    molarMassGmol: sv(
      18.015,
      derived(
        'iupac-atomic-weights',
        'computed from H2O with conventional standard atomic weights',
      ),
    ),
    density: sv(
      { gPerMl: 0.99821, temperatureC: 20 },
      read(
        'tanaka-2001-water-density',
        '998.2067 kg/m³ at 20 °C from the recommended equation (Thiesen form, air-free SMOW, 101.325 kPa) with its five coefficients; the stored 0.99821 g/mL had been recalled as the IAPWS-95 value and agrees to the digits given',
      ),
    ),
    boilingPointC: sv(99.97, read('crc-inorganic-constants', '373.124 K')),
    meltingPointC: sv(0, read('crc-inorganic-constants', '273.15 K (row 7732-18-5)')),
    antoine: [
      antoine(
        'log10-bar-degC',
        5.11564,
        1687.537,
        230.17,
        273.2,
        473.2,
        read(
          'poling-5e-antoine',
          'data file stores log10(P/Pa) with T/K; converted A − 5, C + 273.15',
        ),
      ),
    ],
    enthalpyVapKJmol: sv(40.65, read('crc-enthalpy-vaporization')),
    hansen: sv({ d: 15.5, p: 16, h: 42.3 }, read('hansen-hspipy')),
    molarVolumeCm3mol: sv(18, derived('derived-quantity', 'molar mass / density at 20 °C')),
    unifac: sv({ 16: 1 }, read('unifac-groups', 'whole-molecule subgroup of the original table')),
    waterMiscibility: 'miscible',
    viscosityMPas25C: sv(
      0.893,
      read(
        'vn-3term-viscosity',
        'computed at 298.15 K from A = -1.5318, B = -220.57, C = 149.39 (log10(μ/mPa·s) = A + B/(C − T/K), fitted 270–380 K), 3 significant figures; Perry 2-313 gives 0.913; stored value was 0.89 (recalled)',
      ),
    ),
  },
  {
    id: 'methanol',
    name: 'Methanol',
    synonyms: ['MeOH', 'methyl alcohol'],
    smiles: 'CO',
    cas: '67-56-1',
    molarMassGmol: sv(
      32.042,
      derived(
        'iupac-atomic-weights',
        'computed from CH4O with conventional standard atomic weights',
      ),
    ),
    density: sv({ gPerMl: 0.7914, temperatureC: 20 }, read('crc-organic-constants')),
    boilingPointC: sv(64.5, read('crc-organic-constants')),
    meltingPointC: sv(-97.5, read('crc-organic-constants')),
    antoine: [
      antoine(
        'log10-bar-degC',
        5.20277,
        1580.08,
        239.5,
        262.59,
        356,
        read(
          'poling-5e-antoine',
          'data file stores log10(P/Pa) with T/K; converted A − 5, C + 273.15',
        ),
      ),
      antoine(
        'log10-bar-K',
        5.15853,
        1569.613,
        -34.846,
        353.5,
        512.63,
        read(
          'nist-webbook-antoine',
          'as converted in reference-data.md §C from the data file (ln P/Pa, T/K); high-temperature segment',
        ),
      ),
    ],
    enthalpyVapKJmol: sv(35.21, read('crc-enthalpy-vaporization')),
    hansen: sv(
      { d: 15.1, p: 12.3, h: 22.3 },
      read(
        'hansen-hspipy',
        'newer HSPiP revision (Díaz de los Ríos & Murcia Belmonte 2022): δD 14.7',
      ),
    ),
    molarVolumeCm3mol: sv(40.5, derived('derived-quantity', 'molar mass / density at 20 °C')),
    unifac: sv({ 15: 1 }, read('unifac-groups', 'whole-molecule subgroup of the original table')),
    waterMiscibility: 'miscible',
    viscosityMPas25C: sv(
      0.546,
      read(
        'vn-dutt-prasad-viscosity',
        'computed at 298.15 K from A = -2.2968, B = -675.41, C = -33.89 (log10(μ/mPa·s) = A + B/(C − T/K), fitted 248–333 K), 3 significant figures; Perry 2-313 gives 0.538; V&N 3-term set 0.544; stored value was 0.544 (recalled)',
      ),
    ),
  },
  {
    id: 'ethanol',
    name: 'Ethanol',
    synonyms: ['EtOH', 'ethyl alcohol'],
    smiles: 'CCO',
    cas: '64-17-5',
    molarMassGmol: sv(
      46.069,
      derived(
        'iupac-atomic-weights',
        'computed from C2H6O with conventional standard atomic weights',
      ),
    ),
    density: sv({ gPerMl: 0.7893, temperatureC: 20 }, read('crc-organic-constants')),
    boilingPointC: sv(78.24, read('crc-organic-constants')),
    meltingPointC: sv(-114.14, read('crc-organic-constants')),
    antoine: [
      antoine(
        'log10-bar-degC',
        5.33675,
        1648.22,
        230.918,
        276.5,
        369.54,
        read(
          'poling-5e-antoine',
          'data file stores log10(P/Pa) with T/K; converted A − 5, C + 273.15',
        ),
      ),
      antoine(
        'log10-bar-K',
        4.92531,
        1432.526,
        -61.819,
        364.8,
        513.91,
        read(
          'nist-webbook-antoine',
          'as converted in reference-data.md §C from the data file (ln P/Pa, T/K); high-temperature segment',
        ),
      ),
    ],
    enthalpyVapKJmol: sv(38.56, read('crc-enthalpy-vaporization')),
    hansen: sv({ d: 15.8, p: 8.8, h: 19.4 }, read('hansen-hspipy')),
    molarVolumeCm3mol: sv(58.4, derived('derived-quantity', 'molar mass / density at 20 °C')),
    unifac: sv({ 1: 1, 2: 1, 14: 1 }, ASSIGNED),
    waterMiscibility: 'miscible',
    viscosityMPas25C: sv(
      1.07,
      read(
        'vn-dutt-prasad-viscosity',
        'computed at 298.15 K from A = -2.8857, B = -1032.53, C = -55.95 (log10(μ/mPa·s) = A + B/(C − T/K), fitted 248–348 K), 3 significant figures; Perry 2-313 gives 1.08; stored value was 1.074 (recalled)',
      ),
    ),
  },
  {
    id: '1-propanol',
    name: '1-Propanol',
    synonyms: ['n-propanol', 'propan-1-ol', 'n-PrOH'],
    smiles: 'CCCO',
    cas: '71-23-8',
    molarMassGmol: sv(
      60.096,
      derived(
        'iupac-atomic-weights',
        'computed from C3H8O with conventional standard atomic weights',
      ),
    ),
    density: sv({ gPerMl: 0.7997, temperatureC: 25 }, read('crc-organic-constants')),
    boilingPointC: sv(97.04, read('crc-organic-constants')),
    meltingPointC: sv(-124.39, read('crc-organic-constants')),
    antoine: [
      antoine(
        'log10-bar-degC',
        4.99991,
        1512.94,
        205.807,
        293.19,
        389.32,
        read(
          'poling-5e-antoine',
          'data file stores log10(P/Pa) with T/K; converted A − 5, C + 273.15',
        ),
      ),
    ],
    enthalpyVapKJmol: sv(41.44, read('crc-enthalpy-vaporization')),
    hansen: sv({ d: 16, p: 6.8, h: 17.4 }, read('hansen-hspipy')),
    molarVolumeCm3mol: sv(75.1, derived('derived-quantity', 'molar mass / density at 25 °C')),
    unifac: sv({ 1: 1, 2: 2, 14: 1 }, ASSIGNED),
    waterMiscibility: 'miscible',
    viscosityMPas25C: sv(
      1.94,
      read(
        'vn-dutt-prasad-viscosity',
        'computed at 298.15 K from A = -2.73, B = -854.52, C = 14.96 (log10(μ/mPa·s) = A + B/(C − T/K), fitted 248–348 K), 3 significant figures; Perry 2-313 gives 1.95; stored value was 1.945 (recalled)',
      ),
    ),
  },
  {
    id: '2-propanol',
    name: '2-Propanol',
    synonyms: ['isopropanol', 'IPA', 'isopropyl alcohol', 'propan-2-ol'],
    smiles: 'CC(C)O',
    cas: '67-63-0',
    molarMassGmol: sv(
      60.096,
      derived(
        'iupac-atomic-weights',
        'computed from C3H8O with conventional standard atomic weights',
      ),
    ),
    density: sv({ gPerMl: 0.7809, temperatureC: 25 }, read('crc-organic-constants')),
    boilingPointC: sv(82.21, read('crc-organic-constants')),
    meltingPointC: sv(-87.91, read('crc-organic-constants')),
    antoine: [
      antoine(
        'log10-bar-degC',
        5.24268,
        1580.92,
        219.61,
        281.28,
        373.46,
        read(
          'poling-5e-antoine',
          'data file stores log10(P/Pa) with T/K; converted A − 5, C + 273.15',
        ),
      ),
      antoine(
        'log10-bar-K',
        4.57795,
        1221.423,
        -87.474,
        395.1,
        508.24,
        read(
          'nist-webbook-antoine',
          'as converted in reference-data.md §C from the data file (ln P/Pa, T/K); high-temperature segment',
        ),
      ),
    ],
    enthalpyVapKJmol: sv(39.85, read('crc-enthalpy-vaporization')),
    hansen: sv({ d: 15.8, p: 6.1, h: 16.4 }, read('hansen-hspipy')),
    molarVolumeCm3mol: sv(77, derived('derived-quantity', 'molar mass / density at 25 °C')),
    unifac: sv({ 1: 2, 3: 1, 14: 1 }, ASSIGNED),
    waterMiscibility: 'miscible',
    viscosityMPas25C: sv(
      2.07,
      read(
        'vn-dutt-prasad-viscosity',
        'computed at 298.15 K from A = -3.9124, B = -1399.28, C = -32.76 (log10(μ/mPa·s) = A + B/(C − T/K), fitted 273–348 K), 3 significant figures; Perry 2-313 gives 2.05; V&N 3-term set 2.04; stored value was 2.038 (recalled)',
      ),
    ),
  },
  {
    id: '1-butanol',
    name: '1-Butanol',
    synonyms: ['n-butanol', 'butan-1-ol', 'n-BuOH'],
    smiles: 'CCCCO',
    cas: '71-36-3',
    molarMassGmol: sv(
      74.123,
      derived(
        'iupac-atomic-weights',
        'computed from C4H10O with conventional standard atomic weights',
      ),
    ),
    density: sv({ gPerMl: 0.8095, temperatureC: 20 }, read('crc-organic-constants')),
    boilingPointC: sv(117.6, read('crc-organic-constants')),
    meltingPointC: sv(-88.6, read('crc-organic-constants')),
    antoine: [
      antoine(
        'log10-bar-degC',
        4.6493,
        1395.14,
        182.739,
        310.18,
        411.26,
        read(
          'poling-5e-antoine',
          'data file stores log10(P/Pa) with T/K; converted A − 5, C + 273.15',
        ),
      ),
      antoine(
        'log10-bar-K',
        4.54607,
        1351.555,
        -93.34,
        295.8,
        391,
        read(
          'nist-webbook-antoine',
          'as converted in reference-data.md §C from the data file (ln P/Pa, T/K)',
        ),
      ),
    ],
    enthalpyVapKJmol: sv(43.29, read('crc-enthalpy-vaporization')),
    hansen: sv({ d: 16, p: 5.7, h: 15.8 }, read('hansen-hspipy')),
    molarVolumeCm3mol: sv(91.6, derived('derived-quantity', 'molar mass / density at 20 °C')),
    unifac: sv({ 1: 1, 2: 3, 14: 1 }, ASSIGNED),
    waterMutualSolubility: sv(
      { solventInWaterWtPct: 7.4, waterInSolventWtPct: 20.3, temperatureC: 25 },
      read('iupac-nist-srd106-butanol', 'binary end points at 298.2 K (Letcher & Siswana 1992)'),
    ),
    waterMiscibility: 'partial',
    viscosityMPas25C: sv(
      2.53,
      read(
        'vn-dutt-prasad-viscosity',
        'computed at 298.15 K from A = -2.9918, B = -1026.78, C = -4.25 (log10(μ/mPa·s) = A + B/(C − T/K), fitted 273–393 K), 3 significant figures; Perry 2-313 gives 2.55; stored value was 2.544 (recalled)',
      ),
    ),
  },
  {
    id: '2-butanol',
    name: '2-Butanol',
    synonyms: ['sec-butanol', 'butan-2-ol', 's-BuOH'],
    smiles: 'CCC(C)O',
    cas: '78-92-2',
    molarMassGmol: sv(
      74.123,
      derived(
        'iupac-atomic-weights',
        'computed from C4H10O with conventional standard atomic weights',
      ),
    ),
    density: sv({ gPerMl: 0.8063, temperatureC: 20 }, read('crc-organic-constants')),
    boilingPointC: sv(99.4, read('crc-organic-constants')),
    meltingPointC: sv(-88.44, read('crc-organic-constants')),
    antoine: [
      antoine(
        'log10-bar-K',
        4.59921,
        1314.19,
        -86.6,
        295,
        392,
        read(
          'landolt-iv20-antoine',
          'data file stores ln(P/Pa) with T/K; converted A/ln 10 − 5, B/ln 10',
        ),
      ),
    ],
    enthalpyVapKJmol: sv(40.75, read('crc-enthalpy-vaporization')),
    hansen: sv({ d: 15.8, p: 5.7, h: 14.5 }, read('hansen-hspipy')),
    molarVolumeCm3mol: sv(91.9, derived('derived-quantity', 'molar mass / density at 20 °C')),
    unifac: sv({ 1: 2, 2: 1, 3: 1, 14: 1 }, ASSIGNED),
    waterMutualSolubility: sv(
      { solventInWaterWtPct: 17.5, waterInSolventWtPct: 34.3, temperatureC: 30 },
      read(
        'iupac-nist-srd106-2-butanol-water',
        'IUPAC recommended mutual solubility at 303 K: x(2-butanol) = 0.318 in the alcohol-rich phase and 0.0491 in the water-rich phase, converted to wt % (M 74.123 and 18.015 g/mol); stored values were 15.3 wt % at 20 °C (18.1 g/100 g water, NAS 2016 App. D) and 36 wt % water (recalled)',
      ),
    ),
    waterMiscibility: 'partial',
    viscosityMPas25C: sv(
      3.1,
      read(
        'vn-3term-viscosity',
        'computed at 298.15 K from A = -2.2749, B = -452.89, C = 134.4 (log10(μ/mPa·s) = A + B/(C − T/K), fitted 280–370 K), 3 significant figures; Perry 2-313 gives 3.07; stored value was 3 (recalled)',
      ),
    ),
  },
  {
    id: 'isobutanol',
    name: '2-Methyl-1-propanol',
    synonyms: ['isobutanol', 'isobutyl alcohol', 'i-BuOH'],
    smiles: 'CC(C)CO',
    cas: '78-83-1',
    molarMassGmol: sv(
      74.123,
      derived(
        'iupac-atomic-weights',
        'computed from C4H10O with conventional standard atomic weights',
      ),
    ),
    density: sv({ gPerMl: 0.8018, temperatureC: 20 }, read('crc-organic-constants')),
    boilingPointC: sv(107.84, read('crc-organic-constants')),
    meltingPointC: sv(-101.96, read('crc-organic-constants')),
    antoine: [
      antoine(
        'log10-bar-degC',
        4.34504,
        1190.38,
        166.67,
        303.4,
        400.84,
        read(
          'poling-5e-antoine',
          'data file stores log10(P/Pa) with T/K; converted A − 5, C + 273.15',
        ),
      ),
    ],
    enthalpyVapKJmol: sv(41.82, read('crc-enthalpy-vaporization')),
    hansen: sv({ d: 15.1, p: 5.7, h: 15.9 }, read('hansen-hspipy')),
    molarVolumeCm3mol: sv(92.4, derived('derived-quantity', 'molar mass / density at 20 °C')),
    unifac: sv({ 1: 2, 2: 1, 3: 1, 14: 1 }, ASSIGNED),
    waterMutualSolubility: sv(
      { solventInWaterWtPct: 8.11, waterInSolventWtPct: 16.7, temperatureC: 25 },
      read(
        'iupac-nist-srd106-isobutanol-water',
        'IUPAC recommended mutual solubility at 298 K: x(2-methyl-1-propanol) = 0.548 in the alcohol-rich phase and 0.021 in the water-rich phase, converted to wt % (M 74.123 and 18.015 g/mol); the evaluation finds the measured 0.5425 and 0.0208 (Alberty & Washburn) in good agreement; stored values were 8.5 and 16.4 wt % at 20 °C (recalled)',
      ),
    ),
    waterMiscibility: 'partial',
    viscosityMPas25C: sv(
      3.34,
      read(
        'vn-3term-viscosity',
        'computed at 298.15 K from A = -3.1025, B = -946.92, C = 37.007 (log10(μ/mPa·s) = A + B/(C − T/K), fitted 270–380 K), 3 significant figures; no second table read; stored value was 3.33 (recalled)',
      ),
    ),
  },
  {
    id: 'tert-butanol',
    name: 'tert-Butanol',
    synonyms: ['t-BuOH', '2-methyl-2-propanol', 'tert-butyl alcohol', 'TBA'],
    smiles: 'CC(C)(C)O',
    cas: '75-65-0',
    molarMassGmol: sv(
      74.123,
      derived(
        'iupac-atomic-weights',
        'computed from C4H10O with conventional standard atomic weights',
      ),
    ),
    density: sv(
      { gPerMl: 0.7887, temperatureC: 20 },
      read('crc-organic-constants', 'supercooled liquid (melts at 25.8 °C)'),
    ),
    boilingPointC: sv(82.3, read('crc-organic-constants')),
    meltingPointC: sv(25.81, read('crc-organic-constants')),
    antoine: [
      antoine(
        'log10-bar-degC',
        4.44484,
        1154.48,
        177.65,
        283,
        374.1,
        read(
          'poling-5e-antoine',
          'data file stores log10(P/Pa) with T/K; converted A − 5, C + 273.15',
        ),
      ),
    ],
    enthalpyVapKJmol: sv(39.07, read('crc-enthalpy-vaporization')),
    hansen: sv({ d: 15.2, p: 5.1, h: 14.7 }, read('hansen-hspipy')),
    molarVolumeCm3mol: sv(94, derived('derived-quantity', 'molar mass / density at 20 °C')),
    unifac: sv({ 1: 3, 4: 1, 14: 1 }, ASSIGNED),
    waterMiscibility: 'miscible',
    viscosityMPas25C: sv(
      4.3,
      recalled(
        'crc-viscosity-liquids',
        'Perry 2-313 gives 4.61 and the V&N 3-term set 4.31 (fitted 300–360 K, 25 °C just below); kept as recalled',
      ),
    ),
  },
  {
    id: '1-octanol',
    name: '1-Octanol',
    synonyms: ['n-octanol', 'octan-1-ol', 'octanol'],
    smiles: 'CCCCCCCCO',
    cas: '111-87-5',
    molarMassGmol: sv(
      130.231,
      derived(
        'iupac-atomic-weights',
        'computed from C8H18O with conventional standard atomic weights',
      ),
    ),
    density: sv({ gPerMl: 0.8262, temperatureC: 25 }, read('crc-organic-constants')),
    boilingPointC: sv(194.7, read('crc-organic-constants')),
    meltingPointC: sv(-14.7, read('crc-organic-constants')),
    antoine: [
      antoine(
        'log10-bar-degC',
        3.90225,
        1274.8,
        131.99,
        368.8,
        495.15,
        read(
          'poling-5e-antoine',
          'data file stores log10(P/Pa) with T/K; converted A − 5, C + 273.15',
        ),
      ),
    ],
    enthalpyVapKJmol: sv(
      47.8,
      read(
        'perry-8e-2-150-hvap',
        'computed at Tb = 467.85 K from Tc = 652.3 K, C1 = 72468 J/mol, C2 = −1.2464, C3 = 3.6797, C4 = −2.0665 (ΔH = C1 (1 − Tr)^(C2 + C3 Tr + C4 Tr²)), 3 significant figures; the CRC table read gives only the 25 °C value',
      ),
    ),
    hansen: sv({ d: 16, p: 5, h: 11.9 }, read('hansen-hspipy', 'newer HSPiP revision: δH 11.2')),
    molarVolumeCm3mol: sv(157.6, derived('derived-quantity', 'molar mass / density at 25 °C')),
    unifac: sv({ 1: 1, 2: 7, 14: 1 }, ASSIGNED),
    waterMutualSolubility: sv(
      { solventInWaterWtPct: 0.0542, waterInSolventWtPct: 4.59, temperatureC: 25 },
      read(
        'iupac-nist-srd106-recommended',
        'IUPAC recommended mutual solubility at 298 K: x(1-octanol) = 0.742 in the octanol-rich phase and 7.5e-5 in the water-rich phase, converted to wt % (M 130.23 and 18.015 g/mol); stored values were 0.054 and 4.9 wt % (recalled; water-saturated octanol had been recalled as x(water) ≈ 0.27, read 0.258)',
      ),
    ),
    waterMiscibility: 'partial',
    viscosityMPas25C: sv(
      7.28,
      read(
        'perry-8e-2-313-viscosity',
        'computed at 298.15 K from C1…C5 = -19.907, 2791.7, 0.94296, 2.3041e24, -10.09 (μ/Pa·s = exp(C1 + C2/T + C3 ln T + C4 T^C5), T/K, fitted 280–468.35 K), 3 significant figures; no V&N set in the files read; stored value was 7.288 (recalled)',
      ),
    ),
  },
];
