/**
 * ICH Q3C residual-solvent class, Option 1 concentration limit and PDE of
 * every library solvent, kept apart from the physical data and keyed by
 * solvent id. The guideline: ICH Harmonised Guideline Q3C(R9), Impurities:
 * Guideline for Residual Solvents, Step 4, 24 January 2024 — Table 1 (Class
 * 1), Table 2 (Class 2, PDE and limit), Table 3 (Class 3) and Table 4
 * (solvents without adequate toxicological data); R9 changed only §3.4.
 *
 * Where each number was read is in its source:
 *  - status 'secondary': read in a published reproduction of the guideline's
 *    tables (a journal table, a handbook), not in the guideline itself — no
 *    stored copy of the guideline's own tables could be read for this
 *    library. Results say so wherever these limits are compared;
 *  - status 'not-confirmed': no published table was read, so no class or
 *    limit is held (a recalled number is never used). The engine then tells
 *    the chemist to compare the residual with the current guideline;
 *  - status 'common-practice': water, which Q3C does not treat as a residual
 *    solvent.
 * Option 1 (Q3C §3.3): limit [ppm] = 1000 · PDE [mg/day] / 10 [g/day], so
 * PDE = limit / 100; Class 3 solvents have PDE ≥ 50 mg/day, stored as 50 with
 * the 5000 ppm Option 1 limit.
 */
import type { SolventRecord, Source } from './types';

type IchEntry = SolventRecord['ich'];

const JCR = (note?: string): Source => ({
  ref: 'jcr-2022-table1',
  status: 'secondary',
  ...(note ? { note } : {}),
});
const WYPYCH = (note: string): Source => ({
  ref: 'wypych-2001-q3c-tables',
  status: 'secondary',
  note,
});
const R8_DRAFT = (note: string): Source => ({
  ref: 'q3c-r8-draft-report',
  status: 'secondary',
  note,
});

function class2(limitPpm: number, source: Source): IchEntry {
  return { value: { class: 2, limitPpm, pdeMgDay: limitPpm / 100, table: 'Table 2' }, source };
}
function class3(source: Source): IchEntry {
  return { value: { class: 3, limitPpm: 5000, pdeMgDay: 50, table: 'Table 3' }, source };
}
function notConfirmed(note: string): IchEntry {
  return {
    value: { class: null, limitPpm: null, pdeMgDay: null },
    source: { ref: 'ich-q3c-r9', status: 'not-confirmed', note },
  };
}

const WYPYCH_CLASS3 =
  'Class 3 in the 1997 Table 3 as reproduced by Wypych (Table 16.2.5); not read in the R9 text';

/** ICH Q3C entry of each library solvent, by solvent id. */
export const ICH_Q3C: Readonly<Record<string, IchEntry>> = Object.freeze({
  water: {
    value: { class: null, limitPpm: null, pdeMgDay: null },
    source: {
      ref: 'ich-q3c-r9',
      status: 'common-practice',
      note: 'water is not a residual solvent in the sense of Q3C',
    },
  },
  methanol: class2(3000, JCR('PDE 30 mg/day from the limit by the Option 1 relation')),
  ethanol: class3(JCR()),
  '1-propanol': class3(WYPYCH(WYPYCH_CLASS3)),
  '2-propanol': class3(JCR('listed as isopropanol')),
  '1-butanol': class3(WYPYCH(WYPYCH_CLASS3)),
  '2-butanol': class3(JCR()),
  isobutanol: class3(WYPYCH(`listed as 2-methyl-1-propanol; ${WYPYCH_CLASS3}`)),
  'tert-butanol': class2(
    3500,
    R8_DRAFT('PDE 35 mg/day, Class 2, as proposed in the R8 Step 2 draft; 3500 ppm by Option 1'),
  ),
  '1-octanol': notConfirmed(
    'not in the reproduced Class 3 and Table 4 lists read; Tables 1–2 not read — listing not confirmed',
  ),
  'ethyl-acetate': class3(JCR()),
  'isopropyl-acetate': class3(WYPYCH(WYPYCH_CLASS3)),
  'n-butyl-acetate': class3(WYPYCH(`listed as butyl acetate; ${WYPYCH_CLASS3}`)),
  acetone: class3(JCR()),
  '2-butanone': class3(JCR('listed as butanone/methyl ethyl ketone')),
  mibk: notConfirmed(
    'Class 3 in the 1997 table (Wypych Table 16.2.5) but moved by a later revision; the current entry was not read',
  ),
  thf: class2(720, JCR()),
  '2-methyltetrahydrofuran': class3(
    R8_DRAFT('PDE 50 mg/day, Class 3, as proposed in the R8 Step 2 draft'),
  ),
  mtbe: class3(JCR('listed as methyl tert-butyl ether (MTBE)')),
  cpme: class2(
    1500,
    R8_DRAFT('PDE 15 mg/day, Class 2, as proposed in the R8 Step 2 draft; 1500 ppm by Option 1'),
  ),
  'diethyl-ether': class3(JCR()),
  'diisopropyl-ether': {
    value: { class: null, limitPpm: null, pdeMgDay: null, table: 'Table 4' },
    source: WYPYCH(
      'listed as isopropyl ether among the solvents for which no adequate toxicological data was found (1997 Table 4 as reproduced by Wypych, Table 16.2.6): no PDE',
    ),
  },
  '1-4-dioxane': class2(380, JCR()),
  dme: notConfirmed('1,2-dimethoxyethane: the Class 2 entry was not read in a published table'),
  anisole: class3(WYPYCH(WYPYCH_CLASS3)),
  'n-heptane': class3(WYPYCH(`listed as heptane; ${WYPYCH_CLASS3}`)),
  'n-hexane': notConfirmed('the Class 2 entry was not read in a published table'),
  cyclohexane: class2(3880, JCR()),
  methylcyclohexane: class2(1180, JCR()),
  toluene: class2(890, JCR()),
  'o-xylene': class2(
    2170,
    JCR('total xylenes; Q3C sets one limit for the sum of o-, m-, p-xylene and ethylbenzene'),
  ),
  dichloromethane: class2(600, JCR('listed as methylene chloride')),
  chloroform: notConfirmed('the Class 2 entry was not read in a published table'),
  chlorobenzene: class2(360, JCR()),
  acetonitrile: class2(410, JCR()),
  dmf: notConfirmed('the Class 2 entry was not read in a published table'),
  dmac: notConfirmed('the Class 2 entry was not read in a published table'),
  nmp: notConfirmed('the Class 2 entry (PDE revised in Q3C(R2)) was not read in a published table'),
  dmso: class3(WYPYCH(`listed as dimethylsulfoxide; ${WYPYCH_CLASS3}`)),
  'acetic-acid': class3(WYPYCH(WYPYCH_CLASS3)),
  pyridine: notConfirmed('the Class 2 entry was not read in a published table'),
});
