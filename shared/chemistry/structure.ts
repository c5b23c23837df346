/**
 * Structure input: SMILES or MDL molfile parsed by openchemlib into formula,
 * molar mass, canonical SMILES, a drawing, and the heavy-atom graph that the
 * group-contribution methods match on.
 *
 * openchemlib (Actelion/Idorsia, BSD licence) does the parsing; its error
 * messages name the problem and position (e.g. "dangling ring closure: 1;
 * position: 5") and are passed on, without the internal class prefix.
 */
import { Molecule } from 'openchemlib';

export type StructureInput = { smiles: string } | { molfile: string };

export type ParsedStructure =
  | {
      ok: true;
      formula: string;
      molarMassGmol: number;
      canonicalSmiles: string;
      svg: string;
      atomCount: number;
    }
  | { ok: false; error: string };

/** Heavy-atom graph with implicit hydrogens, as the matchers use it. */
export interface AtomGraph {
  /** openchemlib atom indices of the heavy atoms, in order */
  atoms: number[];
  element: Map<number, string>;
  hydrogens: Map<number, number>;
  charge: Map<number, number>;
  aromatic: Map<number, boolean>;
  /** smallest ring size the atom is in, 0 when acyclic */
  ringSize: Map<number, number>;
  /** heavy neighbours with bond order (1, 2, 3; 1.5 for aromatic) */
  neighbours: Map<number, Array<{ atom: number; order: number }>>;
  /** rings: atoms and aromaticity */
  rings: Array<{ atoms: number[]; aromatic: boolean }>;
  /** number of disconnected fragments */
  fragments: number;
}

/** Strip openchemlib's internal class prefix ("Class$S19: SmilesParser: ...") from a message. */
function cleanMessage(e: unknown): string {
  const raw = e instanceof Error ? e.message : String(e);
  return raw
    .replace(/^Class\$\S+:\s*/, '')
    .replace(/^SmilesParser:\s*/, 'SMILES: ')
    .trim();
}

/**
 * Branch parentheses and atom brackets must pair up. openchemlib reads an
 * unclosed branch such as "C1CC1(" without complaint, which would turn a
 * typing slip into a different molecule, so the pairing is checked first.
 *
 * @returns a plain message naming the position (1-based), or null when balanced
 */
export function smilesBracketProblem(smiles: string): string | null {
  const openBranches: number[] = [];
  let atomBracketAt = -1;
  for (let i = 0; i < smiles.length; i++) {
    const ch = smiles[i];
    if (atomBracketAt >= 0) {
      if (ch === ']') atomBracketAt = -1;
      else if (ch === '[')
        return `an atom bracket opened at position ${atomBracketAt + 1} is not closed before another opens at position ${i + 1}.`;
      continue;
    }
    if (ch === '[') atomBracketAt = i;
    else if (ch === ']') return `an atom bracket closes at position ${i + 1} without being opened.`;
    else if (ch === '(') openBranches.push(i);
    else if (ch === ')') {
      if (openBranches.length === 0)
        return `a branch closes at position ${i + 1} without being opened.`;
      openBranches.pop();
    }
  }
  if (atomBracketAt >= 0)
    return `the atom bracket opened at position ${atomBracketAt + 1} is never closed.`;
  if (openBranches.length > 0)
    return `the branch opened at position ${openBranches[openBranches.length - 1] + 1} is never closed.`;
  return null;
}

function load(input: StructureInput): { ok: true; mol: Molecule } | { ok: false; error: string } {
  if ('smiles' in input) {
    const s = input.smiles?.trim() ?? '';
    if (s.length === 0) return { ok: false, error: 'The SMILES is empty.' };
    if (s.length > 2000) return { ok: false, error: 'The SMILES is longer than 2000 characters.' };
    let mol: Molecule;
    try {
      mol = Molecule.fromSmiles(s);
    } catch (e) {
      return { ok: false, error: `Cannot read the SMILES "${s}": ${cleanMessage(e)}` };
    }
    // What openchemlib tolerates but a chemist did not mean.
    const bracketProblem = smilesBracketProblem(s);
    if (bracketProblem)
      return { ok: false, error: `Cannot read the SMILES "${s}": ${bracketProblem}` };
    // "()" or "[]" parse to nothing: a compound needs at least one atom.
    if (mol.getAllAtoms() === 0)
      return { ok: false, error: `The SMILES "${s}" describes no atoms; enter the structure.` };
    return { ok: true, mol };
  }
  const m = input.molfile ?? '';
  if (m.trim().length === 0) return { ok: false, error: 'The molfile is empty.' };
  if (m.length > 500_000)
    return { ok: false, error: 'The molfile is larger than 500 000 characters.' };
  try {
    const mol = Molecule.fromMolfile(m);
    if (mol.getAllAtoms() === 0) return { ok: false, error: 'The molfile contains no atoms.' };
    return { ok: true, mol };
  } catch (e) {
    return { ok: false, error: `Cannot read the molfile: ${cleanMessage(e)}` };
  }
}

/**
 * Parse a structure into its formula, average molar mass (IUPAC standard
 * atomic weights as carried by openchemlib), canonical SMILES, an SVG drawing
 * and its heavy-atom count.
 *
 * @param input `{ smiles }` or `{ molfile }` (MDL V2000/V3000)
 * @returns `{ ok: true, ... }` or `{ ok: false, error }` naming the problem
 *
 * Example: parseStructure({ smiles: 'CCO' }) → formula 'C2H6O', molar mass
 * 46.07 g/mol, atomCount 3.
 */
/**
 * A molecular formula in Hill order (Hill, J. Am. Chem. Soc. 1900, 22, 478 — citation recalled):
 * with carbon, C first, then H, then the other elements alphabetically; without carbon, every
 * element alphabetically. A formula it cannot read (a charge, a bracket) is returned unchanged.
 * @param formula element symbols with counts, in any order, e.g. 'C8H8NOCl'
 * @returns the same formula in Hill order, e.g. 'C8H8ClNO'
 */
export function hillFormula(formula: string): string {
  if (!/^(?:[A-Z][a-z]?\d*)+$/.test(formula)) return formula;
  const counts = new Map<string, number>();
  for (const [, el, n] of formula.matchAll(/([A-Z][a-z]?)(\d*)/g))
    counts.set(el!, (counts.get(el!) ?? 0) + (n ? Number(n) : 1));
  const hasCarbon = counts.has('C');
  const rank = (el: string) => (!hasCarbon ? 2 : el === 'C' ? 0 : el === 'H' ? 1 : 2);
  return [...counts.entries()]
    .sort(([a], [b]) => rank(a) - rank(b) || (a < b ? -1 : a > b ? 1 : 0))
    .map(([el, n]) => (n === 1 ? el : `${el}${n}`))
    .join('');
}

export function parseStructure(input: StructureInput): ParsedStructure {
  const r = load(input);
  if (!r.ok) return r;
  const mol = r.mol;
  try {
    const mf = mol.getMolecularFormula();
    if (!(mf.relativeWeight > 0))
      return {
        ok: false,
        error: 'The structure has no atoms with a molar mass; enter the structure.',
      };
    let heavy = 0;
    for (let i = 0; i < mol.getAllAtoms(); i++) if (mol.getAtomicNo(i) !== 1) heavy++;
    return {
      ok: true,
      formula: hillFormula(mf.formula),
      molarMassGmol: mf.relativeWeight,
      canonicalSmiles: mol.toIsomericSmiles(),
      svg: mol.toSVG(300, 220, 'structure'),
      atomCount: heavy,
    };
  } catch (e) {
    return {
      ok: false,
      error: `The structure was read but could not be processed: ${cleanMessage(e)}`,
    };
  }
}

/**
 * Load a structure into the heavy-atom graph used by the matchers.
 *
 * @returns the graph, or the parse error
 */
export function loadGraph(
  input: StructureInput,
): { ok: true; graph: AtomGraph } | { ok: false; error: string } {
  const r = load(input);
  if (!r.ok) return r;
  const mol = r.mol;
  mol.ensureHelperArrays(Molecule.cHelperRings);
  const atoms: number[] = [];
  const element = new Map<number, string>();
  const hydrogens = new Map<number, number>();
  const charge = new Map<number, number>();
  const aromatic = new Map<number, boolean>();
  const ringSize = new Map<number, number>();
  const neighbours = new Map<number, Array<{ atom: number; order: number }>>();
  for (let i = 0; i < mol.getAllAtoms(); i++) {
    if (mol.getAtomicNo(i) === 1) continue;
    atoms.push(i);
    element.set(i, mol.getAtomLabel(i));
    hydrogens.set(i, mol.getAllHydrogens(i));
    charge.set(i, mol.getAtomCharge(i));
    aromatic.set(i, mol.isAromaticAtom(i));
    ringSize.set(i, mol.isRingAtom(i) ? mol.getAtomRingSize(i) : 0);
    const nb: Array<{ atom: number; order: number }> = [];
    for (let k = 0; k < mol.getAllConnAtoms(i); k++) {
      const j = mol.getConnAtom(i, k);
      if (mol.getAtomicNo(j) === 1) continue;
      const bond = mol.getConnBond(i, k);
      nb.push({ atom: j, order: mol.isAromaticBond(bond) ? 1.5 : mol.getConnBondOrder(i, k) });
    }
    neighbours.set(i, nb);
  }
  const rs = mol.getRingSet();
  const rings: Array<{ atoms: number[]; aromatic: boolean }> = [];
  for (let k = 0; k < rs.getSize(); k++)
    rings.push({ atoms: [...rs.getRingAtoms(k)], aromatic: rs.isAromatic(k) });
  // Fragments by a walk over heavy atoms.
  const seen = new Set<number>();
  let fragments = 0;
  for (const a of atoms) {
    if (seen.has(a)) continue;
    fragments++;
    const stack = [a];
    seen.add(a);
    while (stack.length) {
      const u = stack.pop() as number;
      for (const { atom: v } of neighbours.get(u) ?? []) {
        if (!seen.has(v)) {
          seen.add(v);
          stack.push(v);
        }
      }
    }
  }
  return {
    ok: true,
    graph: { atoms, element, hydrogens, charge, aromatic, ringSize, neighbours, rings, fragments },
  };
}
