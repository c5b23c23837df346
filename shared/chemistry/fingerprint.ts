/**
 * Structure fingerprint for similarity: openchemlib's FragFp descriptor
 * (512 bits, one per predefined substructure fragment), as 128 hexadecimal
 * digits. The engine compares two of them by the Tanimoto coefficient
 * (shared/engine/properties/similarity.ts).
 */
import { Molecule } from 'openchemlib';
import type { StructureInput } from './structure';

/** FragFp fingerprint of a structure as hex, or null when it cannot be read. */
export function structureFingerprint(input: StructureInput): string | null {
  try {
    const mol =
      'smiles' in input ? Molecule.fromSmiles(input.smiles) : Molecule.fromMolfile(input.molfile);
    if (mol.getAllAtoms() === 0) return null;
    return Array.from(mol.getIndex(), (w) => (w >>> 0).toString(16).padStart(8, '0')).join('');
  } catch {
    return null;
  }
}
