/**
 * What changed between two revisions: steps added, removed and changed (each
 * parameter old → new, by dotted path), connections added and removed, other
 * document changes, and every numeric total of the evaluation side by side.
 * Pure: documents and totals in, a plain object out.
 */
import type { RevisionCompare } from '@shared/schemas/revisions';

interface StepLike {
  id: string;
  kind: string;
  name?: string;
  [key: string]: unknown;
}
interface DocumentLike {
  steps?: StepLike[];
  connections?: Array<{ id?: string; from?: unknown; to?: unknown }>;
  [key: string]: unknown;
}
type Change = { path: string; from: unknown; to: unknown };

/** Keys of a step that only place it on the canvas: moving a card is not a process change. */
const LAYOUT_KEYS = new Set(['position', 'layout']);

const isPlainObject = (value: unknown): value is Record<string, unknown> =>
  typeof value === 'object' && value !== null && !Array.isArray(value);

/**
 * Every leaf that differs, by dotted path. Arrays of objects with ids are
 * matched by id ("contents[toluene].massKg"), other arrays by index.
 */
export function diffValues(from: unknown, to: unknown, path = ''): Change[] {
  if (Object.is(from, to)) return [];
  if (isPlainObject(from) && isPlainObject(to)) {
    const keys = [...new Set([...Object.keys(from), ...Object.keys(to)])].sort();
    return keys.flatMap((key) => diffValues(from[key], to[key], path ? `${path}.${key}` : key));
  }
  if (Array.isArray(from) && Array.isArray(to)) {
    const keyed = (items: unknown[]) =>
      items.every(
        (item) => isPlainObject(item) && typeof (item.id ?? item.componentId) === 'string',
      );
    if (keyed(from) && keyed(to)) {
      const keyOf = (item: unknown) => {
        const record = item as Record<string, unknown>;
        return String(record.id ?? record.componentId);
      };
      const before = new Map(from.map((item) => [keyOf(item), item]));
      const after = new Map(to.map((item) => [keyOf(item), item]));
      const ids = [...new Set([...before.keys(), ...after.keys()])];
      return ids.flatMap((id) => diffValues(before.get(id), after.get(id), `${path}[${id}]`));
    }
    if (JSON.stringify(from) === JSON.stringify(to)) return [];
    const length = Math.max(from.length, to.length);
    if (from.every((v) => !isPlainObject(v)) && to.every((v) => !isPlainObject(v)))
      return [{ path, from, to }];
    return Array.from({ length }, (_, i) => diffValues(from[i], to[i], `${path}[${i}]`)).flat();
  }
  return [{ path, from: from ?? null, to: to ?? null }];
}

const stepRef = (step: StepLike) => ({ id: step.id, kind: step.kind, name: step.name ?? step.id });

function withoutLayout(step: StepLike): Record<string, unknown> {
  return Object.fromEntries(Object.entries(step).filter(([key]) => !LAYOUT_KEYS.has(key)));
}

const connectionKey = (connection: { id?: string; from?: unknown; to?: unknown }) =>
  connection.id ?? JSON.stringify([connection.from, connection.to]);

/** The numeric totals by their result.totals names, purge factors as "purge.<componentId>". */
export function flattenTotals(totals: unknown): Record<string, number | null> {
  const flat: Record<string, number | null> = {};
  if (!isPlainObject(totals)) return flat;
  for (const [name, value] of Object.entries(totals)) {
    if (typeof value === 'number' || value === null) flat[name] = value;
    else if (name === 'purge' && isPlainObject(value)) {
      for (const [componentId, entry] of Object.entries(value))
        flat[`purge.${componentId}`] = isPlainObject(entry)
          ? ((entry.purgeFactor as number | null) ?? null)
          : null;
    } else if (isPlainObject(value)) {
      for (const [key, inner] of Object.entries(value))
        if (typeof inner === 'number' || inner === null) flat[`${name}.${key}`] = inner;
    }
  }
  return flat;
}

export function compareRevisions(
  from: { number: number; document: unknown; totals: unknown },
  to: { number: number; document: unknown; totals: unknown },
): RevisionCompare {
  const a = (from.document ?? {}) as DocumentLike;
  const b = (to.document ?? {}) as DocumentLike;
  const stepsA = new Map((a.steps ?? []).map((s) => [s.id, s]));
  const stepsB = new Map((b.steps ?? []).map((s) => [s.id, s]));

  const stepsAdded = [...stepsB.values()].filter((s) => !stepsA.has(s.id)).map(stepRef);
  const stepsRemoved = [...stepsA.values()].filter((s) => !stepsB.has(s.id)).map(stepRef);
  const stepsChanged = [...stepsB.values()]
    .filter((s) => stepsA.has(s.id))
    .map((s) => ({
      ...stepRef(s),
      stepId: s.id,
      changes: diffValues(withoutLayout(stepsA.get(s.id)!), withoutLayout(s)),
    }))
    .filter((s) => s.changes.length > 0)
    .map(({ stepId, name, kind, changes }) => ({ stepId, name, kind, changes }));

  const connectionsA = new Set((a.connections ?? []).map(connectionKey));
  const connectionsB = new Set((b.connections ?? []).map(connectionKey));

  const rest = (doc: DocumentLike) =>
    Object.fromEntries(Object.entries(doc).filter(([k]) => k !== 'steps' && k !== 'connections'));

  const totalsA = flattenTotals(from.totals);
  const totalsB = flattenTotals(to.totals);
  const totals: RevisionCompare['totals'] = {};
  for (const name of [...new Set([...Object.keys(totalsA), ...Object.keys(totalsB)])].sort())
    totals[name] = { from: totalsA[name] ?? null, to: totalsB[name] ?? null };

  return {
    from: from.number,
    to: to.number,
    stepsAdded,
    stepsRemoved,
    stepsChanged,
    connectionsAdded: [...connectionsB].filter((c) => !connectionsA.has(c)),
    connectionsRemoved: [...connectionsA].filter((c) => !connectionsB.has(c)),
    documentChanges: diffValues(rest(a), rest(b)),
    totals,
  };
}
