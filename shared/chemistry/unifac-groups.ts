/**
 * Automatic assignment of original-UNIFAC subgroups (Fredenslund, Jones &
 * Prausnitz, AIChE J. 1975, 21, 1086; subgroup list of Hansen et al.,
 * Ind. Eng. Chem. Res. 1991, 30, 2352, numbered as in the DDBST list carried
 * by shared/engine/data/unifac.ts) from a structure.
 *
 * Method: substructure matching on the heavy-atom graph with implicit
 * hydrogens. Matchers run from larger groups to smaller, each claiming only
 * atoms no earlier matcher took:
 *   whole-molecule groups (water, methanol, DMSO, DMF, NMP, 1,2-ethanediol,
 *   formic acid, CS2) → nitro → carboxylic acid → ester → amide → aldehyde →
 *   ketone → nitrile → pyridine and thiophene rings → amines → ethers →
 *   thiols and sulfides → hydroxyl → halogens → alkynes → alkenes → aromatic
 *   carbons (ACCH3/ACCH2/ACCH/AC/ACH) → alkyl CH3/CH2/CH/C.
 * Conventions (as in the DDBST assignments and the examples of Hansen et al.):
 * a group that includes a neighbouring carbon (CH3CO, CH3COO, CH3O, CH2NH2,
 * CH3CN, ...) takes a CH3 neighbour before a CH2 neighbour before a CH;
 * the ester group sits on the acyl side (ethyl acetate = CH3COO + CH2 + CH3);
 * an ether oxygen in a saturated five-membered ring takes a ring CH2 as the
 * THF subgroup (tetrahydrofuran = THF + 3 CH2); other cyclic ethers use
 * CH2O (1,4-dioxane = 2 CH2O + 2 CH2); Br and I are atom groups.
 * Atoms no matcher covers are listed with the reason; nothing is guessed.
 */
import type { UnifacGroups } from '../engine/data/types';
import { UNIFAC_SUBGROUPS } from '../engine/data/unifac';
import { loadGraph, type AtomGraph, type StructureInput } from './structure';

export interface UnifacAssignment {
  groups: UnifacGroups;
  summary: Array<{ subgroup: number; name: string; count: number; atoms: number[] }>;
  unassignedAtoms: Array<{ index: number; element: string; reason: string }>;
  warnings: string[];
}

interface Ctx {
  g: AtomGraph;
  claimed: Map<number, number>; // atom → subgroup
  hits: Array<{ subgroup: number; atoms: number[] }>;
  reasons: Map<number, string>;
}

const HALOGENS = new Set(['F', 'Cl', 'Br', 'I']);

function el(c: Ctx, a: number): string {
  return c.g.element.get(a) as string;
}
function H(c: Ctx, a: number): number {
  return c.g.hydrogens.get(a) as number;
}
function nbrs(c: Ctx, a: number): Array<{ atom: number; order: number }> {
  return c.g.neighbours.get(a) ?? [];
}
function free(c: Ctx, a: number): boolean {
  return !c.claimed.has(a);
}
function arom(c: Ctx, a: number): boolean {
  return c.g.aromatic.get(a) === true;
}
function claim(c: Ctx, subgroup: number, atoms: number[]): void {
  for (const a of atoms) c.claimed.set(a, subgroup);
  c.hits.push({ subgroup, atoms });
}

/** sp3 carbon with only single bonds, unclaimed, not aromatic and without halogen neighbours. */
function plainAlkyl(c: Ctx, a: number): boolean {
  if (el(c, a) !== 'C' || arom(c, a) || !free(c, a) || (c.g.charge.get(a) ?? 0) !== 0) return false;
  return nbrs(c, a).every((n) => n.order === 1 && !HALOGENS.has(el(c, n.atom)));
}

/** Pick a neighbour carbon for a group that includes it: CH3, then CH2, then CH (by `allowed`). */
function pickAlkyl(
  c: Ctx,
  center: number,
  hs: number[],
  exclude: number[] = [],
): number | undefined {
  for (const h of hs) {
    for (const n of nbrs(c, center)) {
      if (exclude.includes(n.atom)) continue;
      if (plainAlkyl(c, n.atom) && H(c, n.atom) === h) return n.atom;
    }
  }
  return undefined;
}

function doubleO(c: Ctx, a: number): number | undefined {
  const n = nbrs(c, a).find(
    (x) =>
      x.order === 2 && el(c, x.atom) === 'O' && nbrs(c, x.atom).length === 1 && free(c, x.atom),
  );
  return n?.atom;
}

function wholeMolecule(c: Ctx): boolean {
  const g = c.g;
  const n = g.atoms.length;
  const count = (e: string) => g.atoms.filter((a) => el(c, a) === e).length;
  const totalH = g.atoms.reduce((s, a) => s + H(c, a), 0);
  const sig = (formula: Record<string, number>, h: number) =>
    totalH === h &&
    Object.entries(formula).every(([e, k]) => count(e) === k) &&
    Object.values(formula).reduce((s, k) => s + k, 0) === n;
  if (g.atoms.some((a) => (g.charge.get(a) ?? 0) !== 0)) return false;
  const all = [...g.atoms];
  if (sig({ O: 1 }, 2)) return (claim(c, 16, all), true); // water
  if (sig({ C: 1, O: 1 }, 4)) return (claim(c, 15, all), true); // methanol
  if (sig({ C: 1, S: 2 }, 0)) return (claim(c, 58, all), true); // CS2
  if (sig({ C: 1, O: 2 }, 2) && all.some((a) => el(c, a) === 'C' && doubleO(c, a) !== undefined))
    return (claim(c, 43, all), true); // formic acid
  if (sig({ C: 2, S: 1, O: 1 }, 6)) {
    const s = all.find((a) => el(c, a) === 'S') as number;
    if (nbrs(c, s).length === 3) return (claim(c, 67, all), true); // DMSO
  }
  if (sig({ C: 3, N: 1, O: 1 }, 7)) {
    const nAt = all.find((a) => el(c, a) === 'N') as number;
    const carbonyl = all.find((a) => el(c, a) === 'C' && doubleO(c, a) !== undefined);
    if (carbonyl !== undefined && H(c, carbonyl) === 1 && nbrs(c, nAt).length === 3)
      return (claim(c, 72, all), true); // DMF
  }
  if (sig({ C: 5, N: 1, O: 1 }, 9)) {
    const nAt = all.find((a) => el(c, a) === 'N') as number;
    const carbonyl = all.find((a) => el(c, a) === 'C' && doubleO(c, a) !== undefined);
    if (
      carbonyl !== undefined &&
      c.g.ringSize.get(nAt) === 5 &&
      nbrs(c, nAt).some((x) => H(c, x.atom) === 3)
    )
      return (claim(c, 85, all), true); // NMP
  }
  if (sig({ C: 2, O: 2 }, 6)) {
    const os = all.filter((a) => el(c, a) === 'O');
    if (os.every((o) => H(c, o) === 1)) return (claim(c, 62, all), true); // 1,2-ethanediol (DOH)
  }
  return false;
}

function nitro(c: Ctx): void {
  for (const nAt of c.g.atoms) {
    if (el(c, nAt) !== 'N' || !free(c, nAt)) continue;
    const os = nbrs(c, nAt).filter((x) => el(c, x.atom) === 'O' && nbrs(c, x.atom).length === 1);
    const cs = nbrs(c, nAt).filter((x) => el(c, x.atom) === 'C');
    if (os.length !== 2 || cs.length !== 1) continue;
    const C = cs[0].atom;
    const grp = [nAt, os[0].atom, os[1].atom];
    if (arom(c, C) && free(c, C)) claim(c, 57, [C, ...grp]);
    else if (plainAlkyl(c, C) && H(c, C) === 3) claim(c, 54, [C, ...grp]);
    else if (plainAlkyl(c, C) && H(c, C) === 2) claim(c, 55, [C, ...grp]);
    else if (plainAlkyl(c, C) && H(c, C) === 1) claim(c, 56, [C, ...grp]);
  }
}

function acids(c: Ctx): void {
  for (const C of c.g.atoms) {
    if (el(c, C) !== 'C' || arom(c, C) || !free(c, C)) continue;
    const o2 = doubleO(c, C);
    if (o2 === undefined) continue;
    const oh = nbrs(c, C).find(
      (x) =>
        x.order === 1 &&
        el(c, x.atom) === 'O' &&
        H(c, x.atom) === 1 &&
        nbrs(c, x.atom).length === 1,
    );
    if (!oh) continue;
    const carbonNbrs = nbrs(c, C).filter((x) => el(c, x.atom) === 'C');
    if (carbonNbrs.length === 1 && nbrs(c, C).length === 3) claim(c, 42, [C, o2, oh.atom]);
  }
}

function esters(c: Ctx): void {
  for (const C of c.g.atoms) {
    if (el(c, C) !== 'C' || arom(c, C) || !free(c, C)) continue;
    const o2 = doubleO(c, C);
    if (o2 === undefined) continue;
    const oe = nbrs(c, C).find(
      (x) =>
        x.order === 1 &&
        el(c, x.atom) === 'O' &&
        free(c, x.atom) &&
        H(c, x.atom) === 0 &&
        nbrs(c, x.atom).length === 2 &&
        nbrs(c, x.atom).every((y) => el(c, y.atom) === 'C'),
    );
    if (!oe) continue;
    const acyl = nbrs(c, C).filter((x) => x.atom !== o2 && x.atom !== oe.atom);
    if (acyl.length === 0 && H(c, C) === 1) {
      claim(c, 23, [C, o2, oe.atom]); // formate HCOO
      continue;
    }
    if (acyl.length !== 1 || el(c, acyl[0].atom) !== 'C') continue; // carbonates, etc.
    const R = acyl[0].atom;
    if (plainAlkyl(c, R) && H(c, R) === 3) claim(c, 21, [R, C, o2, oe.atom]);
    else if (plainAlkyl(c, R) && H(c, R) === 2) claim(c, 22, [R, C, o2, oe.atom]);
    else claim(c, 77, [C, o2, oe.atom]); // COO
  }
}

function amides(c: Ctx): void {
  for (const C of c.g.atoms) {
    if (el(c, C) !== 'C' || arom(c, C) || !free(c, C)) continue;
    const o2 = doubleO(c, C);
    if (o2 === undefined) continue;
    const nn = nbrs(c, C).find(
      (x) => x.order === 1 && el(c, x.atom) === 'N' && free(c, x.atom) && !arom(c, x.atom),
    );
    if (!nn) continue;
    const N = nn.atom;
    const others = nbrs(c, N).filter((x) => x.atom !== C);
    if (others.some((x) => x.order !== 1 || el(c, x.atom) !== 'C')) continue;
    const hN = H(c, N);
    const core = [C, o2, N];
    if (
      H(c, C) === 1 &&
      hN === 0 &&
      others.length === 2 &&
      others.every((x) => plainAlkyl(c, x.atom) && H(c, x.atom) === 2)
    ) {
      claim(c, 73, core); // HCON(CH2)2
      continue;
    }
    if (nbrs(c, C).filter((x) => el(c, x.atom) === 'C').length !== 1) continue; // formamides other than the above
    if (hN === 2 && others.length === 0) {
      claim(c, 94, core);
    } else if (hN === 1 && others.length === 1) {
      const R = others[0].atom;
      if (plainAlkyl(c, R) && H(c, R) === 3) claim(c, 95, [...core, R]);
      else if (plainAlkyl(c, R) && H(c, R) === 2) claim(c, 96, [...core, R]);
    } else if (hN === 0 && others.length === 2) {
      const [a, b] = others.map((x) => x.atom);
      const h3 = (x: number) => plainAlkyl(c, x) && H(c, x) === 3;
      const h2 = (x: number) => plainAlkyl(c, x) && H(c, x) === 2;
      if (h3(a) && h3(b)) claim(c, 97, [...core, a, b]);
      else if (h3(a) && h2(b)) claim(c, 98, [...core, a, b]);
      else if (h2(a) && h3(b)) claim(c, 98, [...core, b, a]);
      else if (h2(a) && h2(b)) claim(c, 99, [...core, a, b]);
    }
  }
}

function carbonyls(c: Ctx): void {
  for (const C of c.g.atoms) {
    if (el(c, C) !== 'C' || arom(c, C) || !free(c, C)) continue;
    const o2 = doubleO(c, C);
    if (o2 === undefined) continue;
    const cn = nbrs(c, C).filter((x) => x.atom !== o2);
    if (!cn.every((x) => el(c, x.atom) === 'C' && x.order === 1)) continue;
    if (cn.length === 1 && H(c, C) === 1) {
      claim(c, 20, [C, o2]); // aldehyde CHO
    } else if (cn.length === 2) {
      const R = pickAlkyl(c, C, [3, 2]);
      if (R !== undefined) claim(c, H(c, R) === 3 ? 18 : 19, [R, C, o2]);
      else
        c.reasons.set(
          C,
          'ketone carbonyl with no CH3 or CH2 neighbour: no original UNIFAC subgroup',
        );
    }
  }
}

function nitriles(c: Ctx): void {
  for (const N of c.g.atoms) {
    if (el(c, N) !== 'N' || !free(c, N)) continue;
    const t = nbrs(c, N);
    if (t.length !== 1 || t[0].order !== 3 || el(c, t[0].atom) !== 'C') continue;
    const C = t[0].atom;
    const R = pickAlkyl(c, C, [3, 2], [N]);
    if (R !== undefined) claim(c, H(c, R) === 3 ? 40 : 41, [R, C, N]);
    else {
      c.reasons.set(
        C,
        'nitrile on an aromatic, vinylic or branched carbon: no original UNIFAC subgroup assigned',
      );
      c.reasons.set(
        N,
        'nitrile on an aromatic, vinylic or branched carbon: no original UNIFAC subgroup assigned',
      );
    }
  }
}

function heteroaromaticRings(c: Ctx): void {
  for (const ring of c.g.rings) {
    if (!ring.aromatic) continue;
    if (!ring.atoms.every((a) => free(c, a) && (c.g.charge.get(a) ?? 0) === 0)) continue;
    const hetero = ring.atoms.filter((a) => el(c, a) !== 'C');
    const carbons = ring.atoms.filter((a) => el(c, a) === 'C');
    const hC = carbons.reduce((s, a) => s + H(c, a), 0);
    if (
      ring.atoms.length === 6 &&
      hetero.length === 1 &&
      el(c, hetero[0]) === 'N' &&
      H(c, hetero[0]) === 0
    ) {
      const sg = hC === 5 ? 37 : hC === 4 ? 38 : hC === 3 ? 39 : undefined;
      if (sg) claim(c, sg, [...ring.atoms]);
    } else if (ring.atoms.length === 5 && hetero.length === 1 && el(c, hetero[0]) === 'S') {
      const sg = hC === 4 ? 106 : hC === 3 ? 107 : hC === 2 ? 108 : undefined;
      if (sg) claim(c, sg, [...ring.atoms]);
    }
  }
}

function amines(c: Ctx): void {
  for (const N of c.g.atoms) {
    if (el(c, N) !== 'N' || !free(c, N) || arom(c, N) || (c.g.charge.get(N) ?? 0) !== 0) continue;
    const nb = nbrs(c, N);
    if (!nb.every((x) => x.order === 1 && el(c, x.atom) === 'C')) continue;
    if (
      nb.some(
        (x) =>
          doubleO(c, x.atom) !== undefined ||
          (!free(c, x.atom) &&
            c.claimed.get(x.atom) !== undefined &&
            nbrs(c, x.atom).some((y) => y.order === 2)),
      )
    ) {
      c.reasons.set(
        N,
        'amide nitrogen with substituents that original UNIFAC amide groups do not cover (e.g. anilide, branched N-alkyl)',
      );
      for (const x of nb)
        if (doubleO(c, x.atom) !== undefined && free(c, x.atom))
          c.reasons.set(
            x.atom,
            'amide carbonyl with substituents that original UNIFAC amide groups do not cover',
          );
      continue;
    }
    const h = H(c, N);
    if (h === 2 && nb.length === 1) {
      const C = nb[0].atom;
      if (arom(c, C) && free(c, C)) claim(c, 36, [C, N]);
      else if (plainAlkyl(c, C) && H(c, C) >= 1 && H(c, C) <= 3)
        claim(c, ({ 3: 28, 2: 29, 1: 30 } as Record<number, number>)[H(c, C)], [C, N]);
    } else if (h === 1 && nb.length === 2) {
      const C = pickAlkyl(c, N, [3, 2, 1]);
      if (C !== undefined)
        claim(c, ({ 3: 31, 2: 32, 1: 33 } as Record<number, number>)[H(c, C)], [C, N]);
    } else if (h === 0 && nb.length === 3) {
      const C = pickAlkyl(c, N, [3, 2]);
      if (C !== undefined) claim(c, H(c, C) === 3 ? 34 : 35, [C, N]);
    }
    if (free(c, N))
      c.reasons.set(
        N,
        'amine nitrogen without a CH3/CH2/CH neighbour that original UNIFAC groups cover',
      );
  }
}

function ethers(c: Ctx): void {
  for (const O of c.g.atoms) {
    if (el(c, O) !== 'O' || !free(c, O) || arom(c, O) || H(c, O) !== 0) continue;
    const nb = nbrs(c, O);
    if (nb.length !== 2 || !nb.every((x) => x.order === 1 && el(c, x.atom) === 'C')) continue;
    const inFiveRing = c.g.ringSize.get(O) === 5;
    if (inFiveRing) {
      const C = nb.find(
        (x) => plainAlkyl(c, x.atom) && H(c, x.atom) === 2 && (c.g.ringSize.get(x.atom) ?? 0) === 5,
      );
      if (C) {
        claim(c, 27, [C.atom, O]);
        continue;
      }
    }
    const C = pickAlkyl(c, O, [3, 2, 1]);
    if (C !== undefined)
      claim(c, ({ 3: 24, 2: 25, 1: 26 } as Record<number, number>)[H(c, C)], [C, O]);
    else
      c.reasons.set(
        O,
        'ether oxygen between aromatic or quaternary carbons: no original UNIFAC subgroup',
      );
  }
}

function sulfur(c: Ctx): void {
  for (const S of c.g.atoms) {
    if (el(c, S) !== 'S' || !free(c, S) || arom(c, S)) continue;
    const nb = nbrs(c, S);
    if (!nb.every((x) => x.order === 1 && el(c, x.atom) === 'C')) continue;
    if (H(c, S) === 1 && nb.length === 1) {
      const C = pickAlkyl(c, S, [3, 2]);
      if (C !== undefined) claim(c, H(c, C) === 3 ? 59 : 60, [C, S]);
    } else if (H(c, S) === 0 && nb.length === 2) {
      const C = pickAlkyl(c, S, [3, 2, 1]);
      if (C !== undefined)
        claim(c, ({ 3: 102, 2: 103, 1: 104 } as Record<number, number>)[H(c, C)], [C, S]);
    }
  }
}

function hydroxyls(c: Ctx): void {
  for (const O of c.g.atoms) {
    if (el(c, O) !== 'O' || !free(c, O) || H(c, O) !== 1) continue;
    const nb = nbrs(c, O);
    if (nb.length !== 1 || nb[0].order !== 1 || el(c, nb[0].atom) !== 'C') continue;
    const C = nb[0].atom;
    if (arom(c, C)) {
      if (free(c, C)) claim(c, 17, [C, O]);
    } else if (nbrs(c, C).every((x) => x.order === 1)) {
      claim(c, 14, [O]);
    } else {
      c.reasons.set(
        O,
        'enol or hemi-functional OH on an unsaturated carbon: no original UNIFAC subgroup',
      );
    }
  }
}

function halogens(c: Ctx): void {
  for (const X of c.g.atoms) {
    const e = el(c, X);
    if (!HALOGENS.has(e) || !free(c, X)) continue;
    const nb = nbrs(c, X);
    if (nb.length !== 1 || el(c, nb[0].atom) !== 'C') continue;
    const C = nb[0].atom;
    if (e === 'Br') {
      claim(c, 64, [X]);
      continue;
    }
    if (e === 'I') {
      claim(c, 63, [X]);
      continue;
    }
    if (arom(c, C)) {
      if (free(c, C)) claim(c, e === 'Cl' ? 53 : 71, [C, X]);
      continue;
    }
    const cOrders = nbrs(c, C).map((x) => x.order);
    if (cOrders.some((o) => o === 2) && e === 'Cl') {
      claim(c, 69, [X]); // Cl on a C=C carbon
      continue;
    }
    if (!free(c, C) || cOrders.some((o) => o !== 1)) continue;
    const same = nbrs(c, C)
      .filter((x) => el(c, x.atom) === e)
      .map((x) => x.atom);
    const otherHal = nbrs(c, C).some(
      (x) =>
        HALOGENS.has(el(c, x.atom)) &&
        el(c, x.atom) !== e &&
        el(c, x.atom) !== 'Br' &&
        el(c, x.atom) !== 'I',
    );
    if (otherHal || !same.every((a) => free(c, a))) continue;
    const h = H(c, C);
    const k = same.length;
    let sg: number | undefined;
    if (e === 'Cl') {
      if (k === 1) sg = ({ 2: 44, 1: 45, 0: 46 } as Record<number, number>)[h];
      else if (k === 2) sg = ({ 2: 47, 1: 48, 0: 49 } as Record<number, number>)[h];
      else if (k === 3) sg = ({ 1: 50, 0: 51 } as Record<number, number>)[h];
      else if (k === 4) sg = 52;
    } else if (e === 'F' && h === 0) {
      sg = ({ 3: 74, 2: 75, 1: 76 } as Record<number, number>)[k];
    }
    if (sg !== undefined) claim(c, sg, [C, ...same]);
  }
}

function alkynes(c: Ctx): void {
  for (const a of c.g.atoms) {
    if (el(c, a) !== 'C' || !free(c, a)) continue;
    const t = nbrs(c, a).find((x) => x.order === 3 && el(c, x.atom) === 'C' && free(c, x.atom));
    if (!t) continue;
    const b = t.atom;
    const [h1, h2] = [H(c, a), H(c, b)];
    if (h1 + h2 === 1) claim(c, 65, [a, b]);
    else if (h1 === 0 && h2 === 0) claim(c, 66, [a, b]);
  }
}

function alkenes(c: Ctx): void {
  for (const a of c.g.atoms) {
    if (el(c, a) !== 'C' || !free(c, a) || arom(c, a)) continue;
    const d = nbrs(c, a).filter((x) => x.order === 2);
    if (d.length !== 1 || el(c, d[0].atom) !== 'C') continue;
    const b = d[0].atom;
    if (!free(c, b) || arom(c, b) || nbrs(c, b).filter((x) => x.order === 2).length !== 1) continue;
    let [x, y] = [a, b];
    if (H(c, y) > H(c, x)) [x, y] = [y, x];
    const key = `${H(c, x)}${H(c, y)}`;
    const sg = ({ '21': 5, '11': 6, '20': 7, '10': 8, '00': 70 } as Record<string, number>)[key];
    if (sg !== undefined) claim(c, sg, [x, y]);
    else c.reasons.set(a, 'ethylene (CH2=CH2) has no original UNIFAC subgroup');
  }
}

function aromaticCarbons(c: Ctx): void {
  for (const a of c.g.atoms) {
    if (el(c, a) !== 'C' || !arom(c, a) || !free(c, a)) continue;
    if (H(c, a) === 1) {
      claim(c, 9, [a]);
      continue;
    }
    const R = pickAlkyl(c, a, [3, 2, 1]);
    if (R !== undefined)
      claim(c, ({ 3: 11, 2: 12, 1: 13 } as Record<number, number>)[H(c, R)], [a, R]);
    else claim(c, 10, [a]);
  }
}

function alkyls(c: Ctx): void {
  for (const a of c.g.atoms) {
    if (el(c, a) !== 'C' || !free(c, a) || arom(c, a)) continue;
    if (!nbrs(c, a).every((x) => x.order === 1) || (c.g.charge.get(a) ?? 0) !== 0) continue;
    const sg = ({ 3: 1, 2: 2, 1: 3, 0: 4 } as Record<number, number>)[H(c, a)];
    if (sg !== undefined) claim(c, sg, [a]);
    else c.reasons.set(a, 'methane carbon: no original UNIFAC subgroup');
  }
}

function defaultReason(c: Ctx, a: number): string {
  const e = el(c, a);
  if ((c.g.charge.get(a) ?? 0) !== 0)
    return 'charged atom (salt or zwitterion form): draw the neutral form to assign groups';
  if (arom(c, a))
    return `aromatic ${e} in a ring that original UNIFAC groups do not cover (e.g. furan, pyrrole, fused or substituted heteroaromatics)`;
  switch (e) {
    case 'C':
      return 'carbon in a functional group that the original UNIFAC groups assigned here do not cover';
    case 'O': {
      const carbonylC = nbrs(c, a).find((x) => x.order === 2 && el(c, x.atom) === 'C');
      if (carbonylC && nbrs(c, carbonylC.atom).some((x) => el(c, x.atom) === 'N'))
        return 'amide carbonyl oxygen: the amide as substituted here (e.g. an anilide) has no original UNIFAC group';
      return 'oxygen in a functional group that the original UNIFAC groups assigned here do not cover (e.g. carbonate, peroxide, N-oxide)';
    }
    case 'N':
      return 'nitrogen in a functional group that the original UNIFAC groups assigned here do not cover (e.g. aryl amide, urea, imine, hydrazine)';
    case 'S':
      return 'sulfur in a group not covered here (e.g. sulfoxide other than DMSO, sulfonamide, sulfone)';
    case 'F':
    case 'Cl':
      return `${e} on a carbon that also carries H or another halogen: no original UNIFAC subgroup`;
    default:
      return `element ${e}: no original UNIFAC subgroup`;
  }
}

/**
 * Assign original-UNIFAC subgroups to a structure.
 *
 * @param structure `{ smiles }` or `{ molfile }`
 * @returns subgroup counts (`groups`, keyed by subgroup number), a summary
 *   per subgroup with the atom indices (openchemlib numbering, as in the
 *   drawing), the atoms no group covers with reasons, and warnings. An
 *   unreadable structure gives empty groups and the parse error as a warning.
 *
 * Validity: neutral organic molecules; a salt or charged form is flagged.
 * The assignment is deterministic; ambiguous choices follow the conventions
 * in the module comment. Review and edit in the UI where needed.
 *
 * Example: 'CCO' → { 1: 1, 2: 1, 14: 1 } (CH3 + CH2 + OH);
 * 'CC(=O)OCC' → { 1: 1, 2: 1, 21: 1 }; 'Cc1ccccc1' → { 9: 5, 11: 1 }.
 */
export function assignUnifacGroups(structure: StructureInput): UnifacAssignment {
  const r = loadGraph(structure);
  if (!r.ok) return { groups: {}, summary: [], unassignedAtoms: [], warnings: [r.error] };
  const c: Ctx = { g: r.graph, claimed: new Map(), hits: [], reasons: new Map() };
  const warnings: string[] = [];
  if (r.graph.fragments > 1)
    warnings.push(
      `The structure has ${r.graph.fragments} disconnected parts (a salt or a mixture?); groups are summed over all parts.`,
    );
  if (r.graph.atoms.some((a) => (r.graph.charge.get(a) ?? 0) !== 0)) {
    const nitroLike = r.graph.atoms.every(
      (a) => (r.graph.charge.get(a) ?? 0) === 0 || el(c, a) === 'N' || el(c, a) === 'O',
    );
    if (!nitroLike)
      warnings.push('The structure carries charges; UNIFAC describes neutral molecules.');
  }
  if (!wholeMolecule(c)) {
    nitro(c);
    acids(c);
    esters(c);
    amides(c);
    carbonyls(c);
    nitriles(c);
    heteroaromaticRings(c);
    amines(c);
    ethers(c);
    sulfur(c);
    hydroxyls(c);
    halogens(c);
    alkynes(c);
    alkenes(c);
    aromaticCarbons(c);
    alkyls(c);
  }
  const groups: UnifacGroups = {};
  const bySg = new Map<number, number[]>();
  for (const h of c.hits) {
    groups[h.subgroup] = (groups[h.subgroup] ?? 0) + 1;
    bySg.set(h.subgroup, [...(bySg.get(h.subgroup) ?? []), ...h.atoms]);
  }
  const summary = [...bySg.entries()]
    .sort((a, b) => a[0] - b[0])
    .map(([subgroup, atoms]) => ({
      subgroup,
      name: UNIFAC_SUBGROUPS.get(subgroup)?.name ?? `subgroup ${subgroup}`,
      count: groups[subgroup],
      atoms: [...atoms].sort((x, y) => x - y),
    }));
  for (const s of summary) {
    if (!UNIFAC_SUBGROUPS.has(s.subgroup))
      warnings.push(`Subgroup ${s.subgroup} is not in the parameter table.`);
  }
  const unassignedAtoms = r.graph.atoms
    .filter((a) => !c.claimed.has(a))
    .map((a) => ({ index: a, element: el(c, a), reason: c.reasons.get(a) ?? defaultReason(c, a) }));
  if (unassignedAtoms.length > 0) {
    warnings.push(
      `${unassignedAtoms.length} of ${r.graph.atoms.length} heavy atoms have no UNIFAC group; activity coefficients cannot be computed until they are assigned by hand.`,
    );
  }
  return { groups, summary, unassignedAtoms, warnings };
}
