import {
  compoundCreateSchema,
  type Compound,
  type CompoundCreateInput,
  type CompoundRole,
  type UnifacGroupCounts,
} from '@shared/schemas/compounds';
import { issuesToErrors, type FieldErrors } from '@/lib/use-form';

/** What the form edits: numbers as typed (strings), converted and checked by the shared schema on save. */
export interface CompoundDraft {
  name: string;
  structureKind: 'smiles' | 'molfile';
  smiles: string;
  molfile: string;
  role: CompoundRole;
  pKa: Array<{ value: string; type: 'acid' | 'base' }>;
  logP: string;
  logPMethod: string;
  meltingPointC: string;
  enthalpyFusionKJmol: string;
  hansen: { d: string; p: string; h: string };
  /** Hand-edited groups; null = use the automatic assignment. */
  unifacGroups: UnifacGroupCounts | null;
  solubility: Array<{
    solventId: string;
    temperatureC: string;
    value: string;
    unit: 'g/L' | 'mg/mL' | 'mole-fraction' | 'wt%';
  }>;
  partition: Array<{ organicSolventId: string; pH: string; temperatureC: string; D: string }>;
  notes: string;
  specLimitPct: string;
  solidIncorporation: string;
}

export const emptyDraft = (): CompoundDraft => ({
  name: '',
  structureKind: 'smiles',
  smiles: '',
  molfile: '',
  role: 'impurity',
  pKa: [],
  logP: '',
  logPMethod: '',
  meltingPointC: '',
  enthalpyFusionKJmol: '',
  hansen: { d: '', p: '', h: '' },
  unifacGroups: null,
  solubility: [],
  partition: [],
  notes: '',
  specLimitPct: '',
  solidIncorporation: '',
});

const str = (n: number | null | undefined) => (n === null || n === undefined ? '' : String(n));

export function draftFromCompound(c: Compound): CompoundDraft {
  return {
    name: c.name,
    structureKind: c.smiles ? 'smiles' : 'molfile',
    smiles: c.smiles ?? '',
    molfile: c.molfile ?? '',
    role: c.role,
    pKa: c.pKa.map((p) => ({ value: String(p.value), type: p.type })),
    logP: c.logP?.source === 'measured' ? String(c.logP.value) : '',
    logPMethod: c.logP?.source === 'measured' ? c.logP.method : '',
    meltingPointC: str(c.meltingPointC),
    enthalpyFusionKJmol: str(c.enthalpyFusionKJmol),
    hansen:
      c.hansen?.source === 'entered'
        ? { d: String(c.hansen.d), p: String(c.hansen.p), h: String(c.hansen.h) }
        : { d: '', p: '', h: '' },
    unifacGroups: c.unifac.source === 'edited' ? { ...c.unifac.groups } : null,
    solubility: c.solubility.map((s) => ({
      solventId: s.solventId,
      temperatureC: String(s.temperatureC),
      value: String(s.value),
      unit: s.unit,
    })),
    partition: c.partition.map((p) => ({
      organicSolventId: p.organicSolventId,
      pH: str(p.pH),
      temperatureC: str(p.temperatureC),
      D: String(p.D),
    })),
    notes: c.notes,
    specLimitPct: str(c.specLimitPct),
    solidIncorporation: str(c.solidIncorporation),
  };
}

/** '' → null (not given); anything else → a number (NaN for text, which the schema refuses with a message). */
const num = (s: string): number | null =>
  s.trim() === '' ? null : Number(s.trim().replace(',', '.'));
const optional = (s: string): number | undefined => num(s) ?? undefined;

export function draftToInput(d: CompoundDraft): CompoundCreateInput {
  const logP = num(d.logP);
  const hansenGiven = [d.hansen.d, d.hansen.p, d.hansen.h].some((v) => v.trim() !== '');
  return {
    name: d.name,
    smiles: d.structureKind === 'smiles' ? d.smiles : null,
    molfile: d.structureKind === 'molfile' ? d.molfile : null,
    role: d.role,
    pKa: d.pKa.map((p) => ({ value: num(p.value) as number, type: p.type })),
    logP:
      logP === null
        ? null
        : { value: logP, ...(d.logPMethod.trim() ? { method: d.logPMethod.trim() } : {}) },
    meltingPointC: num(d.meltingPointC),
    enthalpyFusionKJmol: num(d.enthalpyFusionKJmol),
    hansen: hansenGiven
      ? { d: num(d.hansen.d) as number, p: num(d.hansen.p) as number, h: num(d.hansen.h) as number }
      : null,
    unifacGroups: d.unifacGroups,
    solubility: d.solubility.map((s) => ({
      solventId: s.solventId,
      temperatureC: num(s.temperatureC) as number,
      value: num(s.value) as number,
      unit: s.unit,
    })),
    partition: d.partition.map((p) => ({
      organicSolventId: p.organicSolventId,
      pH: optional(p.pH),
      temperatureC: optional(p.temperatureC),
      D: num(p.D) as number,
    })),
    notes: d.notes,
    specLimitPct: num(d.specLimitPct),
    solidIncorporation: num(d.solidIncorporation),
  };
}

/** Checks the draft with the shared schema: the input to send, or the field errors by path. */
export function checkDraft(
  d: CompoundDraft,
): { ok: true; input: CompoundCreateInput } | { ok: false; errors: FieldErrors } {
  const input = draftToInput(d);
  const result = compoundCreateSchema.safeParse(input);
  if (result.success) return { ok: true, input };
  const errors = issuesToErrors(result.error.issues);
  // The structure field the chemist sees is the one in use.
  if (errors.smiles && d.structureKind === 'molfile') errors.molfile = errors.smiles;
  return { ok: false, errors };
}
