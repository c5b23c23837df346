import { describe, expect, it } from 'vitest';
import {
  aqueousSoluteById,
  citationFor,
  SMILES_ALIASES,
  SOLVENT_DATA_VERSION,
  SOLVENTS,
  solventById,
  solventByName,
  solventBySmiles,
} from '@shared/engine/data';

describe('solvent look-ups', () => {
  it('finds every solvent by id and by its own SMILES', () => {
    for (const s of SOLVENTS) {
      expect(solventById(s.id)).toBe(s);
      expect(solventBySmiles(s.smiles)?.id).toBe(s.id);
    }
  });

  it('resolves common alternative SMILES writings and ignores whitespace', () => {
    expect(solventBySmiles('OCC')?.id).toBe('ethanol');
    expect(solventBySmiles('CC(=O)OCC')?.id).toBe('ethyl-acetate');
    expect(solventBySmiles('O1CCCC1')?.id).toBe('thf');
    expect(solventBySmiles('CS(=O)C')?.id).toBe('dmso');
    expect(solventBySmiles('n1ccccc1')?.id).toBe('pyridine');
    expect(solventBySmiles('  Cc1ccccc1 ')?.id).toBe('toluene');
  });

  it('returns undefined for an unknown structure rather than a near match', () => {
    expect(solventBySmiles('CCCCCCCCCC')).toBeUndefined();
    expect(solventBySmiles('cc1ccccc1')).toBeUndefined();
    expect(solventById('benzene')).toBeUndefined();
  });

  it('maps every alias to an existing solvent, never to a different solvent than its canonical owner', () => {
    const canonical = new Map(SOLVENTS.map((s) => [s.smiles, s.id]));
    for (const [smiles, id] of Object.entries(SMILES_ALIASES)) {
      expect(solventById(id), smiles).toBeDefined();
      if (canonical.has(smiles)) expect(canonical.get(smiles), smiles).toBe(id);
    }
  });

  it('finds solvents by name and synonym, case-insensitively', () => {
    expect(solventByName('THF')?.id).toBe('thf');
    expect(solventByName('ethyl ACETATE')?.id).toBe('ethyl-acetate');
    expect(solventByName('MeCN')?.id).toBe('acetonitrile');
    expect(solventByName('xylene')?.id).toBe('o-xylene');
    expect(solventByName('unobtainium')).toBeUndefined();
  });

  it('expands a value source to its bibliography entry', () => {
    const toluene = solventById('toluene')!;
    expect(citationFor(toluene.antoine[0].source)?.citation).toMatch(/Poling/);
    expect(citationFor({ ref: 'no-such-source', status: 'confirmed' })).toBeUndefined();
  });

  it('finds aqueous solutes and carries a semantic data version', () => {
    expect(aqueousSoluteById('nacl')?.formula).toBe('NaCl');
    expect(aqueousSoluteById('kcl')).toBeUndefined();
    expect(SOLVENT_DATA_VERSION).toMatch(/^\d+\.\d+\.\d+$/);
  });
});
