/**
 * CSV for exports, on the server and in the browser: RFC 4180 quoting, CRLF
 * line ends, and every cell guarded against formula injection.
 */

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

/** One CSV cell: neutralised, quoted when it holds a comma, quote or line break. */
export function csvCell(value: unknown): string {
  const text = neutraliseFormula(value);
  return /[",\r\n]/.test(text) ? `"${text.replace(/"/g, '""')}"` : text;
}

/** CSV text (RFC 4180 quoting, CRLF line ends, a final CRLF) with every cell neutralised. */
export function csvText(
  header: readonly string[],
  rows: ReadonlyArray<readonly unknown[]>,
): string {
  return [header, ...rows].map((row) => row.map(csvCell).join(',') + '\r\n').join('');
}
