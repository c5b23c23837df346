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
import {
  KIND_NOUN,
  PHASE_WORDS,
  PORT_WORDS,
  article,
  capitalise,
} from '@shared/engine/route/step-words';

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

const stepWords = (s: StepInput) => `${article(KIND_NOUN[s.kind])} ${KIND_NOUN[s.kind]}`;
const named = (s: StepInput) => s.name?.trim() || KIND_NOUN[s.kind];

/**
 * The output a step's product goes on in: the layer a wash or extraction keeps,
 * a distillation's pot, a crystallisation's slurry, a filtration's cake, the
 * dried solid, or the treated stream.
 */
export function keptOutput(step: StepInput): string {
  switch (step.kind) {
    case 'wash':
    case 'extraction':
      return (step.params as { keep?: string }).keep ?? 'organic';
    case 'distillation':
      return 'pot';
    case 'crystallisation':
      return 'slurry';
    case 'filtration':
      return 'cake';
    case 'drying':
      return 'dry';
    case 'split':
      return 'a';
    default:
      return 'out';
  }
}

/** Whether a connection may be drawn: output to input, phases that fit, each input used once, no loops; if not, why, in the chemist's words. */
export function checkConnection(
  doc: EditorDoc,
  from: { stepId: string; port: string },
  to: { stepId: string; port: string },
): ConnectCheck {
  if (from.stepId === to.stepId) return { ok: false, reason: 'A step cannot feed itself.' };
  const a = doc.steps.find((s) => s.id === from.stepId);
  const b = doc.steps.find((s) => s.id === to.stepId);
  if (!a || !b) return { ok: false, reason: 'That step is no longer on the route.' };
  const out = portPhase(a.kind, 'out', from.port);
  const inn = portPhase(b.kind, 'in', to.port);
  if (!out || !inn)
    return {
      ok: false,
      reason: 'Join an output (right side of a card) to an input (left side of a card).',
    };
  const what = PORT_WORDS[from.port] ?? from.port;
  if (!PHASE_ACCEPTS[inn].includes(out))
    return {
      ok: false,
      reason: `${capitalise(stepWords(a))}'s ${what} cannot feed ${stepWords(b)}: ${article(KIND_NOUN[b.kind])} ${KIND_NOUN[b.kind]} takes ${PHASE_WORDS[inn]}.`,
    };
  const fed = doc.connections.find((c) => c.to.stepId === to.stepId && c.to.port === to.port);
  if (fed) {
    const source = doc.steps.find((s) => s.id === fed.from.stepId);
    return {
      ok: false,
      reason: `${named(b)} is already fed${source ? ` by ${named(source)}` : ''}: remove that stream first (select it and press Delete), or choose where the ${PORT_WORDS[to.port] ?? to.port} comes from in ${named(b)}'s settings.`,
    };
  }
  const goes = doc.connections.find(
    (c) => c.from.stepId === from.stepId && c.from.port === from.port,
  );
  if (goes) {
    const dest = doc.steps.find((s) => s.id === goes.to.stepId);
    return {
      ok: false,
      reason: `${named(a)}'s ${what} already goes to ${dest ? named(dest) : 'another step'}: a stream goes to one step (add a split to divide it).`,
    };
  }
  // A loop would make the route impossible to evaluate in order.
  const next = new Map<string, string[]>();
  for (const c of doc.connections)
    next.set(c.from.stepId, [...(next.get(c.from.stepId) ?? []), c.to.stepId]);
  const stack = [to.stepId];
  const seen = new Set<string>();
  while (stack.length) {
    const s = stack.pop()!;
    if (s === from.stepId)
      return {
        ok: false,
        reason: `${named(b)} comes before ${named(a)} on the route: feeding it back would make a loop.`,
      };
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
