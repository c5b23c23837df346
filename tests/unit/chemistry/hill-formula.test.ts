import { describe, expect, it } from 'vitest';
import { hillFormula, parseStructure } from '@shared/chemistry/structure';

// Hill system: E. A. Hill, J. Am. Chem. Soc. 1900, 22, 478 (citation recalled). Carbon first,
// hydrogen next, then the other elements alphabetically; without carbon, all alphabetically.
describe('formulas in Hill order', () => {
  it('puts C, then H, then the other elements alphabetically', () => {
    expect(hillFormula('C8H8NOCl')).toBe('C8H8ClNO');
    expect(hillFormula('C2H6O')).toBe('C2H6O');
    expect(hillFormula('CH3Br')).toBe('CH3Br');
  });
  it('orders a formula without carbon alphabetically, H included', () => {
    expect(hillFormula('H2O4S')).toBe('H2O4S');
    expect(hillFormula('NaCl')).toBe('ClNa');
    expect(hillFormula('H3N')).toBe('H3N');
  });
  it('leaves a formula it cannot read unchanged', () => {
    expect(hillFormula('H4N+')).toBe('H4N+');
  });
  it('is what a parsed structure reports: the chloro amide', () => {
    const r = parseStructure({ smiles: 'ClC1=CC=CC=C1C(=O)NC' });
    expect(r.ok && r.formula).toBe('C8H8ClNO');
  });
});
