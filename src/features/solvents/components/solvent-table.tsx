import { useMemo, useState } from 'react';
import { GUIDE_CATEGORY_LABELS, type SolventSummary } from '@shared/schemas/solvents';
import { Table, Td, Th } from '@/components/table';
import { TextField } from '@/components/text-field';
import { cn } from '@/components/cn';

type Column = 'name' | 'boilingPointC' | 'densityGmL' | 'flashPointC' | 'ich' | 'guideCategory';
type Sort = { key: Column; dir: 'asc' | 'desc' };

const GUIDE_ORDER = {
  recommended: 0,
  problematic: 1,
  hazardous: 2,
  'highly-hazardous': 3,
} as const;

function sortValue(s: SolventSummary, key: Column): string | number | null {
  switch (key) {
    case 'name':
      return s.name;
    case 'ich':
      return s.ich.class === null ? null : s.ich.class * 1e7 + (s.ich.limitPpm ?? 0);
    case 'guideCategory':
      return GUIDE_ORDER[s.guideCategory];
    default:
      return s[key];
  }
}

function compare(a: string | number | null, b: string | number | null): number {
  if (a === null) return b === null ? 0 : 1;
  if (b === null) return -1;
  return typeof a === 'number' && typeof b === 'number'
    ? a - b
    : String(a).localeCompare(String(b));
}

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
  const [sort, setSort] = useState<Sort>({ key: 'name', dir: 'asc' });
  const rows = useMemo(() => {
    const q = query.trim().toLowerCase();
    const filtered = solvents.filter(
      (s) =>
        !q || [s.name, s.cas, s.smiles, ...s.synonyms].some((t) => t.toLowerCase().includes(q)),
    );
    const sign = sort.dir === 'asc' ? 1 : -1;
    return filtered.sort((a, b) => {
      const va = sortValue(a, sort.key);
      const vb = sortValue(b, sort.key);
      // Missing values stay at the bottom whichever way the column sorts.
      if (va === null || vb === null) return compare(va, vb);
      return sign * compare(va, vb);
    });
  }, [solvents, query, sort]);

  const header = (label: string, key: Column, className?: string, unit?: string) => {
    const active = sort.key === key;
    return (
      <Th
        aria-sort={active ? (sort.dir === 'asc' ? 'ascending' : 'descending') : 'none'}
        className={className}
      >
        <button
          type="button"
          className="inline-flex items-center gap-1 uppercase tracking-wide hover:text-ink focus-visible:outline-2 focus-visible:outline-accent"
          onClick={() => setSort({ key, dir: active && sort.dir === 'asc' ? 'desc' : 'asc' })}
        >
          {label}
          {unit ? <span className="normal-case">({unit})</span> : null}
          <span aria-hidden="true" className={active ? 'text-accent' : 'text-ink-faint'}>
            {active ? (sort.dir === 'asc' ? '▲' : '▼') : '↕'}
          </span>
        </button>
      </Th>
    );
  };

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
