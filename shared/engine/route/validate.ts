/**
 * Graph and reference validation of a route document that already passed
 * the zod schema: step and connection ids, ports and their phases, ports
 * used twice, required inputs left unconnected, cycles, unknown or
 * wrong-kind components, and parameters that are in range for the schema but
 * not for this route (e.g. a medium above its saturation wt %).
 * Every issue names the step (or null for the document) and the field.
 */
import { PHASE_ACCEPTS, PORTS, type RouteDocument, type RouteStep } from '../document';
import type { EvalContext } from './context';
import type { RouteIssue } from './errors';
import {
  AQUEOUS_NEEDS_WATER,
  PHASE_WORDS,
  capitalise,
  listInWords,
  portWords,
  stepInWords,
} from './step-words';

/** A stream's end in words: "the organic layer of the wash “Acid wash”". */
const portOf = (step: RouteStep, port: string) => `the ${portWords(port)} of ${stepInWords(step)}`;

type Ref = {
  field: string;
  id: string;
  want: 'any' | 'solvent' | 'aqueous-solute' | 'compound-or-aqueous';
};

function references(step: RouteStep): Ref[] {
  const r: Ref[] = [];
  const liquid = (
    field: string,
    l: { kind: 'solvent'; solventId: string } | { kind: 'aqueous'; soluteId: string },
  ) => {
    if (l.kind === 'solvent')
      r.push({ field: `${field}.solventId`, id: l.solventId, want: 'solvent' });
    else r.push({ field: `${field}.soluteId`, id: l.soluteId, want: 'aqueous-solute' });
  };
  switch (step.kind) {
    case 'charge':
      step.params.contents.forEach((c, i) => {
        if (c.kind === 'component')
          r.push({ field: `params.contents[${i}].componentId`, id: c.componentId, want: 'any' });
        else
          r.push({
            field: `params.contents[${i}].soluteId`,
            id: c.soluteId,
            want: 'aqueous-solute',
          });
      });
      break;
    case 'wash':
    case 'extraction':
      liquid('params.addedLiquid', step.params.addedLiquid);
      break;
    case 'distillation':
      if (step.params.mode.kind !== 'concentrate')
        r.push({
          field: 'params.mode.addSolventId',
          id: step.params.mode.addSolventId,
          want: 'solvent',
        });
      break;
    case 'crystallisation':
      if (step.params.mode.kind === 'antisolvent')
        r.push({
          field: 'params.mode.antisolventId',
          id: step.params.mode.antisolventId,
          want: 'solvent',
        });
      break;
    case 'filtration':
      if (step.params.cakeWash)
        r.push({
          field: 'params.cakeWash.solventId',
          id: step.params.cakeWash.solventId,
          want: 'solvent',
        });
      break;
    case 'quench':
      r.push({ field: 'params.reagentId', id: step.params.reagentId, want: 'compound-or-aqueous' });
      r.push({
        field: 'params.reactsWith',
        id: step.params.reactsWith,
        want: 'compound-or-aqueous',
      });
      step.params.products.forEach((p, i) =>
        r.push({
          field: `params.products[${i}].componentId`,
          id: p.componentId,
          want: 'compound-or-aqueous',
        }),
      );
      if (step.params.carrier)
        r.push({
          field: 'params.carrier.solventId',
          id: step.params.carrier.solventId,
          want: 'solvent',
        });
      break;
    case 'ph-adjust':
      r.push({
        field: 'params.reagentSoluteId',
        id: step.params.reagentSoluteId,
        want: 'aqueous-solute',
      });
      break;
    case 'carbon-treatment':
    case 'polish-filtration':
      step.params.removals.forEach((x, i) =>
        r.push({ field: `params.removals[${i}].componentId`, id: x.componentId, want: 'any' }),
      );
      break;
    default:
      break;
  }
  return r;
}

function usesAqueousMedium(step: RouteStep): Array<{
  field: string;
  soluteId: string;
  wtPct: number | { value: number; plusMinus: number };
}> {
  if (step.kind === 'charge')
    return step.params.contents.flatMap((c, i) =>
      c.kind === 'aqueous'
        ? [{ field: `params.contents[${i}].wtPct`, soluteId: c.soluteId, wtPct: c.wtPct }]
        : [],
    );
  if (
    (step.kind === 'wash' || step.kind === 'extraction') &&
    step.params.addedLiquid.kind === 'aqueous'
  )
    return [
      {
        field: 'params.addedLiquid.wtPct',
        soluteId: step.params.addedLiquid.soluteId,
        wtPct: step.params.addedLiquid.wtPct,
      },
    ];
  if (step.kind === 'ph-adjust')
    return [
      { field: 'params.wtPct', soluteId: step.params.reagentSoluteId, wtPct: step.params.wtPct },
    ];
  return [];
}

export interface GraphInfo {
  order: string[];
  /** stepId → port → connection */
  incoming: Map<string, Map<string, RouteDocument['connections'][number]>>;
  outgoing: Map<string, Map<string, RouteDocument['connections'][number]>>;
}

/**
 * Check a route document's graph and references: duplicate ids, unknown
 * steps, ports and components, phase mismatches between ports, ports used
 * twice, required inputs left open, aqueous media above their saturation, wt %
 * without a crude mass; then the topological order of the steps (Kahn's
 * algorithm, ties broken by document order) and any cycle.
 *
 * Source: this project's own bookkeeping (no external source); topological
 * sort after Kahn, Commun. ACM 1962, 5, 558.
 * Validity: any route document the schema accepts; every issue names its
 * step and field.
 * @param doc            the route document
 * @param ctx            evaluation context (route components resolved against the library)
 * @param contextIssues  issues already found while resolving the components
 * @returns the issues (step, field, message) and the graph (order, incoming and outgoing connections)
 */
export function validateRoute(
  doc: RouteDocument,
  ctx: EvalContext,
  contextIssues: Array<{ field: string; message: string }>,
): { issues: RouteIssue[]; graph: GraphInfo } {
  const issues: RouteIssue[] = contextIssues.map((i) => ({ stepId: null, ...i }));
  const steps = new Map<string, RouteStep>();
  doc.steps.forEach((s, i) => {
    if (steps.has(s.id))
      issues.push({
        stepId: s.id,
        field: `steps[${i}].id`,
        message: `${capitalise(stepInWords(s))} carries the same internal reference as an earlier step, so it is left out: delete it and add the step again.`,
      });
    else steps.set(s.id, s);
  });
  const incoming = new Map<string, Map<string, RouteDocument['connections'][number]>>();
  const outgoing = new Map<string, Map<string, RouteDocument['connections'][number]>>();
  for (const id of steps.keys()) {
    incoming.set(id, new Map());
    outgoing.set(id, new Map());
  }
  const connIds = new Set<string>();
  doc.connections.forEach((c, i) => {
    const f = `connections[${i}]`;
    if (connIds.has(c.id))
      issues.push({
        stepId: null,
        field: `${f}.id`,
        message: `Two streams carry the same internal reference: delete one of them and draw it again.`,
      });
    connIds.add(c.id);
    const from = steps.get(c.from.stepId);
    const to = steps.get(c.to.stepId);
    if (!from)
      issues.push({
        stepId: null,
        field: `${f}.from.stepId`,
        message: 'A stream comes from a step that is not on the route: delete that stream.',
      });
    if (!to)
      issues.push({
        stepId: null,
        field: `${f}.to.stepId`,
        message: 'A stream goes to a step that is not on the route: delete that stream.',
      });
    if (!from || !to) return;
    const outPort = PORTS[from.kind].outputs.find((p) => p.name === c.from.port);
    const inPort = PORTS[to.kind].inputs.find((p) => p.name === c.to.port);
    if (!outPort)
      issues.push({
        stepId: from.id,
        field: `${f}.from.port`,
        message: `A stream leaves ${stepInWords(from)} from an output it does not have: draw it again from its ${listInWords(PORTS[from.kind].outputs.map((p) => portWords(p.name)))}.`,
      });
    if (!inPort)
      issues.push({
        stepId: to.id,
        field: `${f}.to.port`,
        message: `A stream enters ${stepInWords(to)} at an input it does not have: draw it again into its ${listInWords(PORTS[to.kind].inputs.map((p) => portWords(p.name)))}.`,
      });
    if (!outPort || !inPort) return;
    if (!PHASE_ACCEPTS[inPort.phase].includes(outPort.phase))
      issues.push({
        stepId: to.id,
        field: `${f}`,
        message: `${capitalise(portOf(to, c.to.port))} takes ${PHASE_WORDS[inPort.phase]}, not ${PHASE_WORDS[outPort.phase]} such as ${portOf(from, c.from.port)}: feed it from an output of that kind.`,
      });
    if (from.id === to.id)
      issues.push({
        stepId: to.id,
        field: f,
        message: `${capitalise(stepInWords(to))} cannot feed itself: send its ${portWords(c.from.port)} to a later step.`,
      });
    if (outgoing.get(from.id)!.has(c.from.port))
      issues.push({
        stepId: from.id,
        field: `${f}.from.port`,
        message: `${capitalise(portOf(from, c.from.port))} goes to two steps: a stream goes to one step; add a split to divide it.`,
      });
    else outgoing.get(from.id)!.set(c.from.port, c);
    if (incoming.get(to.id)!.has(c.to.port))
      issues.push({
        stepId: to.id,
        field: `${f}.to.port`,
        message: `${capitalise(portOf(to, c.to.port))} comes from two streams: an input takes one stream; add a merge to combine them.`,
      });
    else incoming.get(to.id)!.set(c.to.port, c);
  });
  doc.steps.forEach((s) => {
    for (const p of PORTS[s.kind].inputs) {
      if (p.required && !incoming.get(s.id)?.has(p.name))
        issues.push({
          stepId: s.id,
          field: `inputs.${p.name}`,
          message: `${capitalise(portOf(s, p.name))} is not connected: draw a stream into it from an earlier step's output.`,
        });
    }
    for (const ref of references(s)) {
      const c = ctx.comps.get(ref.id);
      if (!c) {
        issues.push({
          stepId: s.id,
          field: ref.field,
          message: `${capitalise(stepInWords(s))} names a compound that is not among the route's compounds: choose one from the list, or add it to the route first.`,
        });
        continue;
      }
      if (ref.want === 'solvent' && c.kind !== 'solvent')
        issues.push({
          stepId: s.id,
          field: ref.field,
          message: `${c.name} is not a solvent: choose a solvent here.`,
        });
      if (ref.want === 'aqueous-solute' && c.kind !== 'aqueous-solute')
        issues.push({
          stepId: s.id,
          field: ref.field,
          message: `${c.name} is not a salt, acid or base for an aqueous solution: choose one of the aqueous solutes here.`,
        });
      if (ref.want === 'compound-or-aqueous' && c.kind === 'solvent')
        issues.push({
          stepId: s.id,
          field: ref.field,
          message: `${c.name} is a solvent: choose a compound or an aqueous solute here.`,
        });
    }
    for (const m of usesAqueousMedium(s)) {
      if (!ctx.waterId)
        issues.push({
          stepId: s.id,
          field: m.field,
          message: AQUEOUS_NEEDS_WATER,
        });
      const a = ctx.comps.get(m.soluteId)?.aqueous;
      const w = typeof m.wtPct === 'number' ? m.wtPct : m.wtPct.value + m.wtPct.plusMinus;
      if (a && w > a.maxWtPct)
        issues.push({
          stepId: s.id,
          field: m.field,
          message: `${a.name} at ${w} wt% is above its saturation or usual maximum of ${a.maxWtPct} wt%: enter at most ${a.maxWtPct} wt% (including the ± part).`,
        });
    }
    if (
      s.kind === 'charge' &&
      s.params.contents.some((c) => c.kind === 'component' && c.unit === 'wt%') &&
      s.params.crudeMassKg === undefined
    ) {
      issues.push({
        stepId: s.id,
        field: 'params.crudeMassKg',
        message: 'Entries in wt% need the crude mass they refer to: enter the crude mass.',
      });
    }
    if (s.kind === 'charge') {
      s.params.contents.forEach((c, i) => {
        if (
          c.kind === 'component' &&
          (c.unit === 'L' || c.unit === 'vol') &&
          ctx.comps.get(c.componentId)?.kind === 'aqueous-solute'
        ) {
          issues.push({
            stepId: s.id,
            field: `params.contents[${i}].unit`,
            message: `${ctx.comps.get(c.componentId)!.name} is charged by mass (kg) or as an aqueous solution, not by volume: change the unit.`,
          });
        }
      });
    }
  });
  // Topological order (Kahn), ties broken by document order for determinism.
  const indeg = new Map<string, number>();
  const index = new Map<string, number>();
  doc.steps.forEach((s, i) => {
    index.set(s.id, i);
    indeg.set(s.id, 0);
  });
  for (const [to, ports] of incoming)
    for (const _ of ports) indeg.set(to, (indeg.get(to) ?? 0) + 1);
  const ready = doc.steps.filter((s) => indeg.get(s.id) === 0).map((s) => s.id);
  const order: string[] = [];
  while (ready.length) {
    ready.sort((a, b) => index.get(a)! - index.get(b)!);
    const id = ready.shift()!;
    order.push(id);
    for (const c of outgoing.get(id)?.values() ?? []) {
      const d = indeg.get(c.to.stepId)! - 1;
      indeg.set(c.to.stepId, d);
      if (d === 0) ready.push(c.to.stepId);
    }
  }
  if (order.length < steps.size) {
    const inCycle = [...steps.keys()].filter((id) => !order.includes(id));
    // Kahn's algorithm leaves the loop and every step after it unordered: tell them apart.
    const next = (id: string) =>
      [...(outgoing.get(id)?.values() ?? [])].map((c) => c.to.stepId).filter((t) => steps.has(t));
    const reachesItself = (start: string) => {
      const seen = new Set<string>();
      const stack = next(start);
      while (stack.length) {
        const id = stack.pop()!;
        if (id === start) return true;
        if (seen.has(id)) continue;
        seen.add(id);
        stack.push(...next(id));
      }
      return false;
    };
    const onLoop = inCycle.filter(reachesItself);
    // The loop in stream order, from its first step in the document.
    const walk: string[] = [];
    let at: string | undefined = onLoop[0];
    while (at) {
      walk.push(at);
      at = next(at).find((t) => onLoop.includes(t) && !walk.includes(t));
    }
    const said = [...walk, ...onLoop.filter((id) => !walk.includes(id))]
      .map((id) => steps.get(id)!)
      .map((st) => st.name?.trim() || stepInWords(st));
    const loop = `${said.join(' → ')} → back to ${said[0]}`;
    // One message for every step on the loop and after it, so the problem list shows it once
    // with the steps it stops (each card still carries it).
    const message = `The streams make a loop (${loop}), so the steps on it and after it cannot be worked out: a route runs one way; delete the stream that feeds back.`;
    for (const id of inCycle) issues.push({ stepId: id, field: 'connections', message });
  }
  return { issues, graph: { order, incoming, outgoing } };
}
