import { toCsv } from '@shared/csv';
import { keyOf, type ComponentInput } from './document';
import { significant } from '@/lib/format';

/** One row of the stream table: a connection's or a terminal's stream. */
export interface StreamRow {
  id: string;
  from: string;
  to: string;
  phase: string;
  /** Temperature, °C. */
  T: number;
  /** Volume, L. */
  L: number;
  /** Total mass, kg. */
  total: number;
  kg: Record<string, number>;
}

const round = (value: number, digits: number) => Number(value.toFixed(digits));

/**
 * The stream table as CSV: numbers written as numbers (rounded for reading),
 * text cells guarded against spreadsheet formulas (a step named "=…" stays
 * text), by the same writer as the server's exports.
 */
export function streamsCsv(rows: StreamRow[], components: ComponentInput[]): string {
  const head = [
    'from',
    'to',
    'phase',
    'temperature_C',
    'volume_L',
    'total_kg',
    ...components.flatMap((c) => [`${keyOf(c)}_kg`, `${keyOf(c)}_wt_pct`]),
  ];
  const lines = rows.map((r) => [
    r.from,
    r.to,
    r.phase,
    round(r.T, 2),
    round(r.L, 4),
    round(r.total, 6),
    ...components.flatMap((c) => {
      const kg = r.kg[keyOf(c)] ?? 0;
      return [significant(kg, 6), r.total > 0 ? round((100 * kg) / r.total, 3) : 0];
    }),
  ]);
  return toCsv(head, lines);
}
