import { stringify } from 'csv-stringify/sync';

/**
 * A cell a spreadsheet would run as a formula (starting with =, +, -, @, or
 * a tab or carriage return before one) gets a leading apostrophe, so an
 * exported value can never execute when the file is opened.
 */
export function neutraliseFormula(value: unknown): string {
  if (value === null || value === undefined) return '';
  const text =
    typeof value === 'string'
      ? value
      : typeof value === 'object'
        ? JSON.stringify(value)
        : String(value);
  return /^[=+\-@\t\r]/.test(text) ? `'${text}` : text;
}

/** CSV text (RFC 4180 quoting, CRLF line ends) with every cell neutralised. */
export function toCsv(header: string[], rows: unknown[][]): string {
  return stringify([header, ...rows.map((row) => row.map(neutraliseFormula))], {
    record_delimiter: 'windows',
    // A bare line feed inside a cell must be quoted too, not only CRLF.
    quoted_match: /[\r\n]/,
  });
}
