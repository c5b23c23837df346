/**
 * Collander coefficients: log K(solvent/water) = a · log P(octanol/water) + b.
 *
 * Sources:
 *  - R. Collander, Acta Chem. Scand. 1951, 5, 774–780 (the linear relation
 *    between partition coefficients in different solvent systems).
 *  - A. Leo, C. Hansch, D. Elkins, Chem. Rev. 1971, 71, 525–616, §IV "Linear
 *    free-energy relationships among systems" (regression equations of many
 *    solvent/water systems on octanol/water). doi:10.1021/cr60274a001
 *
 * Status: the table of Leo, Hansch & Elkins could not be read when this file
 * was written (only its first page was available). The a, b below are
 * recalled and marked 'unverified-memory'; verify them against the printed
 * table before relying on them. Octanol itself (a = 1, b = 0) holds by
 * definition. The scatter `sLog` is the typical standard deviation of such
 * regressions (0.2–0.4 log units) — common practice, not a printed value.
 *
 * Keys are the solvent-library ids.
 */
import type { Source } from './types';

export interface CollanderEntry {
  /** slope a [-] */
  a: number;
  /** intercept b [-] */
  b: number;
  /** typical 1σ scatter of the regression [log10 units] */
  sLog: number;
  /** which solutes the regression was fitted on, where the source splits them */
  soluteClass: 'all' | 'h-bond-donors';
  source: Source;
}

const LHE_MEMORY: Source = {
  ref: 'Leo, Hansch & Elkins, Chem. Rev. 1971, 71, 525, solvent regression equations on octanol/water',
  status: 'unverified-memory',
  note: 'recalled, table not read; verify before relying on it',
};

export const COLLANDER: Readonly<Record<string, CollanderEntry>> = {
  '1-octanol': {
    a: 1,
    b: 0,
    sLog: 0,
    soluteClass: 'all',
    source: { ref: 'identity: the reference system itself', status: 'common-practice' },
  },
  'diethyl-ether': { a: 1.13, b: -0.17, sLog: 0.2, soluteClass: 'all', source: LHE_MEMORY },
  '1-butanol': { a: 0.697, b: 0.381, sLog: 0.2, soluteClass: 'all', source: LHE_MEMORY },
  chloroform: { a: 1.126, b: -1.343, sLog: 0.3, soluteClass: 'h-bond-donors', source: LHE_MEMORY },
  benzene: { a: 1.015, b: -1.402, sLog: 0.3, soluteClass: 'h-bond-donors', source: LHE_MEMORY },
};
