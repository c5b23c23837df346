/**
 * Esters and ketones: curated solvent records. Every value carries its source; see
 * shared/engine/data/sources.ts for the full citations and docs/data-sources.md
 * for how the values were chosen. Antoine constants are kept in the published
 * form (see AntoineSet in ../types.ts).
 */
import type { SolventBaseRecord } from '../types';
import { antoine, ASSIGNED, derived, read, recalled, sv, VISCOSITY } from './common';

export const ESTERS_KETONES_SOLVENTS: readonly SolventBaseRecord[] = [
  {
    id: 'ethyl-acetate',
    name: 'Ethyl acetate',
    synonyms: ['EtOAc', 'ethyl ethanoate'],
    smiles: 'CCOC(C)=O',
    cas: '141-78-6',
    molarMassGmol: sv(
      88.106,
      derived(
        'iupac-atomic-weights',
        'computed from C4H8O2 with conventional standard atomic weights',
      ),
    ),
    density: sv({ gPerMl: 0.9003, temperatureC: 20 }, read('crc-organic-constants')),
    boilingPointC: sv(77.1, read('crc-organic-constants')),
    meltingPointC: sv(
      -83.15,
      read(
        'nist-webbook-constants',
        '190 K (the file also gives the triple point, 189.3 K); stored value was −83.6 °C (recalled)',
      ),
    ),
    antoine: [
      antoine(
        'log10-bar-degC',
        4.13361,
        1195.13,
        212.47,
        265.5,
        372.51,
        read(
          'poling-5e-antoine',
          'data file stores log10(P/Pa) with T/K; converted A − 5, C + 273.15',
        ),
      ),
      antoine(
        'log10-bar-K',
        4.22809,
        1245.702,
        -55.189,
        288.73,
        348.98,
        read(
          'nist-webbook-antoine',
          'as converted in reference-data.md §C from the data file (ln P/Pa, T/K)',
        ),
      ),
    ],
    enthalpyVapKJmol: sv(31.94, read('crc-enthalpy-vaporization')),
    hansen: sv({ d: 15.8, p: 5.3, h: 7.2 }, read('hansen-hspipy')),
    molarVolumeCm3mol: sv(97.9, derived('derived-quantity', 'molar mass / density at 20 °C')),
    unifac: sv({ 1: 1, 2: 1, 21: 1 }, ASSIGNED),
    waterMutualSolubility: sv(
      { solventInWaterWtPct: 8, waterInSolventWtPct: 3, temperatureC: 20 },
      read(
        'etoac-solubility-page',
        'weak source; typical 25 °C literature 7.7–8.1 / 3.0–3.3 wt % (memory)',
      ),
    ),
    waterMiscibility: 'partial',
    viscosityMPas25C: sv(
      0.431,
      read(
        'vn-dutt-prasad-viscosity',
        'computed at 298.15 K from A = -3.5169, B = -2089.32, C = -364.82 (log10(μ/mPa·s) = A + B/(C − T/K), fitted 273–463 K), 3 significant figures; Perry 2-313 gives 0.430; stored value was 0.423 (recalled)',
      ),
    ),
  },
  {
    id: 'isopropyl-acetate',
    name: 'Isopropyl acetate',
    synonyms: ['IPAc', 'iPrOAc', '2-propyl acetate'],
    smiles: 'CC(C)OC(C)=O',
    cas: '108-21-4',
    molarMassGmol: sv(
      102.133,
      derived(
        'iupac-atomic-weights',
        'computed from C5H10O2 with conventional standard atomic weights',
      ),
    ),
    density: sv({ gPerMl: 0.8662, temperatureC: 25 }, read('crc-organic-constants')),
    boilingPointC: sv(88.6, read('crc-organic-constants')),
    meltingPointC: sv(-73.4, read('crc-organic-constants')),
    antoine: [
      antoine(
        'log10-bar-K',
        4.55172,
        1490.877,
        -34.098,
        234.9,
        362,
        read(
          'nist-webbook-antoine',
          'as converted in reference-data.md §C from the data file (ln P/Pa, T/K)',
        ),
      ),
    ],
    enthalpyVapKJmol: sv(32.93, read('crc-enthalpy-vaporization')),
    hansen: sv({ d: 14.9, p: 4.5, h: 8.2 }, read('hansen-schrier')),
    molarVolumeCm3mol: sv(117.9, derived('derived-quantity', 'molar mass / density at 25 °C')),
    unifac: sv({ 1: 2, 3: 1, 21: 1 }, ASSIGNED),
    waterMutualSolubility: sv(
      { solventInWaterWtPct: 2.9, waterInSolventWtPct: 1.8, temperatureC: 20 },
      read('encyclopedia-isopropyl-acetate'),
    ),
    waterMiscibility: 'partial',
    viscosityMPas25C: sv(0.5, VISCOSITY),
  },
  {
    id: 'n-butyl-acetate',
    name: 'n-Butyl acetate',
    synonyms: ['BuOAc', 'butyl acetate', 'butyl ethanoate'],
    smiles: 'CCCCOC(C)=O',
    cas: '123-86-4',
    molarMassGmol: sv(
      116.16,
      derived(
        'iupac-atomic-weights',
        'computed from C6H12O2 with conventional standard atomic weights',
      ),
    ),
    density: sv({ gPerMl: 0.8825, temperatureC: 20 }, read('crc-organic-constants')),
    boilingPointC: sv(126, read('crc-organic-constants')),
    meltingPointC: sv(-77, read('crc-organic-constants')),
    antoine: [
      antoine(
        'log10-bar-degC',
        4.5,
        1596.7,
        229.3,
        301,
        424.11,
        read(
          'poling-5e-antoine',
          'data file stores log10(P/Pa) with T/K; converted A − 5, C + 273.15',
        ),
      ),
    ],
    enthalpyVapKJmol: sv(36.28, read('crc-enthalpy-vaporization')),
    hansen: sv({ d: 15.8, p: 3.7, h: 6.3 }, read('hansen-hspipy')),
    molarVolumeCm3mol: sv(131.6, derived('derived-quantity', 'molar mass / density at 20 °C')),
    unifac: sv({ 1: 1, 2: 3, 21: 1 }, ASSIGNED),
    waterMutualSolubility: sv(
      { solventInWaterWtPct: 0.7, waterInSolventWtPct: 1.2, temperatureC: 20 },
      recalled('mutual-solubility-memory'),
    ),
    waterMiscibility: 'partial',
    viscosityMPas25C: sv(
      0.685,
      read(
        'vn-3term-viscosity',
        'computed at 298.15 K from A = -1.7722, B = -431.58, C = 29.726 (log10(μ/mPa·s) = A + B/(C − T/K), fitted 270–380 K), 3 significant figures; Perry 2-313 gives 0.677',
      ),
    ),
  },
  {
    id: 'acetone',
    name: 'Acetone',
    synonyms: ['propanone', '2-propanone', 'dimethyl ketone'],
    smiles: 'CC(C)=O',
    cas: '67-64-1',
    molarMassGmol: sv(
      58.08,
      derived(
        'iupac-atomic-weights',
        'computed from C3H6O with conventional standard atomic weights',
      ),
    ),
    density: sv({ gPerMl: 0.7845, temperatureC: 25 }, read('crc-organic-constants')),
    boilingPointC: sv(56.08, read('crc-organic-constants')),
    meltingPointC: sv(-94.9, read('crc-organic-constants')),
    antoine: [
      antoine(
        'log10-bar-degC',
        4.2184,
        1197.01,
        228.06,
        247.38,
        350.65,
        read(
          'poling-5e-antoine',
          'data file stores log10(P/Pa) with T/K; converted A − 5, C + 273.15',
        ),
      ),
      antoine(
        'log10-bar-K',
        4.42448,
        1312.253,
        -32.445,
        259.16,
        507.6,
        read(
          'nist-webbook-antoine',
          'as converted in reference-data.md §C from the data file (ln P/Pa, T/K)',
        ),
      ),
    ],
    enthalpyVapKJmol: sv(29.1, read('crc-enthalpy-vaporization')),
    hansen: sv({ d: 15.5, p: 10.4, h: 7 }, read('hansen-hspipy')),
    molarVolumeCm3mol: sv(74, derived('derived-quantity', 'molar mass / density at 25 °C')),
    unifac: sv({ 1: 1, 18: 1 }, ASSIGNED),
    waterMiscibility: 'miscible',
    viscosityMPas25C: sv(
      0.301,
      read(
        'vn-dutt-prasad-viscosity',
        'computed at 298.15 K from A = -1.4195, B = -214.96, C = 58.71 (log10(μ/mPa·s) = A + B/(C − T/K), fitted 183–333 K), 3 significant figures; Perry 2-313 gives 0.307; V&N 3-term set 0.306; stored value was 0.306 (recalled)',
      ),
    ),
  },
  {
    id: '2-butanone',
    name: '2-Butanone',
    synonyms: ['MEK', 'methyl ethyl ketone', 'butanone'],
    smiles: 'CCC(C)=O',
    cas: '78-93-3',
    molarMassGmol: sv(
      72.107,
      derived(
        'iupac-atomic-weights',
        'computed from C4H8O with conventional standard atomic weights',
      ),
    ),
    density: sv({ gPerMl: 0.7999, temperatureC: 25 }, read('crc-organic-constants')),
    boilingPointC: sv(79.6, read('crc-organic-constants')),
    meltingPointC: sv(-86.67, read('crc-organic-constants')),
    antoine: [
      antoine(
        'log10-bar-degC',
        4.1386,
        1232.63,
        218.69,
        265.62,
        375.66,
        read(
          'poling-5e-antoine',
          'data file stores log10(P/Pa) with T/K; converted A − 5, C + 273.15',
        ),
      ),
    ],
    enthalpyVapKJmol: sv(31.3, read('crc-enthalpy-vaporization')),
    hansen: sv({ d: 16, p: 9, h: 5.1 }, read('hansen-hspipy')),
    molarVolumeCm3mol: sv(90.1, derived('derived-quantity', 'molar mass / density at 25 °C')),
    unifac: sv({ 1: 1, 2: 1, 18: 1 }, ASSIGNED),
    waterMutualSolubility: sv(
      { solventInWaterWtPct: 20.4, waterInSolventWtPct: 12, temperatureC: 20 },
      recalled(
        'nas-2016-appD',
        'solvent in water read as 25.6 g/100 g water (NAS 2016 App. D) = 20.4 wt%; water in 2-butanone recalled',
      ),
    ),
    waterMiscibility: 'partial',
    viscosityMPas25C: sv(
      0.395,
      read(
        'perry-8e-2-313-viscosity',
        'computed at 298.15 K from C1…C5 = -1.0598, 520.68, -1.4961, 0, 0 (μ/Pa·s = exp(C1 + C2/T + C3 ln T + C4 T^C5), T/K, fitted 186.48–535.5 K), 3 significant figures; no V&N set in the files read; stored value was 0.405 (recalled)',
      ),
    ),
  },
  {
    id: 'mibk',
    name: 'Methyl isobutyl ketone',
    synonyms: ['MIBK', '4-methyl-2-pentanone', 'methyl isobutyl ketone'],
    smiles: 'CC(C)CC(C)=O',
    cas: '108-10-1',
    molarMassGmol: sv(
      100.161,
      derived(
        'iupac-atomic-weights',
        'computed from C6H12O with conventional standard atomic weights',
      ),
    ),
    density: sv({ gPerMl: 0.7965, temperatureC: 25 }, read('crc-organic-constants')),
    boilingPointC: sv(115.7, read('crc-organic-constants')),
    meltingPointC: sv(-85, read('crc-organic-constants')),
    antoine: [
      antoine(
        'log10-bar-degC',
        3.8222,
        1190.6904,
        195.45,
        293.4,
        415.85,
        read(
          'poling-5e-antoine',
          'data file stores log10(P/Pa) with T/K; converted A − 5, C + 273.15',
        ),
      ),
      antoine(
        'log10-bar-K',
        3.95298,
        1254.095,
        -71.537,
        294.9,
        389.3,
        read(
          'nist-webbook-antoine',
          'as converted in reference-data.md §C from the data file (ln P/Pa, T/K)',
        ),
      ),
    ],
    enthalpyVapKJmol: sv(34.49, read('crc-enthalpy-vaporization')),
    hansen: sv({ d: 15.3, p: 6.1, h: 4.1 }, read('hansen-hspipy')),
    molarVolumeCm3mol: sv(125.8, derived('derived-quantity', 'molar mass / density at 25 °C')),
    unifac: sv({ 1: 2, 2: 1, 3: 1, 18: 1 }, ASSIGNED),
    waterMutualSolubility: sv(
      { solventInWaterWtPct: 1.9, waterInSolventWtPct: 1.9, temperatureC: 20 },
      recalled(
        'encyclopedia-mibk',
        'solvent in water 1.91 g/100 mL read on a public encyclopedia page; water in MIBK recalled',
      ),
    ),
    waterMiscibility: 'partial',
    viscosityMPas25C: sv(
      0.544,
      read(
        'perry-8e-2-313-viscosity',
        'computed at 298.15 K from C1…C5 = -11.394, 1168.7, -0.007539, 0, 0 (μ/Pa·s = exp(C1 + C2/T + C3 ln T + C4 T^C5), T/K, fitted 189.15–389.15 K), 3 significant figures; no V&N set in the files read; stored value was 0.545 (recalled)',
      ),
    ),
  },
];
