/**
 * Ionisable groups found from the structure, with an estimated pKa.
 *
 * Method: the linear-free-energy approach of Perrin, Dempsey & Serjeant,
 * "pKa Prediction for Organic Acids and Bases", Chapman & Hall 1981 (PDS):
 * the pKa of the parent class, shifted by its substituents.
 *  - Aliphatic acids and amines (PDS ch. 4): pKa = pKa₀ − Σ ΔpKa(X) · f,
 *    with ΔpKa(X) the shift of a substituent in the reference position —
 *    X–CH₂–COOH for acids, X–CH₂–CH₂–NH₂ for amines (both three bonds from
 *    the proton-bearing atom) — and f = 0.4 per further bond (the attenuation
 *    factor PDS use); for an amine substituent one bond closer (X on the
 *    carbon next to N) f = 2 (recalled order of magnitude: benzylamine 9.34
 *    vs 2-phenylethylamine 9.83).
 *  - Aromatic acids and bases (PDS ch. 5): Hammett, pKa = pKa₀ − ρ Σσ, with σ of
 *    the meta and para ring substituents.
 * Parent pKa values are the usual handbook values of the parent compounds
 * (acetic, benzoic acid, phenol, anilinium, pyridinium, imidazolium;
 * ethyl-, diethyl-, triethylammonium); the secondary-amine value 11.15 and
 * the 0.4 attenuation are those quoted from PDS. ΔpKa of each substituent
 * class is the shift between a parent and its β-substituted analogue
 * (e.g. chloroacetic 2.86 vs acetic 4.76 → 1.9), and σ are Hammett constants
 * (Hansch, Leo & Taft, Chem. Rev. 1991, 91, 165); both recalled, not read in
 * the sources here — docs/methods.md lists every value and its status.
 *
 * Every estimate is stated with a typical error of ±1 pKa unit: PDS state
 * "several tenths" for close analogies; this class-level version without
 * ortho, steric, statistical or hydrogen-bond terms is cruder. Groups found
 * that the method does not cover (amidines, guanidines, sulfonamides,
 * tetrazoles, imides, sulfonic and phosphonic acids) are listed with no pKa,
 * and the caller warns. A measured pKa entered by the chemist replaces the
 * estimate.
 */
import { loadGraph, type AtomGraph, type StructureInput } from './structure';

export const PKA_METHOD =
  'Perrin, Dempsey & Serjeant (1981) group method: parent pKa shifted by Taft-type ΔpKa (attenuation 0.4 per bond) or Hammett σ (meta/para)';
/**
 * Said with every estimate: the parent pKa values and the substituent shifts are recalled
 * handbook values, not read from the printed tables (docs/methods.md gives each one's status).
 */
export const PKA_FROM_MEMORY =
  'parent pKa and substituent shifts recalled from handbooks (from memory, not yet checked against the printed tables)';
/** Typical error of an estimate [pKa units]. */
export const PKA_TYPICAL_ERROR = 1;

export interface IonisableGroup {
  /** Plain name of the group, e.g. "tertiary aliphatic amine". */
  group: string;
  /** 'acid': loses a proton; 'base': the pKa is that of its conjugate acid. */
  type: 'acid' | 'base';
  /** openchemlib atom index of the ionising atom. */
  atom: number;
  /** Estimated pKa, or null when the method does not cover the group. */
  pKa: number | null;
  method: string;
  /** Typical error [pKa units]; null with no estimate. */
  typicalError: number | null;
  notes: string[];
}

// ---- parent classes ---------------------------------------------------------

const PARENT = {
  aliphaticCarboxylic: 4.76, // acetic acid
  aromaticCarboxylic: 4.2, // benzoic acid
  phenol: 9.99,
  primaryAmine: 10.7, // ethylammonium
  secondaryAmine: 11.15, // PDS, as quoted for secondary amines
  tertiaryAmine: 10.75, // triethylammonium
  aniline: 4.6, // anilinium
  pyridine: 5.25, // pyridinium
  imidazole: 6.95, // imidazolium
} as const;

/** Hammett ρ of the aromatic classes (benzoic acid 1 by definition). */
const RHO = { aromaticCarboxylic: 1.0, phenol: 2.23, aniline: 2.89 } as const;

/** Attenuation of an inductive shift per further bond (PDS). */
const ATTENUATION = 0.4;

/** ΔpKa of a substituent atom class in the reference position; see docs/methods.md. */
const DELTA: Record<string, number> = {
  halogen: 1.9, // chloroacetic 2.86 vs acetic 4.76
  ether: 1.2, // methoxyacetic 3.57 vs acetic 4.76
  hydroxyl: 0.9, // glycolic 3.83 vs acetic 4.76
  amideN: 1.1, // acetylglycine 3.67 vs acetic 4.76
  amineN: 0.8, // PDS, as quoted (amino group)
  carbonyl: 1.4, // ethyl hydrogen malonate 3.35 vs acetic 4.76
  nitrile: 2.3, // cyanoacetic 2.47 vs acetic 4.76
  aryl: 0.5, // phenylacetic 4.31 vs acetic 4.76
};

/** Hammett σ (meta, para) of ring substituent classes (Hansch, Leo & Taft 1991; recalled). */
const SIGMA: Record<string, { m: number; p: number; label: string }> = {
  F: { m: 0.34, p: 0.06, label: 'F' },
  Cl: { m: 0.37, p: 0.23, label: 'Cl' },
  Br: { m: 0.39, p: 0.23, label: 'Br' },
  I: { m: 0.35, p: 0.18, label: 'I' },
  OR: { m: 0.12, p: -0.27, label: 'alkoxy' },
  OH: { m: 0.12, p: -0.37, label: 'OH' },
  OAcyl: { m: 0.39, p: 0.31, label: 'acyloxy' },
  NR2: { m: -0.16, p: -0.66, label: 'amino' },
  NHAcyl: { m: 0.21, p: 0.0, label: 'acylamino' },
  NO2: { m: 0.71, p: 0.78, label: 'nitro' },
  CN: { m: 0.56, p: 0.66, label: 'cyano' },
  CF3: { m: 0.43, p: 0.54, label: 'CF3' },
  acyl: { m: 0.37, p: 0.45, label: 'acyl/ester/amide' },
  alkyl: { m: -0.07, p: -0.17, label: 'alkyl' },
  aryl: { m: 0.06, p: -0.01, label: 'aryl' },
  SO2: { m: 0.6, p: 0.72, label: 'sulfonyl' },
  SR: { m: 0.15, p: 0.0, label: 'alkylthio' },
};

// ---- graph helpers ----------------------------------------------------------

const el = (g: AtomGraph, a: number) => g.element.get(a) ?? '';
const nb = (g: AtomGraph, a: number) => g.neighbours.get(a) ?? [];
const h = (g: AtomGraph, a: number) => g.hydrogens.get(a) ?? 0;
const arom = (g: AtomGraph, a: number) => g.aromatic.get(a) ?? false;

/** Atom a carries a double bond to O or S (a carbonyl/thiocarbonyl carbon). */
function isCarbonyl(g: AtomGraph, a: number): boolean {
  return (
    el(g, a) === 'C' &&
    nb(g, a).some((n) => n.order === 2 && (el(g, n.atom) === 'O' || el(g, n.atom) === 'S'))
  );
}
function hasDoubleBond(g: AtomGraph, a: number): boolean {
  return nb(g, a).some((n) => n.order === 2 || n.order === 3);
}

/** Shortest bond distances from `from` to every heavy atom. */
function distances(g: AtomGraph, from: number): Map<number, number> {
  const d = new Map<number, number>([[from, 0]]);
  const queue = [from];
  while (queue.length) {
    const u = queue.shift()!;
    for (const { atom: v } of nb(g, u))
      if (!d.has(v)) {
        d.set(v, d.get(u)! + 1);
        queue.push(v);
      }
  }
  return d;
}

/** Class of a substituent atom for the aliphatic ΔpKa sum, or null when it shifts nothing. */
function deltaClass(g: AtomGraph, a: number): keyof typeof DELTA | null {
  const e = el(g, a);
  if (e === 'F' || e === 'Cl' || e === 'Br' || e === 'I') return 'halogen';
  if (e === 'O') {
    if (nb(g, a).some((n) => n.order === 2)) return null; // carbonyl O: counted on its carbon
    return h(g, a) > 0 ? 'hydroxyl' : 'ether';
  }
  if (e === 'N') {
    if (arom(g, a)) return null;
    return nb(g, a).some((n) => isCarbonyl(g, n.atom)) ? 'amideN' : 'amineN';
  }
  if (e === 'C') {
    if (nb(g, a).some((n) => n.order === 3 && el(g, n.atom) === 'N')) return 'nitrile';
    if (isCarbonyl(g, a)) return 'carbonyl';
    // The attachment atom of an aromatic ring (the ring itself is counted once).
    if (arom(g, a) && nb(g, a).some((n) => !arom(g, n.atom))) return 'aryl';
  }
  return null;
}

/**
 * ΔpKa sum of the substituents around an aliphatic centre `centre`; atoms of
 * the ionising group itself (`own`) are skipped; `reference` is the distance of
 * the reference position (2 from a carboxyl carbon, 3 from an amine N).
 * Substituents more than three bonds past it are ignored (0.4³ ≈ 0.06).
 */
function aliphaticShift(
  g: AtomGraph,
  centre: number,
  own: ReadonlySet<number>,
  reference: 2 | 3,
): { shift: number; terms: string[] } {
  const d = distances(g, centre);
  let shift = 0;
  const terms: string[] = [];
  for (const [a, dist] of d) {
    if (own.has(a) || dist < 2 || dist > reference + 3) continue;
    const cls = deltaClass(g, a);
    if (!cls) continue;
    const e = dist - reference;
    const s = DELTA[cls] * (e >= 0 ? ATTENUATION ** e : 2);
    shift += s;
    terms.push(`${cls} at ${dist} bonds −${s.toFixed(2)}`);
  }
  return { shift, terms };
}

/** The six-membered aromatic ring holding `atom`, in ring order starting from it. */
function ringFrom(g: AtomGraph, atom: number): number[] | null {
  const ring = g.rings.find((r) => r.aromatic && r.atoms.length === 6 && r.atoms.includes(atom));
  if (!ring) return null;
  const order = [atom];
  const inRing = new Set(ring.atoms);
  let prev = -1;
  let cur = atom;
  for (let k = 1; k < 6; k++) {
    const next = nb(g, cur).find((n) => inRing.has(n.atom) && n.atom !== prev && n.atom !== atom);
    if (!next) return null;
    prev = cur;
    cur = next.atom;
    order.push(cur);
  }
  return order;
}

function substituentClass(g: AtomGraph, s: number): keyof typeof SIGMA | null {
  const e = el(g, s);
  if (e === 'F' || e === 'Cl' || e === 'Br' || e === 'I') return e;
  if (e === 'O') {
    if (h(g, s) > 0) return 'OH';
    return nb(g, s).some((n) => isCarbonyl(g, n.atom)) ? 'OAcyl' : 'OR';
  }
  if (e === 'N') {
    const os = nb(g, s).filter((n) => el(g, n.atom) === 'O').length;
    if (os >= 2) return 'NO2';
    return nb(g, s).some((n) => isCarbonyl(g, n.atom)) ? 'NHAcyl' : 'NR2';
  }
  if (e === 'C') {
    if (nb(g, s).some((n) => n.order === 3 && el(g, n.atom) === 'N')) return 'CN';
    if (isCarbonyl(g, s)) return 'acyl';
    if (nb(g, s).filter((n) => el(g, n.atom) === 'F').length === 3) return 'CF3';
    if (arom(g, s)) return 'aryl';
    return 'alkyl';
  }
  if (e === 'S') return nb(g, s).filter((n) => n.order === 2).length >= 2 ? 'SO2' : 'SR';
  return null;
}

/**
 * Hammett Σσ of the meta and para substituents on the benzene ring that
 * carries the group at `attach`; `own` is the group's first atom (skipped).
 */
function hammettSum(
  g: AtomGraph,
  attach: number,
  own: number,
): { sum: number; terms: string[]; notes: string[] } {
  const notes: string[] = [];
  const ring = ringFrom(g, attach);
  if (!ring) return { sum: 0, terms: [], notes: ['not on a benzene ring: no substituent terms'] };
  const inRing = new Set(ring);
  let sum = 0;
  const terms: string[] = [];
  ring.forEach((ra, pos) => {
    if (pos === 0) return;
    const place = pos === 3 ? 'p' : pos === 2 || pos === 4 ? 'm' : 'o';
    for (const n of nb(g, ra)) {
      if (inRing.has(n.atom) || n.atom === own) continue;
      if (
        arom(g, n.atom) &&
        g.rings.some((r) => r.atoms.includes(n.atom) && r.atoms.includes(ra))
      ) {
        notes.push('fused ring: its effect is not estimated');
        continue;
      }
      const cls = substituentClass(g, n.atom);
      if (!cls) continue;
      if (place === 'o') {
        notes.push(`ortho ${SIGMA[cls].label}: ortho effects are not estimated (larger error)`);
        continue;
      }
      const s = SIGMA[cls][place];
      sum += s;
      terms.push(`${place}-${SIGMA[cls].label} σ ${s.toFixed(2)}`);
    }
  });
  return { sum, terms, notes };
}

const round1 = (x: number) => Math.round(x * 10) / 10;

function estimate(
  group: string,
  type: 'acid' | 'base',
  atom: number,
  pKa: number,
  detail: string,
  notes: string[] = [],
): IonisableGroup {
  return {
    group,
    type,
    atom,
    pKa: round1(pKa),
    method: `${PKA_METHOD}; ${detail}`,
    typicalError: PKA_TYPICAL_ERROR,
    notes: [...notes, PKA_FROM_MEMORY],
  };
}

function notCovered(group: string, type: 'acid' | 'base', atom: number): IonisableGroup {
  return {
    group,
    type,
    atom,
    pKa: null,
    method: 'found from the structure; the estimation method does not cover this group',
    typicalError: null,
    notes: [],
  };
}

/**
 * Find the acidic and basic groups of a structure and estimate their pKa.
 *
 * @returns the groups (empty for a neutral compound), or the parse error
 *
 * Example: 'CCNC(=O)NCCCN(C)C' (a dimethylaminopropyl urea) → one tertiary
 * aliphatic amine, pKa ≈ 10.1 (base); the urea nitrogens are not basic.
 */
export function findIonisableGroups(
  input: StructureInput,
): { ok: true; groups: IonisableGroup[] } | { ok: false; error: string } {
  const loaded = loadGraph(input);
  if (!loaded.ok) return loaded;
  const g = loaded.graph;
  const groups: IonisableGroup[] = [];
  for (const a of g.atoms) {
    const e = el(g, a);
    if ((g.charge.get(a) ?? 0) !== 0) continue;
    const ns = nb(g, a);
    // --- acids
    if (e === 'C' && isCarbonyl(g, a)) {
      const oh = ns.find((n) => n.order === 1 && el(g, n.atom) === 'O' && h(g, n.atom) === 1);
      const dblO = ns.find((n) => n.order === 2 && el(g, n.atom) === 'O');
      if (oh && dblO) {
        const r = ns.find((n) => n.atom !== oh.atom && n.atom !== dblO.atom);
        if (r && arom(g, r.atom)) {
          const hs = hammettSum(g, r.atom, a);
          groups.push(
            estimate(
              'aromatic carboxylic acid',
              'acid',
              a,
              PARENT.aromaticCarboxylic - RHO.aromaticCarboxylic * hs.sum,
              `benzoic acid 4.20 − ρ 1.00 × Σσ ${hs.sum.toFixed(2)}${hs.terms.length ? ` (${hs.terms.join(', ')})` : ''}`,
              hs.notes,
            ),
          );
        } else {
          const sh = aliphaticShift(g, a, new Set([a, oh.atom, dblO.atom]), 2);
          groups.push(
            estimate(
              'carboxylic acid',
              'acid',
              a,
              PARENT.aliphaticCarboxylic - sh.shift,
              `acetic acid 4.76 − ΔpKa ${sh.shift.toFixed(2)}${sh.terms.length ? ` (${sh.terms.join(', ')})` : ''}`,
            ),
          );
        }
        continue;
      }
    }
    if (e === 'O' && h(g, a) === 1 && ns.length === 1) {
      const c = ns[0].atom;
      if (arom(g, c) && el(g, c) === 'C') {
        const hs = hammettSum(g, c, a);
        groups.push(
          estimate(
            'phenol',
            'acid',
            a,
            PARENT.phenol - RHO.phenol * hs.sum,
            `phenol 9.99 − ρ 2.23 × Σσ ${hs.sum.toFixed(2)}${hs.terms.length ? ` (${hs.terms.join(', ')})` : ''}`,
            hs.notes,
          ),
        );
        continue;
      }
    }
    if (e === 'S' && ns.filter((n) => n.order === 2 && el(g, n.atom) === 'O').length >= 2) {
      if (ns.some((n) => n.order === 1 && el(g, n.atom) === 'O' && h(g, n.atom) === 1))
        groups.push(notCovered('sulfonic acid', 'acid', a));
      for (const n of ns)
        if (el(g, n.atom) === 'N' && h(g, n.atom) > 0)
          groups.push(notCovered('sulfonamide N–H', 'acid', n.atom));
      continue;
    }
    if (e === 'P' && ns.some((n) => el(g, n.atom) === 'O' && h(g, n.atom) === 1)) {
      groups.push(notCovered('phosphonic or phosphoric acid', 'acid', a));
      continue;
    }
    if (e !== 'N') continue;
    // --- nitrogen: imides, azoles, amidines, amines
    const carbonylNeighbours = ns.filter((n) => isCarbonyl(g, n.atom)).length;
    if (carbonylNeighbours >= 2 && h(g, a) === 1) {
      groups.push(notCovered('imide N–H', 'acid', a));
      continue;
    }
    if (arom(g, a)) {
      const ring = g.rings.find((r) => r.atoms.includes(a));
      const ringNs = ring ? ring.atoms.filter((x) => el(g, x) === 'N') : [];
      if (ring && ring.atoms.length === 5 && ringNs.length >= 4) {
        if (h(g, a) === 1) groups.push(notCovered('tetrazole N–H', 'acid', a));
        continue;
      }
      if (h(g, a) > 0 || ns.length !== 2) continue;
      if (ring?.atoms.length === 6 && ringNs.length === 1)
        groups.push(
          estimate('pyridine nitrogen', 'base', a, PARENT.pyridine, 'pyridinium 5.25', [
            'ring substituents are not estimated for pyridines (larger error)',
          ]),
        );
      else if (
        ring?.atoms.length === 5 &&
        ringNs.length === 2 &&
        ringNs.some((x) => x !== a && (h(g, x) > 0 || nb(g, x).length === 3))
      )
        groups.push(
          estimate('imidazole nitrogen', 'base', a, PARENT.imidazole, 'imidazolium 6.95', [
            'ring substituents are not estimated for imidazoles (larger error)',
          ]),
        );
      continue;
    }
    if (carbonylNeighbours > 0) continue; // amide, carbamate, urea: not basic in water
    if (ns.some((n) => ['O', 'S', 'P'].includes(el(g, n.atom)) || el(g, n.atom) === 'N')) continue; // hydroxylamine, sulfonamide, hydrazine: not covered as bases
    const amidineC = ns.find(
      (n) =>
        el(g, n.atom) === 'C' &&
        nb(g, n.atom).some((m) => m.atom !== a && el(g, m.atom) === 'N' && m.order === 2),
    );
    if (ns.some((n) => n.order === 2 && el(g, n.atom) === 'C') || amidineC) {
      const c = amidineC?.atom ?? ns.find((n) => n.order === 2)!.atom;
      const nCount = nb(g, c).filter((m) => el(g, m.atom) === 'N').length;
      // Report the amidine/guanidine once, at its carbon.
      if (!groups.some((x) => x.atom === c))
        groups.push(notCovered(nCount >= 3 ? 'guanidine' : 'amidine', 'base', c));
      continue;
    }
    if (ns.some((n) => n.order !== 1)) continue; // imine, nitrile, nitro
    const arylNeighbour = ns.find((n) => arom(g, n.atom));
    if (arylNeighbour) {
      if (ns.filter((n) => arom(g, n.atom)).length > 1) continue; // diarylamine: barely basic
      const hs = hammettSum(g, arylNeighbour.atom, a);
      groups.push(
        estimate(
          'aromatic amine (aniline)',
          'base',
          a,
          PARENT.aniline - RHO.aniline * hs.sum,
          `anilinium 4.60 − ρ 2.89 × Σσ ${hs.sum.toFixed(2)}${hs.terms.length ? ` (${hs.terms.join(', ')})` : ''}`,
          hs.notes,
        ),
      );
      continue;
    }
    if (ns.some((n) => hasDoubleBond(g, n.atom) && !isCarbonyl(g, n.atom))) continue; // enamine
    const carbons = ns.length;
    const parent =
      carbons <= 1
        ? PARENT.primaryAmine
        : carbons === 2
          ? PARENT.secondaryAmine
          : PARENT.tertiaryAmine;
    const name =
      carbons <= 1
        ? 'primary aliphatic amine'
        : carbons === 2
          ? 'secondary aliphatic amine'
          : 'tertiary aliphatic amine';
    const sh = aliphaticShift(g, a, new Set([a]), 3);
    groups.push(
      estimate(
        name,
        'base',
        a,
        parent - sh.shift,
        `${name.split(' ')[0]} amine ${parent} − ΔpKa ${sh.shift.toFixed(2)}${sh.terms.length ? ` (${sh.terms.join(', ')})` : ''}`,
      ),
    );
  }
  return { ok: true, groups };
}
