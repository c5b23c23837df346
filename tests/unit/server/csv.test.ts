import { describe, expect, it } from 'vitest';
import { neutraliseFormula, toCsv } from '../../../server/services/csv';

// OWASP "CSV Injection": cells beginning with =, +, -, @, tab or carriage return are run
// as formulas by spreadsheet programs; a leading apostrophe makes them text.
describe('CSV export cells', () => {
  it('neutralises every formula trigger and leaves other text alone', () => {
    for (const text of ['=1+1', '+A1', '-2+3', '@SUM(A1)', '\t=1', '\r=1'])
      expect(neutraliseFormula(text)).toBe(`'${text}`);
    for (const text of ['plain', '1.5', 'a=b', ' =x', ''])
      expect(neutraliseFormula(text)).toBe(text);
    expect(neutraliseFormula(null)).toBe('');
    expect(neutraliseFormula({ a: 1 })).toBe('{"a":1}');
    expect(neutraliseFormula(-3)).toBe("'-3");
  });

  it('quotes by RFC 4180 with CRLF line ends', () => {
    expect(
      toCsv(
        ['a', 'b'],
        [
          ['x,y', 'say "hi"'],
          ['=cmd', 'line\nbreak'],
        ],
      ),
    ).toBe('a,b\r\n"x,y","say ""hi"""\r\n\'=cmd,"line\nbreak"\r\n');
  });
});

describe('csvText (the browser exports)', () => {
  it('quotes commas, quotes and line breaks, ends lines with CRLF and guards formulas', async () => {
    const { csvText } = await import('../../../shared/csv');
    expect(
      csvText(
        ['a', 'b'],
        [
          ['x,y', 'say "hi"'],
          ['=SUM(A1)', 'line\nbreak'],
        ],
      ),
    ).toBe('a,b\r\n"x,y","say ""hi"""\r\n\'=SUM(A1),"line\nbreak"\r\n');
  });
});
