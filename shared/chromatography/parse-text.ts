/**
 * Delimited-text chromatogram exports (CSV, TSV, semicolon or space
 * separated): finds the header and the block of numbers, reads a decimal
 * comma, picks the time column and one of several signal columns, and
 * converts times to minutes. Pure: text in, arrays out.
 *
 * What instruments write varies; the rules below are common practice, with
 * no single published source:
 * - the delimiter is the one of tab, semicolon, comma or spaces that gives the
 *   most rows of at least two numbers with the same column count;
 * - a decimal comma is read when the delimiter is not a comma and the numbers
 *   use commas and never points;
 * - the data block is the first run of all-numeric rows (metadata lines above
 *   it and footer lines below it are passed over, with a note);
 * - the header is the last line above the data with the same column count;
 * - the time column is the one whose name says time (else the first); its
 *   unit is read from the name (s, ms, min; minutes when it says nothing).
 */
import { TraceError } from './processing';

export interface ParsedTextTrace {
  timeMin: Float64Array;
  signal: Float64Array;
  /** Name of the signal column read. */
  signalName: string;
  /** Names of every signal column in the file. */
  signals: string[];
  delimiter: 'tab' | 'semicolon' | 'comma' | 'space';
  decimalComma: boolean;
  timeUnit: 'min' | 's' | 'ms';
  warnings: string[];
}

/** A line longer than this above the data is not a chromatogram header. */
export const MAX_HEADER_LINE_CHARS = 10_000;
/** Lines looked at to find the delimiter and the start of the data. */
const SNIFF_LINES = 400;

type Delimiter = ParsedTextTrace['delimiter'];
const DELIMITERS: Array<[Delimiter, string | RegExp]> = [
  ['tab', '\t'],
  ['semicolon', ';'],
  ['comma', ','],
  ['space', /[ \t]+/],
];

/**
 * Reads a delimited-text chromatogram.
 * @param text the file's text (any line ending; a byte-order mark is ignored)
 * @param wantedSignal name of the signal column to read (case and spaces ignored); default the first
 * @throws TraceError with a plain message when no trace can be read
 */
export function parseDelimitedText(text: string, wantedSignal?: string): ParsedTextTrace {
  const lines = text.replace(/^\uFEFF/, '').split(/\r\n|\n|\r/);
  const warnings: string[] = [];
  if (!lines.some((l) => l.trim())) throw new TraceError('The file is empty.');

  const sniff = lines.slice(0, SNIFF_LINES);
  sniff.forEach((line, i) => {
    if (line.length > MAX_HEADER_LINE_CHARS)
      throw new TraceError(
        `Line ${i + 1} is ${line.length.toLocaleString('en')} characters long; a chromatogram export has short lines of time and signal values.`,
      );
  });

  let best: { delimiter: Delimiter; split: string | RegExp; comma: boolean; score: number } | null =
    null;
  for (const [delimiter, split] of DELIMITERS) {
    for (const comma of delimiter === 'comma' ? [false] : [false, true]) {
      const score = numericRowScore(sniff, split, comma);
      if (score > (best?.score ?? 0)) best = { delimiter, split, comma, score };
    }
  }
  if (!best)
    throw new TraceError(
      'No data rows were found: the file needs at least two columns of numbers (time and signal).',
    );
  const { delimiter, split, comma } = best;

  // The data block starts at the first numeric row followed by numeric rows of the same width.
  let start = -1;
  let width = 0;
  for (let i = 0; i < lines.length && start < 0; i++) {
    const row = numericRow(lines[i], split, comma);
    if (!row || row.length < 2) continue;
    let following = 0;
    for (let j = i + 1; j < lines.length && following < 2; j++) {
      if (!lines[j].trim()) continue;
      const next = numericRow(lines[j], split, comma);
      if (!next || next.length !== row.length) break;
      following++;
    }
    if (following >= 2 || following >= lines.slice(i + 1).filter((l) => l.trim()).length) {
      start = i;
      width = row.length;
    }
  }
  if (start < 0)
    throw new TraceError(
      'No data rows were found: the file needs at least two columns of numbers (time and signal).',
    );

  let names: string[] | null = null;
  let headerLine = start;
  for (let i = start - 1; i >= 0; i--) {
    if (!lines[i].trim()) continue;
    const cells = cellsOf(lines[i], split);
    if (cells.length === width && cells.some((cell) => parseNumber(cell, comma) === null)) {
      names = cells.map((cell, k) => cell || `Column ${k + 1}`);
      headerLine = i;
    }
    break;
  }
  if (!names) {
    names = ['Time', ...Array.from({ length: width - 1 }, (_, k) => `Signal ${k + 1}`)];
    warnings.push('No header line was found: the first column is read as time in minutes.');
  }

  const timeIndex = Math.max(
    0,
    names.findIndex((name) => /time|min\b|^rt$|retention|zeit|temps|tiempo/i.test(name)),
  );
  const signalIndexes = names.map((_, k) => k).filter((k) => k !== timeIndex);
  const signals = signalIndexes.map((k) => names![k]);
  let signalIndex = signalIndexes[0];
  if (wantedSignal !== undefined && wantedSignal.trim() !== '') {
    const key = normalise(wantedSignal);
    const found = signalIndexes.find((k) => normalise(names![k]) === key);
    if (found === undefined)
      throw new TraceError(
        `The file has no signal column named “${wantedSignal}”. Its signal columns: ${signals.map((s) => `“${s}”`).join(', ')}.`,
      );
    signalIndex = found;
  }

  const timeUnit = unitOf(names[timeIndex]);
  if (timeUnit === null && names[timeIndex] !== 'Time')
    warnings.push(`The time column “${names[timeIndex]}” names no unit: read as minutes.`);
  const scale = timeUnit === 's' ? 1 / 60 : timeUnit === 'ms' ? 1 / 60_000 : 1;

  const times: number[] = [];
  const values: number[] = [];
  let end = lines.length;
  for (let i = start; i < lines.length; i++) {
    if (!lines[i].trim()) continue;
    const row = numericRow(lines[i], split, comma);
    if (!row || row.length !== width) {
      end = i;
      break;
    }
    times.push(row[timeIndex] * scale);
    values.push(row[signalIndex]);
  }
  const after = lines.slice(end).filter((l) => l.trim()).length;
  if (after === 1 && end === lastNonEmpty(lines))
    warnings.push(
      `The last line (${end + 1}) is incomplete and was left out; was the file cut short?`,
    );
  else if (after > 0)
    warnings.push(
      `${after} line${after === 1 ? '' : 's'} after the data (from line ${end + 1}) ${after === 1 ? 'was' : 'were'} left out.`,
    );
  const above = lines.slice(0, headerLine).filter((l) => l.trim()).length;
  if (above > 0)
    warnings.push(
      `${above} line${above === 1 ? '' : 's'} of notes above the ${headerLine === start ? 'data' : 'header'} ${above === 1 ? 'was' : 'were'} passed over.`,
    );

  return {
    timeMin: Float64Array.from(times),
    signal: Float64Array.from(values),
    signalName: names[signalIndex],
    signals,
    delimiter,
    decimalComma: comma,
    timeUnit: timeUnit ?? 'min',
    warnings,
  };
}

function normalise(name: string) {
  return name.trim().replace(/\s+/g, ' ').toLowerCase();
}

function unitOf(name: string): 'min' | 's' | 'ms' | null {
  const n = name.toLowerCase();
  if (/\bms\b|millisec/.test(n)) return 'ms';
  if (/\bmin|minute/.test(n)) return 'min';
  if (/\(s\)|\[s\]|\bsec|\bs\b|second/.test(n)) return 's';
  return null;
}

function lastNonEmpty(lines: string[]) {
  for (let i = lines.length - 1; i >= 0; i--) if (lines[i].trim()) return i;
  return -1;
}

/** Cells of a line: split on the delimiter outside double quotes, quotes removed, trimmed. */
function cellsOf(line: string, split: string | RegExp): string[] {
  let cells: string[];
  if (typeof split !== 'string' || !line.includes('"')) {
    cells = line.trim().split(split);
  } else {
    cells = [];
    let cell = '';
    let quoted = false;
    for (let i = 0; i < line.length; i++) {
      const ch = line[i];
      if (ch === '"') {
        if (quoted && line[i + 1] === '"') {
          cell += '"';
          i++;
        } else quoted = !quoted;
      } else if (ch === split && !quoted) {
        cells.push(cell);
        cell = '';
      } else cell += ch;
    }
    cells.push(cell);
  }
  cells = cells.map((c) => c.trim().replace(/^"(.*)"$/, '$1'));
  while (cells.length > 1 && cells[cells.length - 1] === '') cells.pop();
  return cells;
}

const POINT_NUMBER = /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/;
const COMMA_NUMBER = /^[+-]?(\d+,?\d*|,\d+)([eE][+-]?\d+)?$/;

/** A cell as a number, or null. With a decimal comma, "1,25" is 1.25 and "1.25" is not read. */
export function parseNumber(cell: string, decimalComma: boolean): number | null {
  if (decimalComma) {
    if (!COMMA_NUMBER.test(cell)) return null;
    return Number(cell.replace(',', '.'));
  }
  if (!POINT_NUMBER.test(cell)) return null;
  return Number(cell);
}

function numericRow(line: string, split: string | RegExp, comma: boolean): number[] | null {
  if (!line.trim()) return null;
  const cells = cellsOf(line, split);
  const out: number[] = [];
  for (const cell of cells) {
    const v = parseNumber(cell, comma);
    if (v === null || !Number.isFinite(v)) return null;
    out.push(v);
  }
  return out;
}

/** How many sniffed lines read as rows of ≥ 2 numbers with the most common width. */
function numericRowScore(lines: string[], split: string | RegExp, comma: boolean): number {
  const widths = new Map<number, number>();
  for (const line of lines) {
    const row = numericRow(line, split, comma);
    if (row && row.length >= 2) widths.set(row.length, (widths.get(row.length) ?? 0) + 1);
  }
  let top = 0;
  for (const count of widths.values()) top = Math.max(top, count);
  return top;
}
