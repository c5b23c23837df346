import { Th } from '@/components/table';

export type SortState<K extends string> = { key: K; dir: 'asc' | 'desc' };

/** A column header that sorts the table; says its state to assistive technology. */
export function SortableTh<K extends string>({
  label,
  unit,
  column,
  sort,
  onSort,
  className,
}: {
  label: string;
  /** Shown as written (units are case-sensitive). */
  unit?: string;
  column: K;
  sort: SortState<K>;
  onSort: (next: SortState<K>) => void;
  className?: string;
}) {
  const active = sort.key === column;
  return (
    <Th
      aria-sort={active ? (sort.dir === 'asc' ? 'ascending' : 'descending') : 'none'}
      className={className}
    >
      <button
        type="button"
        className="inline-flex items-center gap-1 uppercase tracking-wide hover:text-ink focus-visible:outline-2 focus-visible:outline-accent"
        onClick={() => onSort({ key: column, dir: active && sort.dir === 'asc' ? 'desc' : 'asc' })}
      >
        {label}
        {unit ? <span className="normal-case">({unit})</span> : null}
        <span aria-hidden="true" className={active ? 'text-accent' : 'text-ink-faint'}>
          {active ? (sort.dir === 'asc' ? '▲' : '▼') : '↕'}
        </span>
      </button>
    </Th>
  );
}

export function compareValues(a: string | number | null, b: string | number | null): number {
  if (a === null && b === null) return 0;
  if (a === null) return 1;
  if (b === null) return -1;
  if (typeof a === 'number' && typeof b === 'number') return a - b;
  return String(a).localeCompare(String(b), undefined, { sensitivity: 'base', numeric: true });
}
