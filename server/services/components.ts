/**
 * Resolves a component given by SMILES: a library solvent first (its curated,
 * sourced data), otherwise data derived from the structure (UNIFAC groups by
 * substructure matching). Also maps engine errors to coded API errors.
 */
import { assignUnifacGroups, parseStructure, type UnifacAssignment } from '@shared/chemistry';
import type { ResolvedComponent } from '@shared/schemas/calc';
import type { ApiErrorDetail } from '@shared/schemas/errors';
import type { ValueSource } from '@shared/schemas/solvents';
import {
  citationFor,
  SOLVENTS,
  solventBySmiles,
  type Source,
  type SolventRecord,
  type UnifacGroups,
} from '@shared/engine/data';
import { UNIFAC_PARAMETER_SOURCE } from '@shared/engine/data/unifac';
import { EngineError, UnifacParameterError } from '@shared/engine/errors';
import { unifacGroupsSummary } from '@shared/engine/thermo';
import { apiError, type CodeWithStatus } from '../errors';

/** 422: the request is well formed but cannot be computed. */
export const unprocessable = (
  code: CodeWithStatus<422> &
    ('structure_unparsable' | 'unifac_missing_parameters' | 'no_data' | 'not_computable'),
  message: string,
  details?: ApiErrorDetail[],
) => (code === 'structure_unparsable' ? apiError(code, message, details) : apiError(code, message));

export type ResolvedSmiles =
  | { basis: 'library'; smiles: string; solvent: SolventRecord; groups: UnifacGroups }
  | { basis: 'structure'; smiles: string; canonicalSmiles: string; assignment: UnifacAssignment };

let canonicalIndex: Map<string, SolventRecord> | null = null;

/** Library solvents by their canonical SMILES (openchemlib), built on first use. */
function librarySolventByCanonical(canonical: string): SolventRecord | undefined {
  if (!canonicalIndex) {
    canonicalIndex = new Map();
    for (const solvent of SOLVENTS) {
      const parsed = parseStructure({ smiles: solvent.smiles });
      if (parsed.ok && !canonicalIndex.has(parsed.canonicalSmiles))
        canonicalIndex.set(parsed.canonicalSmiles, solvent);
    }
  }
  return canonicalIndex.get(canonical);
}

/** The library solvent a structure is, by string match then by canonical SMILES. */
export function findLibrarySolvent(
  smiles: string,
  canonicalSmiles?: string,
): SolventRecord | undefined {
  const direct = solventBySmiles(smiles);
  if (direct) return direct;
  if (canonicalSmiles) return librarySolventByCanonical(canonicalSmiles);
  const parsed = parseStructure({ smiles });
  return parsed.ok ? librarySolventByCanonical(parsed.canonicalSmiles) : undefined;
}

/**
 * Resolve one `{ smiles }`. Throws 422 structure_unparsable (with the
 * parser's message naming the problem) when the SMILES cannot be read.
 * `label` names the component in messages ("component 2").
 */
export function resolveSmiles(smiles: string, label: string): ResolvedSmiles {
  const direct = solventBySmiles(smiles);
  if (direct) return { basis: 'library', smiles, solvent: direct, groups: direct.unifac.value };
  const parsed = parseStructure({ smiles });
  if (!parsed.ok)
    throw unprocessable('structure_unparsable', `${capitalise(label)}: ${parsed.error}`);
  const solvent = librarySolventByCanonical(parsed.canonicalSmiles);
  if (solvent) return { basis: 'library', smiles, solvent, groups: solvent.unifac.value };
  return {
    basis: 'structure',
    smiles,
    canonicalSmiles: parsed.canonicalSmiles,
    assignment: assignUnifacGroups({ smiles }),
  };
}

/**
 * UNIFAC groups of a resolved component. Throws 422 unifac_missing_parameters
 * when atoms are left that no group covers.
 */
export function groupsOf(component: ResolvedSmiles, label: string): UnifacGroups {
  if (component.basis === 'library') return component.groups;
  const { assignment } = component;
  if (assignment.unassignedAtoms.length > 0) {
    const atoms = assignment.unassignedAtoms
      .map((a) => `${a.element}${a.index + 1} (${a.reason})`)
      .join('; ');
    throw unprocessable(
      'unifac_missing_parameters',
      `${capitalise(label)} (${component.smiles}): no UNIFAC group covers ${assignment.unassignedAtoms.length} atom(s): ${atoms}.`,
    );
  }
  if (Object.keys(assignment.groups).length === 0) {
    throw unprocessable(
      'unifac_missing_parameters',
      `${capitalise(label)} (${component.smiles}): no UNIFAC groups could be assigned.`,
    );
  }
  return assignment.groups;
}

export function describeResolved(component: ResolvedSmiles): ResolvedComponent {
  return component.basis === 'library'
    ? {
        smiles: component.smiles,
        basis: 'library',
        solventId: component.solvent.id,
        name: component.solvent.name,
      }
    : { smiles: component.smiles, basis: 'structure', solventId: null, name: null };
}

/** Subgroup rows (name, main group) for display; unknown subgroups become a 422. */
export function subgroupRows(groups: UnifacGroups) {
  return mapEngineErrors(() => unifacGroupsSummary(groups));
}

/** A data source with its full citation from the bibliography, when the id is known. */
export function presentSource(source: Source): ValueSource {
  const entry = citationFor(source);
  return {
    ref: source.ref,
    status: source.status,
    ...(source.note ? { note: source.note } : {}),
    ...(entry
      ? {
          citation: entry.citation,
          ...(entry.via ? { via: entry.via } : {}),
          ...(entry.url ? { url: entry.url } : {}),
        }
      : {}),
  };
}

export const unifacSource = (): ValueSource => ({
  ref: UNIFAC_PARAMETER_SOURCE.ref,
  status: UNIFAC_PARAMETER_SOURCE.status,
});

/** Source of structure-derived UNIFAC groups. */
export const assignedGroupsSource = (): ValueSource => ({
  ref: 'Automatic assignment of original-UNIFAC subgroups by substructure matching (Phasewright, shared/chemistry)',
  status: 'estimated',
});

/**
 * Runs engine code and turns its coded errors into API errors: a UNIFAC
 * parameter gap → 422 unifac_missing_parameters; missing vapour-pressure data
 * → 422 no_data; input outside the model's domain or no convergence → 422
 * not_computable. Anything else is a bug and stays a 500.
 */
export function mapEngineErrors<T>(run: () => T): T {
  try {
    return run();
  } catch (error) {
    if (error instanceof UnifacParameterError) {
      const pairs = error.gap.missingPairs.map((p) => `${p.names[0]}–${p.names[1]}`).join(', ');
      const unknown = error.gap.unknownSubgroups.join(', ');
      const parts = [
        pairs ? `no interaction parameters for the main-group pair(s) ${pairs}` : '',
        unknown ? `unknown subgroup(s) ${unknown}` : '',
      ].filter(Boolean);
      throw unprocessable(
        'unifac_missing_parameters',
        `UNIFAC cannot be evaluated: ${parts.join('; ') || error.message}.`,
      );
    }
    if (error instanceof EngineError) {
      if (error.code === 'no-vapour-pressure-data') throw unprocessable('no_data', error.message);
      if (error.code === 'unifac-missing-parameters')
        throw unprocessable('unifac_missing_parameters', error.message);
      throw unprocessable('not_computable', error.message);
    }
    throw error;
  }
}

function capitalise(text: string): string {
  return text.charAt(0).toUpperCase() + text.slice(1);
}
