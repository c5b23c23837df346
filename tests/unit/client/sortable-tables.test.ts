import { describe, expect, it } from 'vitest';
import type { Compound } from '@shared/schemas/compounds';
import type { SolventSummary } from '@shared/schemas/solvents';
import { missing, sortRows, type SortColumns } from '@/components/sortable-table';
import { compoundColumns } from '@/features/compounds/components/compound-table';
import { solventColumns } from '@/features/solvents/components/solvent-table';

// Every sortable table sorts through TanStack Table with one rule for missing
// values: they go last, whichever way the column is sorted. (Before, the
// compound table put compounds without logP first when sorted descending,
// while the solvent table kept missing flash points last.)
const solvent = (name: string, flashPointC: number | null) =>
  ({
    name,
    boilingPointC: 50,
    densityGmL: 1,
    flashPointC,
    ich: { class: null, limitPpm: null },
    guideCategory: 'recommended',
  }) as unknown as SolventSummary;

const compound = (name: string, logP: number | null) =>
  ({
    name,
    role: 'impurity',
    formula: 'C2H6O',
    molarMassGmol: 46.07,
    logP: logP === null ? null : { value: logP, source: 'estimated', method: 'x' },
  }) as unknown as Compound;

const names = <T extends { name: string }>(rows: T[]) => rows.map((r) => r.name);

describe('sortable tables', () => {
  it('the solvent table keeps missing flash points last in both directions', () => {
    const data = [solvent('b', null), solvent('a', 20), solvent('c', -10)];
    const sort = (desc: boolean) =>
      names(sortRows({ data, columns: solventColumns, sorting: [{ id: 'flashPointC', desc }] }));
    expect(sort(false)).toEqual(['c', 'a', 'b']);
    expect(sort(true)).toEqual(['a', 'c', 'b']);
  });

  it('the compound table keeps missing logP last in both directions', () => {
    const data = [compound('none', null), compound('low', -0.3), compound('high', 2.1)];
    const sort = (desc: boolean) =>
      names(sortRows({ data, columns: compoundColumns, sorting: [{ id: 'logP', desc }] }));
    expect(sort(false)).toEqual(['low', 'high', 'none']);
    expect(sort(true)).toEqual(['high', 'low', 'none']);
  });

  it('sorts names without regard to case and with numbers in order', () => {
    const data = [compound('Impurity 10', 1), compound('impurity 9', 1), compound('Acid', 1)];
    expect(
      names(sortRows({ data, columns: compoundColumns, sorting: [{ id: 'name', desc: false }] })),
    ).toEqual(['Acid', 'impurity 9', 'Impurity 10']);
  });

  it('a column whose accessor gives missing() values follows the same rule', () => {
    const columns: SortColumns<{ name: string; v: number | null }> = [
      { id: 'v', accessorFn: (r) => missing(r.v) },
    ];
    const data = [
      { name: 'x', v: null },
      { name: 'y', v: 0 },
    ];
    expect(names(sortRows({ data, columns, sorting: [{ id: 'v', desc: true }] }))).toEqual([
      'y',
      'x',
    ]);
  });
});
