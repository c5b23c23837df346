import { describe, expect, it } from 'vitest';
import { parseDelimitedText, processTrace, TraceError } from '@shared/chromatography';

const rows = (n: number, f: (i: number) => string) => Array.from({ length: n }, (_, i) => f(i));

describe('delimited-text chromatograms', () => {
  it('reads a CSV with a header and two signals, the first by default, another by name', () => {
    const text = [
      'Time (min),Signal A (mAU),"Signal B, 254 nm (mAU)"',
      ...rows(20, (i) => `${(i * 0.1).toFixed(2)},${i},${2 * i}`),
    ].join('\n');
    const first = parseDelimitedText(text);
    expect(first.delimiter).toBe('comma');
    expect(first.signals).toEqual(['Signal A (mAU)', 'Signal B, 254 nm (mAU)']);
    expect(first.signalName).toBe('Signal A (mAU)');
    expect(first.signal[3]).toBe(3);
    expect(first.timeUnit).toBe('min');
    const second = parseDelimitedText(text, '  signal b, 254 NM (mau) ');
    expect(second.signal[3]).toBe(6);
    expect(second.timeMin[10]).toBeCloseTo(1, 12);
  });

  it('reads semicolons with a decimal comma, passing over notes above the header', () => {
    const text = [
      'Sample;IPC after base wash (invented)',
      'Injection;1',
      '',
      'Zeit [min];UV 220 nm',
      ...rows(
        15,
        (i) =>
          `${(i * 0.05).toFixed(2).replace('.', ',')};${(i * 1.5).toFixed(1).replace('.', ',')}`,
      ),
    ].join('\r\n');
    const r = parseDelimitedText(text);
    expect(r.delimiter).toBe('semicolon');
    expect(r.decimalComma).toBe(true);
    expect(r.timeMin[2]).toBeCloseTo(0.1, 12);
    expect(r.signal[3]).toBeCloseTo(4.5, 12);
    expect(r.signalName).toBe('UV 220 nm');
    expect(r.warnings.join(' ')).toMatch(/2 lines of notes/);
  });

  it('reads a TSV in seconds and converts to minutes', () => {
    const text = ['Time (s)\tDetector', ...rows(12, (i) => `${i * 30}\t${i}`)].join('\n');
    const r = parseDelimitedText(text);
    expect(r.delimiter).toBe('tab');
    expect(r.timeUnit).toBe('s');
    expect(r.timeMin[2]).toBeCloseTo(1, 12);
  });

  it('reads space-separated numbers without a header, saying it assumed minutes', () => {
    const text = rows(12, (i) => `  ${i * 0.5}   ${i % 3}`).join('\n');
    const r = parseDelimitedText(text);
    expect(r.delimiter).toBe('space');
    expect(r.signals).toEqual(['Signal 1']);
    expect(r.warnings.join(' ')).toMatch(/No header line/);
  });

  it('names the signal columns when the asked one is missing', () => {
    const text = ['t (min),A,B', ...rows(12, (i) => `${i},1,2`)].join('\n');
    expect(() => parseDelimitedText(text, 'C')).toThrow(/no signal column named “C”.*“A”, “B”/);
  });

  it('a header without rows is refused: no data rows', () => {
    expect(() => parseDelimitedText('Time (min),Signal\n')).toThrow(/No data rows/);
    expect(() => parseDelimitedText('')).toThrow(/empty/);
    expect(() => parseDelimitedText('just words\nand more words\n')).toThrow(/No data rows/);
  });

  it('a huge header line is refused quickly with a plain reason', () => {
    const text = 'x'.repeat(2_000_000) + '\n' + rows(12, (i) => `${i},${i}`).join('\n');
    expect(() => parseDelimitedText(text)).toThrow(/Line 1 is 2,000,000 characters long/);
  });

  it('a file cut short loses only its incomplete last line, with a note', () => {
    const text = ['Time (min),Signal', ...rows(12, (i) => `${i},${i}`), '12,'].join('\n');
    const r = parseDelimitedText(text);
    expect(r.signal).toHaveLength(12);
    expect(r.warnings.join(' ')).toMatch(/incomplete/);
  });

  it('footer lines after the data are left out with a note', () => {
    const text = [
      'Time (min),Signal',
      ...rows(12, (i) => `${i},${i}`),
      'End of report',
      'Operator: invented',
    ].join('\n');
    const r = parseDelimitedText(text);
    expect(r.signal).toHaveLength(12);
    expect(r.warnings.join(' ')).toMatch(/2 lines after the data/);
  });

  it('times that go backwards are refused when processed, naming the data point', () => {
    const text = ['Time (min),Signal', ...rows(12, (i) => `${i === 5 ? 3 : i},${i}`)].join('\n');
    const r = parseDelimitedText(text);
    expect(() => processTrace(r)).toThrow(TraceError);
    expect(() => processTrace(r)).toThrow(/data point 6/);
  });
});
