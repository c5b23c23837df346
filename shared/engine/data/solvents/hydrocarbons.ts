/**
 * Hydrocarbons: curated solvent records. Every value carries its source; see
 * shared/engine/data/sources.ts for the full citations and docs/data-sources.md
 * for how the values were chosen. Antoine constants are kept in the published
 * form (see AntoineSet in ../types.ts).
 */
import type { SolventBaseRecord } from '../types';
import { antoine, ASSIGNED, derived, read, recalled, sv } from './common';

export const HYDROCARBONS_SOLVENTS: readonly SolventBaseRecord[] = [
  {
    id: 'n-heptane',
    name: 'n-Heptane',
    synonyms: ['heptane'],
    smiles: 'CCCCCCC',
    cas: '142-82-5',
    molarMassGmol: sv(
      100.205,
      derived(
        'iupac-atomic-weights',
        'computed from C7H16 with conventional standard atomic weights',
      ),
    ),
    density: sv({ gPerMl: 0.6795, temperatureC: 25 }, read('crc-organic-constants')),
    boilingPointC: sv(98.38, read('crc-organic-constants')),
    meltingPointC: sv(
      -90.55,
      read(
        'nist-webbook-constants',
        '182.6 K (triple point 182.56 K); stored value was −90.6 °C (recalled)',
      ),
    ),
    antoine: [
      antoine(
        'log10-bar-degC',
        4.02023,
        1263.909,
        216.432,
        277.71,
        396.53,
        read(
          'poling-5e-antoine',
          'data file stores log10(P/Pa) with T/K; converted A − 5, C + 273.15',
        ),
      ),
      antoine(
        'log10-bar-K',
        4.81803,
        1635.409,
        -27.338,
        185.29,
        295.6,
        read(
          'nist-webbook-antoine',
          'as converted in reference-data.md §C from the data file (ln P/Pa, T/K); low-temperature segment only; not for use near Tb',
        ),
      ),
    ],
    enthalpyVapKJmol: sv(31.77, read('crc-enthalpy-vaporization')),
    hansen: sv({ d: 15.3, p: 0, h: 0 }, read('hansen-hspipy')),
    molarVolumeCm3mol: sv(147.5, derived('derived-quantity', 'molar mass / density at 25 °C')),
    unifac: sv({ 1: 2, 2: 5 }, ASSIGNED),
    waterMutualSolubility: sv(
      { solventInWaterWtPct: 0.00024, waterInSolventWtPct: 0.0101, temperatureC: 25 },
      read(
        'iupac-nist-srd106-heptane-water',
        'IUPAC recommended mutual solubility at 298.2 K: x(heptane) = 4.3e-7 in the water-rich phase and x(water) = 5.6e-4 in the heptane-rich phase, converted to wt % (M 100.205 and 18.015 g/mol); stored values were 0.0003 and 0.009 wt % (recalled)',
      ),
    ),
    waterMiscibility: 'partial',
    viscosityMPas25C: sv(
      0.388,
      read(
        'vn-dutt-prasad-viscosity',
        'computed at 298.15 K from A = -1.5365, B = -277.33, C = 51.64 (log10(μ/mPa·s) = A + B/(C − T/K), fitted 183–373 K), 3 significant figures; Perry 2-313 gives 0.388; stored value was 0.387 (recalled)',
      ),
    ),
  },
  {
    id: 'n-hexane',
    name: 'n-Hexane',
    synonyms: ['hexane'],
    smiles: 'CCCCCC',
    cas: '110-54-3',
    molarMassGmol: sv(
      86.178,
      derived(
        'iupac-atomic-weights',
        'computed from C6H14 with conventional standard atomic weights',
      ),
    ),
    density: sv({ gPerMl: 0.6606, temperatureC: 25 }, read('crc-organic-constants')),
    boilingPointC: sv(68.72, read('crc-organic-constants')),
    meltingPointC: sv(-95.27, read('crc-organic-constants')),
    antoine: [
      antoine(
        'log10-bar-degC',
        4.00139,
        1170.875,
        224.317,
        254.24,
        365.25,
        read(
          'poling-5e-antoine',
          'data file stores log10(P/Pa) with T/K; converted A − 5, C + 273.15',
        ),
      ),
      antoine(
        'log10-bar-K',
        3.45604,
        1044.038,
        -53.893,
        177.7,
        264.93,
        read(
          'nist-webbook-antoine',
          'as converted in reference-data.md §C from the data file (ln P/Pa, T/K); low-temperature segment only; not for use near Tb',
        ),
      ),
    ],
    enthalpyVapKJmol: sv(28.85, read('crc-enthalpy-vaporization')),
    hansen: sv({ d: 14.9, p: 0, h: 0 }, read('hansen-hspipy')),
    molarVolumeCm3mol: sv(130.5, derived('derived-quantity', 'molar mass / density at 25 °C')),
    unifac: sv({ 1: 2, 2: 4 }, ASSIGNED),
    waterMutualSolubility: sv(
      { solventInWaterWtPct: 0.0012, waterInSolventWtPct: 0.0113, temperatureC: 20 },
      read(
        'iupac-nist-srd106-recommended',
        'IUPAC recommended mutual solubility at 293 K: x(hexane) = 0.99946 in the hexane-rich phase and 2.5e-6 in the water-rich phase, converted to wt % (M 86.178 and 18.015 g/mol); stored values were 0.0012 and 0.01 wt % at 25 °C (recalled); a single 25 °C data sheet gives hexane in water 0.00123 g/100 g solution (Leinonen & Mackay, Can. J. Chem. Eng. 1973, 51, 230)',
      ),
    ),
    waterMiscibility: 'partial',
    viscosityMPas25C: sv(
      0.298,
      read(
        'vn-dutt-prasad-viscosity',
        'computed at 298.15 K from A = -1.804, B = -401.73, C = -16.29 (log10(μ/mPa·s) = A + B/(C − T/K), fitted 213–343 K), 3 significant figures; Perry 2-313 gives 0.293; stored value was 0.3 (recalled)',
      ),
    ),
  },
  {
    id: 'cyclohexane',
    name: 'Cyclohexane',
    smiles: 'C1CCCCC1',
    cas: '110-82-7',
    molarMassGmol: sv(
      84.162,
      derived(
        'iupac-atomic-weights',
        'computed from C6H12 with conventional standard atomic weights',
      ),
    ),
    density: sv({ gPerMl: 0.7739, temperatureC: 25 }, read('crc-organic-constants')),
    boilingPointC: sv(80.7, read('crc-organic-constants')),
    meltingPointC: sv(6.7, read('crc-organic-constants')),
    antoine: [
      antoine(
        'log10-bar-degC',
        3.93002,
        1182.774,
        220.618,
        282.11,
        378.46,
        read(
          'poling-5e-antoine',
          'data file stores log10(P/Pa) with T/K; converted A − 5, C + 273.15',
        ),
      ),
    ],
    enthalpyVapKJmol: sv(29.97, read('crc-enthalpy-vaporization')),
    hansen: sv({ d: 16.8, p: 0, h: 0.2 }, read('hansen-hspipy')),
    molarVolumeCm3mol: sv(108.8, derived('derived-quantity', 'molar mass / density at 25 °C')),
    unifac: sv({ 2: 6 }, ASSIGNED),
    waterMutualSolubility: sv(
      { solventInWaterWtPct: 0.0055, waterInSolventWtPct: 0.01, temperatureC: 25 },
      recalled('mutual-solubility-memory'),
    ),
    waterMiscibility: 'partial',
    viscosityMPas25C: sv(
      0.896,
      read(
        'vn-dutt-prasad-viscosity',
        'computed at 298.15 K from A = -1.969, B = -501.37, C = 37.2 (log10(μ/mPa·s) = A + B/(C − T/K), fitted 278–353 K), 3 significant figures; Perry 2-313 gives 0.893; stored value was 0.894 (recalled)',
      ),
    ),
  },
  {
    id: 'methylcyclohexane',
    name: 'Methylcyclohexane',
    synonyms: ['MCH'],
    smiles: 'CC1CCCCC1',
    cas: '108-87-2',
    molarMassGmol: sv(
      98.189,
      derived(
        'iupac-atomic-weights',
        'computed from C7H14 with conventional standard atomic weights',
      ),
    ),
    density: sv({ gPerMl: 0.7694, temperatureC: 20 }, read('crc-organic-constants')),
    boilingPointC: sv(100.9, read('crc-organic-constants')),
    meltingPointC: sv(-126.6, read('crc-organic-constants')),
    antoine: [
      antoine(
        'log10-bar-degC',
        3.98232,
        1290.968,
        223.701,
        276.68,
        400.13,
        read(
          'poling-5e-antoine',
          'data file stores log10(P/Pa) with T/K; converted A − 5, C + 273.15',
        ),
      ),
    ],
    enthalpyVapKJmol: sv(31.27, read('crc-enthalpy-vaporization')),
    hansen: sv({ d: 16, p: 0, h: 1 }, read('hansen-hspipy')),
    molarVolumeCm3mol: sv(127.6, derived('derived-quantity', 'molar mass / density at 20 °C')),
    unifac: sv({ 1: 1, 2: 5, 3: 1 }, ASSIGNED),
    waterMutualSolubility: sv(
      { solventInWaterWtPct: 0.0014, waterInSolventWtPct: 0.01, temperatureC: 25 },
      recalled('mutual-solubility-memory'),
    ),
    waterMiscibility: 'partial',
    viscosityMPas25C: sv(
      0.679,
      read(
        'vn-3term-viscosity',
        'computed at 298.15 K from A = -1.5348, B = -319.07, C = 64.712 (log10(μ/mPa·s) = A + B/(C − T/K), fitted 270–380 K), 3 significant figures; Perry 2-313 gives 0.683',
      ),
    ),
  },
  {
    id: 'toluene',
    name: 'Toluene',
    synonyms: ['methylbenzene', 'PhMe'],
    smiles: 'Cc1ccccc1',
    cas: '108-88-3',
    molarMassGmol: sv(
      92.141,
      derived(
        'iupac-atomic-weights',
        'computed from C7H8 with conventional standard atomic weights',
      ),
    ),
    density: sv({ gPerMl: 0.8623, temperatureC: 25 }, read('crc-organic-constants')),
    boilingPointC: sv(110.6, read('crc-organic-constants')),
    meltingPointC: sv(-95, read('crc-organic-constants')),
    antoine: [
      antoine(
        'log10-bar-degC',
        4.05043,
        1327.62,
        217.625,
        286.44,
        409.61,
        read(
          'poling-5e-antoine',
          'data file stores log10(P/Pa) with T/K; converted A − 5, C + 273.15',
        ),
      ),
      antoine(
        'log10-bar-K',
        4.23679,
        1426.448,
        -45.957,
        273.13,
        297.89,
        read(
          'nist-webbook-antoine',
          'as converted in reference-data.md §C from the data file (ln P/Pa, T/K); low-temperature segment only; not for use near Tb',
        ),
      ),
    ],
    enthalpyVapKJmol: sv(33.18, read('crc-enthalpy-vaporization')),
    hansen: sv({ d: 18, p: 1.4, h: 2 }, read('hansen-hspipy')),
    molarVolumeCm3mol: sv(106.9, derived('derived-quantity', 'molar mass / density at 25 °C')),
    unifac: sv({ 9: 5, 11: 1 }, ASSIGNED),
    waterMutualSolubility: sv(
      { solventInWaterWtPct: 0.052, waterInSolventWtPct: 0.033, temperatureC: 25 },
      recalled(
        'mutual-solubility-memory',
        'toluene in water 526 mg/L was read on a web page that is not a publication (citation removed); water in toluene recalled',
      ),
    ),
    waterMiscibility: 'partial',
    viscosityMPas25C: sv(
      0.555,
      read(
        'vn-dutt-prasad-viscosity',
        'computed at 298.15 K from A = -1.7712, B = -433.71, C = 12.03 (log10(μ/mPa·s) = A + B/(C − T/K), fitted 253–383 K), 3 significant figures; Perry 2-313 gives 0.554; stored value was 0.56 (recalled)',
      ),
    ),
  },
  {
    id: 'o-xylene',
    name: 'o-Xylene',
    synonyms: ['xylene', 'xylenes', '1,2-dimethylbenzene'],
    smiles: 'Cc1ccccc1C',
    cas: '95-47-6',
    molarMassGmol: sv(
      106.168,
      derived(
        'iupac-atomic-weights',
        'computed from C8H10 with conventional standard atomic weights',
      ),
    ),
    density: sv({ gPerMl: 0.8755, temperatureC: 25 }, read('crc-organic-constants')),
    boilingPointC: sv(144.4, read('crc-organic-constants')),
    meltingPointC: sv(-25.16, read('crc-organic-constants')),
    antoine: [
      antoine(
        'log10-bar-degC',
        4.09789,
        1458.706,
        212.041,
        312.75,
        445.3,
        read(
          'poling-5e-antoine',
          'data file stores log10(P/Pa) with T/K; converted A − 5, C + 273.15',
        ),
      ),
    ],
    enthalpyVapKJmol: sv(36.24, read('crc-enthalpy-vaporization')),
    hansen: sv(
      { d: 17.8, p: 1, h: 3.1 },
      read('hansen-hspipy', 'mixed xylenes 17.6/1.0/3.1 in the same file'),
    ),
    molarVolumeCm3mol: sv(121.3, derived('derived-quantity', 'molar mass / density at 25 °C')),
    unifac: sv({ 9: 4, 11: 2 }, ASSIGNED),
    waterMutualSolubility: sv(
      { solventInWaterWtPct: 0.0178, waterInSolventWtPct: 0.03, temperatureC: 25 },
      recalled('mutual-solubility-memory'),
    ),
    waterMiscibility: 'partial',
    viscosityMPas25C: sv(
      0.761,
      read(
        'vn-dutt-prasad-viscosity',
        'computed at 298.15 K from A = -1.735, B = -445.93, C = 22.25 (log10(μ/mPa·s) = A + B/(C − T/K), fitted 273–413 K), 3 significant figures; Perry 2-313 gives 0.758; stored value was 0.76 (recalled)',
      ),
    ),
  },
];
