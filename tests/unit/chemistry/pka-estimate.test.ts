import { describe, expect, it } from 'vitest';
import { findIonisableGroups, structureFingerprint } from '../../../shared/chemistry';
import { demoAmideIsolation } from '../../fixtures/routes/demo-amide-isolation';

function groups(smiles: string) {
  const r = findIonisableGroups({ smiles });
  if (!r.ok) throw new Error(r.error);
  return r.groups;
}

/**
 * Measured aqueous pKa at 25 °C of simple acids and bases (values as commonly
 * tabulated, e.g. CRC Handbook of Chemistry and Physics, "Dissociation
 * constants of organic acids and bases"; recalled, not read here). The method
 * states ±1 unit; each check allows that.
 */
const MEASURED: Array<[string, string, 'acid' | 'base', number]> = [
  ['acetic acid', 'CC(=O)O', 'acid', 4.76],
  ['chloroacetic acid', 'ClCC(=O)O', 'acid', 2.87],
  ['methoxyacetic acid', 'COCC(=O)O', 'acid', 3.57],
  ['benzoic acid', 'OC(=O)c1ccccc1', 'acid', 4.2],
  ['4-chlorobenzoic acid', 'OC(=O)c1ccc(Cl)cc1', 'acid', 3.98],
  ['3-nitrobenzoic acid', 'OC(=O)c1cccc([N+](=O)[O-])c1', 'acid', 3.45],
  ['phenol', 'Oc1ccccc1', 'acid', 9.99],
  ['paracetamol (phenol)', 'CC(=O)Nc1ccc(O)cc1', 'acid', 9.38],
  ['ethylamine', 'CCN', 'base', 10.65],
  ['diethylamine', 'CCNCC', 'base', 10.98],
  ['triethylamine', 'CCN(CC)CC', 'base', 10.75],
  ['ethanolamine', 'NCCO', 'base', 9.5],
  ['benzylamine', 'NCc1ccccc1', 'base', 9.34],
  ['aniline', 'Nc1ccccc1', 'base', 4.6],
  ['4-chloroaniline', 'Nc1ccc(Cl)cc1', 'base', 4.0],
  ['pyridine', 'c1ccncc1', 'base', 5.23],
  ['imidazole', 'c1cnc[nH]1', 'base', 6.95],
];

describe('ionisable groups and pKa estimates (Perrin, Dempsey & Serjeant 1981 group method)', () => {
  it.each(MEASURED)('%s: one %s group within ±1 of %s', (_name, smiles, type, pKa) => {
    const g = groups(smiles);
    expect(g).toHaveLength(1);
    expect(g[0].type).toBe(type);
    expect(Math.abs(g[0].pKa! - pKa)).toBeLessThanOrEqual(1);
    expect(g[0].typicalError).toBe(1);
    expect(g[0].method).toMatch(/Perrin, Dempsey & Serjeant/);
  });

  it('amides, ureas, ethers and the neutral demo product have no ionisable group', () => {
    expect(groups('CC(=O)NC')).toEqual([]);
    expect(groups('CNC(=O)NC')).toEqual([]);
    expect(groups('CCOCC')).toEqual([]);
    expect(groups('O=C(NCCC1CCOCC1)c1ccc(Cl)c(OCC2CC2)c1')).toEqual([]);
  });

  it('the coupling urea: its dimethylamino group is a base near pKa 10; the demo route carries that estimate', () => {
    const g = groups('CCNC(=O)NCCCN(C)C');
    expect(g).toHaveLength(1);
    expect(g[0].group).toBe('tertiary aliphatic amine');
    // Regression value of this implementation (10.75 − 0.44 − 0.22 − 0.07).
    expect(g[0].pKa).toBeCloseTo(10.0, 5);
    const urea = demoAmideIsolation.components.find(
      (c) => c.kind === 'compound' && c.id === 'coupling-urea',
    ) as { pKa: Array<{ value: number; source?: string }> };
    expect(urea.pKa).toEqual([{ value: g[0].pKa, type: 'base', source: 'estimated' }]);
  });

  it('groups the method does not cover are found with no pKa', () => {
    for (const s of ['NC(=N)N', 'CS(=O)(=O)N', 'O=C1CCC(=O)N1', 'c1nn[nH]n1']) {
      const g = groups(s);
      expect(g.length).toBeGreaterThan(0);
      expect(g.every((x) => x.pKa === null && x.typicalError === null)).toBe(true);
    }
  });
});

describe('structure fingerprints', () => {
  it('the demo route carries the fingerprints the structures give', () => {
    for (const c of demoAmideIsolation.components) {
      if (c.kind !== 'compound') continue;
      expect(c.fingerprint).toBe(structureFingerprint({ smiles: c.smiles! }));
    }
  });
  it('says of every estimate that its parent values are recalled, from memory', () => {
    const found = findIonisableGroups({ smiles: 'OC(=O)c1ccc(Cl)cc1' });
    expect(found.ok).toBe(true);
    const estimates = found.ok ? found.groups.filter((g) => g.pKa !== null) : [];
    expect(estimates.length).toBeGreaterThan(0);
    for (const g of estimates) expect(g.notes.join(' ')).toMatch(/from memory/);
  });
  it('the demo route carries the ionisable groups the structures give', () => {
    for (const c of demoAmideIsolation.components) {
      if (c.kind !== 'compound') continue;
      const found = findIonisableGroups({ smiles: c.smiles! });
      expect(found.ok).toBe(true);
      const groups = found.ok ? found.groups.map(({ group, type }) => ({ group, type })) : [];
      expect(c.ionisableGroups ?? []).toEqual(groups);
    }
  });
  it('a bad structure gives none', () => {
    expect(structureFingerprint({ smiles: 'C1CC' })).toBeNull();
  });
});
