import { describe, expect, it } from 'vitest';
import { csvCell, toCsv } from '@shared/csv';
import { streamsCsv } from '@/features/editor/streams-csv';

// OWASP "CSV Injection": text cells beginning with =, +, -, @, tab or carriage return
// are run as formulas by spreadsheet programs; a leading apostrophe makes them text.
// Numbers are never formulas and stay numbers.
describe('CSV cells', () => {
  it('neutralises every formula trigger in text and leaves other text alone', () => {
    for (const text of ['=1+1', '+A1', '-2+3', '@SUM(A1)', '\t=1', '\r=1'])
      expect(csvCell(text)).toBe(`'${text}`);
    for (const text of ['plain', '1.5', 'a=b', ' =x', '']) expect(csvCell(text)).toBe(text);
    expect(csvCell(null)).toBe('');
    expect(csvCell({ a: 1 })).toBe('{"a":1}');
  });

  it('keeps numbers as numbers, negative ones included', () => {
    expect(csvCell(-3)).toBe(-3);
    expect(csvCell(0.25)).toBe(0.25);
    expect(toCsv(['t_C', 'note'], [[-12.5, '-12.5 by hand']])).toBe(
      "t_C,note\r\n-12.5,'-12.5 by hand\r\n",
    );
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

describe('the stream table download', () => {
  it('writes step names as text that cannot run, and temperatures as numbers', () => {
    const text = streamsCsv(
      [
        {
          id: 'c1',
          from: '=HYPERLINK("http://x") · out',
          to: '@step · in',
          phase: 'liquid',
          T: -10,
          L: 1.23456,
          total: 2,
          kg: { water: 2 },
        },
      ],
      [{ kind: 'solvent', id: 'water', solventId: 'water' }],
    );
    const [head, row] = text.split('\r\n');
    expect(head).toBe('from,to,phase,temperature_C,volume_L,total_kg,water_kg,water_wt_pct');
    expect(row).toBe('"\'=HYPERLINK(""http://x"") · out",\'@step · in,liquid,-10,1.2346,2,2,100');
  });
});

describe('csvText (the browser exports)', () => {
  it('quotes commas, quotes and line breaks, ends lines with CRLF and guards formulas', async () => {
    const { csvText } = await import('@shared/csv');
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
