/**
 * Solvent-selection guide categories, read row by row from the table of the
 * CHEM21 guide (Prat et al., Green Chem. 2016, 18, 288–296: the classical
 * solvents' table, column "ranking after discussion"), through an open data
 * file that reproduces that table (source id 'chem21-guide-2016-table'; the
 * file's columns "Ranking Default" and "Ranking Discussion" are the guide's
 * two ranking columns).
 *
 * Only rows actually read are listed. A library solvent without a row here
 * has no category in the advisor (guideCategory null, "not in the guide's
 * table as read"); the recalled categories in the solvent records are not used.
 * docs/data-sources.md lists the rows read.
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

/** Keyed by library solvent id. */
export const SOLVENT_GUIDE: Readonly<Record<string, GuideRow>> = Object.freeze({
  dme: { row: '1,2-Dimethoxyethane', category: 'hazardous', defaultCategory: 'hazardous' },
  'acetic-acid': { row: 'Acetic acid', category: 'problematic', defaultCategory: 'problematic' },
  acetone: { row: 'Acetone', category: 'recommended', defaultCategory: 'problematic' },
  acetonitrile: { row: 'Acetonitrile', category: 'problematic', defaultCategory: 'recommended' },
  anisole: { row: 'Anisole', category: 'recommended', defaultCategory: 'problematic' },
});

/**
 * The guide's category of a library solvent, or null when its row was not read.
 *
 * Source: SOLVENT_GUIDE (CHEM21 table, ranking after discussion; see the module comment).
 * Validity: the rows read; no category is inferred for other solvents.
 *
 * @param solventId  library solvent id, e.g. 'dme'
 * @returns the category, or null
 */
export function guideCategoryOf(solventId: string): GuideCategory | null {
  return Object.hasOwn(SOLVENT_GUIDE, solventId) ? SOLVENT_GUIDE[solventId].category : null;
}
