/**
 * Structural similarity of two compounds from their fingerprints.
 *
 * The fingerprints are openchemlib's FragFp descriptor (512 bits, one per
 * predefined substructure fragment; Idorsia/Actelion, openchemlib
 * SSSearcherWithIndex), computed from the structure when the compound is
 * saved (shared/chemistry/fingerprint.ts) and carried in the route document
 * as 128 hexadecimal digits, so the engine needs no structure parser.
 *
 * Tanimoto (Jaccard) coefficient: T = |A ∧ B| / |A ∨ B| = c / (a + b − c),
 * with a, b the bits set in each and c those set in both (Willett, Barnard &
 * Downs, J. Chem. Inf. Comput. Sci. 1998, 38, 983). T = 1 for identical bit
 * sets, 0 for disjoint ones.
 */

/** Tanimoto at or above which an impurity counts as a close analogue of the product (see docs/methods.md). */
export const CLOSE_ANALOGUE_TANIMOTO = 0.8;

function popcount32(x: number): number {
  let v = x >>> 0;
  v -= (v >>> 1) & 0x55555555;
  v = (v & 0x33333333) + ((v >>> 2) & 0x33333333);
  return (((v + (v >>> 4)) & 0x0f0f0f0f) * 0x01010101) >>> 24;
}

function words(hex: string): number[] {
  const w: number[] = [];
  for (let i = 0; i + 8 <= hex.length; i += 8) w.push(parseInt(hex.slice(i, i + 8), 16) >>> 0);
  return w;
}

/**
 * Tanimoto coefficient of two hexadecimal fingerprints of equal length.
 *
 * @param a fingerprint as hex digits (multiple of 8)
 * @param b fingerprint as hex digits (same length)
 * @returns T in [0, 1]; null when the lengths differ or both are empty
 *
 * Example: tanimotoHex('0000000f', '00000003') → 0.5
 *
 * Source: Tanimoto (Jaccard) coefficient T = c / (a + b − c) (Willett,
 * Barnard & Downs, J. Chem. Inf. Comput. Sci. 1998, 38, 983); the popcount is
 * the standard SWAR bit count.
 * Validity: fingerprints of the same descriptor and length (a multiple of 8
 * hex digits, else null); T measures shared fragments, not a guarantee of
 * similar solubility or crystallisation behaviour.
 */
export function tanimotoHex(a: string, b: string): number | null {
  if (a.length !== b.length || a.length % 8 !== 0) return null;
  const wa = words(a);
  const wb = words(b);
  let both = 0;
  let either = 0;
  for (let i = 0; i < wa.length; i++) {
    both += popcount32(wa[i] & wb[i]);
    either += popcount32(wa[i] | wb[i]);
  }
  return either === 0 ? null : both / either;
}
