/**
 * Curated component data: solvents, aqueous media, their bibliography, and the
 * look-ups the calculation API uses to resolve a request's `{ smiles }` to a
 * library solvent.
 */
import type { AqueousSoluteRecord, Source, SolventRecord } from './types';
import { SOLVENTS } from './solvents';
import { AQUEOUS_SOLUTES } from './aqueous';
import { isSourceId, SOURCES, type SourceEntry } from './sources';

export type * from './types';
export { SOLVENTS } from './solvents';
export { AQUEOUS_SOLUTES } from './aqueous';
export { SOURCES, isSourceId } from './sources';
export type { SourceEntry, SourceId } from './sources';

/** Bumped whenever a number, a source or a record changes. */
export const SOLVENT_DATA_VERSION = '1.1.0';

/**
 * Other common writings of the library solvents' SMILES (no cheminformatics:
 * a request's SMILES is matched as a string, so the usual alternatives are
 * listed here). Each maps to a solvent id.
 */
export const SMILES_ALIASES: Readonly<Record<string, string>> = Object.freeze({
  '[OH2]': 'water',
  '[H]O[H]': 'water',
  OC: 'methanol',
  OCC: 'ethanol',
  'C(C)O': 'ethanol',
  OCCC: '1-propanol',
  'CC(O)C': '2-propanol',
  'OC(C)C': '2-propanol',
  OCCCC: '1-butanol',
  'CC(O)CC': '2-butanol',
  'CCC(O)C': '2-butanol',
  'OC(C)CC': '2-butanol',
  'OCC(C)C': 'isobutanol',
  'OC(C)(C)C': 'tert-butanol',
  'CC(C)(O)C': 'tert-butanol',
  OCCCCCCCC: '1-octanol',
  'CC(=O)OCC': 'ethyl-acetate',
  'CCOC(=O)C': 'ethyl-acetate',
  'O=C(C)OCC': 'ethyl-acetate',
  'CC(=O)OC(C)C': 'isopropyl-acetate',
  'CC(C)OC(=O)C': 'isopropyl-acetate',
  'CC(=O)OCCCC': 'n-butyl-acetate',
  'CCCCOC(=O)C': 'n-butyl-acetate',
  'CC(=O)C': 'acetone',
  'O=C(C)C': 'acetone',
  'CCC(=O)C': '2-butanone',
  'CC(=O)CC': '2-butanone',
  'O=C(C)CC': '2-butanone',
  'CC(=O)CC(C)C': 'mibk',
  'CC(C)CC(=O)C': 'mibk',
  O1CCCC1: 'thf',
  C1COCC1: 'thf',
  CC1OCCC1: '2-methyltetrahydrofuran',
  O1CCCC1C: '2-methyltetrahydrofuran',
  'CC(C)(C)OC': 'mtbe',
  'C1CCC(C1)OC': 'cpme',
  'CC(C)OC(C)C': 'diisopropyl-ether',
  C1OCCOC1: '1-4-dioxane',
  O1CCOCC1: '1-4-dioxane',
  'c1ccc(cc1)OC': 'anisole',
  c1ccccc1OC: 'anisole',
  'C1CCC(C)CC1': 'methylcyclohexane',
  c1ccccc1C: 'toluene',
  'c1ccc(C)cc1': 'toluene',
  'c1ccc(C)c(C)c1': 'o-xylene',
  'C(Cl)Cl': 'dichloromethane',
  'C(Cl)(Cl)Cl': 'chloroform',
  'c1ccc(Cl)cc1': 'chlorobenzene',
  c1ccccc1Cl: 'chlorobenzene',
  'N#CC': 'acetonitrile',
  'O=CN(C)C': 'dmf',
  'CN(C)C(C)=O': 'dmac',
  'O=C(C)N(C)C': 'dmac',
  'O=C1CCCN1C': 'nmp',
  'CN1C(=O)CCC1': 'nmp',
  'CS(=O)C': 'dmso',
  'O=S(C)C': 'dmso',
  'C[S+](C)[O-]': 'dmso',
  'CC(O)=O': 'acetic-acid',
  'OC(C)=O': 'acetic-acid',
  'OC(=O)C': 'acetic-acid',
  n1ccccc1: 'pyridine',
  'C1=CC=NC=C1': 'pyridine',
});

const byId = new Map<string, SolventRecord>(SOLVENTS.map((s) => [s.id, s]));
const bySmiles = new Map<string, SolventRecord>();
for (const s of SOLVENTS) bySmiles.set(s.smiles, s);
for (const [smiles, id] of Object.entries(SMILES_ALIASES)) {
  const s = byId.get(id);
  if (s && !bySmiles.has(smiles)) bySmiles.set(smiles, s);
}
const byName = new Map<string, SolventRecord>();
for (const s of SOLVENTS) {
  for (const n of [s.id, s.name, ...(s.synonyms ?? [])]) {
    const key = normaliseName(n);
    if (!byName.has(key)) byName.set(key, s);
  }
}
const aqueousById = new Map<string, AqueousSoluteRecord>(AQUEOUS_SOLUTES.map((a) => [a.id, a]));

function normaliseName(name: string): string {
  return name
    .trim()
    .toLowerCase()
    .replace(/[\s_]+/g, ' ');
}

/**
 * Normalise a SMILES string for the string match: trims and drops whitespace.
 *
 * Source: none needed (string handling; no chemistry: canonicalisation is done in shared/chemistry).
 *
 * @param smiles  SMILES as typed
 * @returns the SMILES without whitespace
 *
 * Validity: any string.
 */
export function normaliseSmiles(smiles: string): string {
  return smiles.replace(/\s+/g, '');
}

/**
 * The library solvent with this id.
 *
 * Source: the solvent library (data/solvents, each value with its own source).
 *
 * @param id  library id (e.g. 'ethyl-acetate')
 * @returns the record, or undefined when no solvent has that id
 *
 * Validity: ids of the library.
 */
export function solventById(id: string): SolventRecord | undefined {
  return byId.get(id);
}

/**
 * The library solvent written as `smiles` (canonical form or a listed alias), if any.
 *
 * Source: the solvent library (data/solvents).
 *
 * @param smiles  SMILES (whitespace ignored; matched as a string, not as a structure)
 * @returns the record, or undefined
 *
 * Validity: the canonical SMILES of the library and their listed aliases.
 */
export function solventBySmiles(smiles: string): SolventRecord | undefined {
  return bySmiles.get(normaliseSmiles(smiles));
}

/**
 * Case-insensitive match on id, name or synonym (e.g. 'THF', 'ethyl acetate').
 *
 * Source: the solvent library (data/solvents).
 *
 * @param name  id, name or synonym (case and repeated spaces ignored)
 * @returns the record, or undefined
 *
 * Validity: names and synonyms listed in the library.
 */
export function solventByName(name: string): SolventRecord | undefined {
  return byName.get(normaliseName(name));
}

/**
 * The aqueous medium solute (salt, acid, base) with this id.
 *
 * Source: the aqueous media table (data/aqueous.ts, each value with its own source).
 *
 * @param id  library id (e.g. 'sodium-chloride')
 * @returns the record, or undefined
 *
 * Validity: ids of the aqueous media table.
 */
export function aqueousSoluteById(id: string): AqueousSoluteRecord | undefined {
  return aqueousById.get(id);
}

/**
 * The bibliography entry a value's source points to.
 *
 * Source: the bibliography (data/sources.ts).
 *
 * @param source  the value's source
 * @returns the entry (citation, address), or undefined when the reference is not in the bibliography
 *
 * Validity: any source record.
 */
export function citationFor(source: Source): SourceEntry | undefined {
  return isSourceId(source.ref) ? SOURCES[source.ref] : undefined;
}
