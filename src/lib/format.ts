const dateTime = new Intl.DateTimeFormat('en-GB', { dateStyle: 'medium', timeStyle: 'short' });
const date = new Intl.DateTimeFormat('en-GB', { dateStyle: 'medium' });

export function formatDateTime(iso: string | null | undefined): string {
  if (!iso) return '—';
  const d = new Date(iso);
  return Number.isNaN(d.getTime()) ? iso : dateTime.format(d);
}

export function formatDate(iso: string | null | undefined): string {
  if (!iso) return '—';
  const d = new Date(iso);
  return Number.isNaN(d.getTime()) ? iso : date.format(d);
}

const SUPERSCRIPT: Record<string, string> = {
  '-': '⁻',
  '0': '⁰',
  '1': '¹',
  '2': '²',
  '3': '³',
  '4': '⁴',
  '5': '⁵',
  '6': '⁶',
  '7': '⁷',
  '8': '⁸',
  '9': '⁹',
};

const FROM_SUPERSCRIPT: Record<string, string> = Object.fromEntries(
  Object.entries(SUPERSCRIPT).map(([plain, sup]) => [sup, plain]),
);

/**
 * A number in engineering notation when it is very large or very small: 1.0 × 10¹⁰ is written
 * "10 × 10⁹", 2.5e-5 "25 × 10⁻⁶" (the power a multiple of three, as units step); between 0.001
 * and 100 000 it is written plainly. `digits` significant figures. Used by every field and table
 * that shows such numbers, and read back by the unit parser (src/lib/units.ts).
 */
export function formatEngineering(value: number, digits = 3): string {
  if (!Number.isFinite(value)) return Number.isNaN(value) ? '—' : value > 0 ? '∞' : '−∞';
  const abs = Math.abs(value);
  if (abs === 0 || (abs >= 1e-3 && abs < 1e5)) return String(Number(value.toPrecision(10)));
  let exponent = Math.floor(Math.log10(abs) / 3) * 3;
  let mantissa = Number((value / 10 ** exponent).toPrecision(digits));
  if (Math.abs(mantissa) >= 1000) {
    exponent += 3;
    mantissa = Number((mantissa / 1000).toPrecision(digits));
  }
  const power = String(exponent).replace(/./g, (c) => SUPERSCRIPT[c] ?? c);
  return `${mantissa} × 10${power}`;
}

/**
 * A number shown to `digits` significant figures: plainly between 0.001 and 100 000
 * ("0.0125", "1230"), in engineering notation outside it ("25 × 10⁻⁶"). The display form of
 * every computed number (cards, stream table, plots, step list, chromatograms); fields that must
 * read back exactly use formatEngineering.
 */
export function formatSignificant(value: number, digits = 3): string {
  if (!Number.isFinite(value)) return formatEngineering(value, digits);
  const abs = Math.abs(value);
  if (abs === 0) return '0';
  if (abs >= 1e-3 && abs < 1e5) return String(significant(value, digits));
  return formatEngineering(value, digits);
}

/**
 * `value` rounded to `digits` significant figures, as a number (for files written for other
 * programs, such as the CSV exports, and for values stored back). Not for display: a number
 * shown to a chemist goes through formatSignificant or formatEngineering.
 */
export function significant(value: number, digits: number): number {
  return Number.isFinite(value) ? Number(value.toPrecision(digits)) : value;
}

/**
 * "10 × 10⁹" or "10 x 10^9" as the computer writes it ("10e9"); other text unchanged. The power
 * must be superscript or follow "^", so "2 × 100 mL" (two washes of 100 mL) is left alone.
 */
export function engineeringToE(text: string): string {
  return text.replace(
    /(\d)\s*[×x*]\s*10\s*(?:\^\s*([-+]?\d+)|([⁻]?[⁰¹²³⁴⁵⁶⁷⁸⁹]+))/g,
    (_m, digit: string, caret: string | undefined, sup: string | undefined) =>
      `${digit}e${caret ?? (sup ?? '').replace(/./g, (c) => FROM_SUPERSCRIPT[c] ?? c)}`,
  );
}

/**
 * A ratio such as a purge factor, readable at any size: 3.2, 845, 12 400, then
 * 2.4 × 10¹² — thirteen digits tell a chemist nothing that the power does not.
 */
export function formatFactor(value: number | null | undefined): string {
  if (value === null || value === undefined || Number.isNaN(value)) return '—';
  if (!Number.isFinite(value)) return '∞';
  const abs = Math.abs(value);
  if (abs < 1) return formatSignificant(value, 2);
  if (abs < 100) return value.toFixed(1);
  if (abs < 1e5) return Math.round(value).toLocaleString('en-GB').replace(/,/g, '\u2009');
  return formatEngineering(value, 2);
}
