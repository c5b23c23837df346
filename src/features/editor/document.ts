/**
 * The route document as the editor holds it: the shared schema's input shape,
 * except that an unfinished draft may have no steps or components yet.
 */
import type { z } from 'zod';
import {
  PORTS,
  PHASE_ACCEPTS,
  ROUTE_SCHEMA_VERSION,
  componentKey,
  type componentSchema,
  type stepSchema,
  type connectionSchema,
  type PortPhase,
  type StepKind,
} from '@shared/schemas/route';

export type StepInput = z.input<typeof stepSchema>;
export type ComponentInput = z.input<typeof componentSchema>;
export type ConnectionInput = z.input<typeof connectionSchema>;

export interface EditorDoc {
  schemaVersion: typeof ROUTE_SCHEMA_VERSION;
  name?: string;
  referenceInput: { componentId: string; massKg: number };
  components: ComponentInput[];
  steps: StepInput[];
  connections: ConnectionInput[];
}

/** Whatever the server holds, made into a document the editor can work on. */
export function normaliseDocument(raw: unknown): EditorDoc {
  const d = (raw && typeof raw === 'object' ? raw : {}) as Partial<EditorDoc>;
  const components = Array.isArray(d.components) ? d.components : [];
  const product = components.find((c) => c.kind === 'compound' && c.role === 'product');
  return {
    schemaVersion: ROUTE_SCHEMA_VERSION,
    ...(d.name ? { name: d.name } : {}),
    referenceInput: d.referenceInput ?? {
      componentId: product
        ? componentKey(product as never)
        : components[0]
          ? componentKey(components[0] as never)
          : 'product',
      massKg: 1,
    },
    components,
    steps: Array.isArray(d.steps) ? d.steps : [],
    connections: Array.isArray(d.connections) ? d.connections : [],
  };
}

export const keyOf = (c: ComponentInput) => componentKey(c as never);

export function portPhase(kind: StepKind, side: 'in' | 'out', port: string): PortPhase | null {
  const list = side === 'in' ? PORTS[kind].inputs : PORTS[kind].outputs;
  return list.find((p) => p.name === port)?.phase ?? null;
}

/** Handle ids on the canvas: "in:feed", "out:organic". */
export const handleId = (side: 'in' | 'out', port: string) => `${side}:${port}`;
export const portOfHandle = (h: string | null | undefined) =>
  h ? h.replace(/^(in|out):/, '') : '';

export type ConnectCheck = { ok: true } | { ok: false; reason: string };

/** Whether a connection may be drawn: output to input, phases that fit, each input used once, no loops. */
export function checkConnection(
  doc: EditorDoc,
  from: { stepId: string; port: string },
  to: { stepId: string; port: string },
): ConnectCheck {
  if (from.stepId === to.stepId) return { ok: false, reason: 'A step cannot feed itself.' };
  const a = doc.steps.find((s) => s.id === from.stepId);
  const b = doc.steps.find((s) => s.id === to.stepId);
  if (!a || !b) return { ok: false, reason: 'Unknown step.' };
  const out = portPhase(a.kind, 'out', from.port);
  const inn = portPhase(b.kind, 'in', to.port);
  if (!out || !inn)
    return { ok: false, reason: 'Connect an output (right side) to an input (left side).' };
  if (!PHASE_ACCEPTS[inn].includes(out))
    return { ok: false, reason: `The ${to.port} input takes ${inn}, not ${out}.` };
  if (doc.connections.some((c) => c.to.stepId === to.stepId && c.to.port === to.port))
    return { ok: false, reason: `${b.name || b.kind} already has a ${to.port} stream.` };
  if (doc.connections.some((c) => c.from.stepId === from.stepId && c.from.port === from.port))
    return { ok: false, reason: `The ${from.port} output already goes somewhere.` };
  // A loop would make the route impossible to evaluate in order.
  const next = new Map<string, string[]>();
  for (const c of doc.connections)
    next.set(c.from.stepId, [...(next.get(c.from.stepId) ?? []), c.to.stepId]);
  const stack = [to.stepId];
  const seen = new Set<string>();
  while (stack.length) {
    const s = stack.pop()!;
    if (s === from.stepId) return { ok: false, reason: 'That connection would make a loop.' };
    if (seen.has(s)) continue;
    seen.add(s);
    stack.push(...(next.get(s) ?? []));
  }
  return { ok: true };
}

/** Immutable set of a value at a path inside an object. */
export function setIn<T>(obj: T, path: ReadonlyArray<string | number>, value: unknown): T {
  if (path.length === 0) return value as T;
  const [head, ...rest] = path;
  const src = (obj ?? (typeof head === 'number' ? [] : {})) as Record<string | number, unknown>;
  const copy = (Array.isArray(src) ? [...src] : { ...src }) as Record<string | number, unknown>;
  if (value === undefined && rest.length === 0) {
    if (Array.isArray(copy)) (copy as unknown as unknown[]).splice(Number(head), 1);
    else delete copy[head];
  } else copy[head] = setIn(src[head], rest, value);
  return copy as T;
}

export function getIn(obj: unknown, path: ReadonlyArray<string | number>): unknown {
  let cur = obj as Record<string | number, unknown> | undefined;
  for (const p of path) cur = cur?.[p] as Record<string | number, unknown> | undefined;
  return cur;
}
