/**
 * Quantities typed the way chemists write them ("250 mL", "10 vol",
 * "45 °C", "150 mbar", "1.2 equiv", "2.5 kg") converted to the units the
 * route document stores. Physical units go through mathjs; "vol" (L per kg of
 * the reference input) and "equiv" (mol per mol of it) are the document's own
 * relative units and are read here directly. Errors say what was expected.
 */
import { engineeringToE, formatEngineering, significant } from './format';
import {
  create,
  // @ts-expect-error mathjs exports the Unit class factory but its type declarations omit it
  createUnitClass,
  factory,
} from 'mathjs';

// A custom mathjs bundle: the Unit class alone, over plain numbers. Unit asks for the
// arithmetic, formatting and number types of the full library; every value here is a plain
// number, so each of those is the number operation itself and the BigNumber, Fraction and
// Complex types are empty stand-ins that are never built from what a chemist types. This keeps
// mathjs' matrices, typed functions and the decimal, fraction and complex libraries out of the
// editor's code.
const plain = <F extends (...args: never[]) => unknown>(name: string, fn: F) =>
  factory(name, [], () => fn);
class Unused {
  constructor(..._args: unknown[]) {}
}
const math = create({
  createUnitClass,
  createAddScalar: plain('addScalar', (a: number, b: number) => a + b),
  createSubtractScalar: plain('subtractScalar', (a: number, b: number) => a - b),
  createMultiplyScalar: plain('multiplyScalar', (a: number, b: number) => a * b),
  createDivideScalar: plain('divideScalar', (a: number, b: number) => a / b),
  createPow: plain('pow', (a: number, b: number) => a ** b),
  createAbs: plain('abs', (a: number) => Math.abs(a)),
  createFix: plain('fix', (a: number) => Math.trunc(a)),
  createRound: plain('round', (a: number, digits = 0) => {
    const scale = 10 ** digits;
    return Math.round(a * scale) / scale;
  }),
  createEqual: plain('equal', (a: number, b: number) => a === b),
  createIsNumeric: plain('isNumeric', (a: unknown) => typeof a === 'number'),
  createFormat: plain('format', (a: number) => String(a)),
  createNumber: plain('number', (a: unknown) => Number(a)),
  createComplexClass: factory('Complex', [], () => Unused),
  createBigNumberClass: factory('BigNumber', [], () => Unused),
  createFractionClass: factory('Fraction', [], () => Unused),
}) as unknown as { Unit: MathUnitClass };

interface MathUnit {
  equalBase(other: MathUnit): boolean;
  toNumber(unit: string): number;
}
interface MathUnitClass {
  parse(text: string): MathUnit;
}
const unit = (text: string) => math.Unit.parse(text);

export type QuantityKind =
  | 'volume'
  | 'temperature'
  | 'pressure'
  | 'equiv'
  | 'mass'
  | 'percent'
  | 'fraction'
  | 'count'
  | 'number';

export type Parsed<T> = { ok: true; value: T } | { ok: false; error: string };

const EXAMPLES: Record<QuantityKind, string> = {
  volume: '“250 mL”, “2 L” or “10 vol”',
  temperature: '“45 °C”, “318 K” or “45”',
  pressure: '“150 mbar”, “0.2 bar” or “15 kPa”',
  equiv: '“1.2 equiv”',
  mass: '“2.5 kg” or “250 g”',
  percent: '“12 %” or “12”',
  fraction: '“0.8” or “80 %”',
  count: 'a whole number such as “3”',
  number: 'a number',
};

const NUMBER_AND_REST = /^\s*([-+]?(?:\d+(?:[.,]\d*)?|[.,]\d+)(?:[eE][-+]?\d+)?)\s*(.*)$/;

type Range = { centre: number; plusMinus: number; unit: string } | { error: string };

/**
 * "10 ± 1 vol", "10 vol ± 1", "250 ± 10 mL" or "10 +/- 1 vol": the centre, the half-width and the
 * unit (written once, on either side); null when the text has no ± at all. "," is a decimal mark.
 */
function splitRange(text: string): Range | null {
  const parts = text.split(/±|\+\/-/);
  if (parts.length === 1) return null;
  const left = parts.length === 2 ? NUMBER_AND_REST.exec(parts[0]) : null;
  const right = parts.length === 2 ? NUMBER_AND_REST.exec(parts[1]) : null;
  if (!left || !right) return { error: 'Write the range as “10 ± 1 vol”.' };
  const [lu, ru] = [left[2].trim(), right[2].trim()];
  if (lu && ru && lu !== ru) return { error: 'Write the unit once, for example “10 ± 1 vol”.' };
  const num = (s: string) => Number(s.replace(',', '.'));
  return { centre: num(left[1]), plusMinus: Math.abs(num(right[1])), unit: lu || ru };
}

/**
 * A value with an optional ± range, parsed by `parse`; the half-width is converted with the
 * centre's unit ("250 ± 10 mL" → 0.25 ± 0.01 L; "318 ± 2 K" → 44.85 ± 2 °C).
 */
function withRange<T>(
  text: string,
  parse: (t: string) => Parsed<T>,
  number: (v: T) => number,
): Parsed<{ centre: T; plusMinus: number | null }> {
  const range = splitRange(text);
  if (range === null) return mapParsed(parse(text), (centre) => ({ centre, plusMinus: null }));
  if ('error' in range) return { ok: false, error: range.error };
  const centre = parse(`${range.centre} ${range.unit}`.trim());
  if (!centre.ok) return centre;
  const upper = parse(`${range.centre + range.plusMinus} ${range.unit}`.trim());
  if (!upper.ok) return upper;
  return {
    ok: true,
    value: {
      centre: centre.value,
      plusMinus: round(Math.abs(number(upper.value) - number(centre.value))),
    },
  };
}

function mapParsed<A, B>(r: Parsed<A>, f: (v: A) => B): Parsed<B> {
  return r.ok ? { ok: true, value: f(r.value) } : r;
}

function normalise(text: string): string {
  return engineeringToE(text)
    .trim()
    .replace(/(\d),(\d)/g, '$1.$2')
    .replace(/°\s*C|℃/g, ' degC')
    .replace(/°\s*F/g, ' degF')
    .replace(/\bdeg\s*C\b/gi, ' degC')
    .replace(/\bmin\b/g, ' minute')
    .replace(/\s+/g, ' ')
    .trim();
}

const plainNumber = /^[-+]?(\d+\.?\d*|\.\d+)([eE][-+]?\d+)?$/;

function toUnit(text: string, target: string, kind: QuantityKind): Parsed<number> {
  const t = normalise(text);
  if (!t) return { ok: false, error: `Enter a value, for example ${EXAMPLES[kind]}.` };
  try {
    const u = unit(t);
    if (!u.equalBase(unit(target))) {
      return {
        ok: false,
        error: `“${text.trim()}” is not a ${kind}. Write it as ${EXAMPLES[kind]}.`,
      };
    }
    const v = u.toNumber(target);
    if (!Number.isFinite(v)) return { ok: false, error: `“${text.trim()}” is not a number.` };
    return { ok: true, value: v };
  } catch {
    return {
      ok: false,
      error: `“${text.trim()}” could not be read. Write it as ${EXAMPLES[kind]}.`,
    };
  }
}

export type VolumeValue = { value: number; unit: 'L' | 'vol' };

/** "10 vol" → {10, vol}; "250 mL" → {0.25, L}; a bare number is taken as vol (the usual way to write charges). */
export function parseVolume(text: string): Parsed<VolumeValue> {
  const t = normalise(text);
  const rel = /^([-+]?(?:\d+\.?\d*|\.\d+)(?:[eE][-+]?\d+)?)\s*(vol|vols|volumes|V)$/i.exec(t);
  if (rel) return nonNegative({ value: Number(rel[1]), unit: 'vol' as const }, (v) => v.value);
  if (plainNumber.test(t))
    return nonNegative({ value: Number(t), unit: 'vol' as const }, (v) => v.value);
  const r = toUnit(text, 'L', 'volume');
  if (!r.ok) return r;
  return nonNegative({ value: round(r.value), unit: 'L' as const }, (v) => v.value);
}

function nonNegative<T>(v: T, n: (v: T) => number): Parsed<T> {
  return n(v) < 0 ? { ok: false, error: 'Enter a value of zero or more.' } : { ok: true, value: v };
}

/** °C; a bare number is °C. */
export function parseTemperatureC(text: string): Parsed<number> {
  const t = normalise(text);
  if (plainNumber.test(t)) return { ok: true, value: Number(t) };
  return mapOk(toUnit(text, 'degC', 'temperature'), round);
}

/** mbar; a bare number is mbar. */
export function parsePressureMbar(text: string): Parsed<number> {
  const t = normalise(text);
  if (plainNumber.test(t)) return { ok: true, value: Number(t) };
  return mapOk(toUnit(text, 'mbar', 'pressure'), round);
}

/** kg; a bare number is kg. */
export function parseMassKg(text: string): Parsed<number> {
  const t = normalise(text);
  if (plainNumber.test(t)) return { ok: true, value: Number(t) };
  return mapOk(toUnit(text, 'kg', 'mass'), round);
}

/** equiv (mol per mol of the reference input). */
export function parseEquiv(text: string): Parsed<number> {
  const t = normalise(text);
  const m = /^([-+]?(?:\d+\.?\d*|\.\d+)(?:[eE][-+]?\d+)?)\s*(equiv|eq|equivalents?)?$/i.exec(t);
  if (!m)
    return {
      ok: false,
      error: `“${text.trim()}” could not be read. Write it as ${EXAMPLES.equiv}.`,
    };
  return { ok: true, value: Number(m[1]) };
}

/** Percent: "12 %" or "12". */
export function parsePercent(text: string): Parsed<number> {
  const t = normalise(text).replace(/\s*(%|wt%|wt ?%)$/i, '');
  if (!plainNumber.test(t))
    return {
      ok: false,
      error: `“${text.trim()}” could not be read. Write it as ${EXAMPLES.percent}.`,
    };
  return { ok: true, value: Number(t) };
}

/** A fraction: "0.8" or "80 %". */
export function parseFraction(text: string): Parsed<number> {
  const t = normalise(text);
  const pct = /^(.*?)\s*%$/.exec(t);
  if (pct && plainNumber.test(pct[1])) return { ok: true, value: Number(pct[1]) / 100 };
  if (!plainNumber.test(t))
    return {
      ok: false,
      error: `“${text.trim()}” could not be read. Write it as ${EXAMPLES.fraction}.`,
    };
  return { ok: true, value: Number(t) };
}

export function parseCount(text: string): Parsed<number> {
  const t = normalise(text);
  if (!/^\d+$/.test(t)) return { ok: false, error: `Enter ${EXAMPLES.count}.` };
  return { ok: true, value: Number(t) };
}

export function parseNumber(text: string): Parsed<number> {
  const t = normalise(text);
  if (!plainNumber.test(t)) return { ok: false, error: `“${text.trim()}” is not a number.` };
  return { ok: true, value: Number(t) };
}

export const PARSERS = {
  temperature: parseTemperatureC,
  pressure: parsePressureMbar,
  mass: parseMassKg,
  equiv: parseEquiv,
  percent: parsePercent,
  fraction: parseFraction,
  count: parseCount,
  number: parseNumber,
} as const;

/** Parse a scalar with an optional ± range: "10 ± 2 °C" → {value:10, plusMinus:2}. */
export function parseUncertain(
  text: string,
  parse: (t: string) => Parsed<number>,
): Parsed<number | { value: number; plusMinus: number }> {
  return mapParsed(
    withRange(text, parse, (v) => v),
    ({ centre, plusMinus }) => (plusMinus === null ? centre : { value: centre, plusMinus }),
  );
}

export type UncertainVolumeValue = {
  value: number | { value: number; plusMinus: number };
  unit: 'L' | 'vol';
};

/** A volume with an optional ± range: "10 ± 1 vol" → {value: {10, ±1}, unit: vol}; "250 ± 10 mL" → {value: {0.25, ±0.01}, unit: L}. */
export function parseUncertainVolume(text: string): Parsed<UncertainVolumeValue> {
  return mapParsed(
    withRange(text, parseVolume, (v) => v.value),
    ({ centre, plusMinus }) =>
      plusMinus === null
        ? centre
        : { unit: centre.unit, value: { value: centre.value, plusMinus } },
  );
}

/** The way a stored value is shown back in its field. */
export function formatQuantity(kind: QuantityKind, value: unknown): string {
  const withRange = (v: unknown, suffix: string) => {
    if (typeof v === 'number') return `${fmt(v)}${suffix}`;
    if (v && typeof v === 'object' && 'value' in v) {
      const u = v as { value: number; plusMinus: number };
      return `${fmt(u.value)} ± ${fmt(u.plusMinus)}${suffix}`;
    }
    return '';
  };
  switch (kind) {
    case 'volume': {
      const v = value as VolumeValue | undefined;
      if (!v) return '';
      return withRange(v.value, v.unit === 'vol' ? ' vol' : ' L');
    }
    case 'temperature':
      return withRange(value, ' °C');
    case 'pressure':
      return withRange(value, ' mbar');
    case 'equiv':
      return withRange(value, ' equiv');
    case 'mass':
      return withRange(value, ' kg');
    case 'percent':
      return withRange(value, ' %');
    default:
      return withRange(value, '');
  }
}

function fmt(v: number): string {
  // Very large and very small values in engineering notation ("10 × 10⁹"), which the parser reads back.
  return formatEngineering(round(v), 4);
}
function round(v: number): number {
  return significant(v, 10);
}
function mapOk(r: Parsed<number>, f: (v: number) => number): Parsed<number> {
  return r.ok ? { ok: true, value: f(r.value) } : r;
}
