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

/**
 * A ratio such as a purge factor, readable at any size: 3.2, 845, 12 400, then
 * 2.4 × 10¹² — thirteen digits tell a chemist nothing that the power does not.
 */
export function formatFactor(value: number | null | undefined): string {
  if (value === null || value === undefined || Number.isNaN(value)) return '—';
  if (!Number.isFinite(value)) return '∞';
  const abs = Math.abs(value);
  if (abs < 1) return value.toPrecision(2);
  if (abs < 100) return value.toFixed(1);
  if (abs < 1e5) return Math.round(value).toLocaleString('en-GB').replace(/,/g, '\u2009');
  const [mantissa, exponent] = value.toExponential(1).split('e');
  const power = String(Number(exponent)).replace(/./g, (c) => SUPERSCRIPT[c] ?? c);
  return `${mantissa} × 10${power}`;
}
