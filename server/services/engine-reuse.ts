/**
 * The engine's reuse of unchanged work in this thread (an engine pool worker):
 * one step-result memo and one pool of document caches, kept between
 * requests. Editing one step of a route re-evaluates that step and those
 * downstream of it; an unchanged route, evaluated again (a second request, a
 * draft saved without an engine change), runs no step model. The answers are
 * the same to the last bit as a fresh evaluation (shared/engine/route/step-memo.ts).
 *
 * Bounded: 2000 step results (a few kB each: about 10–20 MB of heap) and 16
 * component sets.
 */
import type { RouteDocument } from '@shared/engine/document';
import {
  evaluatePrepared,
  parseRoute,
  prepareRoute,
  type PreparedRoute,
  type RouteResult,
} from '@shared/engine/route/evaluate';
import {
  cachesFor,
  createCachePool,
  createStepMemo,
  type StepMemo,
} from '@shared/engine/route/step-memo';

const stepMemo = createStepMemo(2000);
const cachePool = createCachePool(16);

export interface ReuseOptions {
  /**
   * The document is the output of the route document schema already (the web thread parsed the
   * request with it before handing the document over): the schema is not run a second time.
   * The schema's output parses to itself (its defaults are filled in, it has no transforms), so
   * the evaluation is the same to the last bit; the route checks (components, graph) still run.
   */
  schemaChecked?: boolean;
}

/** Prepares a document with this thread's shared document caches (validation as prepareRoute). */
export function prepareWithReuse(document: unknown, options: ReuseOptions = {}): PreparedRoute {
  const parsed = options.schemaChecked ? (document as RouteDocument) : parseRoute(document);
  const prepared = prepareRoute(parsed);
  prepared.caches = cachesFor(cachePool, parsed);
  return prepared;
}

/** Evaluates a document (parsed or raw) as evaluateRoute does, reusing unchanged steps. */
export function evaluateWithReuse(
  document: RouteDocument | unknown,
  options: ReuseOptions = {},
): RouteResult {
  return evaluatePrepared(prepareWithReuse(document, options), null, stepMemo);
}

/** A memo for one Monte Carlo job: its nominal steps are reused draw after draw. */
export function monteCarloMemo(steps: number): StepMemo {
  return createStepMemo(Math.max(16, 4 * steps));
}

/** Hits and misses of the shared step memo (for tests and diagnostics). */
export function stepMemoStats(): { hits: number; misses: number; entries: number } {
  return { hits: stepMemo.hits, misses: stepMemo.misses, entries: stepMemo.entries.size };
}
