import { stringify } from 'csv-stringify/sync';
import { neutraliseFormula } from '@shared/csv';

// The guard against formula injection is shared with the exports the browser makes.
export { neutraliseFormula };

/** CSV text (RFC 4180 quoting, CRLF line ends) with every cell neutralised. */
export function toCsv(header: string[], rows: unknown[][]): string {
  return stringify([header, ...rows.map((row) => row.map(neutraliseFormula))], {
    record_delimiter: 'windows',
    // A bare line feed inside a cell must be quoted too, not only CRLF.
    quoted_match: /[\r\n]/,
  });
}
