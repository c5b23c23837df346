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
