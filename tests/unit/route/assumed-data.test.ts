import { describe, expect, it } from 'vitest';
import { evaluateRoute } from '../../../shared/engine/route/evaluate';
import { DEFAULT_COMPOUND_DENSITY_GML } from '../../../shared/engine/route/context';
import { demoAmideIsolation } from '../../fixtures/routes/demo-amide-isolation';

type Component = { id?: string; kind: string; name?: string; densityGmL?: number };
const copy = () => JSON.parse(JSON.stringify(demoAmideIsolation));

describe('a default standing in for missing data is never silent', () => {
  it('names every compound whose density is assumed, and none whose density is given', () => {
    const doc = copy();
    const compounds = (doc.components as Component[]).filter((c) => c.kind === 'compound');
    const without = compounds.filter((c) => c.densityGmL === undefined);
    expect(without.length).toBeGreaterThan(0);
    const notes = evaluateRoute(doc).warnings.filter((w) => w.code === 'density-assumed');
    expect(notes).toHaveLength(without.length);
    for (const c of without) {
      const note = notes.find((w) => w.message.includes(`for ${c.name}:`));
      expect(note?.message).toContain(`${DEFAULT_COMPOUND_DENSITY_GML} g/mL is assumed`);
      expect(note?.stepId).toBeNull();
    }
    for (const c of compounds.filter((x) => x.densityGmL !== undefined))
      expect(notes.some((w) => w.message.includes(`for ${c.name}:`))).toBe(false);
  });

  it('drops the note once the density is entered, and the entered density changes the volumes', () => {
    const doc = copy();
    for (const c of doc.components as Component[]) if (c.kind === 'compound') c.densityGmL = 1.3;
    const r = evaluateRoute(doc);
    expect(r.warnings.some((w) => w.code === 'density-assumed')).toBe(false);
    const base = evaluateRoute(copy());
    const volume = (res: typeof r) =>
      Object.values(res.streams).reduce((a, s) => a + s.volumeM3, 0);
    expect(volume(r)).not.toBeCloseTo(volume(base), 6);
  });
});

describe('an ionisable group with no pKa is never silently neutral', () => {
  type WithPka = Component & { pKa?: Array<{ value: number; type: string }> };
  const urea = (doc: { components: WithPka[] }) =>
    doc.components.find((c) => c.id === 'coupling-urea')!;

  it('warns, in words, when the urea’s amine has no pKa, and the acid wash then leaves more of it in the organic', () => {
    const doc = copy();
    delete urea(doc).pKa;
    const r = evaluateRoute(doc);
    const warnings = r.warnings.filter((w) => w.code === 'ionisable-group-without-pka');
    expect(warnings).toHaveLength(1);
    expect(warnings[0].severity).toBe('warning');
    expect(warnings[0].stepId).toBeNull();
    expect(warnings[0].message).toContain('Coupling-agent urea (invented) has a basic group');
    expect(warnings[0].message).toContain('tertiary aliphatic amine');
    expect(warnings[0].message).toContain('an acid wash will not take it into the water');
    expect(warnings[0].message).not.toMatch(/coupling-urea|ionisableGroups/);
    // What the warning is about: without the pKa the acid wash removes less of the urea.
    const left = (res: typeof r) => {
      const p = res.steps['acid-wash']?.purge?.['coupling-urea'];
      return p ? p.outKg / p.inKg : NaN;
    };
    const withPka = evaluateRoute(copy());
    expect(left(withPka)).toBeLessThan(0.05);
    expect(left(r)).toBeGreaterThan(left(withPka));
  });

  it('is silent when every group has its pKa, and counts sites: two basic groups need two', () => {
    expect(
      evaluateRoute(copy()).warnings.some((w) => w.code === 'ionisable-group-without-pka'),
    ).toBe(false);
    const doc = copy();
    (urea(doc) as WithPka & { ionisableGroups: unknown[] }).ionisableGroups.push({
      group: 'pyridine nitrogen',
      type: 'base',
    });
    const w = evaluateRoute(doc).warnings.filter((x) => x.code === 'ionisable-group-without-pka');
    expect(w).toHaveLength(1);
    expect(w[0].message).toContain('2 basic groups');
  });
});
