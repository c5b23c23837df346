import { useMemo, useState } from 'react';
import { GUIDE_CATEGORY_LABELS, type SolventSummary } from '@shared/schemas/solvents';
import {
  missing,
  SortHeader,
  useSortableTable,
  type SortColumns,
} from '@/components/sortable-table';
import { Table, Td, Th } from '@/components/table';
import { TextField } from '@/components/text-field';
import { cn } from '@/components/cn';

const GUIDE_ORDER = {
  recommended: 0,
  problematic: 1,
  hazardous: 2,
  'highly-hazardous': 3,
} as const;

/** What each column sorts by; a missing value (undefined) sorts last either way. */
export const solventColumns: SortColumns<SolventSummary> = [
  { id: 'name', accessorFn: (s) => s.name },
  { id: 'boilingPointC', accessorFn: (s) => s.boilingPointC },
  { id: 'densityGmL', accessorFn: (s) => s.densityGmL },
  { id: 'flashPointC', accessorFn: (s) => missing(s.flashPointC) },
  {
    id: 'ich',
    accessorFn: (s) =>
      s.ich.class === null ? undefined : s.ich.class * 1e7 + (s.ich.limitPpm ?? 0),
  },
  {
    id: 'guideCategory',
    accessorFn: (s) => (s.guideCategory === null ? undefined : GUIDE_ORDER[s.guideCategory]),
  },
];

export function SolventTable({
  solvents,
  onOpen,
  selectedId,
}: {
  solvents: SolventSummary[];
  onOpen: (id: string) => void;
  selectedId: string | null;
}) {
  const [query, setQuery] = useState('');
  const filtered = useMemo(() => {
    const q = query.trim().toLowerCase();
    return solvents.filter(
      (s) =>
        !q || [s.name, s.cas, s.smiles, ...s.synonyms].some((t) => t.toLowerCase().includes(q)),
    );
  }, [solvents, query]);
  const { table, rows } = useSortableTable({
    data: filtered,
    columns: solventColumns,
    initialSorting: [{ id: 'name', desc: false }],
  });

  const header = (label: string, id: string, className?: string, unit?: string) => (
    <SortHeader column={table.getColumn(id)!} label={label} unit={unit} className={className} />
  );

  return (
    <div className="space-y-3">
      <div className="flex items-end gap-3">
        <TextField
          label="Search by name, synonym, CAS RN or SMILES"
          type="search"
          value={query}
          onValueChange={setQuery}
          className="w-80"
        />
        <p className="pb-2 text-small text-ink-muted" aria-live="polite">
          {rows.length} of {solvents.length} solvents
        </p>
      </div>
      <Table caption="Solvent library">
        <thead>
          <tr>
            {header('Solvent', 'name')}
            {header('Tb', 'boilingPointC', 'text-right', '°C')}
            {header('Density', 'densityGmL', 'text-right', 'g/mL')}
            {header('Flash point', 'flashPointC', 'text-right', '°C')}
            {header('ICH Q3C', 'ich')}
            {header('Guide', 'guideCategory')}
            <Th>Flags</Th>
          </tr>
        </thead>
        <tbody>
          {rows.length === 0 ? (
            <tr>
              <Td colSpan={7} className="py-6 text-center text-ink-muted">
                No solvent matches “{query}”.
              </Td>
            </tr>
          ) : (
            rows.map((s) => (
              <tr
                key={s.id}
                className={cn('hover:bg-paper-sunken/60', s.id === selectedId && 'bg-accent-soft')}
              >
                <Td>
                  <button
                    type="button"
                    onClick={() => onOpen(s.id)}
                    className="text-left font-medium text-accent hover:underline focus-visible:outline-2 focus-visible:outline-accent"
                  >
                    {s.name}
                  </button>
                  <span className="block text-caption text-ink-muted">{s.cas}</span>
                </Td>
                <Td className="text-right tabular-nums">{s.boilingPointC.toFixed(1)}</Td>
                <Td className="text-right tabular-nums">
                  {s.densityGmL.toFixed(3)}{' '}
                  <span className="text-caption text-ink-muted">({s.densityTemperatureC} °C)</span>
                </Td>
                <Td className="text-right tabular-nums">
                  {s.flashPointC === null ? (
                    <span className="text-ink-muted">
                      {s.sources.flashPointC?.status === 'not-confirmed' ? 'not confirmed' : 'none'}
                    </span>
                  ) : (
                    s.flashPointC.toFixed(0)
                  )}
                </Td>
                <Td>
                  {s.ich.class === null ? (
                    <span className="text-ink-muted">
                      {s.sources.ich?.status === 'not-confirmed' ? 'not confirmed' : 'not listed'}
                    </span>
                  ) : (
                    `Class ${s.ich.class}${s.ich.limitPpm !== null ? ` · ${s.ich.limitPpm} ppm` : ''}`
                  )}
                </Td>
                <Td>
                  <GuideChip category={s.guideCategory} />
                </Td>
                <Td>
                  <div className="flex flex-wrap gap-1">
                    {s.peroxideFormer ? <Flag tone="hazard">Peroxide former</Flag> : null}
                    {s.lowConductivity ? <Flag tone="warning">Static</Flag> : null}
                  </div>
                </Td>
              </tr>
            ))
          )}
        </tbody>
      </Table>
    </div>
  );
}

const GUIDE_TONE = {
  recommended: 'bg-phase-aqueous-soft text-phase-aqueous-deep',
  problematic: 'bg-caution-advisory-soft text-caution-advisory-deep',
  hazardous: 'bg-caution-warning-soft text-caution-warning-deep',
  'highly-hazardous': 'bg-caution-hazard-soft text-caution-hazard-deep',
} as const;

export function GuideChip({ category }: { category: SolventSummary['guideCategory'] }) {
  if (category === null)
    return <span className="text-caption text-ink-muted">not in the guide</span>;
  return (
    <span
      className={cn(
        'inline-block rounded-control px-1.5 py-0.5 text-caption font-medium',
        GUIDE_TONE[category],
      )}
    >
      {GUIDE_CATEGORY_LABELS[category]}
    </span>
  );
}

function Flag({ tone, children }: { tone: 'hazard' | 'warning'; children: string }) {
  return (
    <span
      className={cn(
        'inline-flex items-center gap-1 rounded-control px-1.5 py-0.5 text-caption font-medium',
        tone === 'hazard'
          ? 'bg-caution-hazard-soft text-caution-hazard-deep'
          : 'bg-caution-warning-soft text-caution-warning-deep',
      )}
    >
      <span
        aria-hidden="true"
        className={cn(
          'inline-block size-1.5 rotate-45',
          tone === 'hazard' ? 'bg-caution-hazard' : 'bg-caution-warning',
        )}
      />
      {children}
    </span>
  );
}
