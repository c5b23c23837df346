import { describe, expect, it } from 'vitest';
import { parseStructure } from '@shared/chemistry';
import { smilesBracketProblem } from '@shared/chemistry/structure';

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
  it("escapes markup in a molfile's atom labels, so the drawing carries text, never elements", () => {
    // A molfile may carry free-text atom labels (here openchemlib's custom label data field);
    // the drawing must show them as text: the page shows it as an <img>, the server no longer
    // filters it.
    const molfile = [
      '',
      '  label test',
      '',
      '  3  2  0  0  0  0  0  0  0  0999 V2000',
      '    1.7321   -0.5000    0.0000 C   0  0  0  0  0  0  0  0  0  0  0  0',
      '    0.8660    0.0000    0.0000 C   0  0  0  0  0  0  0  0  0  0  0  0',
      '    0.0000   -0.5000    0.0000 O   0  0  0  0  0  0  0  0  0  0  0  0',
      '  1  2  1  0  0  0  0',
      '  2  3  1  0  0  0  0',
      'M  STY  1   1 DAT',
      'M  SLB  1   1   1',
      'M  SAL   1  1   1',
      'M  SDT   1 NOSEARCH_OCL_CUSTOM_LABEL',
      'M  SDD   1     1.7321    0.5000    DA    ALL  1       5',
      'M  SED   1 <script>alert(1)</script><img src=x onerror="y">',
      'M  END',
    ].join('\n');
    const r = parseStructure({ molfile });
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.svg).toContain('&lt;script&gt;alert(1)&lt;/script&gt;');
    const elements = new Set([...r.svg.matchAll(/<([a-zA-Z][\w:-]*)/g)].map((m) => m[1]));
    expect([...elements].sort()).toEqual(['circle', 'line', 'style', 'svg', 'text']);
    expect(r.svg).not.toMatch(/\son\w+\s*=\s*"/i);
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
  it('refuses unpaired branch parentheses and atom brackets, naming the position, instead of reading another molecule', () => {
    const cases: Array<[string, RegExp]> = [
      // openchemlib reads this one as cyclopropane; our own check refuses it.
      ['C1CC1(', /branch opened at position 6 is never closed/],
      // These openchemlib refuses itself, with its own wording and position.
      ['CC)O', /\)[\s\S]*position/i],
      ['C[NH4+', /bracket[\s\S]*position/i],
      ['CC]', /bracket[\s\S]*position/i],
    ];
    for (const [smiles, message] of cases) {
      const r = parseStructure({ smiles });
      expect(r.ok).toBe(false);
      if (!r.ok) expect(r.error).toMatch(message);
    }
    // Branches and charged atoms that do pair up still read.
    expect(parseStructure({ smiles: 'CC(C)(C)O' }).ok).toBe(true);
    expect(parseStructure({ smiles: '[Na+].[Cl-]' }).ok).toBe(true);
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

describe('smilesBracketProblem', () => {
  it('pairs branch parentheses and atom brackets and names the first problem with its 1-based position', () => {
    expect(smilesBracketProblem('CC(C)(C)O')).toBeNull();
    expect(smilesBracketProblem('[Na+].[Cl-]')).toBeNull();
    expect(smilesBracketProblem('C(C')).toBe('the branch opened at position 2 is never closed.');
    expect(smilesBracketProblem('CC)O')).toBe(
      'a branch closes at position 3 without being opened.',
    );
    expect(smilesBracketProblem('C[NH4+')).toBe(
      'the atom bracket opened at position 2 is never closed.',
    );
    expect(smilesBracketProblem('CC]')).toBe(
      'an atom bracket closes at position 3 without being opened.',
    );
    expect(smilesBracketProblem('[N[H]')).toBe(
      'an atom bracket opened at position 1 is not closed before another opens at position 3.',
    );
  });
});
