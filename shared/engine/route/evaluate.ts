/**
 * Route evaluation: validate the graph, run every step model in topological
 * order, carry the streams along the connections, check the mass balance of
 * every component at every step, and add the route totals.
 *
 * Totals:
 *  - isolated yield = product in the isolated solid (unconnected 'dry' or
 *    'cake' outputs) / product charged (+ seeds, + formed by reaction);
 *  - purity = product / all mass in the isolated solid [wt %] (the assay,
 *    residual solvents and water included);
 *  - solvent-free purity = product / (product + every other route compound)
 *    in the isolated solid [%]: organic impurities only, the basis of an
 *    HPLC area-% result (equal response factors assumed; solvents, water and
 *    inorganic salts are not seen);
 *  - each impurity's level in the isolated solid on the same solvent-free
 *    basis, judged against the specification limit set on the compound;
 *  - purge factor of each impurity = amount in / amount in the isolated solid,
 *    and per step = amount entering the step / amount leaving it with the
 *    product (the output that carries the most product);
 *  - residual solvents within 20 % of their ICH Q3C limit get a near-limit note;
 *  - solvent use = litres of liquid charged / kg isolated product;
 *  - PMI = total mass charged (incl. water, reagents, auxiliaries) / kg
 *    product (ACS GCI Pharmaceutical Roundtable; Jimenez-Gonzalez et al.,
 *    Org. Process Res. Dev. 2011, 15, 912);
 *  - E-factor = (total mass charged − product) / product (Sheldon, Chem. Ind.
 *    1992, 903; here with water and solvents, no recycling: the "complete"
 *    E-factor), and the same without water;
 *  - peak volume per step; cycle time as the sum of the steps' durations
 *    (common-practice durations, parallel branches counted in series).
 */
import { messageInWords } from './field-words';
import { capitalise, stepInWords } from './step-words';
import { routeDocumentSchema, PORTS, type RouteDocument, type RouteStep } from '../document';
import type { SeededRandom } from '../random';
import { EngineError } from '../errors';
import {
  buildContext,
  createEvaluationCaches,
  type EvalContext,
  type EvaluationCaches,
} from './context';
import { RouteValidationError, StepError, type RouteIssue } from './errors';
import { validateRoute, type GraphInfo } from './validate';
import {
  contextToken,
  recallStep,
  rememberStep,
  stepIsUncertain,
  stepKey,
  type StepMemo,
} from './step-memo';
import { analogueCautions, assumedDataNotes, missingPkaWarnings } from './cautions';
import type { EngineWarning, StepOutput, StepResult, Stream } from './types';
import { charge } from '../unitops/charge';
import { washOrExtraction } from '../unitops/wash';
import { distillation } from '../unitops/distillation';
import { crystallisation } from '../unitops/crystallisation';
import { filtration } from '../unitops/filtration';
import { drying } from '../unitops/drying';
import {
  carbonTreatment,
  merge,
  phAdjust,
  polishFiltration,
  quench,
  split,
} from '../unitops/simple';

import { ENGINE_VERSION } from '../version';

export { ENGINE_VERSION };

/** Relative closure required of every component balance at every step. */
export const MASS_BALANCE_TOLERANCE = 1e-9;

import { PROCESS_SAFETY_NOTE } from './safety-note';
import { idRecord } from '../text';
export { PROCESS_SAFETY_NOTE };

/** Output ports whose unconnected stream counts as the isolated product. */
export const ISOLATED_PORTS: ReadonlyArray<{ kind: RouteStep['kind']; port: string }> = [
  { kind: 'drying', port: 'dry' },
  { kind: 'filtration', port: 'cake' },
];

export interface PurgeEntry {
  inKg: number;
  outKg: number;
  /** in/out; null when none reaches the isolated solid (complete purge). */
  purgeFactor: number | null;
}

/** An impurity's level in the isolated solid (solvent-free basis) against its specification limit. */
export interface ImpurityLevel {
  componentId: string;
  /** 100 · m_i / (m_product + Σ m_other compounds) in the isolated solid [%]. */
  levelPct: number;
  /** The compound's specification limit [%], or null when none is set. */
  limitPct: number | null;
  /** levelPct ≤ limitPct; null without a limit. */
  pass: boolean | null;
}

export interface RouteTotals {
  productId: string | null;
  productInKg: number;
  isolatedProductKg: number;
  isolatedSolidKg: number;
  yieldPct: number | null;
  /** Assay of the isolated solid including residual solvents and water [wt %]. */
  purityWtPct: number | null;
  /** Product / (product + organic impurities) in the isolated solid [%] (area-% basis). */
  solventFreePurityPct: number | null;
  /** Every route compound other than the product that was charged, in route order of components. */
  impurities: ImpurityLevel[];
  purge: Record<string, PurgeEntry>;
  solventUseLPerKg: number | null;
  pmi: number | null;
  eFactor: number | null;
  eFactorExcludingWater: number | null;
  totalInputKg: number;
  peakVolumeL: Record<string, number>;
  cycleTimeH: number;
  cycleTimeBasis: string;
}

export interface RouteResult {
  engineVersion: string;
  schemaVersion: 1;
  order: string[];
  steps: Record<string, StepResult>;
  /** Stream on each connection, by connection id. */
  streams: Record<string, Stream>;
  /** Outputs not connected to another step: product, waste, distillate. */
  terminals: Array<{ stepId: string; port: string; isolated: boolean; stream: Stream }>;
  totals: RouteTotals;
  warnings: Array<EngineWarning & { stepId: string | null }>;
  processSafetyNote: string;
}

type Model = (
  inputs: Record<string, Stream | undefined>,
  params: never,
  ctx: EvalContext,
  step: RouteStep,
) => StepOutput;

const MODELS: Record<RouteStep['kind'], Model> = {
  charge: charge as Model,
  wash: washOrExtraction as Model,
  extraction: washOrExtraction as Model,
  distillation: distillation as Model,
  crystallisation: crystallisation as Model,
  filtration: filtration as Model,
  drying: drying as Model,
  quench: quench as Model,
  'ph-adjust': phAdjust as Model,
  'carbon-treatment': carbonTreatment as Model,
  'polish-filtration': polishFiltration as Model,
  split: split as Model,
  merge: merge as Model,
};

/**
 * Parse with the schema; schema errors become a RouteValidationError with field paths.
 * Source: this project's own bookkeeping (no external source): the route document schema (document.ts).
 * Validity: any input; every schema issue is reported with its step and field.
 * @param doc  the route document as received (unparsed)
 * @returns the parsed route document; throws RouteValidationError
 */
export function parseRoute(doc: unknown): RouteDocument {
  const r = routeDocumentSchema.safeParse(doc);
  if (r.success) return r.data;
  const steps = (doc as { steps?: Array<{ id?: string }> })?.steps;
  throw new RouteValidationError(
    r.error.issues.map((i) => {
      const path = i.path.map(String);
      const stepId =
        path[0] === 'steps' && steps?.[Number(path[1])]?.id
          ? String(steps[Number(path[1])].id)
          : null;
      // A step's field is named inside the step (as the route validation names it); the
      // message says what to enter, in the chemist's words, not the schema's.
      const field = (stepId ? path.slice(2) : path).join('.');
      return { stepId, field, message: messageInWords(i) };
    }),
  );
}

/**
 * Evaluate a route document (parsed or raw). Throws RouteValidationError naming step and field.
 * parseRoute, prepareRoute, then evaluatePrepared.
 * Source: the step models' own sources (docs/methods.md); totals as in the
 * module comment — PMI after the ACS GCI Pharmaceutical Roundtable
 * (Jimenez-Gonzalez et al., Org. Process Res. Dev. 2011, 15, 912), E-factor
 * after Sheldon (Chem. Ind. 1992, 903); cycle time from common-practice
 * durations.
 * Validity: any route document the schema accepts; each number within the
 * validity of the step models that produce it (their warnings say where a
 * model is stretched); parallel branches are counted in series in the cycle time.
 * @param doc             the route document (parsed or raw)
 * @param options.rng     seeded random source for one Monte Carlo draw (nominal values without it)
 * @param options.memo    step-result memo of the caller (step-memo.ts), or none
 * @param options.caches  document caches to use (step-memo.ts cachesFor), or fresh ones
 * @returns the route result (per-step results, streams [kg, m³, K], terminals, totals, warnings)
 */
export function evaluateRoute(
  doc: unknown,
  options: { rng?: SeededRandom; memo?: StepMemo | null; caches?: EvaluationCaches } = {},
): RouteResult {
  const parsed = parseRoute(doc);
  const prepared = prepareRoute(parsed);
  if (options.caches) prepared.caches = options.caches;
  return evaluatePrepared(prepared, options.rng ?? null, options.memo ?? null);
}

export interface PreparedRoute {
  doc: RouteDocument;
  graph: GraphInfo;
  /** Document-keyed caches shared by the evaluations of this route (solubility curves, UNIFAC models). */
  caches?: EvaluationCaches;
}

/**
 * Validate once (for repeated evaluation in Monte Carlo): resolve the
 * components, check the graph and order the steps; throws
 * RouteValidationError with every issue.
 * Source: this project's own bookkeeping (no external source); see validateRoute.
 * Validity: any parsed route document.
 * @param doc  the parsed route document
 * @returns the document, its graph (topological order, connections) and fresh caches
 */
export function prepareRoute(doc: RouteDocument): PreparedRoute {
  const { ctx, issues: ctxIssues } = buildContext(doc);
  const { issues, graph } = validateRoute(doc, ctx, ctxIssues);
  if (issues.length) throw new RouteValidationError(issues);
  return { doc, graph, caches: createEvaluationCaches() };
}

/**
 * Evaluate a prepared route: every step model in topological order, streams
 * carried along the connections, the mass balance of every component checked
 * at every step (in + added + generated − consumed = out, to
 * MASS_BALANCE_TOLERANCE relative), the per-step purge, the route totals and
 * the route-level cautions and notes.
 * Source: the step models' own sources (docs/methods.md); totals as in the
 * module comment — PMI after the ACS GCI Pharmaceutical Roundtable
 * (Jimenez-Gonzalez et al., Org. Process Res. Dev. 2011, 15, 912), E-factor
 * after Sheldon (Chem. Ind. 1992, 903); cycle time from common-practice
 * durations.
 * Validity: any route document the schema accepts; each number within the
 * validity of the step models that produce it (their warnings say where a
 * model is stretched); parallel branches are counted in series in the cycle time.
 *
 * With a step-result memo (step-memo.ts), a step whose own parameters,
 * inlet streams and route components were seen before is answered with a frozen copy
 * of its earlier result instead of running its model (the same numbers to the
 * last bit); in a Monte Carlo draw only steps with no uncertain parameter of
 * their own or upstream of them are looked up. Each step gets a fresh scratch
 * memo, so its result never depends on what an earlier step left there.
 * @param prepared  the prepared route (prepareRoute)
 * @param rng       seeded random source for one Monte Carlo draw, or null for nominal values
 * @param memo      step-result memo owned by the caller, or null to evaluate every step
 * @returns the route result (per-step results, streams, terminals, totals, warnings, process-safety note)
 */
export function evaluatePrepared(
  prepared: PreparedRoute,
  rng: SeededRandom | null,
  memo: StepMemo | null = null,
): RouteResult {
  const { graph } = prepared;
  const streams = idRecord<Stream>();
  const { ctx, stepById, outputsOf, results } = runSteps(prepared, rng, memo, streams);
  const terminals = terminalsOf(graph, stepById, outputsOf);
  const totals = computeTotals(ctx, graph.order, results, terminals);
  const warnings: RouteResult['warnings'] = [];
  // Written out, not spread: a spread of each step's warnings cost about 2 % of an evaluation.
  for (const id of graph.order)
    for (const w of results[id].warnings)
      warnings.push({ severity: w.severity, code: w.code, message: w.message, stepId: id });
  warnings.push(...analogueCautions(ctx, graph.order, stepById, results));
  warnings.push(...nearLimitNotes(ctx, terminals));
  warnings.push(...assumedDataNotes(ctx));
  warnings.push(...missingPkaWarnings(ctx));
  if (!ctx.productId)
    warnings.push({
      severity: 'info',
      code: 'no-product',
      message:
        'No compound is marked as the product, so yield, purity and purge are not worked out: mark the compound you isolate as the product.',
      stepId: null,
    });
  else if (!terminals.some((t) => t.isolated))
    warnings.push({
      severity: 'info',
      code: 'no-isolation',
      message: 'No unconnected cake or dry-solid output: nothing is isolated yet.',
      stepId: null,
    });
  return {
    engineVersion: ENGINE_VERSION,
    schemaVersion: 1,
    order: graph.order,
    steps: results,
    streams,
    terminals,
    totals,
    warnings,
    processSafetyNote: PROCESS_SAFETY_NOTE,
  };
}

/** The totals one Monte Carlo draw samples: what its summary reads of a route result. */
export type DrawTotals = Pick<RouteTotals, 'yieldPct' | 'purityWtPct' | 'purge'>;

/**
 * One Monte Carlo draw of a prepared route: the same step models, in the same
 * order and with the same draws from `rng`, as evaluatePrepared(prepared, rng,
 * memo), and the same totals to the last bit, without what a draw's summary
 * never reads: the per-step mass-balance check and purge, the streams by
 * connection, the route's cautions and the collected warnings. A step the memo
 * answers or remembers is still completed in full (balance and purge), so the
 * memo holds the same entries as after evaluatePrepared.
 * Source: as evaluatePrepared (the totals are its computeTotals).
 * Validity: as evaluatePrepared; tests/unit/route/monte-carlo.test.ts compares
 * every draw with evaluatePrepared's totals.
 * @param prepared  the prepared route (prepareRoute)
 * @param rng       seeded random source of the draw
 * @param memo      step-result memo owned by the caller, or null
 * @returns isolated yield [%], purity [wt %] and the purge of each impurity (in, out [kg], factor [–])
 */
export function evaluateDraw(
  prepared: PreparedRoute,
  rng: SeededRandom,
  memo: StepMemo | null = null,
): DrawTotals {
  const { graph } = prepared;
  const { ctx, stepById, outputsOf, results } = runSteps(prepared, rng, memo, null);
  const totals = computeTotals(ctx, graph.order, results, terminalsOf(graph, stepById, outputsOf));
  return { yieldPct: totals.yieldPct, purityWtPct: totals.purityWtPct, purge: totals.purge };
}

/**
 * Every step model in topological order, streams carried along the connections. With `streams`
 * (a full evaluation) every step's balance is checked and its purge worked out, and the stream of
 * each connection is recorded there; without (a Monte Carlo draw) only the steps the memo answers
 * or remembers are completed so (the memo's entries are always complete).
 *
 * In a draw (rng given), a step is looked up in the memo only when neither it nor any step
 * upstream of it has an uncertain parameter: any other step's inlets or settings are drawn anew
 * each time, so its key would never be met again (the memo answers only exact repeats, so this
 * changes no number, only the work of writing keys and copying results that are never reused).
 */
function runSteps(
  prepared: PreparedRoute,
  rng: SeededRandom | null,
  memo: StepMemo | null,
  streams: Record<string, Stream> | null,
): {
  ctx: EvalContext;
  stepById: Map<string, RouteStep>;
  outputsOf: Map<string, Record<string, Stream>>;
  results: Record<string, StepResult>;
} {
  const { doc, graph } = prepared;
  const { ctx } = buildContext(doc, rng, prepared.caches ?? createEvaluationCaches());
  const token = memo ? contextToken(memo, doc) : '';
  const stepById = new Map(doc.steps.map((s) => [s.id, s]));
  const outputsOf = new Map<string, Record<string, Stream>>();
  // Numbers standing for the output streams of each step remembered or reused, by port (their stand-ins in keys).
  const entryOf = memo ? new Map<string, Record<string, number>>() : null;
  // Steps whose result depends on a draw (their own uncertain setting or one upstream); a draw only.
  const drawn = memo && rng ? new Set<string>() : null;
  // Indexed by step and connection ids: no prototype, so no id can read a built-in.
  const results = idRecord<StepResult>();
  for (const id of graph.order) {
    const step = stepById.get(id)!;
    const inputs = idRecord<Stream | undefined>();
    const from = entryOf ? idRecord<string | undefined>() : null;
    let upstreamDrawn = false;
    for (const [port, c] of graph.incoming.get(id)!) {
      inputs[port] = outputsOf.get(c.from.stepId)![c.from.port];
      if (drawn?.has(c.from.stepId)) upstreamDrawn = true;
      const n = entryOf?.get(c.from.stepId)?.[c.from.port];
      if (n !== undefined) from![port] = `${n}`;
    }
    if (drawn && (upstreamDrawn || stepIsUncertain(step))) drawn.add(id);
    const key = memo && !drawn?.has(id) ? stepKey(token, step, inputs, from!) : null;
    const hit = key !== null ? recallStep(memo!, key) : undefined;
    let out = hit?.out;
    if (hit) entryOf!.set(id, hit.ports);
    if (!out) {
      ctx.scratch = new Map();
      try {
        out = MODELS[step.kind](inputs, step.params as never, ctx, step);
      } catch (e) {
        throw toRouteError(e, step);
      }
      if (streams || key !== null) {
        checkBalance(ctx, inputs, out);
        out.result.purge = stepPurge(ctx, out);
      }
      if (key !== null) entryOf!.set(id, rememberStep(memo!, key, out));
    }
    outputsOf.set(id, out.outputs);
    results[id] = out.result;
    if (streams) for (const [port, c] of graph.outgoing.get(id)!) streams[c.id] = out.outputs[port];
  }
  return { ctx, stepById, outputsOf, results };
}

/** The outputs connected to no other step, in step order (isolated: a cake or dry-solid port). */
function terminalsOf(
  graph: GraphInfo,
  stepById: ReadonlyMap<string, RouteStep>,
  outputsOf: ReadonlyMap<string, Record<string, Stream>>,
): RouteResult['terminals'] {
  const terminals: RouteResult['terminals'] = [];
  for (const id of graph.order) {
    const step = stepById.get(id)!;
    for (const p of PORTS[step.kind].outputs) {
      if (graph.outgoing.get(id)!.has(p.name)) continue;
      const isolated = ISOLATED_PORTS.some((q) => q.kind === step.kind && q.port === p.name);
      terminals.push({ stepId: id, port: p.name, isolated, stream: outputsOf.get(id)![p.name] });
    }
  }
  return terminals;
}

function toRouteError(e: unknown, step: RouteStep): Error {
  if (e instanceof RouteValidationError) return e;
  if (e instanceof StepError)
    return new RouteValidationError([
      {
        stepId: step.id,
        field: e.field,
        message: e.inStep ? e.inStep(capitalise(stepInWords(step))) : e.message,
      },
    ]);
  if (e instanceof EngineError)
    return new RouteValidationError([{ stepId: step.id, field: 'params', message: e.message }]);
  return e as Error;
}

/** in + added + generated − consumed = out for every component, to MASS_BALANCE_TOLERANCE relative. */
function checkBalance(
  ctx: EvalContext,
  inputs: Record<string, Stream | undefined>,
  out: StepOutput,
) {
  const r = out.result;
  const balance: NonNullable<StepResult['balance']> = idRecord();
  const ids = ctx.ids;
  let scale = 0;
  const inKg = new Float64Array(ids.length);
  const outKg = new Float64Array(ids.length);
  // The ports listed once per step, not once per component (in the same order, so the same sums).
  const inlets: Array<Stream | undefined> = [];
  for (const p in inputs) inlets.push(inputs[p]);
  const outlets: Array<Record<string, number>> = [];
  for (const p in out.outputs) outlets.push(out.outputs[p].kg);
  for (let i = 0; i < ids.length; i++) {
    const id = ids[i];
    let a = (r.addedKg[id] ?? 0) + (r.generatedKg[id] ?? 0) - (r.consumedKg[id] ?? 0);
    for (let j = 0; j < inlets.length; j++) a += inlets[j]?.kg[id] ?? 0;
    let b = 0;
    for (let j = 0; j < outlets.length; j++) b += outlets[j][id];
    inKg[i] = a;
    outKg[i] = b;
    scale = Math.max(scale, Math.abs(a), Math.abs(b));
  }
  for (let i = 0; i < ids.length; i++) {
    const id = ids[i];
    const a = inKg[i];
    const b = outKg[i];
    const denom = Math.max(Math.abs(a), Math.abs(b), scale * 1e-12, 1e-300);
    const rel = Math.abs(a - b) / denom;
    balance[id] = { inKg: a, outKg: b, relativeError: rel };
    if (!(rel <= MASS_BALANCE_TOLERANCE)) {
      r.warnings.push({
        severity: 'warning',
        code: 'mass-balance',
        message: `Mass balance of ${ctx.comps.get(id)!.name} does not close (relative error ${rel.toExponential(2)}); please report this route.`,
      });
    }
  }
  r.balance = balance;
}

/**
 * Where each impurity goes at one step: the amount entering it (inputs +
 * charged + formed − consumed, from the balance) and the amount leaving with
 * the product, i.e. in the output that carries the most product; purge factor
 * = in / out (null when none leaves with the product). Empty when no product
 * passes through the step, or the route names no product.
 *
 * Source: the purge factor of a purge argument (Teasdale et al., Org.
 * Process Res. Dev. 2013, 17, 221); amounts from this step's mass balance.
 * Validity: any evaluated step; "with the product" is the one output that
 * carries the most product (a step that splits the product between outputs
 * counts only the largest).
 * @param ctx  evaluation context (route components resolved against the library)
 * @param out  the step's outputs (kg [kg]) and result (balance [kg])
 * @returns in and out [kg] and the purge factor [–] of each impurity, by component id
 */
export function stepPurge(ctx: EvalContext, out: StepOutput): Record<string, PurgeEntry> {
  const purge = idRecord<PurgeEntry>();
  const pid = ctx.productId;
  const balance = out.result.balance;
  if (!pid || !balance) return purge;
  let carrier: Stream | null = null;
  for (const port in out.outputs) {
    const s = out.outputs[port];
    if (s.kg[pid] > 0 && (!carrier || s.kg[pid] > carrier.kg[pid])) carrier = s;
  }
  if (!carrier) return purge;
  for (const id of ctx.ids) {
    const c = ctx.comps.get(id)!;
    const inKg = balance[id]?.inKg ?? 0;
    if (c.kind !== 'compound' || id === pid || !(inKg > 0)) continue;
    const outKg = carrier.kg[id];
    purge[id] = { inKg, outKg, purgeFactor: outKg > 0 ? inKg / outKg : null };
  }
  return purge;
}

/** Fraction of an ICH Q3C limit from which a residual solvent gets a near-limit note. */
export const ICH_NEAR_LIMIT_FRACTION = 0.8;

/**
 * Near-limit notes for the residual solvents of the isolated solid: a
 * residual at or above 80 % of its ICH Q3C(R9) concentration limit (Option 1,
 * the library's reproduced table) but not above it (exceedance is the drying
 * step's own warning). The 20 % margin is common practice for a result that
 * batch-to-batch variation may carry over the limit.
 */
function nearLimitNotes(
  ctx: EvalContext,
  terminals: RouteResult['terminals'],
): RouteResult['warnings'] {
  const notes: RouteResult['warnings'] = [];
  for (const t of terminals) {
    if (!t.isolated) continue;
    let total = 0;
    for (const id of ctx.ids) total += t.stream.kg[id];
    if (!(total > 0)) continue;
    for (const id of ctx.ids) {
      const c = ctx.comps.get(id)!;
      const limit = c.solvent?.ich.value.limitPpm ?? null;
      if (!c.solvent || c.isWater || limit === null || !(t.stream.kg[id] > 0)) continue;
      const ppm = (t.stream.kg[id] / total) * 1e6;
      if (ppm >= ICH_NEAR_LIMIT_FRACTION * limit && ppm <= limit)
        notes.push({
          severity: 'advisory',
          code: 'ich-near-limit',
          message: `Residual ${c.name} ${ppm.toFixed(0)} ppm is within 20 % of its ICH Q3C limit of ${limit} ppm (${((100 * ppm) / limit).toFixed(0)} % of it): batch-to-batch variation may carry it over; dry longer or confirm by GC.`,
          stepId: t.stepId,
        });
    }
  }
  return notes;
}

function computeTotals(
  ctx: EvalContext,
  order: string[],
  results: Record<string, StepResult>,
  terminals: RouteResult['terminals'],
): RouteTotals {
  const pid = ctx.productId;
  const inputKg = idRecord<number>();
  for (const id of ctx.ids) inputKg[id] = 0;
  let aux = 0;
  let volumeL = 0;
  let hours = 0;
  const peak = idRecord<number>();
  for (const id of order) {
    const r = results[id];
    for (const c in r.addedKg) inputKg[c] += r.addedKg[c];
    for (const c in r.generatedKg) inputKg[c] += r.generatedKg[c];
    for (const c in r.consumedKg) inputKg[c] -= r.consumedKg[c];
    aux += r.auxiliaryKg;
    volumeL += r.addedVolumeM3 * 1000;
    hours += r.duration.hours;
    peak[id] = r.peakVolumeM3 * 1000;
  }
  const iso = idRecord<number>();
  for (const id of ctx.ids) iso[id] = 0;
  for (const t of terminals) if (t.isolated) for (const id of ctx.ids) iso[id] += t.stream.kg[id];
  const isoTotal = Object.values(iso).reduce((a, b) => a + b, 0);
  const product = pid ? iso[pid] : 0;
  const purge = idRecord<PurgeEntry>();
  for (const id of ctx.ids) {
    const c = ctx.comps.get(id)!;
    if (c.kind !== 'compound' || id === pid || !(inputKg[id] > 0)) continue;
    purge[id] = {
      inKg: inputKg[id],
      outKg: iso[id],
      purgeFactor: iso[id] > 0 ? inputKg[id] / iso[id] : null,
    };
  }
  // Solvent-free basis: the product and every other route compound in the solid.
  let organicKg = product;
  for (const id of ctx.ids)
    if (id !== pid && ctx.comps.get(id)!.kind === 'compound') organicKg += iso[id];
  const impurities: ImpurityLevel[] = [];
  if (pid && organicKg > 0)
    for (const id of ctx.ids) {
      const c = ctx.comps.get(id)!;
      if (c.kind !== 'compound' || id === pid || !(inputKg[id] > 0)) continue;
      const levelPct = (100 * iso[id]) / organicKg;
      const limitPct = c.compound?.specLimitPct ?? null;
      impurities.push({
        componentId: id,
        levelPct,
        limitPct,
        pass: limitPct === null ? null : levelPct <= limitPct,
      });
    }
  // Total mass charged: everything added by any step (reaction products are not inputs) plus auxiliaries.
  let charged = aux;
  let water = 0;
  for (const id of order) {
    const r = results[id];
    for (const c in r.addedKg) {
      charged += r.addedKg[c];
      if (ctx.comps.get(c)!.isWater) water += r.addedKg[c];
    }
  }
  const has = product > 0;
  return {
    productId: pid,
    productInKg: pid ? inputKg[pid] : 0,
    isolatedProductKg: product,
    isolatedSolidKg: isoTotal,
    yieldPct: pid && inputKg[pid] > 0 ? (100 * product) / inputKg[pid] : null,
    purityWtPct: isoTotal > 0 && pid ? (100 * product) / isoTotal : null,
    solventFreePurityPct: pid && organicKg > 0 ? (100 * product) / organicKg : null,
    impurities,
    purge,
    solventUseLPerKg: has ? volumeL / product : null,
    pmi: has ? charged / product : null,
    eFactor: has ? (charged - product) / product : null,
    eFactorExcludingWater: has ? (charged - water - product) / product : null,
    totalInputKg: charged,
    peakVolumeL: peak,
    cycleTimeH: hours,
    cycleTimeBasis:
      'sum of common-practice step durations (docs/methods.md); parallel branches counted in series',
  };
}

export type { RouteIssue };
