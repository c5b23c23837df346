/**
 * Fallback logP for structures the UNIFAC group set cannot describe:
 * openchemlib's atom-type increment estimate (MoleculeProperties.logP, the
 * cLogP predictor of openchemlib by Actelion/Idorsia: a sum of increments
 * per atom type, each type set by the atom and its neighbourhood). Used only
 * when the UNIFAC route (shared/engine/properties/logp.ts) cannot run, and
 * marked as the fallback it is; its authors' accuracy figures were not read
 * here, so expect errors of a log unit for drug-like molecules.
 */
import { Molecule, MoleculeProperties } from 'openchemlib';
import type { StructureInput } from './structure';

export const LOGP_FALLBACK_METHOD =
  'fallback: atom-type increments (openchemlib cLogP, MoleculeProperties.logP), used because the UNIFAC groups do not cover the structure';

/** openchemlib's atom-increment logP, or null when the structure cannot be read. */
export function atomContributionLogP(input: StructureInput): number | null {
  try {
    const mol =
      'smiles' in input ? Molecule.fromSmiles(input.smiles) : Molecule.fromMolfile(input.molfile);
    if (mol.getAllAtoms() === 0) return null;
    const v = new MoleculeProperties(mol).logP;
    return Number.isFinite(v) ? Math.round(v * 100) / 100 : null;
  } catch {
    return null;
  }
}

/** Plain names of the groups the UNIFAC set misses, from the unassigned atoms' reasons. */
export function missingGroupNames(reasons: readonly string[]): string[] {
  const names = new Set<string>();
  const anilide = reasons.some((r) => /anilide|aryl amide/.test(r));
  for (const r of reasons) {
    if (/amide/.test(r) && anilide) names.add('the anilide link (aryl–NH–C(=O)–)');
    else if (/amide/.test(r)) names.add('the amide group as substituted here');
    else if (/urea/.test(r)) names.add('the urea group');
    else if (/charged/.test(r)) names.add('a charged atom (draw the neutral form)');
    else if (/aromatic/.test(r)) names.add('the heteroaromatic ring');
    else if (/sulfur/.test(r)) names.add('the sulfur group');
    else names.add(r.replace(/^[a-z]+ in /, '').replace(/ that the original UNIFAC.*$/, ''));
  }
  return [...names];
}
