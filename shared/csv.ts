import { stringify } from 'csv-stringify/browser/esm/sync';
// The browser build (its own small Buffer shim) runs in Node and in the page alike;
// the Node build needs the Buffer global, which the page does not have.

/**
 * CSV written by the server (audit export) and the client (stream table), in
 * one place, on csv-stringify (RFC 4180 quoting).
 *
 * A text cell a spreadsheet would run as a formula — one that begins with =, +,
 * -, @, or a tab or carriage return — gets a leading apostrophe, so an exported
 * value can never execute when the file is opened (OWASP, "CSV Injection").
 * Numbers stay numbers: -5 is written as -5, since a number is never a formula.
 */
export function csvCell(value: unknown): string | number {
  if (value === null || value === undefined) return '';
  if (typeof value === 'number') return Number.isFinite(value) ? value : '';
  if (typeof value === 'bigint') return value.toString();
  if (typeof value === 'boolean') return value ? 'true' : 'false';
  const text =
    value instanceof Date
      ? value.toISOString()
      : typeof value === 'object'
        ? JSON.stringify(value)
        : String(value);
  return /^[=+\-@\t\r]/.test(text) ? `'${text}` : text;
}

/** A text cell guarded against formulas (csvCell's rule, always as text). */
export const neutraliseFormula = (value: unknown): string => String(csvCell(value));

/** CSV text (CRLF line ends) with a header row and every cell passed through csvCell. */
export function toCsv(header: readonly string[], rows: ReadonlyArray<readonly unknown[]>): string {
  return stringify([header.map(csvCell), ...rows.map((row) => row.map(csvCell))], {
    record_delimiter: 'windows',
    // A bare line feed inside a cell must be quoted too, not only CRLF.
    quoted_match: /[\r\n]/,
  });
}

/** The same CSV text, under the name the browser's exports use. */
export const csvText = toCsv;
