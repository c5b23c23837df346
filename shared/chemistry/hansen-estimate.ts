/**
 * Hansen solubility parameters estimated from structure by the group
 * contributions of Hoftyzer and Van Krevelen:
 *
 *   δD = ΣFd,i / V      δP = √(ΣFp,i²) / V      δH = √(ΣEh,i / V)
 *
 * with Fd, Fp [J^0.5·cm^1.5/mol], Eh [J/mol] per group and V the molar volume
 * [cm³/mol] (measured, or by the group increments of Fedors).
 *
 * Sources (numbers below are UNVERIFIED (memory): recalled from the printed
 * tables, which could not be read when this was written — verify):
 *  - D. W. Van Krevelen, K. te Nijenhuis, *Properties of Polymers*, 4th ed.,
 *    Elsevier 2009, ch. 7, Table 7.10 (Hoftyzer–Van Krevelen increments).
 *    doi:10.1016/B978-0-08-054819-7.X0001-5
 *  - R. F. Fedors, Polym. Eng. Sci. 1974, 14, 147–154 (molar-volume
 *    increments). doi:10.1002/pen.760140211
 * The symmetry correction of the method (δP × 0.5 for one plane of symmetry,
 * × 0.25 for two) is not applied: the caller is warned.
 */
import type { HansenParams } from '../engine/properties/hansen';
import { loadGraph, type AtomGraph, type StructureInput } from './structure';

interface GroupIncrement {
  name: string;
  Fd: number;
  Fp: number;
  Eh: number;
  /** Fedors molar-volume increment [cm³/mol] */
  V: number;
}

/** Hoftyzer–Van Krevelen increments with Fedors volumes. UNVERIFIED (memory). */
export const HVK_GROUPS: Readonly<Record<string, GroupIncrement>> = {
  CH3: { name: '–CH3', Fd: 420, Fp: 0, Eh: 0, V: 33.5 },
  CH2: { name: '–CH2–', Fd: 270, Fp: 0, Eh: 0, V: 16.1 },
  CH: { name: '>CH–', Fd: 80, Fp: 0, Eh: 0, V: -1.0 },
  C: { name: '>C<', Fd: -70, Fp: 0, Eh: 0, V: -19.2 },
  '=CH2': { name: '=CH2', Fd: 400, Fp: 0, Eh: 0, V: 28.5 },
  '=CH': { name: '=CH–', Fd: 200, Fp: 0, Eh: 0, V: 13.5 },
  '=C': { name: '=C<', Fd: 70, Fp: 0, Eh: 0, V: -5.5 },
  phenyl: { name: '–C6H5', Fd: 1430, Fp: 110, Eh: 0, V: 71.4 },
  phenylene: { name: '–C6H4–', Fd: 1270, Fp: 110, Eh: 0, V: 52.4 },
  ring: { name: 'ring (≥ 5 atoms, non-aromatic)', Fd: 190, Fp: 0, Eh: 0, V: 16 },
  OH: { name: '–OH', Fd: 210, Fp: 500, Eh: 20000, V: 10.0 },
  O: { name: '–O–', Fd: 100, Fp: 400, Eh: 3000, V: 3.8 },
  CO: { name: '>C=O', Fd: 290, Fp: 770, Eh: 2000, V: 10.8 },
  CHO: { name: '–CHO', Fd: 470, Fp: 800, Eh: 4500, V: 22.3 },
  COOH: { name: '–COOH', Fd: 530, Fp: 420, Eh: 10000, V: 28.5 },
  COO: { name: '–COO–', Fd: 390, Fp: 490, Eh: 7000, V: 18.0 },
  NH2: { name: '–NH2', Fd: 280, Fp: 0, Eh: 8400, V: 19.2 },
  NH: { name: '>NH', Fd: 160, Fp: 210, Eh: 3100, V: 4.5 },
  N: { name: '>N–', Fd: 20, Fp: 800, Eh: 5000, V: -9.0 },
  CN: { name: '–C≡N', Fd: 430, Fp: 1100, Eh: 2500, V: 24.0 },
  NO2: { name: '–NO2', Fd: 500, Fp: 1070, Eh: 1500, V: 24.0 },
  Cl: { name: '–Cl', Fd: 450, Fp: 550, Eh: 400, V: 24.0 },
};

export type MolarVolumeInput = { kind: 'measured'; cm3mol: number } | { kind: 'fedors' };

export type HansenEstimate =
  | {
      ok: true;
      params: HansenParams;
      molarVolumeCm3mol: number;
      molarVolumeBasis: 'measured' | 'Fedors group increments';
      groups: Array<{ group: string; name: string; count: number; atoms: number[] }>;
      method: string;
      warnings: string[];
    }
  | {
      ok: false;
      reason: string;
      groups: Array<{ group: string; name: string; count: number; atoms: number[] }>;
      unassignedAtoms: Array<{ index: number; element: string; reason: string }>;
    };

function match(g: AtomGraph): {
  hits: Array<{ group: string; atoms: number[] }>;
  left: number[];
  amideSplit: boolean;
} {
  let amideSplit = false;
  const claimed = new Set<number>();
  const hits: Array<{ group: string; atoms: number[] }> = [];
  const el = (a: number) => g.element.get(a) as string;
  const H = (a: number) => g.hydrogens.get(a) as number;
  const nb = (a: number) => g.neighbours.get(a) ?? [];
  const take = (group: string, atoms: number[]) => {
    atoms.forEach((a) => claimed.add(a));
    hits.push({ group, atoms });
  };
  // Benzene rings: mono-substituted → phenyl, di-substituted → phenylene.
  for (const ring of g.rings) {
    if (
      !ring.aromatic ||
      ring.atoms.length !== 6 ||
      !ring.atoms.every((a) => el(a) === 'C' && !claimed.has(a))
    )
      continue;
    const fused = ring.atoms.some((a) => g.rings.filter((r) => r.atoms.includes(a)).length > 1);
    if (fused) continue;
    const subst = ring.atoms.filter((a) => H(a) === 0).length;
    if (subst === 1) take('phenyl', [...ring.atoms]);
    else if (subst === 2) take('phenylene', [...ring.atoms]);
  }
  // Non-aromatic rings (≥ 5 atoms) add a ring increment (atoms stay for their own groups).
  for (const ring of g.rings) {
    if (!ring.aromatic && ring.atoms.length >= 5) hits.push({ group: 'ring', atoms: [] });
  }
  for (const a of g.atoms) {
    if (claimed.has(a) || ((g.charge.get(a) ?? 0) !== 0 && el(a) !== 'N' && el(a) !== 'O'))
      continue;
    const e = el(a);
    if (e === 'C' && !g.aromatic.get(a)) {
      const dO = nb(a).find((x) => x.order === 2 && el(x.atom) === 'O' && nb(x.atom).length === 1);
      if (dO) {
        if (nb(a).some((x) => el(x.atom) === 'N')) {
          // Amides (anilides included): split into >C=O and the nitrogen's own
          // >NH / >N– / –NH2 increment, a group-split fallback marked in the warnings.
          take('CO', [a, dO.atom]);
          amideSplit = true;
          continue;
        }
        const sO = nb(a).find((x) => x.order === 1 && el(x.atom) === 'O' && !claimed.has(x.atom));
        if (sO && H(sO.atom) === 1) take('COOH', [a, dO.atom, sO.atom]);
        else if (sO && H(sO.atom) === 0 && nb(sO.atom).length === 2)
          take('COO', [a, dO.atom, sO.atom]);
        else if (nb(a).filter((x) => el(x.atom) === 'C').length === 2) take('CO', [a, dO.atom]);
        else if (H(a) === 1 && nb(a).length === 2) take('CHO', [a, dO.atom]);
        continue;
      }
      const tN = nb(a).find((x) => x.order === 3 && el(x.atom) === 'N');
      if (tN) {
        take('CN', [a, tN.atom]);
        continue;
      }
      const dbl = nb(a).some((x) => x.order === 2 && el(x.atom) === 'C');
      if (dbl) {
        const k = ({ 2: '=CH2', 1: '=CH', 0: '=C' } as Record<number, string>)[H(a)];
        if (k) take(k, [a]);
        continue;
      }
      if (nb(a).every((x) => x.order === 1)) {
        const k = ({ 3: 'CH3', 2: 'CH2', 1: 'CH', 0: 'C' } as Record<number, string>)[H(a)];
        if (k) take(k, [a]);
      }
    }
  }
  for (const a of g.atoms) {
    if (claimed.has(a)) continue;
    const e = el(a);
    const bonds = nb(a);
    if (e === 'O' && bonds.every((x) => x.order === 1)) {
      if (H(a) === 1 && bonds.length === 1) take('OH', [a]);
      else if (H(a) === 0 && bonds.length === 2) take('O', [a]);
    } else if (e === 'N' && !g.aromatic.get(a)) {
      const os = bonds.filter((x) => el(x.atom) === 'O' && nb(x.atom).length === 1);
      if (os.length === 2 && bonds.length === 3) take('NO2', [a, ...os.map((x) => x.atom)]);
      else if (bonds.every((x) => x.order === 1)) {
        const k = ({ 2: 'NH2', 1: 'NH', 0: 'N' } as Record<number, string>)[H(a)];
        if (k) take(k, [a]);
      }
    } else if (e === 'Cl') {
      take('Cl', [a]);
    }
  }
  return { hits, left: g.atoms.filter((a) => !claimed.has(a)), amideSplit };
}

/**
 * Estimate δD, δP, δH of a molecule (Hoftyzer–Van Krevelen).
 *
 * @param structure `{ smiles }` or `{ molfile }`
 * @param molarVolume `{ kind: 'measured', cm3mol }` (M/ρ of the liquid, or
 *   of the subcooled liquid for a solid, [cm³/mol]) or `{ kind: 'fedors' }`
 * @returns the estimate with the groups it used, or `ok: false` with the
 *   atoms no group covers (no partial estimate is returned)
 *
 * Validity: an estimate for screening, typically within 1–3 MPa^0.5 per
 * component of handbook values for simple molecules (see the reference
 * tests); δH of weakly H-bonding groups and δP of symmetric molecules are
 * the weakest. Covered: alkyl, alkene, mono/di-substituted benzene rings,
 * OH, ether, ketone, aldehyde, acid, ester, amines, nitrile, nitro, Cl.
 *
 * Example: ethanol, V = 58.5 cm³/mol → δD = (420+270+210)/58.5 = 15.4,
 * δP = 500/58.5 = 8.5, δH = √(20000/58.5) = 18.5 MPa^0.5.
 */
export function estimateHansen(
  structure: StructureInput,
  molarVolume: MolarVolumeInput,
): HansenEstimate {
  const r = loadGraph(structure);
  if (!r.ok) return { ok: false, reason: r.error, groups: [], unassignedAtoms: [] };
  const { hits, left, amideSplit } = match(r.graph);
  const counts = new Map<string, { count: number; atoms: number[] }>();
  for (const h of hits) {
    const e = counts.get(h.group) ?? { count: 0, atoms: [] };
    e.count++;
    e.atoms.push(...h.atoms);
    counts.set(h.group, e);
  }
  const groups = [...counts.entries()].map(([group, v]) => ({
    group,
    name: HVK_GROUPS[group].name,
    count: v.count,
    atoms: v.atoms.sort((a, b) => a - b),
  }));
  if (left.length > 0) {
    return {
      ok: false,
      reason: `${left.length} heavy atom(s) are not covered by the Hoftyzer–Van Krevelen groups implemented here.`,
      groups,
      unassignedAtoms: left.map((a) => ({
        index: a,
        element: r.graph.element.get(a) as string,
        reason: r.graph.aromatic.get(a)
          ? 'aromatic atom outside a mono- or di-substituted benzene ring'
          : 'no group increment for this atom environment',
      })),
    };
  }
  let Fd = 0;
  let Fp2 = 0;
  let Eh = 0;
  let Vf = 0;
  for (const [g, v] of counts) {
    const inc = HVK_GROUPS[g];
    Fd += v.count * inc.Fd;
    Fp2 += v.count * inc.Fp * inc.Fp;
    Eh += v.count * inc.Eh;
    Vf += v.count * inc.V;
  }
  const warnings = [
    ...(amideSplit
      ? [
          'Fallback for the amide link, which the group set has no increment for: taken as >C=O plus the nitrogen group (group split); expect a larger error.',
        ]
      : []),
    'Group-contribution estimate (Hoftyzer–Van Krevelen); increments UNVERIFIED (memory) — verify against the printed table. Prefer measured parameters.',
    'No symmetry correction applied: δP is overestimated for symmetric molecules (e.g. para-disubstituted rings).',
  ];
  let V: number;
  let basis: 'measured' | 'Fedors group increments';
  if (molarVolume.kind === 'measured') {
    if (!Number.isFinite(molarVolume.cm3mol) || molarVolume.cm3mol <= 0) {
      return {
        ok: false,
        reason: `Molar volume must be a positive number of cm³/mol (got ${molarVolume.cm3mol}).`,
        groups,
        unassignedAtoms: [],
      };
    }
    V = molarVolume.cm3mol;
    basis = 'measured';
  } else {
    V = Vf;
    basis = 'Fedors group increments';
    warnings.push(
      'Molar volume from Fedors increments (UNVERIFIED (memory)); a measured M/ρ is better.',
    );
    if (!(V > 0))
      return {
        ok: false,
        reason: 'The Fedors molar volume came out non-positive; give a measured molar volume.',
        groups,
        unassignedAtoms: [],
      };
  }
  const params: HansenParams = { d: Fd / V, p: Math.sqrt(Fp2) / V, h: Math.sqrt(Eh / V) };
  return {
    ok: true,
    params,
    molarVolumeCm3mol: V,
    molarVolumeBasis: basis,
    groups,
    method:
      'Hoftyzer–Van Krevelen group contributions (Van Krevelen & te Nijenhuis, Properties of Polymers, 4th ed., 2009, ch. 7)',
    warnings,
  };
}
