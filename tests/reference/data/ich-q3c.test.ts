/**
 * ICH Q3C(R9) residual-solvent classes and Option 1 concentration limits,
 * checked against the published tables.
 *
 * Primary: ICH Q3C(R9), Impurities: Guideline for Residual Solvents (Step 4,
 * 24 January 2024), Table 2 (Class 2, PDE and limit) and Table 3 (Class 3,
 * limit 5000 ppm under Option 1). R9 changed only §3.4 (analytics), so the
 * limits below are those of earlier revisions too.
 * Read in (see shared/reference-data.md §E):
 *  [JCR] J. Cannabis Res. 2022, s42238-022-00130-3, Table 1 "Residual solvent
 *        limits imposed by ICH and USP (ICH 2011; USP 2009)";
 *  [CAS] ALS/caslab "USP Class 3 Residual Solvents List".
 * Each row names where its numbers were read. Tolerance: exact.
 */
import { describe, expect, it } from 'vitest';
import { solventById } from '@shared/engine/data';

interface Q3cRow {
  id: string;
  cls: 2 | 3;
  limitPpm: number;
  readIn: string;
}

const PUBLISHED: Q3cRow[] = [
  { id: 'methanol', cls: 2, limitPpm: 3000, readIn: 'Q3C Table 2; [JCR] Table 1' },
  { id: 'toluene', cls: 2, limitPpm: 890, readIn: 'Q3C Table 2; [JCR] Table 1' },
  { id: 'thf', cls: 2, limitPpm: 720, readIn: 'Q3C Table 2; [JCR] Table 1' },
  {
    id: 'dichloromethane',
    cls: 2,
    limitPpm: 600,
    readIn: 'Q3C Table 2; [JCR] Table 1 (methylene chloride)',
  },
  { id: 'acetonitrile', cls: 2, limitPpm: 410, readIn: 'Q3C Table 2; [JCR] Table 1' },
  { id: '1-4-dioxane', cls: 2, limitPpm: 380, readIn: 'Q3C Table 2; [JCR] Table 1' },
  { id: 'cyclohexane', cls: 2, limitPpm: 3880, readIn: 'Q3C Table 2; [JCR] Table 1' },
  {
    id: 'o-xylene',
    cls: 2,
    limitPpm: 2170,
    readIn: 'Q3C Table 2 (xylene); [JCR] Table 1 (total xylenes)',
  },
  { id: 'chlorobenzene', cls: 2, limitPpm: 360, readIn: 'Q3C Table 2; [JCR] Table 1' },
  { id: 'methylcyclohexane', cls: 2, limitPpm: 1180, readIn: 'Q3C Table 2; [JCR] Table 1' },
  { id: 'ethanol', cls: 3, limitPpm: 5000, readIn: 'Q3C Table 3; [JCR] Table 1; [CAS]' },
  { id: '2-propanol', cls: 3, limitPpm: 5000, readIn: 'Q3C Table 3; [JCR] Table 1 (isopropanol)' },
  { id: 'acetone', cls: 3, limitPpm: 5000, readIn: 'Q3C Table 3; [JCR] Table 1' },
  { id: 'ethyl-acetate', cls: 3, limitPpm: 5000, readIn: 'Q3C Table 3; [JCR] Table 1' },
  { id: 'mtbe', cls: 3, limitPpm: 5000, readIn: 'Q3C Table 3; [JCR] Table 1; [CAS]' },
  { id: '2-butanol', cls: 3, limitPpm: 5000, readIn: 'Q3C Table 3; [JCR] Table 1' },
  {
    id: '2-butanone',
    cls: 3,
    limitPpm: 5000,
    readIn: 'Q3C Table 3; [JCR] Table 1 (butanone/methyl ethyl ketone)',
  },
  {
    id: 'diethyl-ether',
    cls: 3,
    limitPpm: 5000,
    readIn: 'Q3C Table 3 (ethyl ether); [JCR] Table 1',
  },
  { id: 'isopropyl-acetate', cls: 3, limitPpm: 5000, readIn: 'Q3C Table 3; [CAS]' },
  { id: 'n-heptane', cls: 3, limitPpm: 5000, readIn: 'Q3C Table 3; [CAS]' },
  { id: 'dmso', cls: 3, limitPpm: 5000, readIn: 'Q3C Table 3; [CAS]' },
  { id: '1-butanol', cls: 3, limitPpm: 5000, readIn: 'Q3C Table 3; [CAS]' },
  { id: 'acetic-acid', cls: 3, limitPpm: 5000, readIn: 'Q3C Table 3; [CAS]' },
];

describe('ICH Q3C(R9) classes and limits against the published tables', () => {
  it('checks at least 15 solvents', () => {
    expect(PUBLISHED.length).toBeGreaterThanOrEqual(15);
  });

  it.each(PUBLISHED.map((r) => [r.id, r] as const))('%s', (id, row) => {
    const s = solventById(id)!;
    expect(s, id).toBeDefined();
    expect(s.ich.value.class, row.readIn).toBe(row.cls);
    expect(s.ich.value.limitPpm, row.readIn).toBe(row.limitPpm);
    // A value checked against a read table must say it was read.
    expect(s.ich.source.status).toBe('confirmed');
  });
});
