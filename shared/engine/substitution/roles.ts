/**
 * Where a step holds the solvent of a substitution role, and the route with
 * that one solvent replaced.
 *
 * Roles (docs/api.md, POST /api/v1/solvent-alternatives):
 *  - extraction: the solvent a wash or extraction adds (addedLiquid of kind
 *    solvent), or the one organic solvent a charge puts the crude in;
 *  - swap-target: the solvent a put-and-take or constant-volume distillation adds;
 *  - crystallisation: the solvent the product crystallises from, at the step
 *    that adds it (the swap distillation, or the charge) when a
 *    crystallisation follows it; a crystallisation step itself adds no
 *    solvent except its antisolvent;
 *  - antisolvent: the antisolvent of an antisolvent crystallisation;
 *  - cake-wash: the solvent of a filtration's cake wash.
 *
 * Only the chosen step's field changes: the substitute becomes a route
 * component (reused when the route already holds that library solvent), and
 * every other step keeps its solvents.
 */
import type { RouteDocument, RouteStep } from '../document';

export const SUBSTITUTION_ROLES = [
  'extraction',
  'swap-target',
  'crystallisation',
  'antisolvent',
  'cake-wash',
] as const;
export type SubstitutionRole = (typeof SUBSTITUTION_ROLES)[number];

/** How the roles read to a chemist. */
export const ROLE_LABELS: Record<SubstitutionRole, string> = {
  extraction: 'extraction solvent',
  'swap-target': 'swap solvent',
  crystallisation: 'crystallisation solvent',
  antisolvent: 'antisolvent',
  'cake-wash': 'cake-wash solvent',
};

/** A request the route cannot answer, in the chemist's words, with the field it concerns. */
export class SubstitutionError extends Error {
  constructor(
    message: string,
    readonly field: 'stepId' | 'role',
  ) {
    super(message);
    this.name = 'SubstitutionError';
  }
}

/** The solvent a step holds in a role: its route component and library solvent. */
export interface RoleSolvent {
  componentId: string;
  solventId: string;
}

type Located = RoleSolvent & { set: (step: RouteStep, componentId: string) => void };

function libraryIdOf(doc: RouteDocument, componentId: string): string | null {
  const c = doc.components.find((x) => x.kind === 'solvent' && x.id === componentId);
  return c && c.kind === 'solvent' ? c.solventId : null;
}

/** Steps reachable downstream of `stepId` (not including it). */
function downstream(doc: RouteDocument, stepId: string): Set<string> {
  const seen = new Set<string>();
  const queue = [stepId];
  while (queue.length > 0) {
    const from = queue.shift()!;
    for (const c of doc.connections)
      if (c.from.stepId === from && !seen.has(c.to.stepId)) {
        seen.add(c.to.stepId);
        queue.push(c.to.stepId);
      }
  }
  return seen;
}

function crystallisesDownstream(doc: RouteDocument, stepId: string): boolean {
  const after = downstream(doc, stepId);
  return doc.steps.some((s) => s.kind === 'crystallisation' && after.has(s.id));
}

/** The organic (non-water) solvent entries of a charge. */
function chargeSolventEntries(doc: RouteDocument, step: Extract<RouteStep, { kind: 'charge' }>) {
  return step.params.contents.filter(
    (e) =>
      e.kind === 'component' &&
      libraryIdOf(doc, e.componentId) !== null &&
      libraryIdOf(doc, e.componentId) !== 'water',
  ) as Array<Extract<(typeof step.params.contents)[number], { kind: 'component' }>>;
}

function fromCharge(
  doc: RouteDocument,
  step: Extract<RouteStep, { kind: 'charge' }>,
  role: SubstitutionRole,
): Located {
  const entries = chargeSolventEntries(doc, step);
  if (entries.length !== 1)
    throw new SubstitutionError(
      entries.length === 0
        ? `Step "${step.name || step.id}" charges no organic solvent to replace as the ${ROLE_LABELS[role]}.`
        : `Step "${step.name || step.id}" charges ${entries.length} organic solvents; the advisor replaces the ${ROLE_LABELS[role]} only where a charge holds one.`,
      'role',
    );
  const entry = entries[0];
  const index = step.params.contents.indexOf(entry);
  return {
    componentId: entry.componentId,
    solventId: libraryIdOf(doc, entry.componentId)!,
    set: (s, id) => {
      const e = (s as typeof step).params.contents[index];
      if (e.kind === 'component') e.componentId = id;
    },
  };
}

function locate(doc: RouteDocument, step: RouteStep, role: SubstitutionRole): Located | string {
  const name = step.name || step.id;
  switch (role) {
    case 'extraction':
      if (step.kind === 'wash' || step.kind === 'extraction') {
        const liquid = step.params.addedLiquid;
        if (liquid.kind !== 'solvent')
          return `Step "${name}" adds an aqueous solution, not a solvent: choose the step that charges the extraction solvent.`;
        return {
          componentId: liquid.solventId,
          solventId: libraryIdOf(doc, liquid.solventId) ?? '',
          set: (s, id) => {
            const l = (s as typeof step).params.addedLiquid;
            if (l.kind === 'solvent') l.solventId = id;
          },
        };
      }
      if (step.kind === 'charge') return fromCharge(doc, step, role);
      return `Step "${name}" (${step.kind}) has no extraction solvent: choose a wash, an extraction or the charge of the crude.`;
    case 'swap-target':
      if (step.kind === 'distillation') {
        const mode = step.params.mode;
        if (mode.kind === 'concentrate')
          return `Step "${name}" only concentrates; it adds no solvent to swap to.`;
        return {
          componentId: mode.addSolventId,
          solventId: libraryIdOf(doc, mode.addSolventId) ?? '',
          set: (s, id) => {
            const m = (s as typeof step).params.mode;
            if (m.kind !== 'concentrate') m.addSolventId = id;
          },
        };
      }
      return `Step "${name}" (${step.kind}) is not a solvent swap: choose a put-and-take or constant-volume distillation.`;
    case 'crystallisation':
      if (step.kind === 'crystallisation')
        return `Step "${name}" takes its solvent from the steps before it: choose the step that adds the crystallisation solvent (the solvent swap or the charge), or the role antisolvent.`;
      if (
        (step.kind === 'distillation' && step.params.mode.kind !== 'concentrate') ||
        step.kind === 'charge'
      ) {
        if (!crystallisesDownstream(doc, step.id))
          return `No crystallisation follows step "${name}", so its solvent is not a crystallisation solvent.`;
        return step.kind === 'charge'
          ? fromCharge(doc, step, role)
          : locate(doc, step, 'swap-target');
      }
      return `Step "${name}" (${step.kind}) adds no crystallisation solvent: choose the solvent swap or the charge before the crystallisation.`;
    case 'antisolvent':
      if (step.kind === 'crystallisation') {
        const mode = step.params.mode;
        if (mode.kind !== 'antisolvent')
          return `Step "${name}" is a ${mode.kind} crystallisation and adds no antisolvent.`;
        return {
          componentId: mode.antisolventId,
          solventId: libraryIdOf(doc, mode.antisolventId) ?? '',
          set: (s, id) => {
            const m = (s as typeof step).params.mode;
            if (m.kind === 'antisolvent') m.antisolventId = id;
          },
        };
      }
      return `Step "${name}" (${step.kind}) is not an antisolvent crystallisation.`;
    case 'cake-wash':
      if (step.kind === 'filtration') {
        const wash = step.params.cakeWash;
        if (!wash) return `Filtration "${name}" has no cake wash.`;
        return {
          componentId: wash.solventId,
          solventId: libraryIdOf(doc, wash.solventId) ?? '',
          set: (s, id) => {
            const w = (s as typeof step).params.cakeWash;
            if (w) w.solventId = id;
          },
        };
      }
      return `Step "${name}" (${step.kind}) is not a filtration with a cake wash.`;
  }
}

function located(doc: RouteDocument, stepId: string, role: SubstitutionRole): Located {
  const step = doc.steps.find((s) => s.id === stepId);
  if (!step) throw new SubstitutionError(`The route has no step "${stepId}".`, 'stepId');
  const found = locate(doc, step, role);
  if (typeof found === 'string') throw new SubstitutionError(found, 'role');
  if (!found.solventId)
    throw new SubstitutionError(
      `The ${ROLE_LABELS[role]} of step "${step.name || step.id}" is not a solvent of the library.`,
      'role',
    );
  return found;
}

/**
 * The solvent a step holds in a role.
 * Source: this project's own bookkeeping (no external source).
 * Validity: any route document the schema accepts.
 * @param doc     the route document
 * @param stepId  the step's id
 * @param role    which of the step's solvents
 * @returns the route component id and the library solvent id
 *
 * @throws SubstitutionError naming the step when it has no such solvent
 * Example: the demo route's "swap" in role swap-target → { componentId: '2-propanol', solventId: '2-propanol' }.
 */
export function roleSolvent(
  doc: RouteDocument,
  stepId: string,
  role: SubstitutionRole,
): RoleSolvent {
  const { componentId, solventId } = located(doc, stepId, role);
  return { componentId, solventId };
}

/**
 * A copy of the route with the solvent of one step's role replaced by a
 * library solvent; nothing else changes (volumes stay in their units). The
 * substitute is added as a solvent component with the library id as its id
 * (or the existing component of that library solvent is reused).
 * Source: this project's own bookkeeping (no external source).
 * Validity: any route document the schema accepts; throws SubstitutionError
 * for a step or role the route does not have.
 * @param doc        the route document (not modified)
 * @param stepId     the step's id
 * @param role       which of the step's solvents
 * @param solventId  library id of the substitute
 * @returns the changed copy
 */
export function substituteSolvent(
  doc: RouteDocument,
  stepId: string,
  role: SubstitutionRole,
  solventId: string,
): RouteDocument {
  const copy = structuredClone(doc);
  const where = located(copy, stepId, role);
  let component = copy.components.find((c) => c.kind === 'solvent' && c.solventId === solventId);
  if (!component) {
    const taken = new Set(copy.components.map((c) => ('id' in c ? c.id : undefined)));
    let id = solventId;
    for (let n = 2; taken.has(id); n++) id = `${solventId}-${n}`;
    component = { kind: 'solvent', id, solventId };
    copy.components.push(component);
  }
  const step = copy.steps.find((s) => s.id === stepId)!;
  where.set(step, (component as { id: string }).id);
  return copy;
}
