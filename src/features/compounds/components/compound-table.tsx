import { useMemo, useState } from 'react';
import {
  COMPOUND_ROLE_LABELS,
  COMPOUND_ROLES,
  type Compound,
  type CompoundRole,
} from '@shared/schemas/compounds';
import { Button } from '@/components/button';
import { Select } from '@/components/select';
import { Table, Td } from '@/components/table';
import {
  missing,
  SortHeader,
  useSortableTable,
  type SortColumns,
} from '@/components/sortable-table';
import { StructureImage } from './structure-image';

/** What each column sorts by; a missing value (undefined) sorts last either way. */
export const compoundColumns: SortColumns<Compound> = [
  { id: 'name', accessorFn: (c) => c.name },
  { id: 'role', accessorFn: (c) => COMPOUND_ROLE_LABELS[c.role] },
  { id: 'formula', accessorFn: (c) => c.formula },
  { id: 'molarMassGmol', accessorFn: (c) => c.molarMassGmol },
  { id: 'logP', accessorFn: (c) => missing(c.logP?.value) },
];

export function CompoundTable({
  compounds,
  onOpen,
  canWrite,
  selectedId,
}: {
  compounds: Compound[];
  onOpen: (compound: Compound) => void;
  canWrite: boolean;
  selectedId?: string | null;
}) {
  // Search by name or formula is the page's server search; the role only narrows the rows shown.
  const [role, setRole] = useState<CompoundRole | 'all'>('all');
  const filtered = useMemo(
    () => compounds.filter((c) => role === 'all' || c.role === role),
    [compounds, role],
  );
  const { table, rows } = useSortableTable({
    data: filtered,
    columns: compoundColumns,
    initialSorting: [{ id: 'name', desc: false }],
  });
  const column = (id: string) => table.getColumn(id)!;

  return (
    <div className="space-y-3">
      <div className="flex flex-wrap items-end gap-3">
        <Select
          label="Role"
          value={role}
          onValueChange={(v) => setRole(v as CompoundRole | 'all')}
          options={[
            { value: 'all', label: 'All roles' },
            ...COMPOUND_ROLES.map((r) => ({ value: r, label: COMPOUND_ROLE_LABELS[r] })),
          ]}
          className="w-44"
        />
        <p className="pb-2 text-small text-ink-muted" aria-live="polite">
          {rows.length} of {compounds.length} compound{compounds.length === 1 ? '' : 's'} shown
        </p>
      </div>
      <Table caption="Compounds of this workspace">
        <thead>
          <tr>
            <th
              scope="col"
              className="w-24 border-b border-rule bg-paper-sunken px-3 py-2 text-caption font-medium uppercase tracking-wide text-ink-muted"
            >
              Structure
            </th>
            <SortHeader label="Name" column={column('name')} />
            <SortHeader label="Role" column={column('role')} />
            <SortHeader label="Formula" column={column('formula')} />
            <SortHeader
              label="M"
              unit="g/mol"
              column={column('molarMassGmol')}
              className="text-right"
            />
            <SortHeader label="logP" column={column('logP')} className="text-right" />
            <th scope="col" className="border-b border-rule bg-paper-sunken px-3 py-2">
              <span className="sr-only">Actions</span>
            </th>
          </tr>
        </thead>
        <tbody>
          {rows.length === 0 ? (
            <tr>
              <Td colSpan={7} className="py-6 text-center text-ink-muted">
                No compound shown has this role.
              </Td>
            </tr>
          ) : (
            rows.map((c) => (
              <tr key={c.id} className={c.id === selectedId ? 'bg-accent-soft' : undefined}>
                <Td className="py-1">
                  <StructureImage
                    svg={c.svg}
                    alt={`Structure of ${c.name}`}
                    className="h-14 w-20 rounded-control object-contain"
                  />
                </Td>
                <Td>
                  <span className="font-medium text-ink">{c.name}</span>
                  <span
                    className="block max-w-72 truncate text-caption text-ink-muted"
                    title={c.smiles ?? c.canonicalSmiles}
                  >
                    {c.smiles ?? c.canonicalSmiles}
                  </span>
                </Td>
                <Td>
                  <RoleChip role={c.role} />
                </Td>
                <Td className="tabular-nums">{c.formula}</Td>
                <Td className="text-right tabular-nums">{c.molarMassGmol.toFixed(2)}</Td>
                <Td className="text-right tabular-nums">
                  {c.logP ? (
                    <>
                      {c.logP.value.toFixed(2)}{' '}
                      <span className="text-caption text-ink-muted" title={c.logP.method}>
                        {c.logP.source === 'measured' ? 'measured' : 'estimate'}
                      </span>
                    </>
                  ) : (
                    <span className="text-ink-muted">—</span>
                  )}
                </Td>
                <Td className="text-right">
                  <Button
                    variant="quiet"
                    size="sm"
                    onClick={() => onOpen(c)}
                    aria-label={`${canWrite ? 'Edit' : 'View'} ${c.name}`}
                  >
                    {canWrite ? 'Edit' : 'View'}
                  </Button>
                </Td>
              </tr>
            ))
          )}
        </tbody>
      </Table>
    </div>
  );
}

const ROLE_TONE: Record<CompoundRole, string> = {
  product: 'bg-accent-soft text-accent-deep',
  impurity: 'bg-caution-warning-soft text-caution-warning-deep',
  reagent: 'bg-paper-sunken text-ink',
  'by-product': 'bg-phase-solid-soft text-phase-solid-deep',
};

export function RoleChip({ role }: { role: CompoundRole }) {
  return (
    <span
      className={`inline-block rounded-control px-1.5 py-0.5 text-caption font-medium ${ROLE_TONE[role]}`}
    >
      {COMPOUND_ROLE_LABELS[role]}
    </span>
  );
}
