/**
 * Ethers: curated solvent records. Every value carries its source; see
 * shared/engine/data/sources.ts for the full citations and docs/data-sources.md
 * for how the values were chosen. Antoine constants are kept in the published
 * form (see AntoineSet in ../types.ts).
 */
import type { SolventBaseRecord } from '../types';
import { antoine, ASSIGNED, derived, read, recalled, sv, VISCOSITY } from './common';

export const ETHERS_SOLVENTS: readonly SolventBaseRecord[] = [
  {
    id: 'thf',
    name: 'Tetrahydrofuran',
    synonyms: ['THF', 'oxolane'],
    smiles: 'C1CCOC1',
    cas: '109-99-9',
    molarMassGmol: sv(
      72.107,
      derived(
        'iupac-atomic-weights',
        'computed from C4H8O with conventional standard atomic weights',
      ),
    ),
    density: sv({ gPerMl: 0.8833, temperatureC: 25 }, read('crc-organic-constants')),
    boilingPointC: sv(
      66,
      read('crc-organic-constants', 'NIST/Poling Antoine gives 65.97 °C; Yaws 64.85 °C'),
    ),
    meltingPointC: sv(-108.38, read('crc-organic-constants')),
    antoine: [
      antoine(
        'log10-bar-degC',
        4.12142,
        1203.11,
        226.355,
        253.5,
        361.71,
        read(
          'poling-5e-antoine',
          'data file stores log10(P/Pa) with T/K; converted A − 5, C + 273.15',
        ),
      ),
      antoine(
        'log10-bar-K',
        4.12118,
        1202.942,
        -46.818,
        296.29,
        372.8,
        read(
          'nist-webbook-antoine',
          'as converted in reference-data.md §C from the data file (ln P/Pa, T/K)',
        ),
      ),
    ],
    enthalpyVapKJmol: sv(29.81, read('crc-enthalpy-vaporization')),
    hansen: sv({ d: 16.8, p: 5.7, h: 8 }, read('hansen-hspipy')),
    molarVolumeCm3mol: sv(81.6, derived('derived-quantity', 'molar mass / density at 25 °C')),
    unifac: sv({ 2: 3, 27: 1 }, ASSIGNED),
    waterMiscibility: 'miscible',
    viscosityMPas25C: sv(
      0.456,
      recalled(
        'crc-viscosity-liquids',
        'the two tables read disagree by 4 % (Dutt–Prasad set 0.475, Perry 2-313 0.456); kept as recalled',
      ),
    ),
  },
  {
    id: '2-methyltetrahydrofuran',
    name: '2-Methyltetrahydrofuran',
    synonyms: ['2-MeTHF', 'MeTHF'],
    smiles: 'CC1CCCO1',
    cas: '96-47-9',
    molarMassGmol: sv(
      86.134,
      derived(
        'iupac-atomic-weights',
        'computed from C5H10O with conventional standard atomic weights',
      ),
    ),
    density: sv({ gPerMl: 0.8552, temperatureC: 20 }, read('crc-organic-constants')),
    boilingPointC: sv(80, read('crc-organic-constants')),
    meltingPointC: sv(
      -136.1,
      read('nist-webbook-constants', '137.05 K; stored value was −136 °C (recalled)'),
    ),
    antoine: [
      antoine(
        'log10-bar-degC',
        3.95009,
        1175.51,
        217.802,
        263.44,
        377.49,
        read(
          'poling-5e-antoine',
          'data file stores log10(P/Pa) with T/K; converted A − 5, C + 273.15',
        ),
      ),
    ],
    hansen: sv({ d: 16.9, p: 5, h: 4.3 }, read('hansen-diaz-2022')),
    molarVolumeCm3mol: sv(100.7, derived('derived-quantity', 'molar mass / density at 20 °C')),
    unifac: sv({ 1: 1, 2: 2, 3: 1, 27: 1 }, ASSIGNED),
    waterMutualSolubility: sv(
      { solventInWaterWtPct: 14.4, waterInSolventWtPct: 4.4, temperatureC: 20 },
      read(
        'encyclopedia-2-methyltetrahydrofuran',
        'solvent in water 14.4 wt% at 19.3 °C (inverse solubility: 21.0 % at 0 °C, 6.0 % at 70.6 °C); water in solvent 4.4 g/100 g at 23 °C',
      ),
    ),
    waterMutualSolubilityCurve: sv(
      [
        { temperatureC: 0, solventInWaterWtPct: 21.0 },
        { temperatureC: 29.5, solventInWaterWtPct: 11.4 },
        { temperatureC: 70.6, solventInWaterWtPct: 6.0 },
      ],
      read(
        'encyclopedia-2-methyltetrahydrofuran',
        'solvent in water: 21.0 % at 0 °C, 11.4 wt% at 29.5 °C, 6.0 % at 70.6 °C (inverse solubility); no water-in-solvent value at another temperature',
      ),
    ),
    waterMiscibility: 'partial',
    viscosityMPas25C: sv(0.46, VISCOSITY),
  },
  {
    id: 'mtbe',
    name: 'Methyl tert-butyl ether',
    synonyms: ['MTBE', 'tert-butyl methyl ether', 'TBME'],
    smiles: 'COC(C)(C)C',
    cas: '1634-04-4',
    molarMassGmol: sv(
      88.15,
      derived(
        'iupac-atomic-weights',
        'computed from C5H12O with conventional standard atomic weights',
      ),
    ),
    density: sv(
      { gPerMl: 0.7353, temperatureC: 25 },
      read(
        'crc-organic-constants',
        'handbook monograph quoted on a public page gives d20/4 0.7404',
      ),
    ),
    boilingPointC: sv(55.1, read('crc-organic-constants')),
    meltingPointC: sv(-108.65, read('nist-webbook-constants', '164.5 K')),
    antoine: [
      antoine(
        'log10-bar-K',
        4.62562,
        1454.276,
        -13.144,
        287,
        326,
        read(
          'landolt-iv20-antoine',
          'as converted in reference-data.md §C from the data file (ln P/Pa, T/K); narrow range; unusual C = −13.144 K; reproduces Tb to 0.3 K',
        ),
      ),
    ],
    enthalpyVapKJmol: sv(27.94, read('crc-enthalpy-vaporization')),
    hansen: sv({ d: 14.8, p: 4.3, h: 5 }, read('hansen-hspipy')),
    molarVolumeCm3mol: sv(119.9, derived('derived-quantity', 'molar mass / density at 25 °C')),
    unifac: sv({ 1: 3, 4: 1, 24: 1 }, ASSIGNED),
    waterMutualSolubility: sv(
      { solventInWaterWtPct: 4.6, waterInSolventWtPct: 1.5, temperatureC: 20 },
      {
        ref: 'merck-index-mtbe',
        status: 'secondary',
        note: '4.8 g/100 g water (≈4.6 wt%) and 1.5 g water/100 g',
      },
    ),
    waterMiscibility: 'partial',
    viscosityMPas25C: sv(
      0.337,
      read(
        'perry-8e-2-313-viscosity',
        'computed at 298.15 K from C1…C5 = -6.921, 790.773, -0.654, 0, 0 (μ/Pa·s = exp(C1 + C2/T + C3 ln T + C4 T^C5), T/K, fitted 164.55–450 K), 3 significant figures; no V&N set in the files read; stored value was 0.34 (recalled)',
      ),
    ),
  },
  {
    id: 'cpme',
    name: 'Cyclopentyl methyl ether',
    synonyms: ['CPME', 'methoxycyclopentane'],
    smiles: 'COC1CCCC1',
    cas: '5614-37-9',
    molarMassGmol: sv(
      100.161,
      derived(
        'iupac-atomic-weights',
        'computed from C6H12O with conventional standard atomic weights',
      ),
    ),
    density: sv({ gPerMl: 0.86, temperatureC: 20 }, recalled('density-memory')),
    boilingPointC: sv(
      105.44,
      read('cas-common-chemistry', '378.59 K; stored value was 106 °C (recalled)'),
    ),
    meltingPointC: sv(-140, read('opennotebook-melting-points', '133.15 K')),
    antoine: [], // no Antoine set found in the sources read; see docs/data-sources.md
    hansen: sv({ d: 16.7, p: 4.3, h: 4.3 }, read('hansen-diaz-2022')),
    molarVolumeCm3mol: sv(116.5, derived('derived-quantity', 'molar mass / density at 20 °C')),
    unifac: sv({ 2: 4, 3: 1, 24: 1 }, ASSIGNED),
    waterMutualSolubility: sv(
      { solventInWaterWtPct: 1.1, waterInSolventWtPct: 0.3, temperatureC: 23 },
      recalled('mutual-solubility-memory'),
    ),
    waterMiscibility: 'partial',
    viscosityMPas25C: sv(0.55, VISCOSITY),
  },
  {
    id: 'diethyl-ether',
    name: 'Diethyl ether',
    synonyms: ['ether', 'Et2O', 'ethyl ether', 'ethoxyethane'],
    smiles: 'CCOCC',
    cas: '60-29-7',
    molarMassGmol: sv(
      74.123,
      derived(
        'iupac-atomic-weights',
        'computed from C4H10O with conventional standard atomic weights',
      ),
    ),
    density: sv({ gPerMl: 0.7138, temperatureC: 20 }, read('crc-organic-constants')),
    boilingPointC: sv(34.4, read('crc-organic-constants')),
    meltingPointC: sv(-116.22, read('crc-organic-constants')),
    antoine: [
      antoine(
        'log10-bar-degC',
        4.10962,
        1090.64,
        231.2,
        229.71,
        328.31,
        read(
          'poling-5e-antoine',
          'data file stores log10(P/Pa) with T/K; converted A − 5, C + 273.15',
        ),
      ),
    ],
    enthalpyVapKJmol: sv(26.52, read('crc-enthalpy-vaporization')),
    hansen: sv({ d: 14.5, p: 2.9, h: 5.1 }, read('hansen-hspipy', 'newer HSPiP revision: δH 4.6')),
    molarVolumeCm3mol: sv(103.8, derived('derived-quantity', 'molar mass / density at 20 °C')),
    unifac: sv({ 1: 2, 2: 1, 25: 1 }, ASSIGNED),
    waterMutualSolubility: sv(
      { solventInWaterWtPct: 7, waterInSolventWtPct: 1.3, temperatureC: 20 },
      recalled(
        'nas-2016-appD',
        'solvent in water read as 7.5 g/100 g water (NAS 2016 App. D) = 7.0 wt%; water in ether recalled',
      ),
    ),
    waterMiscibility: 'partial',
    viscosityMPas25C: sv(
      0.226,
      read(
        'vn-dutt-prasad-viscosity',
        'computed at 298.15 K from A = -4.4735, B = -3623.26, C = -648.55 (log10(μ/mPa·s) = A + B/(C − T/K), fitted 273–373 K), 3 significant figures; Perry 2-313 gives 0.225; stored value was 0.224 (recalled)',
      ),
    ),
  },
  {
    id: 'diisopropyl-ether',
    name: 'Diisopropyl ether',
    synonyms: ['IPE', 'DIPE', 'isopropyl ether', '2-isopropoxypropane'],
    smiles: 'CC(C)OC(C)C',
    cas: '108-20-3',
    molarMassGmol: sv(
      102.177,
      derived(
        'iupac-atomic-weights',
        'computed from C6H14O with conventional standard atomic weights',
      ),
    ),
    density: sv({ gPerMl: 0.7192, temperatureC: 25 }, read('crc-organic-constants')),
    boilingPointC: sv(68.4, read('crc-organic-constants')),
    meltingPointC: sv(-85.37, read('crc-organic-constants')),
    antoine: [
      antoine(
        'log10-bar-K',
        3.97669,
        1142.723,
        -53.874,
        283,
        365,
        read(
          'landolt-iv20-antoine',
          'data file stores ln(P/Pa) with T/K; converted A/ln 10 − 5, B/ln 10',
        ),
      ),
    ],
    enthalpyVapKJmol: sv(29.1, read('crc-enthalpy-vaporization')),
    hansen: sv({ d: 15.1, p: 3.2, h: 3.2 }, read('hansen-hspipy')),
    molarVolumeCm3mol: sv(142.1, derived('derived-quantity', 'molar mass / density at 25 °C')),
    unifac: sv({ 1: 4, 3: 1, 26: 1 }, ASSIGNED),
    waterMutualSolubility: sv(
      { solventInWaterWtPct: 0.9, waterInSolventWtPct: 0.6, temperatureC: 20 },
      recalled('mutual-solubility-memory'),
    ),
    waterMiscibility: 'partial',
    viscosityMPas25C: sv(
      0.321,
      read(
        'perry-8e-2-313-viscosity',
        'computed at 298.15 K from C1…C5 = -11.5, 993, 0.022, 0, 0 (μ/Pa·s = exp(C1 + C2/T + C3 ln T + C4 T^C5), T/K, fitted 187.65–341.45 K), 3 significant figures; no V&N set in the files read; stored value was 0.379 (recalled)',
      ),
    ),
  },
  {
    id: '1-4-dioxane',
    name: '1,4-Dioxane',
    synonyms: ['dioxane'],
    smiles: 'C1COCCO1',
    cas: '123-91-1',
    molarMassGmol: sv(
      88.106,
      derived(
        'iupac-atomic-weights',
        'computed from C4H8O2 with conventional standard atomic weights',
      ),
    ),
    density: sv({ gPerMl: 1.0337, temperatureC: 20 }, read('crc-organic-constants')),
    boilingPointC: sv(101.2, read('crc-organic-constants')),
    meltingPointC: sv(11.75, read('crc-organic-constants')),
    antoine: [
      antoine(
        'log10-bar-K',
        4.59519,
        1667.742,
        -8.669,
        427,
        583,
        read(
          'landolt-iv20-antoine',
          'data file stores ln(P/Pa) with T/K; converted A/ln 10 − 5, B/ln 10; valid 427–583 K only (above Tb); below, extrapolate from Tb with ΔHvap',
        ),
      ),
    ],
    enthalpyVapKJmol: sv(34.16, read('crc-enthalpy-vaporization')),
    hansen: sv({ d: 19, p: 1.8, h: 7.4 }, read('hansen-hspipy')),
    molarVolumeCm3mol: sv(85.2, derived('derived-quantity', 'molar mass / density at 20 °C')),
    unifac: sv({ 2: 2, 25: 2 }, ASSIGNED),
    waterMiscibility: 'miscible',
    viscosityMPas25C: sv(
      1.18,
      read(
        'vn-dutt-prasad-viscosity',
        'computed at 298.15 K from A = -1.4827, B = -302.77, C = 103.4 (log10(μ/mPa·s) = A + B/(C − T/K), fitted 288–348 K), 3 significant figures; Perry 2-313 gives 1.19; stored value was 1.177 (recalled)',
      ),
    ),
  },
  {
    id: 'dme',
    name: '1,2-Dimethoxyethane',
    synonyms: ['DME', 'glyme', 'monoglyme', 'ethylene glycol dimethyl ether'],
    smiles: 'COCCOC',
    cas: '110-71-4',
    molarMassGmol: sv(
      90.122,
      derived(
        'iupac-atomic-weights',
        'computed from C4H10O2 with conventional standard atomic weights',
      ),
    ),
    density: sv({ gPerMl: 0.8637, temperatureC: 25 }, read('crc-organic-constants')),
    boilingPointC: sv(85, read('crc-organic-constants')),
    meltingPointC: sv(-69, read('crc-organic-constants')),
    antoine: [
      antoine(
        'log10-bar-K',
        4.24776,
        1281.235,
        -55.921,
        359,
        467,
        read(
          'landolt-iv20-antoine',
          'data file stores ln(P/Pa) with T/K; converted A/ln 10 − 5, B/ln 10',
        ),
      ),
    ],
    enthalpyVapKJmol: sv(32.42, read('crc-enthalpy-vaporization')),
    hansen: sv({ d: 15.4, p: 6, h: 6 }, read('hansen-diaz-2022')),
    molarVolumeCm3mol: sv(104.3, derived('derived-quantity', 'molar mass / density at 25 °C')),
    unifac: sv({ 2: 2, 24: 2 }, ASSIGNED),
    waterMiscibility: 'miscible',
    viscosityMPas25C: sv(0.455, VISCOSITY),
  },
  {
    id: 'anisole',
    name: 'Anisole',
    synonyms: ['methoxybenzene'],
    smiles: 'COc1ccccc1',
    cas: '100-66-3',
    molarMassGmol: sv(
      108.14,
      derived(
        'iupac-atomic-weights',
        'computed from C7H8O with conventional standard atomic weights',
      ),
    ),
    density: sv({ gPerMl: 0.994, temperatureC: 20 }, read('crc-organic-constants')),
    boilingPointC: sv(153.6, read('crc-organic-constants')),
    meltingPointC: sv(-37.3, read('crc-organic-constants')),
    antoine: [
      antoine(
        'log10-bar-K',
        4.17726,
        1489.756,
        -69.607,
        383.03,
        437.26,
        read(
          'nist-webbook-antoine',
          'data file stores ln(P/Pa) with T/K; converted A/ln 10 − 5, B/ln 10; read from the data file for this library',
        ),
      ),
    ],
    enthalpyVapKJmol: sv(38.97, read('crc-enthalpy-vaporization')),
    hansen: sv(
      { d: 17.8, p: 4.1, h: 6.7 },
      read('hansen-hspipy', 'newer HSPiP revision: 17.8/4.4/6.9'),
    ),
    molarVolumeCm3mol: sv(108.8, derived('derived-quantity', 'molar mass / density at 20 °C')),
    unifac: sv({ 9: 5, 10: 1, 24: 1 }, ASSIGNED),
    waterMutualSolubility: sv(
      { solventInWaterWtPct: 0.1, waterInSolventWtPct: 0.2, temperatureC: 25 },
      recalled('mutual-solubility-memory'),
    ),
    waterMiscibility: 'partial',
    viscosityMPas25C: sv(
      1.02,
      read(
        'perry-8e-2-313-viscosity',
        'computed at 298.15 K from C1…C5 = -15.407, 1518.7, 0.60172, 0, 0 (μ/Pa·s = exp(C1 + C2/T + C3 ln T + C4 T^C5), T/K, fitted 235.65–426.73 K), 3 significant figures; no V&N set in the files read; stored value was 0.98 (recalled)',
      ),
    ),
  },
];
