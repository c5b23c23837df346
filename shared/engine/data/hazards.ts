/**
 * Fire and handling hazards of the library solvents, kept apart from the
 * physical data and keyed by solvent id: closed-cup flash point, peroxide
 * former, static accumulator.
 *
 * Flash point [°C]: IEC 60079-20-1:2010, the standard's own data table, read
 * through the open data file that carries it (converted from K); NFPA 497
 * (2008) where IEC has no row; a value that neither table holds is
 * 'not-confirmed' (null) and the engine treats that liquid as flammable at any
 * temperature — a recalled flash point is never used.
 *
 * Peroxide former: Kelly 1996, Tables A–D (as reproduced, see the source);
 * ethers not named there are flagged by analogy (common practice).
 *
 * Static accumulator (conductivity below about 50 pS/m): NFPA 77 (2000)
 * Table B.2 where its row was read, otherwise the solvent family's common
 * practice classification, stated as such.
 */
import type { SolventSafetyFields, Source, Sourced } from './types';

type Hazards = Pick<SolventSafetyFields, 'flashPointC' | 'peroxideFormer' | 'lowConductivity'>;

const iec = (c: number, note?: string): Sourced<number> => ({
  value: c,
  source: { ref: 'iec-60079-20-1', status: 'confirmed', ...(note ? { note } : {}) },
});
const nfpa497 = (c: number, note: string): Sourced<number> => ({
  value: c,
  source: { ref: 'nfpa-497', status: 'confirmed', note },
});
const noFlashPoint = (note: string): Sourced<null> => ({
  value: null,
  source: { ref: 'flammability-practice', status: 'common-practice', note },
});
const flashNotConfirmed = (note: string): Sourced<null> => ({
  value: null,
  source: { ref: 'iec-60079-20-1', status: 'not-confirmed', note },
});

const kelly = (value: boolean, note: string): Sourced<boolean> => ({
  value,
  source: { ref: 'kelly-1996-peroxide-tables', status: 'confirmed', note },
});
const NOT_IN_KELLY = kelly(false, 'not in Tables A–C; Table D read in part');
const byAnalogy = (note: string): Sourced<boolean> => ({
  value: true,
  source: { ref: 'peroxide-practice', status: 'common-practice', note },
});

const nfpa77 = (note: string): Sourced<boolean> => ({
  value: false,
  source: { ref: 'nfpa-77-2000-table-b2', status: 'confirmed', note },
});
const family = (value: boolean, family: string): Sourced<boolean> => ({
  value,
  source: {
    ref: 'static-accumulator-practice',
    status: 'common-practice',
    note: `${family}; no measured conductivity read for this solvent`,
  },
});
const HYDROCARBON = family(true, 'hydrocarbon: static accumulator');
const ETHER = family(true, 'ether: treated as a static accumulator');
const ALCOHOL = family(false, 'alcohol: conductive');
const ESTER = family(false, 'ester: treated as conductive (not confirmed by a measured value)');

function h(
  flashPointC: Sourced<number | null>,
  peroxideFormer: Sourced<boolean>,
  lowConductivity: Sourced<boolean>,
): Hazards {
  return { flashPointC, peroxideFormer, lowConductivity };
}

/** Hazard fields of each library solvent, by solvent id. */
export const SOLVENT_HAZARDS: Readonly<Record<string, Hazards>> = Object.freeze({
  water: h(noFlashPoint('not flammable'), NOT_IN_KELLY, family(false, 'water: conductive')),
  methanol: h(
    iec(9, 'NFPA 497: 12 °C'),
    NOT_IN_KELLY,
    nfpa77('methyl alcohol (18 °C): 4.4 × 10⁷ pS/m'),
  ),
  ethanol: h(iec(12, 'NFPA 497: 13 °C'), NOT_IN_KELLY, ALCOHOL),
  '1-propanol': h(iec(15, 'NFPA 497: 15 °C'), NOT_IN_KELLY, ALCOHOL),
  '2-propanol': h(
    iec(12, 'NFPA 497: 12 °C'),
    kelly(true, 'Table B (2-propanol): peroxide hazard on concentration'),
    ALCOHOL,
  ),
  '1-butanol': h(iec(35, 'NFPA 497: 36 °C'), NOT_IN_KELLY, ALCOHOL),
  '2-butanol': h(
    iec(24, 'NFPA 497: 23.8 °C'),
    kelly(true, 'Table B (2-butanol): peroxide hazard on concentration'),
    ALCOHOL,
  ),
  isobutanol: h(
    iec(28, 'the NFPA 497 file gives −40 °C, almost certainly an error'),
    NOT_IN_KELLY,
    ALCOHOL,
  ),
  'tert-butanol': h(
    nfpa497(10, 'not in the IEC 60079-20-1 file'),
    NOT_IN_KELLY,
    family(false, 'alcohol: conductive'),
  ),
  '1-octanol': h(iec(81), NOT_IN_KELLY, nfpa77('octyl alcohol: 1.39 × 10⁷ pS/m')),
  'ethyl-acetate': h(iec(-4, 'NFPA 497: −4 °C'), NOT_IN_KELLY, ESTER),
  'isopropyl-acetate': h(iec(1), NOT_IN_KELLY, ESTER),
  'n-butyl-acetate': h(iec(22, 'NFPA 497: 22 °C'), NOT_IN_KELLY, ESTER),
  acetone: h(iec(-20, 'NFPA 497: −20 °C'), NOT_IN_KELLY, family(false, 'ketone: conductive')),
  '2-butanone': h(
    iec(-10, 'NFPA 497: −6 °C'),
    NOT_IN_KELLY,
    nfpa77('methyl ethyl ketone (25 °C): of order 10⁷ pS/m (mantissa lost in the copy read)'),
  ),
  mibk: h(
    iec(16),
    kelly(true, 'Table B (methyl isobutyl ketone): peroxide hazard on concentration'),
    nfpa77('methyl isobutyl ketone: < 5.2 × 10⁶ pS/m'),
  ),
  thf: h(
    iec(-14, 'NFPA 497: −14 °C'),
    kelly(true, 'Table B (tetrahydrofuran): peroxide hazard on concentration'),
    ETHER,
  ),
  '2-methyltetrahydrofuran': h(
    flashNotConfirmed('in neither the IEC 60079-20-1 nor the NFPA 497 table'),
    byAnalogy('cyclic ether like THF; not named in Kelly Tables A–C'),
    ETHER,
  ),
  mtbe: h(
    iec(-27, 'the NFPA 497 file gives −80 °C, almost certainly an error'),
    NOT_IN_KELLY,
    ETHER,
  ),
  cpme: h(
    flashNotConfirmed('in neither the IEC 60079-20-1 nor the NFPA 497 table'),
    byAnalogy('ether with an α-hydrogen (cyclopentyl CH); not named in Kelly Tables A–C'),
    ETHER,
  ),
  'diethyl-ether': h(
    iec(-45, 'NFPA 497: −45 °C'),
    kelly(true, 'Table B (diethyl ether): peroxide hazard on concentration'),
    ETHER,
  ),
  'diisopropyl-ether': h(
    iec(-28, 'NFPA 497: −28 °C'),
    kelly(true, 'Table A (isopropyl ether): explosive peroxides on storage without concentration'),
    ETHER,
  ),
  '1-4-dioxane': h(
    iec(11, 'NFPA 497: 12 °C'),
    kelly(true, 'Table B (dioxanes): peroxide hazard on concentration'),
    ETHER,
  ),
  dme: h(
    iec(-6, 'NAS 2016 App. D gives −2 °C'),
    kelly(true, 'Table B (ethylene glycol dimethyl ether, glyme)'),
    ETHER,
  ),
  anisole: h(
    flashNotConfirmed('in neither the IEC 60079-20-1 nor the NFPA 497 table'),
    NOT_IN_KELLY,
    ETHER,
  ),
  'n-heptane': h(iec(-7, 'NFPA 497: −4 °C'), NOT_IN_KELLY, HYDROCARBON),
  'n-hexane': h(iec(-22, 'NFPA 497: −23 °C'), NOT_IN_KELLY, HYDROCARBON),
  cyclohexane: h(iec(-17, 'NFPA 497: −17 °C'), NOT_IN_KELLY, HYDROCARBON),
  methylcyclohexane: h(iec(-4, 'NFPA 497: −4 °C'), NOT_IN_KELLY, HYDROCARBON),
  toluene: h(iec(4, 'NFPA 497: 4 °C'), NOT_IN_KELLY, HYDROCARBON),
  'o-xylene': h(
    iec(30, 'mixed xylenes (CAS 1330-20-7): 25 °C in NFPA 497'),
    NOT_IN_KELLY,
    HYDROCARBON,
  ),
  dichloromethane: h(
    noFlashPoint('no flash point under the standard closed-cup test'),
    NOT_IN_KELLY,
    family(false, 'chlorinated alkane: treated as conductive (not confirmed by a measured value)'),
  ),
  chloroform: h(
    noFlashPoint('non-flammable under the standard test'),
    NOT_IN_KELLY,
    family(false, 'chlorinated alkane: treated as conductive (not confirmed by a measured value)'),
  ),
  chlorobenzene: h(
    iec(28, 'NFPA 497: 29 °C'),
    NOT_IN_KELLY,
    family(true, 'aromatic hydrocarbon derivative: treated as a static accumulator'),
  ),
  acetonitrile: h(iec(2, 'NFPA 497: 6 °C'), NOT_IN_KELLY, family(false, 'nitrile: conductive')),
  dmf: h(iec(58, 'NFPA 497: 58 °C'), NOT_IN_KELLY, family(false, 'amide: conductive')),
  dmac: h(
    flashNotConfirmed('in neither the IEC 60079-20-1 nor the NFPA 497 table'),
    NOT_IN_KELLY,
    family(false, 'amide: conductive'),
  ),
  nmp: h(
    flashNotConfirmed('in neither the IEC 60079-20-1 nor the NFPA 497 table'),
    NOT_IN_KELLY,
    nfpa77('n-methyl-2-pyrolidone: of order 10⁶ pS/m (mantissa lost in the copy read)'),
  ),
  dmso: h(
    {
      value: 95,
      source: {
        ref: 'nas-2016-appD',
        status: 'confirmed',
        note: 'in neither the IEC 60079-20-1 nor the NFPA 497 table',
      },
    },
    NOT_IN_KELLY,
    family(false, 'sulfoxide: conductive'),
  ),
  'acetic-acid': h(
    iec(39, 'NFPA 497: 39 °C'),
    NOT_IN_KELLY,
    family(false, 'carboxylic acid: conductive'),
  ),
  pyridine: h(iec(18, 'NFPA 497: 20 °C'), NOT_IN_KELLY, family(false, 'pyridine base: conductive')),
});

/**
 * Whether a source leaves the field without a confirmed value.
 *
 * Source: the library's own source statuses (data/types.ts); a bookkeeping
 * function, no formula.
 *
 * @param source  the value's source
 * @returns true when the status is 'not-confirmed'
 *
 * Validity: any source record.
 */
export function isNotConfirmed(source: Source): boolean {
  return source.status === 'not-confirmed';
}
