import { formatSignificant } from '@/lib/format';

/** Number formats of the peak table: the precision a chemist reads an IPC result to. */
export const fmt = {
  min: (v: number) => v.toFixed(3),
  pct: (v: number) => (v >= 10 ? v.toFixed(1) : v >= 0.1 ? v.toFixed(2) : v.toFixed(3)),
  sig: (v: number) =>
    Math.abs(v) >= 1000 && Math.abs(v) < 1e5 ? v.toFixed(0) : formatSignificant(v, 4),
  int: (v: number) => Math.round(v).toLocaleString('en'),
  twoDp: (v: number) => v.toFixed(2),
  bytes: (n: number) =>
    n >= 1024 * 1024
      ? `${(n / 1024 / 1024).toFixed(1)} MB`
      : n >= 1024
        ? `${(n / 1024).toFixed(0)} kB`
        : `${n} B`,
  when: (iso: string) =>
    new Date(iso).toLocaleString('en-GB', {
      day: 'numeric',
      month: 'short',
      year: 'numeric',
      hour: '2-digit',
      minute: '2-digit',
    }),
};
