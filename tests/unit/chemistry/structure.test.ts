import { describe, expect, it } from 'vitest';
import { parseStructure } from '@shared/chemistry';

describe('parseStructure', () => {
  it('reads a SMILES into formula, molar mass, canonical SMILES, drawing and heavy-atom count', () => {
    const r = parseStructure({ smiles: 'OCC' });
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.formula).toBe('C2H6O');
    // 2·12.011 + 6·1.008 + 15.999 = 46.069 (IUPAC standard atomic weights, abridged)
    expect(r.molarMassGmol).toBeCloseTo(46.069, 2);
    expect(r.canonicalSmiles).toBe('CCO');
    expect(r.svg.startsWith('<svg')).toBe(true);
    expect(r.atomCount).toBe(3);
  });
  it('gives the same canonical SMILES for two writings of one molecule', () => {
    const a = parseStructure({ smiles: 'c1ccccc1C' });
    const b = parseStructure({ smiles: 'Cc1ccccc1' });
    expect(a.ok && b.ok && a.canonicalSmiles === b.canonicalSmiles).toBe(true);
  });
  it('names a dangling ring closure and its position', () => {
    const r = parseStructure({ smiles: 'C1CC(' });
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(r.error).toMatch(/ring closure/);
    expect(r.error).toMatch(/position/);
    expect(r.error).not.toMatch(/Class\$/);
  });
  it('refuses an empty SMILES and an empty molfile plainly', () => {
    expect(parseStructure({ smiles: '  ' })).toEqual({ ok: false, error: 'The SMILES is empty.' });
    expect(parseStructure({ molfile: '' })).toEqual({ ok: false, error: 'The molfile is empty.' });
  });
  it('reads a V2000 molfile', () => {
    const molfile = [
      '',
      '  test',
      '',
      '  2  1  0  0  0  0  0  0  0  0999 V2000',
      '    0.0000    0.0000    0.0000 C   0  0  0  0  0  0  0  0  0  0  0  0',
      '    1.2990    0.7500    0.0000 O   0  0  0  0  0  0  0  0  0  0  0  0',
      '  1  2  1  0  0  0  0',
      'M  END',
    ].join('\n');
    const r = parseStructure({ molfile });
    expect(r.ok && r.formula).toBe('CH4O');
  });
});
