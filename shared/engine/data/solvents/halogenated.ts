/**
 * Halogenated solvents: curated solvent records. Every value carries its source; see
 * shared/engine/data/sources.ts for the full citations and docs/data-sources.md
 * for how the values were chosen. Antoine constants are kept in the published
 * form (see AntoineSet in ../types.ts).
 */
import type { SolventBaseRecord } from '../types';
import { antoine, ASSIGNED, derived, read, recalled, sv } from './common';

export const HALOGENATED_SOLVENTS: readonly SolventBaseRecord[] = [
  {
    id: 'dichloromethane',
    name: 'Dichloromethane',
    synonyms: ['DCM', 'methylene chloride'],
    smiles: 'ClCCl',
    cas: '75-09-2',
    molarMassGmol: sv(
      84.927,
      derived(
        'iupac-atomic-weights',
        'computed from CH2Cl2 with conventional standard atomic weights',
      ),
    ),
    density: sv({ gPerMl: 1.3266, temperatureC: 20 }, read('crc-organic-constants')),
    boilingPointC: sv(39.8, read('crc-organic-constants')),
    meltingPointC: sv(-95, read('crc-organic-constants')),
    antoine: [
      antoine(
        'log10-bar-degC',
        4.07622,
        1070.07,
        223.24,
        235.2,
        333.36,
        read(
          'poling-5e-antoine',
          'data file stores log10(P/Pa) with T/K; converted A − 5, C + 273.15',
        ),
      ),
      antoine(
        'log10-bar-K',
        3.97323,
        1016.865,
        -56.623,
        303.14,
        313.14,
        read(
          'nist-webbook-antoine',
          'as converted in reference-data.md §C from the data file (ln P/Pa, T/K); narrow range 30–40 °C',
        ),
      ),
    ],
    enthalpyVapKJmol: sv(28.06, read('crc-enthalpy-vaporization')),
    hansen: sv(
      { d: 18.2, p: 6.3, h: 6.1 },
      read('hansen-hspipy', 'classic handbook set; newer HSPiP revision 17.0/7.3/7.1'),
    ),
    molarVolumeCm3mol: sv(64, derived('derived-quantity', 'molar mass / density at 20 °C')),
    unifac: sv({ 47: 1 }, read('unifac-groups', 'whole-molecule subgroup of the original table')),
    waterMutualSolubility: sv(
      { solventInWaterWtPct: 1.73, waterInSolventWtPct: 0.2, temperatureC: 25 },
      recalled(
        'mutual-solubility-memory',
        'DCM in water 17.5 g/L at 25 °C was read on a vendor page (citation removed); water in DCM recalled',
      ),
    ),
    waterMiscibility: 'partial',
    viscosityMPas25C: sv(
      0.414,
      read(
        'vn-dutt-prasad-viscosity',
        'computed at 298.15 K from A = -1.4815, B = -302.66, C = 22.64 (log10(μ/mPa·s) = A + B/(C − T/K), fitted 248–310 K), 3 significant figures; Perry 2-313 gives 0.413; stored value was 0.413 (recalled)',
      ),
    ),
  },
  {
    id: 'chloroform',
    name: 'Chloroform',
    synonyms: ['trichloromethane'],
    smiles: 'ClC(Cl)Cl',
    cas: '67-66-3',
    molarMassGmol: sv(
      119.369,
      derived(
        'iupac-atomic-weights',
        'computed from CHCl3 with conventional standard atomic weights',
      ),
    ),
    density: sv({ gPerMl: 1.4788, temperatureC: 25 }, read('crc-organic-constants')),
    boilingPointC: sv(61.2, read('crc-organic-constants')),
    meltingPointC: sv(-63.47, read('crc-organic-constants')),
    antoine: [
      antoine(
        'log10-bar-degC',
        3.96288,
        1106.904,
        218.552,
        250.1,
        356.89,
        read(
          'poling-5e-antoine',
          'data file stores log10(P/Pa) with T/K; converted A − 5, C + 273.15',
        ),
      ),
    ],
    enthalpyVapKJmol: sv(29.24, read('crc-enthalpy-vaporization')),
    hansen: sv({ d: 17.8, p: 3.1, h: 5.7 }, read('hansen-hspipy')),
    molarVolumeCm3mol: sv(80.7, derived('derived-quantity', 'molar mass / density at 25 °C')),
    unifac: sv({ 50: 1 }, read('unifac-groups', 'whole-molecule subgroup of the original table')),
    waterMutualSolubility: sv(
      { solventInWaterWtPct: 0.79, waterInSolventWtPct: 0.09, temperatureC: 20 },
      recalled(
        'nas-2016-appD',
        'solvent in water read as 0.8 g/100 g water (NAS 2016 App. D); water in chloroform recalled',
      ),
    ),
    waterMiscibility: 'partial',
    viscosityMPas25C: sv(
      0.532,
      read(
        'vn-dutt-prasad-viscosity',
        'computed at 298.15 K from A = -1.3917, B = -288.76, C = 39.69 (log10(μ/mPa·s) = A + B/(C − T/K), fitted 248–333 K), 3 significant figures; Perry 2-313 gives 0.539; V&N 3-term set 0.537; stored value was 0.537 (recalled)',
      ),
    ),
  },
  {
    id: 'chlorobenzene',
    name: 'Chlorobenzene',
    synonyms: ['PhCl', 'monochlorobenzene', 'MCB'],
    smiles: 'Clc1ccccc1',
    cas: '108-90-7',
    molarMassGmol: sv(
      112.556,
      derived(
        'iupac-atomic-weights',
        'computed from C6H5Cl with conventional standard atomic weights',
      ),
    ),
    density: sv({ gPerMl: 1.1058, temperatureC: 20 }, read('crc-organic-constants')),
    boilingPointC: sv(131.6, read('crc-organic-constants')),
    meltingPointC: sv(-45.2, read('crc-organic-constants')),
    antoine: [
      antoine(
        'log10-bar-degC',
        4.02012,
        1378.79,
        211.7,
        302.5,
        432.18,
        read(
          'poling-5e-antoine',
          'data file stores log10(P/Pa) with T/K; converted A − 5, C + 273.15',
        ),
      ),
    ],
    enthalpyVapKJmol: sv(35.19, read('crc-enthalpy-vaporization')),
    hansen: sv({ d: 19, p: 4.3, h: 2 }, read('hansen-hspipy')),
    molarVolumeCm3mol: sv(101.8, derived('derived-quantity', 'molar mass / density at 20 °C')),
    unifac: sv({ 9: 5, 53: 1 }, ASSIGNED),
    waterMutualSolubility: sv(
      { solventInWaterWtPct: 0.05, waterInSolventWtPct: 0.03, temperatureC: 20 },
      recalled(
        'nas-2016-appD',
        'solvent in water read as 0.05 g/100 g water (NAS 2016 App. D); water in chlorobenzene recalled',
      ),
    ),
    waterMiscibility: 'partial',
    viscosityMPas25C: sv(
      0.755,
      read(
        'vn-dutt-prasad-viscosity',
        'computed at 298.15 K from A = -1.5481, B = -390.95, C = 24.03 (log10(μ/mPa·s) = A + B/(C − T/K), fitted 273–393 K), 3 significant figures; Perry 2-313 gives 0.755; stored value was 0.753 (recalled)',
      ),
    ),
  },
];
