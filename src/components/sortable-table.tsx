/**
 * Sortable tables, on TanStack Table: every table sorts the same way, and a
 * missing value (an accessor that returns undefined) sorts last whichever way
 * the column is sorted. Columns declare accessors only; each table renders
 * its rows from `row.original` and its headers with `SortHeader`.
 */
import {
  createTable,
  getCoreRowModel,
  getFilteredRowModel,
  getSortedRowModel,
  useReactTable,
  type Column,
  type ColumnDef,
  type FilterFn,
  type Row,
  type SortingState,
  type TableOptions,
} from '@tanstack/react-table';
import { useState } from 'react';
import { Th } from './table';

// eslint-disable-next-line @typescript-eslint/no-explicit-any -- accessors return different types per column
export type SortColumns<T> = ColumnDef<T, any>[];

/** The missing value of a sortable column: `missing(x)` is undefined for null, so it sorts last. */
export const missing = <V,>(value: V | null | undefined): V | undefined => value ?? undefined;

/**
 * How two present values compare in every table: numbers by value, text in the
 * reader's collation without regard to case, with numbers inside text in
 * numeric order ("Impurity 9" before "Impurity 10").
 */
export function compareCells<T>(a: Row<T>, b: Row<T>, columnId: string): number {
  const x = a.getValue<unknown>(columnId);
  const y = b.getValue<unknown>(columnId);
  if (typeof x === 'number' && typeof y === 'number') return x - y;
  return String(x).localeCompare(String(y), undefined, { sensitivity: 'base', numeric: true });
}

export interface SortOptions<T> {
  data: T[];
  columns: SortColumns<T>;
  sorting: SortingState;
  globalFilter?: string;
  globalFilterFn?: FilterFn<T>;
}

/**
 * The options every sortable table shares: missing values last, the first
 * click sorts ascending, a second descending (never back to unsorted), one
 * column at a time.
 */
export function sortableTableOptions<T>(
  o: Pick<SortOptions<T>, 'data' | 'columns' | 'globalFilterFn'>,
): Omit<TableOptions<T>, 'state' | 'onStateChange'> {
  return {
    data: o.data,
    columns: o.columns,
    defaultColumn: { sortUndefined: 'last', sortDescFirst: false, sortingFn: compareCells },
    enableSortingRemoval: false,
    enableMultiSort: false,
    ...(o.globalFilterFn ? { globalFilterFn: o.globalFilterFn } : {}),
    getCoreRowModel: getCoreRowModel(),
    getSortedRowModel: getSortedRowModel(),
    getFilteredRowModel: getFilteredRowModel(),
    renderFallbackValue: null,
  };
}

/** The rows as a table shows them (filtered, then sorted): the same pipeline the hook runs. */
export function sortRows<T>(o: SortOptions<T>): T[] {
  const table = createTable<T>({
    ...sortableTableOptions(o),
    state: {},
    onStateChange: () => undefined,
    renderFallbackValue: null,
  });
  table.setOptions((prev) => ({
    ...prev,
    state: { ...table.initialState, sorting: o.sorting, globalFilter: o.globalFilter ?? '' },
  }));
  return table.getRowModel().rows.map((r) => r.original);
}

/** A sortable table's state and rows. */
export function useSortableTable<T>(
  o: Omit<SortOptions<T>, 'sorting'> & { initialSorting: SortingState },
) {
  const [sorting, setSorting] = useState<SortingState>(o.initialSorting);
  const table = useReactTable<T>({
    ...sortableTableOptions(o),
    state: { sorting, globalFilter: o.globalFilter ?? '' },
    onSortingChange: setSorting,
  });
  return { table, rows: table.getRowModel().rows.map((r) => r.original) };
}

/** A column header that sorts its table; says its state to assistive technology. */
export function SortHeader<T>({
  column,
  label,
  unit,
  className,
}: {
  column: Column<T, unknown>;
  label: string;
  /** Shown as written (units are case-sensitive). */
  unit?: string;
  className?: string;
}) {
  const sorted = column.getIsSorted();
  return (
    <Th
      aria-sort={sorted ? (sorted === 'asc' ? 'ascending' : 'descending') : 'none'}
      className={className}
    >
      <button
        type="button"
        className="inline-flex items-center gap-1 uppercase tracking-wide hover:text-ink focus-visible:outline-2 focus-visible:outline-accent"
        onClick={column.getToggleSortingHandler()}
      >
        {label}
        {unit ? <span className="normal-case">({unit})</span> : null}
        <span aria-hidden="true" className={sorted ? 'text-accent' : 'text-ink-faint'}>
          {sorted === 'asc' ? '▲' : sorted === 'desc' ? '▼' : '↕'}
        </span>
      </button>
    </Th>
  );
}
