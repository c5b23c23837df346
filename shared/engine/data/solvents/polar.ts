/**
 * Dipolar aprotic solvents, acids and bases: curated solvent records. Every value carries its source; see
 * shared/engine/data/sources.ts for the full citations and docs/data-sources.md
 * for how the values were chosen. Antoine constants are kept in the published
 * form (see AntoineSet in ../types.ts).
 */
import type { SolventBaseRecord } from '../types';
import { antoine, ASSIGNED, derived, read, recalled, reproduced, sv, VISCOSITY } from './common';

export const POLAR_SOLVENTS: readonly SolventBaseRecord[] = [
  {
    id: 'acetonitrile',
    name: 'Acetonitrile',
    synonyms: ['MeCN', 'ACN', 'methyl cyanide'],
    smiles: 'CC#N',
    cas: '75-05-8',
    molarMassGmol: sv(
      41.053,
      derived(
        'iupac-atomic-weights',
        'computed from C2H3N with conventional standard atomic weights',
      ),
    ),
    density: sv({ gPerMl: 0.7857, temperatureC: 20 }, read('crc-organic-constants')),
    boilingPointC: sv(81.6, read('crc-organic-constants')),
    meltingPointC: sv(-44, read('crc-organic-constants')),
    antoine: [
      antoine(
        'log10-bar-K',
        4.27873,
        1355.374,
        -37.853,
        288.3,
        362.3,
        read(
          'nist-webbook-antoine',
          'as converted in reference-data.md §C from the data file (ln P/Pa, T/K)',
        ),
      ),
    ],
    enthalpyVapKJmol: sv(29.75, read('crc-enthalpy-vaporization')),
    hansen: sv({ d: 15.3, p: 18, h: 6.1 }, read('hansen-hspipy')),
    molarVolumeCm3mol: sv(52.3, derived('derived-quantity', 'molar mass / density at 20 °C')),
    unifac: sv({ 40: 1 }, read('unifac-groups', 'whole-molecule subgroup of the original table')),
    waterMiscibility: 'miscible',
    viscosityMPas25C: sv(
      0.349,
      read(
        'vdi-ppds9-viscosity',
        'computed at 298.15 K from A = -0.08444, B = 3.22207, C = 685.539 K, D = -331.224 K, E = 6.935e-5 Pa·s (PPDS equation 9), 3 significant figures; Perry 2-313 gives 0.342 (2 % lower); the V&N 3-term set (0.485, fitted 280–360 K) disagrees with both and is not used; stored value was 0.369 (recalled)',
      ),
    ),
  },
  {
    id: 'dmf',
    name: 'N,N-Dimethylformamide',
    synonyms: ['DMF', 'dimethylformamide'],
    smiles: 'CN(C)C=O',
    cas: '68-12-2',
    molarMassGmol: sv(
      73.095,
      derived(
        'iupac-atomic-weights',
        'computed from C3H7NO with conventional standard atomic weights',
      ),
    ),
    density: sv({ gPerMl: 0.9445, temperatureC: 25 }, read('crc-organic-constants')),
    boilingPointC: sv(152.8, read('crc-organic-constants')),
    meltingPointC: sv(-60.3, read('crc-organic-constants')),
    antoine: [
      antoine(
        'log10-bar-K',
        3.93068,
        1337.716,
        -82.648,
        303,
        363,
        read(
          'nist-webbook-antoine',
          'as converted in reference-data.md §C from the data file (ln P/Pa, T/K); valid 30–90 °C; extrapolates Tb to 150.3 °C',
        ),
      ),
    ],
    enthalpyVapKJmol: sv(
      39.5,
      read(
        'perry-8e-2-150-hvap',
        'computed at Tb = 425.95 K from Tc = 649.6 K, C1 = 59217 J/mol, C2 = 0.37996 (ΔH = C1 (1 − Tr)^(C2 + C3 Tr + C4 Tr²)), 3 significant figures; the CRC table read gives only the 25 °C value',
      ),
    ),
    hansen: sv({ d: 17.4, p: 13.7, h: 11.3 }, read('hansen-hspipy')),
    molarVolumeCm3mol: sv(77.4, derived('derived-quantity', 'molar mass / density at 25 °C')),
    unifac: sv({ 72: 1 }, read('unifac-groups', 'whole-molecule subgroup of the original table')),
    waterMiscibility: 'miscible',
    viscosityMPas25C: sv(
      0.793,
      read(
        'vn-dutt-prasad-viscosity',
        'computed at 298.15 K from A = -0.6419, B = -56.54, C = 193.62 (log10(μ/mPa·s) = A + B/(C − T/K), fitted 273–323 K), 3 significant figures; Perry 2-313 gives 0.815; V&N 3-term set 0.794; stored value was 0.794 (recalled)',
      ),
    ),
  },
  {
    id: 'dmac',
    name: 'N,N-Dimethylacetamide',
    synonyms: ['DMAc', 'DMA', 'dimethylacetamide'],
    smiles: 'CC(=O)N(C)C',
    cas: '127-19-5',
    molarMassGmol: sv(
      87.122,
      derived(
        'iupac-atomic-weights',
        'computed from C4H9NO with conventional standard atomic weights',
      ),
    ),
    density: sv({ gPerMl: 0.9372, temperatureC: 25 }, read('crc-organic-constants')),
    boilingPointC: sv(165.9, read('crc-organic-constants')),
    meltingPointC: sv(-19, read('crc-organic-constants')),
    antoine: [
      antoine(
        'log10-bar-K',
        6.8458,
        3273.8,
        61.34,
        303,
        363,
        read(
          'landolt-iv20-antoine',
          'data file stores ln(P/Pa) with T/K; converted A/ln 10 − 5, B/ln 10; valid 30–90 °C; extrapolates Tb to 144 °C — do not use beyond the range',
        ),
      ),
    ],
    hansen: sv({ d: 16.8, p: 11.5, h: 10.2 }, read('hansen-hspipy')),
    molarVolumeCm3mol: sv(93, derived('derived-quantity', 'molar mass / density at 25 °C')),
    unifac: sv({ 1: 1, 97: 1 }, ASSIGNED),
    waterMiscibility: 'miscible',
    viscosityMPas25C: sv(
      0.927,
      recalled(
        'crc-viscosity-liquids',
        'the only table read (V&N 3-term set) gives 1.96, twice this value; not used — kept as recalled, verify',
      ),
    ),
  },
  {
    id: 'nmp',
    name: 'N-Methyl-2-pyrrolidone',
    synonyms: ['NMP', 'N-methylpyrrolidone', '1-methyl-2-pyrrolidinone'],
    smiles: 'CN1CCCC1=O',
    cas: '872-50-4',
    molarMassGmol: sv(
      99.133,
      derived(
        'iupac-atomic-weights',
        'computed from C5H9NO with conventional standard atomic weights',
      ),
    ),
    density: sv({ gPerMl: 1.023, temperatureC: 25 }, read('crc-organic-constants')),
    boilingPointC: sv(204.2, read('crc-organic-constants', 'Yaws gives 202.05 °C')),
    meltingPointC: sv(
      -25,
      read(
        'cas-common-chemistry',
        '248.15 K (given to the degree); stored value was −24.4 °C (recalled)',
      ),
    ),
    antoine: [], // no Antoine set found in the sources read; see docs/data-sources.md
    hansen: sv({ d: 18, p: 12.3, h: 7.2 }, read('hansen-hspipy')),
    molarVolumeCm3mol: sv(96.9, derived('derived-quantity', 'molar mass / density at 25 °C')),
    unifac: sv({ 85: 1 }, read('unifac-groups', 'whole-molecule subgroup of the original table')),
    waterMiscibility: 'miscible',
    viscosityMPas25C: sv(1.67, VISCOSITY),
  },
  {
    id: 'dmso',
    name: 'Dimethyl sulfoxide',
    synonyms: ['DMSO', 'methyl sulfoxide'],
    smiles: 'CS(C)=O',
    cas: '67-68-5',
    molarMassGmol: sv(
      78.129,
      derived(
        'iupac-atomic-weights',
        'computed from C2H6OS with conventional standard atomic weights',
      ),
    ),
    density: sv({ gPerMl: 1.101, temperatureC: 25 }, read('crc-organic-constants')),
    boilingPointC: sv(191.9, read('crc-organic-constants')),
    meltingPointC: sv(18.52, read('crc-organic-constants')),
    antoine: [
      antoine('log10-bar-K', 5.23039, 2239.161, -29.215, 293, 323, {
        ref: 'nist-webbook-antoine',
        status: 'secondary',
        note: 'NIST set read as quoted on a vendor page (citation removed); a different NIST segment from the one in the data file; not checked in the WebBook itself',
      }),
      antoine(
        'log10-bar-K',
        4.49107,
        1807.002,
        -60.995,
        325.49,
        442.09,
        read(
          'nist-webbook-antoine',
          'as converted in reference-data.md §C from the data file (ln P/Pa, T/K)',
        ),
      ),
    ],
    enthalpyVapKJmol: sv(43.1, read('crc-enthalpy-vaporization')),
    hansen: sv({ d: 18.4, p: 16.4, h: 10.2 }, read('hansen-hspipy')),
    molarVolumeCm3mol: sv(71, derived('derived-quantity', 'molar mass / density at 25 °C')),
    unifac: sv({ 67: 1 }, read('unifac-groups', 'whole-molecule subgroup of the original table')),
    waterMiscibility: 'miscible',
    viscosityMPas25C: sv(
      1.99,
      read(
        'vn-3term-viscosity',
        'computed at 298.15 K from A = -1.3585, B = -323.95, C = 102.62 (log10(μ/mPa·s) = A + B/(C − T/K), fitted 290–400 K), 3 significant figures; Perry 2-313 gives 1.98; stored value was 1.987 (recalled)',
      ),
    ),
  },
  {
    id: 'acetic-acid',
    name: 'Acetic acid',
    synonyms: ['AcOH', 'ethanoic acid', 'glacial acetic acid'],
    smiles: 'CC(=O)O',
    cas: '64-19-7',
    pKa: sv(
      [{ value: 4.76, type: 'acid' }],
      reproduced(
        'libretexts-e1-acid-dissociation',
        'acetic acid at 25 °C: printed pKa 4.756 (Ka 1.75e-5), stored to two decimals as before',
      ),
    ),
    molarMassGmol: sv(
      60.052,
      derived(
        'iupac-atomic-weights',
        'computed from C2H4O2 with conventional standard atomic weights',
      ),
    ),
    density: sv({ gPerMl: 1.0446, temperatureC: 25 }, read('crc-organic-constants')),
    boilingPointC: sv(117.9, read('crc-organic-constants')),
    meltingPointC: sv(17, read('crc-organic-constants')),
    antoine: [
      antoine(
        'log10-bar-degC',
        4.54456,
        1555.12,
        224.65,
        297.58,
        414.97,
        read(
          'poling-5e-antoine',
          'data file stores log10(P/Pa) with T/K; converted A − 5, C + 273.15',
        ),
      ),
      antoine(
        'log10-bar-K',
        4.68206,
        1642.54,
        -39.764,
        290.26,
        391.01,
        read(
          'nist-webbook-antoine',
          'as converted in reference-data.md §C from the data file (ln P/Pa, T/K)',
        ),
      ),
    ],
    enthalpyVapKJmol: sv(
      23.7,
      read('crc-enthalpy-vaporization', 'apparent value; the vapour is partly dimerised'),
    ),
    hansen: sv({ d: 14.5, p: 8, h: 13.5 }, read('hansen-hspipy')),
    molarVolumeCm3mol: sv(57.5, derived('derived-quantity', 'molar mass / density at 25 °C')),
    unifac: sv({ 1: 1, 42: 1 }, ASSIGNED),
    waterMiscibility: 'miscible',
    viscosityMPas25C: sv(
      1.1,
      read(
        'vn-dutt-prasad-viscosity',
        'computed at 298.15 K from A = -1.4999, B = -353.33, C = 69.11 (log10(μ/mPa·s) = A + B/(C − T/K), fitted 283–383 K), 3 significant figures; Perry 2-313 gives 1.12; stored value was 1.056 (recalled)',
      ),
    ),
  },
  {
    id: 'pyridine',
    name: 'Pyridine',
    synonyms: ['py'],
    smiles: 'c1ccncc1',
    cas: '110-86-1',
    pKa: sv(
      [{ value: 5.23, type: 'base' }],
      recalled('crc-dissociation-constants', 'pyridinium ion (conjugate acid), 25 °C'),
    ),
    molarMassGmol: sv(
      79.102,
      derived(
        'iupac-atomic-weights',
        'computed from C5H5N with conventional standard atomic weights',
      ),
    ),
    density: sv({ gPerMl: 0.9819, temperatureC: 20 }, read('crc-organic-constants')),
    boilingPointC: sv(115.2, read('crc-organic-constants')),
    meltingPointC: sv(-41.63, read('crc-organic-constants')),
    antoine: [
      antoine(
        'log10-bar-degC',
        4.16749,
        1373.026,
        214.69,
        292.51,
        413.57,
        read(
          'poling-5e-antoine',
          'data file stores log10(P/Pa) with T/K; converted A − 5, C + 273.15',
        ),
      ),
    ],
    enthalpyVapKJmol: sv(35.09, read('crc-enthalpy-vaporization')),
    hansen: sv({ d: 19, p: 8.8, h: 5.9 }, read('hansen-hspipy')),
    molarVolumeCm3mol: sv(80.6, derived('derived-quantity', 'molar mass / density at 20 °C')),
    unifac: sv({ 37: 1 }, read('unifac-groups', 'whole-molecule subgroup of the original table')),
    waterMiscibility: 'miscible',
    viscosityMPas25C: sv(
      0.879,
      read(
        'vn-3term-viscosity',
        'computed at 298.15 K from A = -1.1172, B = -174.52, C = 133.66 (log10(μ/mPa·s) = A + B/(C − T/K), fitted 270–390 K), 3 significant figures; the VDI Heat Atlas PPDS equation 9 gives 0.885 (0.7 % higher) and sides with this set; the V&N Dutt–Prasad set gives 0.852; the stored (recalled) value was the same',
      ),
    ),
  },
];
