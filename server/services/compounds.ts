/**
 * Workspace compounds: parse the structure, assign UNIFAC groups, estimate
 * what the chemist did not enter (logP from UNIFAC, Hansen parameters by
 * group contributions) and mark it estimated, store, audit.
 */
import { Op, type Transaction, type WhereOptions } from 'sequelize';
import {
  assignUnifacGroups,
  estimateHansen,
  atomContributionLogP,
  findIonisableGroups,
  LOGP_FALLBACK_METHOD,
  missingGroupNames,
  parseStructure,
  structureFingerprint,
  type StructureInput,
} from '@shared/chemistry';
import {
  pKaForEngine,
  type Compound as CompoundPayload,
  type CompoundCreateInput,
  type CompoundUpdateInput,
  type IonisableGroupPayload,
  type StructurePreview,
  type UnifacGroupCounts,
} from '@shared/schemas/compounds';
import { compoundSnapshotSchema, type CompoundSnapshot } from '@shared/schemas/route';
import type { ApiErrorDetail } from '@shared/schemas/errors';
import { solventById, type UnifacGroups } from '@shared/engine/data';
import { UNIFAC_SUBGROUPS } from '@shared/engine/data/unifac';
import { EngineError } from '@shared/engine/errors';
import { estimateLogPow } from '@shared/engine/properties';
import { notFound, validationFailed, versionConflict } from '../errors';
import { Compound, User } from '../models';
import { recordAudit } from './audit';
import {
  afterCursor,
  matchingRows,
  keyAttributes,
  keyOrder,
  pageOf,
  type KeysetOrder,
} from './keyset';
import { findLibrarySolvent, subgroupRows, unprocessable } from './components';

// ----- structure ------------------------------------------------------------

type Unifac = CompoundPayload['unifac'];

interface DerivedStructure {
  formula: string;
  molarMassGmol: number;
  canonicalSmiles: string;
  svg: string;
  librarySolventId: string | null;
  automatic: {
    groups: UnifacGroupCounts;
    summary: Unifac['summary'];
    unassignedAtoms: Unifac['unassignedAtoms'];
    warnings: string[];
  };
}

const toCounts = (groups: UnifacGroups): UnifacGroupCounts =>
  Object.fromEntries(Object.entries(groups).map(([k, v]) => [String(k), v]));
const fromCounts = (groups: UnifacGroupCounts): UnifacGroups =>
  Object.fromEntries(Object.entries(groups).map(([k, v]) => [Number(k), v]));

function structureInput(
  smiles: string | null | undefined,
  molfile: string | null | undefined,
): StructureInput {
  return smiles?.trim() ? { smiles: smiles.trim() } : { molfile: molfile ?? '' };
}

/** Parses the structure; 422 structure_unparsable with the parser's message naming the problem. */
export function deriveStructure(input: StructureInput, path = 'smiles'): DerivedStructure {
  const parsed = parseStructure(input);
  if (!parsed.ok)
    throw unprocessable('structure_unparsable', parsed.error, [{ path, message: parsed.error }]);
  const assignment = assignUnifacGroups(input);
  const library =
    'smiles' in input ? findLibrarySolvent(input.smiles, parsed.canonicalSmiles) : undefined;
  return {
    formula: parsed.formula,
    molarMassGmol: parsed.molarMassGmol,
    canonicalSmiles: parsed.canonicalSmiles,
    // openchemlib writes the drawing itself and escapes every label it draws (an atom's
    // custom label included); the client shows it only as an <img>, where SVG runs nothing.
    svg: parsed.svg,
    librarySolventId: library?.id ?? null,
    automatic: {
      groups: toCounts(assignment.groups),
      summary: assignment.summary.map((s) => ({
        subgroup: s.subgroup,
        name: s.name,
        count: s.count,
      })),
      unassignedAtoms: assignment.unassignedAtoms,
      warnings: assignment.warnings,
    },
  };
}

interface Estimates {
  logP: { value: number; method: string; warnings: string[] } | null;
  hansen: { d: number; p: number; h: number; method: string; warnings: string[] } | null;
  notes: string[];
}

/** logP from UNIFAC (estimateLogPow) and Hansen parameters by Hoftyzer–Van Krevelen, where the groups allow. */
function estimate(
  input: StructureInput,
  groups: UnifacGroupCounts,
  groupsComplete: boolean,
  want: { logP: boolean; hansen: boolean },
  unassignedReasons: readonly string[] = [],
): Estimates {
  const out: Estimates = { logP: null, hansen: null, notes: [] };
  if (want.logP) {
    if (!groupsComplete) {
      const missing = missingGroupNames(unassignedReasons);
      const what = missing.length
        ? `the UNIFAC groups have nothing for ${missing.join(', ')}`
        : 'some atoms have no UNIFAC group';
      const fallback = atomContributionLogP(input);
      if (fallback !== null) {
        out.logP = {
          value: fallback,
          method: LOGP_FALLBACK_METHOD,
          warnings: [
            `Fallback estimate: ${what}. Edit the groups or enter a measured logP for a better value.`,
          ],
        };
      } else
        out.notes.push(`logP not estimated: ${what}. Edit the groups or enter a measured logP.`);
    } else if (Object.keys(groups).length === 0)
      out.notes.push('logP not estimated: no UNIFAC groups.');
    else {
      try {
        const r = estimateLogPow(fromCounts(groups));
        out.logP = { value: r.logP, method: r.method, warnings: r.warnings };
      } catch (error) {
        if (!(error instanceof EngineError)) throw error;
        out.notes.push(`logP not estimated: ${error.message}`);
      }
    }
  }
  if (want.hansen) {
    const r = estimateHansen(input, { kind: 'fedors' });
    if (r.ok)
      out.hansen = {
        ...r.params,
        method: `${r.method}; molar volume by ${r.molarVolumeBasis}`,
        warnings: r.warnings,
      };
    else out.notes.push(`Hansen parameters not estimated: ${r.reason}`);
  }
  return out;
}

/** POST /structures/preview: what the form shows while the chemist types. */
export function previewStructure(input: StructureInput): StructurePreview {
  const derived = deriveStructure(input, 'smiles' in input ? 'smiles' : 'molfile');
  const complete = derived.automatic.unassignedAtoms.length === 0;
  const estimates = estimate(
    input,
    derived.automatic.groups,
    complete,
    { logP: true, hansen: true },
    derived.automatic.unassignedAtoms.map((a) => a.reason),
  );
  return {
    formula: derived.formula,
    molarMassGmol: derived.molarMassGmol,
    svg: derived.svg,
    canonicalSmiles: derived.canonicalSmiles,
    librarySolventId: derived.librarySolventId,
    unifac: { ...derived.automatic, summary: withMainGroups(derived.automatic.groups) },
    ionisableGroups: ionisableGroups(input),
    estimates: { ...estimates, notes: [...estimates.notes, ...ionisableNotes(input, [])] },
  };
}

/** Acidic and basic groups with their estimated pKa (shared/chemistry/pka-estimate.ts). */
export function ionisableGroups(input: StructureInput): IonisableGroupPayload[] {
  const r = findIonisableGroups(input);
  if (!r.ok) return [];
  return r.groups.map((g) => ({
    group: g.group,
    type: g.type,
    pKa: g.pKa,
    method: g.method,
    typicalError: g.typicalError,
    notes: g.notes,
  }));
}

/** A note for each ionisable group with no pKa, unless measured values are entered. */
function ionisableNotes(input: StructureInput, measured: CompoundPayload['pKa']): string[] {
  if (measured.length > 0) return [];
  return ionisableGroups(input)
    .filter((g) => g.pKa === null)
    .map(
      (g) =>
        `The structure has an ionisable group (${g.group}) with no pKa estimate: enter a measured pKa so washes and pH adjustments treat it as an ${g.type === 'acid' ? 'acid' : 'base'}.`,
    );
}

function withMainGroups(groups: UnifacGroupCounts): Unifac['summary'] {
  return subgroupRows(fromCounts(groups));
}

// ----- the record -----------------------------------------------------------

/** Everything the chemist decides about a compound; the rest is derived from it. */
interface CompoundState {
  name: string;
  role: CompoundPayload['role'];
  smiles: string | null;
  molfile: string | null;
  pKa: CompoundPayload['pKa'];
  logPMeasured: { value: number; method?: string } | null;
  meltingPointC: number | null;
  enthalpyFusionKJmol: number | null;
  hansenEntered: { d: number; p: number; h: number } | null;
  unifacEdited: UnifacGroupCounts | null;
  solubility: CompoundPayload['solubility'];
  partition: CompoundPayload['partition'];
  notes: string;
  specLimitPct: number | null;
  solidIncorporation: number | null;
}

function checkReferences(state: CompoundState): void {
  const details: ApiErrorDetail[] = [];
  state.solubility.forEach((p, i) => {
    if (!solventById(p.solventId))
      details.push({
        path: `solubility.${i}.solventId`,
        message: `Unknown solvent "${p.solventId}": choose one from the solvent library.`,
      });
  });
  state.partition.forEach((p, i) => {
    const s = solventById(p.organicSolventId);
    if (!s)
      details.push({
        path: `partition.${i}.organicSolventId`,
        message: `Unknown solvent "${p.organicSolventId}": choose one from the solvent library.`,
      });
    else if (s.waterMiscibility === 'miscible')
      details.push({
        path: `partition.${i}.organicSolventId`,
        message: `${s.name} is miscible with water: a partition needs a second phase.`,
      });
  });
  for (const key of Object.keys(state.unifacEdited ?? {})) {
    if (!UNIFAC_SUBGROUPS.has(Number(key)))
      details.push({
        path: `unifacGroups.${key}`,
        message: `There is no UNIFAC subgroup ${key} in the parameter table.`,
      });
  }
  if (details.length > 0) throw validationFailed(details);
}

type Attributes = Omit<
  CompoundPayload,
  | 'id'
  | 'version'
  | 'workspaceId'
  | 'createdBy'
  | 'createdAt'
  | 'updatedAt'
  | 'ionisableGroups'
  | 'fingerprint'
>;

function build(state: CompoundState): Attributes {
  checkReferences(state);
  const input = structureInput(state.smiles, state.molfile);
  const derived = deriveStructure(input, 'smiles' in input ? 'smiles' : 'molfile');
  const edited =
    state.unifacEdited && Object.keys(state.unifacEdited).length > 0 ? state.unifacEdited : null;
  const groups = edited ?? derived.automatic.groups;
  const complete = edited !== null || derived.automatic.unassignedAtoms.length === 0;
  const estimates = estimate(
    input,
    groups,
    complete,
    { logP: !state.logPMeasured, hansen: !state.hansenEntered },
    edited ? [] : derived.automatic.unassignedAtoms.map((a) => a.reason),
  );
  const unifacWarnings = edited
    ? ['Groups edited by hand; the automatic assignment is kept for comparison in the history.']
    : derived.automatic.warnings;
  return {
    name: state.name,
    role: state.role,
    smiles: state.smiles?.trim() ? state.smiles.trim() : null,
    molfile: state.smiles?.trim() ? null : state.molfile,
    canonicalSmiles: derived.canonicalSmiles,
    formula: derived.formula,
    molarMassGmol: derived.molarMassGmol,
    svg: derived.svg,
    pKa: state.pKa,
    logP: state.logPMeasured
      ? {
          value: state.logPMeasured.value,
          source: 'measured',
          method: state.logPMeasured.method || 'measured (entered by the chemist)',
          warnings: [],
        }
      : estimates.logP
        ? { ...estimates.logP, source: 'estimated' }
        : null,
    meltingPointC: state.meltingPointC,
    enthalpyFusionKJmol: state.enthalpyFusionKJmol,
    hansen: state.hansenEntered
      ? {
          ...state.hansenEntered,
          source: 'entered',
          method: 'entered by the chemist',
          warnings: [],
        }
      : estimates.hansen
        ? { ...estimates.hansen, source: 'estimated' }
        : null,
    unifac: {
      groups,
      source: edited ? 'edited' : 'assigned',
      summary: withMainGroups(groups),
      unassignedAtoms: edited ? [] : derived.automatic.unassignedAtoms,
      warnings: unifacWarnings,
    },
    estimateNotes: [...estimates.notes, ...ionisableNotes(input, state.pKa)],
    solubility: state.solubility,
    partition: state.partition,
    notes: state.notes,
    specLimitPct: state.specLimitPct,
    solidIncorporation: state.solidIncorporation,
  };
}

function stateFromCreate(input: CompoundCreateInput): CompoundState {
  return {
    name: input.name.trim(),
    role: input.role,
    smiles: input.smiles?.trim() || null,
    molfile: input.molfile?.trim() ? input.molfile : null,
    pKa: input.pKa ?? [],
    logPMeasured: input.logP ?? null,
    meltingPointC: input.meltingPointC ?? null,
    enthalpyFusionKJmol: input.enthalpyFusionKJmol ?? null,
    hansenEntered: input.hansen ?? null,
    unifacEdited: input.unifacGroups ?? null,
    solubility: input.solubility ?? [],
    partition: input.partition ?? [],
    notes: input.notes ?? '',
    specLimitPct: input.specLimitPct ?? null,
    solidIncorporation: input.solidIncorporation ?? null,
  };
}

function stateFromRecord(c: Compound): CompoundState {
  return {
    name: c.name,
    role: c.role,
    smiles: c.smiles,
    molfile: c.molfile,
    pKa: c.pKa,
    logPMeasured:
      c.logP?.source === 'measured' ? { value: c.logP.value, method: c.logP.method } : null,
    meltingPointC: c.meltingPointC,
    enthalpyFusionKJmol: c.enthalpyFusionKJmol,
    hansenEntered:
      c.hansen?.source === 'entered' ? { d: c.hansen.d, p: c.hansen.p, h: c.hansen.h } : null,
    unifacEdited: c.unifac.source === 'edited' ? c.unifac.groups : null,
    solubility: c.solubility,
    partition: c.partition,
    notes: c.notes,
    specLimitPct: c.specLimitPct,
    solidIncorporation: c.solidIncorporation,
  };
}

function applyPatch(
  state: CompoundState,
  patch: Omit<CompoundUpdateInput, 'baseVersion'>,
): CompoundState {
  const next: CompoundState = { ...state };
  if (patch.name !== undefined) next.name = patch.name.trim();
  if (patch.role !== undefined) next.role = patch.role;
  if (patch.smiles !== undefined || patch.molfile !== undefined) {
    // A new structure replaces the old one, and a hand-edited group list made for the old one.
    next.smiles = patch.smiles?.trim() || null;
    next.molfile = patch.molfile?.trim() ? patch.molfile : null;
    if (!next.smiles && !next.molfile)
      throw validationFailed([{ path: 'smiles', message: 'Enter a SMILES or paste a molfile.' }]);
    if (patch.unifacGroups === undefined) next.unifacEdited = null;
  }
  if (patch.pKa !== undefined) next.pKa = patch.pKa;
  if (patch.logP !== undefined) next.logPMeasured = patch.logP;
  if (patch.meltingPointC !== undefined) next.meltingPointC = patch.meltingPointC;
  if (patch.enthalpyFusionKJmol !== undefined) next.enthalpyFusionKJmol = patch.enthalpyFusionKJmol;
  if (patch.hansen !== undefined) next.hansenEntered = patch.hansen;
  if (patch.unifacGroups !== undefined) next.unifacEdited = patch.unifacGroups;
  if (patch.solubility !== undefined) next.solubility = patch.solubility;
  if (patch.partition !== undefined) next.partition = patch.partition;
  if (patch.notes !== undefined) next.notes = patch.notes;
  if (patch.specLimitPct !== undefined) next.specLimitPct = patch.specLimitPct;
  if (patch.solidIncorporation !== undefined) next.solidIncorporation = patch.solidIncorporation;
  return next;
}

export function presentCompound(c: Compound): CompoundPayload {
  return {
    id: c.id,
    version: c.version,
    workspaceId: c.workspaceId as string,
    name: c.name,
    role: c.role,
    smiles: c.smiles,
    molfile: c.molfile,
    canonicalSmiles: c.canonicalSmiles,
    formula: c.formula,
    molarMassGmol: c.molarMassGmol,
    svg: c.svg,
    pKa: c.pKa,
    logP: c.logP,
    meltingPointC: c.meltingPointC,
    enthalpyFusionKJmol: c.enthalpyFusionKJmol,
    hansen: c.hansen,
    unifac: c.unifac,
    estimateNotes: c.estimateNotes,
    solubility: c.solubility,
    partition: c.partition,
    notes: c.notes,
    specLimitPct: c.specLimitPct,
    solidIncorporation: c.solidIncorporation,
    ionisableGroups: ionisableGroups(structureInput(c.smiles, c.molfile)),
    fingerprint: structureFingerprint(structureInput(c.smiles, c.molfile)),
    createdBy: c.createdBy ? { id: c.createdBy.id, name: c.createdBy.name } : null,
    createdAt: c.createdAt.toISOString(),
    updatedAt: c.updatedAt.toISOString(),
  };
}

/** The audit trail keeps what the chemist and the server decided, not the drawing. */
function auditView(c: Compound) {
  const { svg: _svg, createdBy: _by, ...rest } = presentCompound(c);
  return rest;
}

const includeCreator = [{ model: User, as: 'createdBy', required: false }];

const COMPOUND_ORDERS: Record<'name' | 'created', KeysetOrder> = {
  name: {
    name: 'name',
    columns: [
      { sql: 'lower("Compound"."name")', type: 'text' },
      { sql: '"Compound"."id"', type: 'uuid' },
    ],
    direction: 'ASC',
  },
  created: {
    name: 'created',
    columns: [
      { sql: '"Compound"."created_at"', type: 'timestamptz' },
      { sql: '"Compound"."id"', type: 'uuid' },
    ],
    direction: 'DESC',
  },
};

/**
 * One page of the workspace's compounds by name or newest first (indexes
 * compounds_workspace_name_id_idx, compounds_workspace_created_idx); `q`
 * matches part of the name or the formula (trigram indexes).
 */
export async function listCompounds(
  workspaceId: string,
  query: { q?: string; sort: 'name' | 'created'; limit: number; cursor?: string },
  transaction: Transaction | null,
): Promise<{ items: Compound[]; nextCursor: string | null }> {
  const order = COMPOUND_ORDERS[query.sort];
  const conditions: WhereOptions[] = [{ workspaceId }];
  if (query.q)
    conditions.push(
      await matchingRows(
        {
          model: 'Compound',
          table: 'compounds',
          expressions: [(t) => `${t}.name`, (t) => `${t}.formula`],
        },
        query.q,
      ),
    );
  if (query.cursor) conditions.push(afterCursor(order, query.cursor));
  const rows = await Compound.findAll({
    where: { [Op.and]: conditions },
    attributes: { include: keyAttributes(order) },
    include: includeCreator,
    order: keyOrder(order),
    limit: query.limit + 1,
    subQuery: false,
    transaction,
  });
  return pageOf(rows, query.limit, order);
}

/** A compound of this workspace; another workspace's compound answers exactly like a missing one. */
export async function loadCompound(
  workspaceId: string,
  compoundId: string,
  transaction: Transaction | null,
): Promise<Compound> {
  const compound = await Compound.findOne({
    where: { id: compoundId, workspaceId },
    include: includeCreator,
    transaction,
  });
  if (!compound) throw notFound();
  return compound;
}

export async function createCompound(
  args: { workspaceId: string; actorId: string | null; input: CompoundCreateInput },
  transaction: Transaction | null,
): Promise<Compound> {
  const attributes = build(stateFromCreate(args.input));
  const created = await Compound.create(
    { ...attributes, workspaceId: args.workspaceId, createdById: args.actorId },
    { transaction },
  );
  const compound = await loadCompound(args.workspaceId, created.id, transaction);
  await recordAudit(
    {
      workspaceId: args.workspaceId,
      actorId: args.actorId,
      action: 'compound.create',
      entityType: 'compound',
      entityId: compound.id,
      after: auditView(compound),
    },
    transaction,
  );
  return compound;
}

export async function updateCompound(
  compound: Compound,
  patch: CompoundUpdateInput,
  actorId: string | null,
  transaction: Transaction | null,
): Promise<Compound> {
  const { baseVersion, ...changes } = patch;
  await compound.reload({
    transaction,
    lock: transaction ? { level: transaction.LOCK.UPDATE, of: Compound } : undefined,
  });
  if (compound.version !== baseVersion) throw versionConflict('compound', compound);
  const before = auditView(compound);
  const attributes = build(applyPatch(stateFromRecord(compound), changes));
  await compound.update({ ...attributes, version: compound.version + 1 }, { transaction });
  const after = await loadCompound(compound.workspaceId as string, compound.id, transaction);
  await recordAudit(
    {
      workspaceId: compound.workspaceId as string,
      actorId,
      action: 'compound.update',
      entityType: 'compound',
      entityId: compound.id,
      before,
      after: auditView(after),
    },
    transaction,
  );
  return after;
}

export async function deleteCompound(
  compound: Compound,
  actorId: string | null,
  transaction: Transaction | null,
): Promise<void> {
  const before = auditView(compound);
  await compound.destroy({ transaction });
  await recordAudit(
    {
      workspaceId: compound.workspaceId as string,
      actorId,
      action: 'compound.delete',
      entityType: 'compound',
      entityId: compound.id,
      before,
    },
    transaction,
  );
}

/**
 * The self-contained property snapshot a route document carries
 * (compoundSnapshotSchema in shared/schemas/route.ts): the values the engine
 * uses, measured or estimated, so a stored route evaluates the same later.
 */
export function toCompoundSnapshot(compound: Compound | CompoundPayload): CompoundSnapshot {
  const c = compound instanceof Compound ? presentCompound(compound) : compound;
  const groupsUsable =
    Object.keys(c.unifac.groups).length > 0 && c.unifac.unassignedAtoms.length === 0;
  const engineP = pKaForEngine(c.pKa, c.ionisableGroups);
  const methodNotes = [
    c.logP ? `logP ${c.logP.source}` : null,
    engineP.some((p) => p.source === 'estimated') ? 'pKa estimated from the structure' : null,
    c.hansen ? `Hansen ${c.hansen.source}` : null,
    `UNIFAC groups ${c.unifac.source}`,
  ].filter(Boolean);
  const snapshot: CompoundSnapshot = {
    kind: 'compound',
    id: c.id,
    name: c.name.slice(0, 200),
    role: c.role,
    smiles: c.smiles ?? c.canonicalSmiles,
    molarMassGmol: c.molarMassGmol,
    ...(c.meltingPointC !== null ? { meltingPointC: c.meltingPointC } : {}),
    ...(c.enthalpyFusionKJmol !== null ? { enthalpyFusionKJmol: c.enthalpyFusionKJmol } : {}),
    ...(c.logP ? { logP: c.logP.value } : {}),
    ...(engineP.length > 0 ? { pKa: engineP } : {}),
    ...(c.ionisableGroups.length > 0
      ? {
          ionisableGroups: c.ionisableGroups
            .slice(0, 20)
            .map(({ group, type }) => ({ group, type })),
        }
      : {}),
    ...(groupsUsable ? { unifac: { ...c.unifac.groups } } : {}),
    ...(c.hansen ? { hansen: { d: c.hansen.d, p: c.hansen.p, h: c.hansen.h } } : {}),
    ...(c.solubility.length > 0 ? { solubility: c.solubility.map((p) => ({ ...p })) } : {}),
    ...(c.partition.length > 0 ? { partition: c.partition.map((p) => ({ ...p })) } : {}),
    ...(c.specLimitPct !== null ? { specLimitPct: c.specLimitPct } : {}),
    ...(c.solidIncorporation !== null ? { solidIncorporation: c.solidIncorporation } : {}),
    ...(c.fingerprint ? { fingerprint: c.fingerprint } : {}),
    note: [c.notes, methodNotes.join(', ')].filter(Boolean).join(' — ').slice(0, 500),
  };
  return compoundSnapshotSchema.parse(snapshot);
}
