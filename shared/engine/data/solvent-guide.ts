/**
 * Solvent-selection guide categories, read row by row from the table of the
 * CHEM21 guide (Prat et al., Green Chem. 2016, 18, 288–296: the classical
 * solvents' table, column "ranking after discussion"), through an open data
 * file that reproduces that table (source id 'chem21-guide-2016-table'; the
 * file's columns "Ranking Default" and "Ranking Discussion" are the guide's
 * two ranking columns).
 *
 * The whole table was read (53 rows). Every library solvent is either listed
 * in SOLVENT_GUIDE with the row that gives it, or in NOT_IN_GUIDE with the
 * reason; a unit test fails if a library solvent is in neither, so a new
 * solvent cannot get a category without its row being read. No category is
 * recalled or inferred. docs/data-sources.md lists the rows read.
 */
import type { GuideCategory, Source } from './types';

export interface GuideRow {
  /** The solvent's name as the table's row gives it. */
  row: string;
  /** Ranking after discussion (the guide's final category). */
  category: GuideCategory;
  /** The table's default ranking (from the safety, health and environment scores), for reference. */
  defaultCategory: GuideCategory;
}

export const SOLVENT_GUIDE_SOURCE: Source = {
  ref: 'chem21-guide-2016-table',
  status: 'secondary',
  note: 'read in an open data file that reproduces the guide’s table, not in the article itself',
};

/** Keyed by library solvent id; rows in the table's order. */
export const SOLVENT_GUIDE: Readonly<Record<string, GuideRow>> = Object.freeze({
  dme: { row: '1,2-Dimethoxyethane', category: 'hazardous', defaultCategory: 'hazardous' },
  'acetic-acid': { row: 'Acetic acid', category: 'problematic', defaultCategory: 'problematic' },
  acetone: { row: 'Acetone', category: 'recommended', defaultCategory: 'problematic' },
  acetonitrile: { row: 'Acetonitrile', category: 'problematic', defaultCategory: 'recommended' },
  anisole: { row: 'Anisole', category: 'recommended', defaultCategory: 'problematic' },
  chlorobenzene: { row: 'Chlorobenzene', category: 'problematic', defaultCategory: 'problematic' },
  chloroform: { row: 'Chloroform', category: 'highly-hazardous', defaultCategory: 'problematic' },
  cyclohexane: { row: 'Cyclohexane', category: 'problematic', defaultCategory: 'problematic' },
  dichloromethane: { row: 'Dichloromethane', category: 'hazardous', defaultCategory: 'hazardous' },
  'diethyl-ether': {
    row: 'Diethyl ether',
    category: 'highly-hazardous',
    defaultCategory: 'hazardous',
  },
  'diisopropyl-ether': {
    row: 'Diisopropyl ether',
    category: 'hazardous',
    defaultCategory: 'hazardous',
  },
  dmso: { row: 'Dimethyl sulfoxide', category: 'problematic', defaultCategory: 'recommended' },
  '1-4-dioxane': { row: 'Dioxane', category: 'hazardous', defaultCategory: 'problematic' },
  ethanol: { row: 'Ethanol', category: 'recommended', defaultCategory: 'recommended' },
  'ethyl-acetate': {
    row: 'Ethyl acetate',
    category: 'recommended',
    defaultCategory: 'recommended',
  },
  'n-heptane': { row: 'Heptane', category: 'problematic', defaultCategory: 'problematic' },
  'n-hexane': { row: 'Hexane', category: 'hazardous', defaultCategory: 'hazardous' },
  '2-propanol': {
    row: 'Isopropyl alcohol',
    category: 'recommended',
    defaultCategory: 'recommended',
  },
  'isopropyl-acetate': {
    row: 'Isopropylacetate',
    category: 'recommended',
    defaultCategory: 'recommended',
  },
  methanol: { row: 'Methanol', category: 'recommended', defaultCategory: 'problematic' },
  methylcyclohexane: {
    row: 'Methyl cyclohexane',
    category: 'problematic',
    defaultCategory: 'problematic',
  },
  '2-butanone': {
    row: 'Methyl ethyl ketone',
    category: 'recommended',
    defaultCategory: 'recommended',
  },
  mibk: { row: 'Methyl isobutyl ketone', category: 'recommended', defaultCategory: 'recommended' },
  mtbe: { row: 'Methyl tert-butyl ether', category: 'hazardous', defaultCategory: 'hazardous' },
  '2-methyltetrahydrofuran': {
    row: 'Methyl tetrahydrofuran',
    category: 'problematic',
    defaultCategory: 'problematic',
  },
  dmac: { row: 'N,N-Dimethylacetamide', category: 'hazardous', defaultCategory: 'hazardous' },
  dmf: { row: 'N,N-Dimethylformamide', category: 'hazardous', defaultCategory: 'hazardous' },
  '1-butanol': { row: 'n-Butanol', category: 'recommended', defaultCategory: 'recommended' },
  'n-butyl-acetate': {
    row: 'n-Butylacetate',
    category: 'recommended',
    defaultCategory: 'recommended',
  },
  nmp: { row: 'N-Methyl-2-pyrrolidinone', category: 'hazardous', defaultCategory: 'hazardous' },
  pyridine: { row: 'Pyridine', category: 'hazardous', defaultCategory: 'recommended' },
  'tert-butanol': { row: 't-Butanol', category: 'recommended', defaultCategory: 'recommended' },
  thf: { row: 'Tetrahydrofuran', category: 'problematic', defaultCategory: 'problematic' },
  toluene: { row: 'Toluene', category: 'problematic', defaultCategory: 'problematic' },
  water: { row: 'Water', category: 'recommended', defaultCategory: 'recommended' },
});

/**
 * Library solvents the guide's table does not list, with what the table has
 * instead. They show "not in the guide"; no category is given by analogy.
 */
export const NOT_IN_GUIDE: Readonly<Record<string, string>> = Object.freeze({
  cpme: 'no row for cyclopentyl methyl ether',
  'o-xylene': 'the table has "Xylenes" (mixed isomers, CAS 1330-20-7), not o-xylene',
  '1-propanol': 'no row for 1-propanol',
  '2-butanol': 'no row for 2-butanol',
  isobutanol: 'no row for 2-methyl-1-propanol',
  '1-octanol': 'no row for 1-octanol',
});

/**
 * The guide's category of a library solvent, or null when the guide does not list it.
 *
 * Source: SOLVENT_GUIDE (CHEM21 table, ranking after discussion; see the module comment).
 * Validity: the table's rows; no category is inferred for solvents it does not list.
 *
 * @param solventId  library solvent id, e.g. 'dme'
 * @returns the category, or null
 */
export function guideCategoryOf(solventId: string): GuideCategory | null {
  return Object.hasOwn(SOLVENT_GUIDE, solventId) ? SOLVENT_GUIDE[solventId].category : null;
}
