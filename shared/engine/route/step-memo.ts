/**
 * Reuse of unchanged work between evaluations: a memo of step results, and a
 * pool of the document caches (solubility curves, UNIFAC models) keyed by the
 * route's components.
 *
 * A step model is a function of its own step (kind, name, parameters), the
 * streams on its inlets and the route's components (with their compound data)
 * and reference input; nothing else of the route reaches it (the evaluator
 * gives each step a fresh scratch memo). So a step whose key — exactly those
 * things, every number written in full (shortest round-trip form, −0, NaN and
 * ±∞ kept apart) — was seen before has the same result, and the evaluator can
 * return it instead of running the model (the memo keeps a copy frozen through
 * and through, handed out as it is: a caller that changed a remembered result
 * would get a TypeError, never a changed memo): an edited step and the
 * steps downstream of it are evaluated again, the others are not, and a
 * repeated evaluation of an unchanged route runs no model at all. The answer
 * is the same to the last bit (tests/unit/route/step-memo.test.ts compares
 * whole results with and without the memo).
 *
 * A Monte Carlo draw reuses a step only when none of the step's own parameters
 * is uncertain (no random number is drawn for it) and its inlets are unchanged.
 *
 * An inlet stream made by a step the memo remembers is written in a key as the
 * number standing for that stream's full key (given when the step was
 * remembered, the same number for the same stream, never reused for another):
 * a step is reused after an edit upstream that left its inlets as they were,
 * and a key costs the step's own settings, not every number of its inlets. A
 * stream from a step with no entry (none in a nominal evaluation with a memo)
 * is written in full.
 *
 * The memo is owned by its caller (one per worker process in the server, one
 * per browser worker), never module state of the engine, and bounded: least
 * recently used entries are dropped beyond `maxEntries`.
 */
import type { RouteDocument, RouteStep } from '../document';
import { createEvaluationCaches, type EvaluationCaches } from './context';
import type { StepOutput, Stream } from './types';

/** A bounded memo of step results; create with createStepMemo. */
export interface StepMemo {
  /** Entries kept at most (least recently used dropped first). */
  readonly maxEntries: number;
  /** Results by step key, with their entry numbers (Map order = use order, oldest first). */
  readonly entries: Map<string, MemoEntry>;
  /** Short tokens standing for whole context keys (components and reference input). */
  readonly contexts: Map<string, string>;
  /** Counters since creation: steps answered from the memo and steps evaluated. */
  hits: number;
  misses: number;
  /** Next context token number (never reused, so a dropped context cannot alias a new one). */
  nextToken: number;
  /** Next entry number (never reused, so a dropped entry cannot alias a new one). */
  nextEntry: number;
  /** Numbers standing for whole stream keys (streams put out by remembered steps). */
  readonly streams: Map<string, number>;
  /** Next stream number (never reused, so a dropped stream key cannot alias a new one). */
  nextStream: number;
}

/** One remembered step: its outputs and result, and the number standing for its key. */
export interface MemoEntry {
  readonly out: StepOutput;
  readonly n: number;
  /** The number standing for each output stream's key, by port. */
  readonly ports: Record<string, number>;
  /** Whether `out` is frozen through and through (shared with every evaluation that meets the key). */
  readonly frozen: boolean;
}

/** Context keys kept (each distinct component set and reference input of recent routes). */
const MAX_CONTEXTS = 64;

/**
 * An empty step-result memo.
 * Source: this project's own bookkeeping (no external source).
 * Validity: any route; one memo may serve any number of routes (keys include
 * everything a step's result depends on).
 * @param maxEntries  step results kept at most [–] (default 5000)
 * @returns the memo
 */
export function createStepMemo(maxEntries = 5000): StepMemo {
  return {
    maxEntries,
    entries: new Map(),
    contexts: new Map(),
    hits: 0,
    misses: 0,
    nextToken: 0,
    nextEntry: 0,
    streams: new Map(),
    nextStream: 0,
  };
}

/** A number written so that two numbers give the same text only when they are the same number. */
function numberKey(x: number): string {
  return Object.is(x, -0) ? '-0' : String(x);
}

/** Any JSON-like value written exactly (numbers as numberKey, keys in their order). */
function exactKey(value: unknown): string {
  switch (typeof value) {
    case 'number':
      return numberKey(value);
    case 'string':
      return JSON.stringify(value);
    case 'boolean':
      return value ? 't' : 'f';
    case 'undefined':
      return 'u';
    case 'object': {
      if (value === null) return 'n';
      if (Array.isArray(value)) return `[${value.map(exactKey).join(',')}]`;
      let s = '{';
      for (const k in value as Record<string, unknown>)
        s += `${JSON.stringify(k)}:${exactKey((value as Record<string, unknown>)[k])},`;
      return `${s}}`;
    }
    default:
      // Functions, symbols, bigints do not occur in a parsed document; never equal to anything.
      return `?${Math.random()}`;
  }
}

function recordKey(r: Record<string, number>): string {
  let s = '';
  for (const k in r) s += `${k}=${numberKey(r[k])};`;
  return s;
}

function streamKey(s: Stream): string {
  return `${s.phase}|${numberKey(s.temperatureK)}|${numberKey(s.volumeM3)}|${recordKey(s.kg)}|${recordKey(s.solidKg)}`;
}

/**
 * Token of a route's evaluation context: the components (with every compound
 * property) and the reference input, which every step model may read.
 * Source: this project's own bookkeeping (no external source).
 * Validity: any parsed route document.
 * @param memo  the step memo (its context tokens are updated)
 * @param doc   the parsed route document
 * @returns a short token standing for the context
 */
export function contextToken(memo: StepMemo, doc: RouteDocument): string {
  const key = `${exactKey(doc.components)}#${exactKey(doc.referenceInput)}`;
  let token = memo.contexts.get(key);
  if (token !== undefined) memo.contexts.delete(key);
  else token = `c${memo.nextToken++}`;
  memo.contexts.set(key, token);
  while (memo.contexts.size > MAX_CONTEXTS)
    memo.contexts.delete(memo.contexts.keys().next().value!);
  return token;
}

/**
 * Whether evaluating the step draws random numbers in a Monte Carlo draw: any
 * parameter given as { value, plusMinus } with plusMinus ≠ 0.
 * Source: this project's own bookkeeping (no external source); the parameter
 * reader of the evaluation context draws only for such values.
 * Validity: any parsed route step.
 * @param step  the route step
 * @returns true when the step has an uncertain parameter
 */
export function stepIsUncertain(step: RouteStep): boolean {
  const walk = (v: unknown): boolean => {
    if (v === null || typeof v !== 'object') return false;
    if (Array.isArray(v)) return v.some(walk);
    const o = v as Record<string, unknown>;
    if ('plusMinus' in o && typeof o.plusMinus === 'number' && o.plusMinus !== 0) return true;
    for (const k in o) if (walk(o[k])) return true;
    return false;
  };
  return walk(step.params);
}

/**
 * Key of one step's evaluation: context token, the whole step, and every
 * connected inlet's stream (port by port, in port-name order): the number
 * standing for its key (`from`, from rememberStep), or else the stream written
 * in full.
 * Source: this project's own bookkeeping (no external source).
 * Validity: any step of a prepared route; `from` only for streams that the
 * number stands for (rememberStep or recallStep of this evaluation).
 * @param token   the context token (contextToken)
 * @param step    the route step
 * @param inputs  the streams on its connected inlets, by port
 * @param from    the number standing for each inlet stream's key, by port, where it has one
 * @returns the key
 */
export function stepKey(
  token: string,
  step: RouteStep,
  inputs: Record<string, Stream | undefined>,
  from: Record<string, string | undefined> = {},
): string {
  let s = `${token}\u0001${exactKey(step)}`;
  for (const port of Object.keys(inputs).sort()) {
    const stream = inputs[port];
    const made = from[port];
    s +=
      made !== undefined
        ? `\u0001${port}<${made}`
        : `\u0001${port}:${stream ? streamKey(stream) : 'none'}`;
  }
  return s;
}

/**
 * Deep copy keeping each object's prototype (the engine's id records have none). Plain objects
 * and id records are filled by for…in, which for them visits exactly Object.keys, in its order,
 * without building the list of keys.
 */
function copy<T>(v: T): T {
  if (v === null || typeof v !== 'object') return v;
  if (Array.isArray(v)) {
    const out: unknown[] = [];
    for (let i = 0; i < v.length; i++) out.push(copy(v[i] as unknown));
    return out as T;
  }
  if (ArrayBuffer.isView(v)) return (v as unknown as Float64Array).slice() as T;
  const source = v as Record<string, unknown>;
  const proto = Object.getPrototypeOf(v) as object | null;
  if (proto === null || proto === Object.prototype) {
    const out: Record<string, unknown> = proto === null ? Object.create(null) : {};
    for (const k in source) out[k] = copy(source[k]);
    return out as T;
  }
  const out = Object.create(proto) as Record<string, unknown>;
  for (const k of Object.keys(v)) out[k] = copy(source[k]);
  return out as T;
}

/**
 * A deep copy (as copy) frozen through and through, or undefined when the value
 * holds a typed array, whose elements cannot be frozen.
 */
function frozenCopy<T>(v: T): T | undefined {
  if (v === null || typeof v !== 'object') return v;
  if (ArrayBuffer.isView(v)) return undefined;
  if (Array.isArray(v)) {
    const out: unknown[] = [];
    for (let i = 0; i < v.length; i++) {
      const x = frozenCopy(v[i] as unknown);
      if (x === undefined && v[i] !== undefined) return undefined;
      out.push(x);
    }
    return Object.freeze(out) as T;
  }
  const source = v as Record<string, unknown>;
  const proto = Object.getPrototypeOf(v) as object | null;
  const out = (
    proto === null ? Object.create(null) : proto === Object.prototype ? {} : Object.create(proto)
  ) as Record<string, unknown>;
  // Plain objects and id records by for…in (exactly Object.keys for them, without the list).
  if (proto === null || proto === Object.prototype) {
    for (const k in source) {
      const x = frozenCopy(source[k]);
      if (x === undefined && source[k] !== undefined) return undefined;
      out[k] = x;
    }
  } else {
    for (const k of Object.keys(v)) {
      const x = frozenCopy(source[k]);
      if (x === undefined && source[k] !== undefined) return undefined;
      out[k] = x;
    }
  }
  return Object.freeze(out) as T;
}

/**
 * A remembered step result, or undefined; marks it recently used. The result
 * is frozen through and through (a change to it throws), so it is handed out
 * as it is, not copied; a result that could not be frozen is copied.
 * Source: this project's own bookkeeping (no external source).
 * Validity: any key made by stepKey.
 * @param memo  the step memo
 * @param key   the step key
 * @returns the outputs and result (frozen, or a copy) and the entry number, or undefined
 */
export function recallStep(
  memo: StepMemo,
  key: string,
): { out: StepOutput; n: number; ports: Record<string, number> } | undefined {
  const hit = memo.entries.get(key);
  if (!hit) {
    memo.misses++;
    return undefined;
  }
  memo.hits++;
  memo.entries.delete(key);
  memo.entries.set(key, hit);
  return { out: hit.frozen ? hit.out : copy(hit.out), n: hit.n, ports: hit.ports };
}

/**
 * Remember a copy of a step's outputs and result (so later changes to the
 * evaluation's own objects do not reach the memo), frozen through and through
 * where it can be, so that it can be handed out without copying (a change to
 * it throws); drops the least recently used beyond maxEntries.
 * Source: this project's own bookkeeping (no external source).
 * Validity: the complete result of the step (balance and purge filled in).
 * @param memo  the step memo
 * @param key   the step key
 * @param out   the step's outputs and result
 * @returns the number standing for each output stream's key (the same number for the same stream), by port
 */
export function rememberStep(memo: StepMemo, key: string, out: StepOutput): Record<string, number> {
  const n = memo.nextEntry++;
  const ports: Record<string, number> = Object.create(null);
  for (const port in out.outputs) {
    const k = streamKey(out.outputs[port]);
    let id = memo.streams.get(k);
    if (id !== undefined) memo.streams.delete(k);
    else id = memo.nextStream++;
    memo.streams.set(k, id);
    ports[port] = id;
  }
  while (memo.streams.size > 4 * memo.maxEntries + MAX_CONTEXTS)
    memo.streams.delete(memo.streams.keys().next().value!);
  const shared = frozenCopy(out);
  memo.entries.set(
    key,
    shared ? { out: shared, n, ports, frozen: true } : { out: copy(out), n, ports, frozen: false },
  );
  while (memo.entries.size > memo.maxEntries)
    memo.entries.delete(memo.entries.keys().next().value!);
  return ports;
}

/** A bounded set of document caches, keyed by the route's components; create with createCachePool. */
export interface CachePool {
  readonly maxSets: number;
  /** Caches by component key (Map order = use order, oldest first). */
  readonly sets: Map<string, EvaluationCaches>;
}

/**
 * An empty pool of document caches.
 * Source: this project's own bookkeeping (no external source).
 * Validity: any routes.
 * @param maxSets  component sets kept at most [–] (default 16)
 * @returns the pool
 */
export function createCachePool(maxSets = 16): CachePool {
  return { maxSets, sets: new Map() };
}

/**
 * The document caches for a route's components (solubility curves, UNIFAC
 * models): the same caches for every route with the same components, so a
 * second request or an edit of a step's setting rebuilds none of them. They
 * depend on the components only (their keys name compounds and solvents of
 * the route, whose data the component key fixes) and make no number differ
 * from a fresh evaluation.
 * Source: this project's own bookkeeping (no external source).
 * Validity: any parsed route document.
 * @param pool  the cache pool (updated)
 * @param doc   the parsed route document
 * @returns the caches to put on the prepared route
 */
export function cachesFor(pool: CachePool, doc: RouteDocument): EvaluationCaches {
  const key = exactKey(doc.components);
  let caches = pool.sets.get(key);
  if (caches) pool.sets.delete(key);
  else caches = createEvaluationCaches();
  pool.sets.set(key, caches);
  while (pool.sets.size > pool.maxSets) pool.sets.delete(pool.sets.keys().next().value!);
  return caches;
}
