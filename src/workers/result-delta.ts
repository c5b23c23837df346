/**
 * What the evaluation worker sends back after an edit: only the parts of the
 * route's result that differ from its previous answer. An edit changes the
 * edited step and those downstream of it; the page keeps the rest, object for
 * object, so copying the answer between threads costs less and a card whose
 * own result did not change is handed the very object it already shows.
 *
 * `resultDelta` (in the worker) and `applyResultDelta` (on the page) are each
 * other's inverse: applying every delta in the order sent rebuilds each
 * result exactly (tests/unit/client/result-delta.test.ts).
 */
import type { RouteResult } from '@shared/engine/route/evaluate';

/** Entries of a record by key: every key in order, with the values that changed. */
export interface KeyedDelta<T> {
  keys: string[];
  changed: Record<string, T>;
}

export type StepResults = RouteResult['steps'];
export type StreamResults = RouteResult['streams'];
type Rest = Omit<RouteResult, 'steps' | 'streams'>;

export interface ResultDelta {
  steps: KeyedDelta<StepResults[string]>;
  streams: KeyedDelta<StreamResults[string]>;
  /** The other fields that differ from the previous answer (an absent field is unchanged). */
  rest: Partial<Rest>;
}

const REST_FIELDS = [
  'engineVersion',
  'schemaVersion',
  'order',
  'terminals',
  'totals',
  'warnings',
  'processSafetyNote',
] as const satisfies ReadonlyArray<keyof Rest>;
/** A field the engine adds to its result fails the type-check here until it is listed above. */
const EVERY_FIELD_LISTED: Exclude<keyof Rest, (typeof REST_FIELDS)[number]> extends never
  ? true
  : never = true;
void EVERY_FIELD_LISTED;

/** An object of plain data (the engine builds some without a prototype; a copy between threads gives them one). */
function plainObject(x: object): boolean {
  const proto = Object.getPrototypeOf(x);
  return proto === Object.prototype || proto === null;
}

/**
 * The same value, exactly: numbers by Object.is (so NaN equals NaN, and 0 and
 * −0 differ, as a copy between threads keeps them), objects key by key in the
 * same order, arrays item by item. Anything but plain objects and arrays is
 * never called the same unless it is the same object.
 */
export function sameValue(a: unknown, b: unknown): boolean {
  if (Object.is(a, b)) return true;
  if (typeof a !== 'object' || typeof b !== 'object' || a === null || b === null) return false;
  if (Array.isArray(a)) {
    if (!Array.isArray(b) || a.length !== b.length) return false;
    for (let i = 0; i < a.length; i++) if (!sameValue(a[i], b[i])) return false;
    return true;
  }
  if (Array.isArray(b)) return false;
  if (!plainObject(a) || !plainObject(b)) return false;
  const ka = Object.keys(a);
  const kb = Object.keys(b);
  if (ka.length !== kb.length) return false;
  for (let i = 0; i < ka.length; i++) {
    const k = ka[i];
    if (k !== kb[i]) return false;
    if (!sameValue((a as Record<string, unknown>)[k], (b as Record<string, unknown>)[k]))
      return false;
  }
  return true;
}

function keyedDelta<T>(
  prev: Record<string, T> | undefined,
  next: Record<string, T>,
): KeyedDelta<T> {
  const keys = Object.keys(next);
  const changed: Record<string, T> = {};
  for (const k of keys)
    if (!prev || !Object.prototype.hasOwnProperty.call(prev, k) || !sameValue(prev[k], next[k]))
      changed[k] = next[k];
  return { keys, changed };
}

/** What `next` changes against `prev`, the last result sent (null: none yet, send it whole). */
export function resultDelta(prev: RouteResult | null, next: RouteResult): ResultDelta {
  const rest: Partial<Rest> = {};
  for (const f of REST_FIELDS)
    if (!prev || !sameValue(prev[f], next[f])) (rest as Record<string, unknown>)[f] = next[f];
  return {
    steps: keyedDelta(prev?.steps, next.steps),
    streams: keyedDelta(prev?.streams, next.streams),
    rest,
  };
}

function applyKeyed<T>(base: Record<string, T> | undefined, d: KeyedDelta<T>): Record<string, T> {
  const out: Record<string, T> = {};
  for (const k of d.keys) {
    if (Object.prototype.hasOwnProperty.call(d.changed, k)) out[k] = d.changed[k];
    else if (base && Object.prototype.hasOwnProperty.call(base, k)) out[k] = base[k];
    else throw new Error(`The evaluation answer left out "${k}", which the page does not have.`);
  }
  return out;
}

/**
 * The result a delta stands for, given the result built from the delta before it
 * (null for the first). Unchanged steps, streams and fields are the base's own objects.
 */
export function applyResultDelta(base: RouteResult | null, d: ResultDelta): RouteResult {
  const field = <K extends keyof Rest>(f: K): Rest[K] => {
    if (Object.prototype.hasOwnProperty.call(d.rest, f)) return d.rest[f] as Rest[K];
    if (base) return base[f];
    throw new Error(`The evaluation answer left out "${f}", which the page does not have.`);
  };
  // The fields in the engine's own order.
  return {
    engineVersion: field('engineVersion'),
    schemaVersion: field('schemaVersion'),
    order: field('order'),
    steps: applyKeyed(base?.steps, d.steps),
    streams: applyKeyed(base?.streams, d.streams),
    terminals: field('terminals'),
    totals: field('totals'),
    warnings: field('warnings'),
    processSafetyNote: field('processSafetyNote'),
  };
}
