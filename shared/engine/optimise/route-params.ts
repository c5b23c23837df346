/**
 * Free parameters of a route: a step's parameter addressed by its path
 * inside the step's `params` as written in the route document (for example
 * `addedLiquid.volume` of a wash, `mode.cycles` of a put-and-take swap).
 * The path addresses the quantity: a plain number, a number with a ± range
 * ({ value, plusMinus }: the value moves, the range stays) or a volume
 * ({ value, unit }: the value moves in the document's unit).
 */
import type { RouteDocument, RouteStep } from '../document';

/** Step parameters that only take whole numbers: stages, put-and-take cycles, cake washes. */
const INTEGER_FIELDS = new Set(['stages', 'cycles', 'washes']);

/** The chemist's name of each parameter the optimiser is meant for, by step kind and path. */
const LABELS: Partial<Record<RouteStep['kind'], Record<string, string>>> = {
  wash: {
    'addedLiquid.volume': 'wash volume',
    'addedLiquid.wtPct': 'strength of the wash',
    'addedLiquid.pH': 'pH of the wash',
    stages: 'number of washes',
    temperatureC: 'temperature',
  },
  extraction: {
    'addedLiquid.volume': 'extraction volume',
    'addedLiquid.pH': 'pH of the aqueous phase',
    stages: 'number of stages',
    temperatureC: 'temperature',
  },
  distillation: {
    'mode.cycles': 'put-and-take cycles',
    'mode.addVolume': 'volume added',
    'mode.targetVolume': 'volume to distil down to',
    'condition.pressureMbar': 'pressure',
    'condition.potTemperatureC': 'pot temperature',
  },
  crystallisation: {
    'mode.volume': 'antisolvent volume',
    'mode.endC': 'end temperature',
    'mode.startC': 'start temperature',
    'mode.temperatureC': 'temperature',
    'mode.targetVolume': 'volume to evaporate down to',
    seedWtPct: 'seed charge',
  },
  filtration: {
    'cakeWash.volume': 'cake-wash volume',
    'cakeWash.washes': 'number of cake washes',
  },
  drying: { temperatureC: 'drying temperature', pressureMbar: 'drying pressure' },
};

/**
 * How a message names a free parameter in the chemist's words, e.g. "the wash
 * volume of step “Acid wash”" (the step's name, else its id; a path without
 * a label is named as it is written).
 * Source: this project's own bookkeeping (no external source).
 * Validity: any route document the schema accepts.
 * @param step  the step (kind, name, id)
 * @param path  the parameter's path inside the step's params, e.g. "addedLiquid.volume"
 * @returns the phrase
 */
export function paramLabel(step: Pick<RouteStep, 'kind' | 'name' | 'id'>, path: string): string {
  const label = LABELS[step.kind]?.[path] ?? `parameter “${path}”`;
  return `the ${label} of step “${step.name || step.id}”`;
}

/**
 * Whether a parameter only takes whole numbers (stages, put-and-take cycles,
 * cake washes), by the last field of its path.
 * Source: this project's own bookkeeping (no external source).
 * Validity: any route document the schema accepts.
 * @param path  the parameter's path inside the step's params
 * @returns true for a count
 */
export function isIntegerParam(path: string): boolean {
  return INTEGER_FIELDS.has(path.split('.').at(-1) ?? '');
}

type Holder = Record<string, unknown> | unknown[];

/** Where the number lives: the object holding it and its key. */
function locate(params: unknown, path: string): { holder: Holder; key: string } | null {
  const parts = path.split('.');
  if (parts.some((p) => p === '' || p === '__proto__' || p === 'constructor' || p === 'prototype'))
    return null;
  let holder: unknown = null;
  let key = '';
  let node: unknown = params;
  for (const part of parts) {
    if (node === null || typeof node !== 'object' || !Object.hasOwn(node, part)) return null;
    holder = node;
    key = part;
    node = (node as Record<string, unknown>)[part];
  }
  // Descend into a volume's value, then into a ± range's value.
  for (;;) {
    if (typeof node === 'number') return { holder: holder as Holder, key };
    if (node && typeof node === 'object' && 'value' in node) {
      holder = node;
      key = 'value';
      node = (node as { value: unknown }).value;
      continue;
    }
    return null;
  }
}

/**
 * The current value of a step's parameter in the document's own unit (a
 * volume's value in its unit, the central value of a ± range), or null when
 * the path does not address a number.
 * Source: this project's own bookkeeping (no external source).
 * Validity: any route document the schema accepts.
 * @param doc     the route document
 * @param stepId  the step's id
 * @param path    the parameter's path inside the step's params
 * @returns the value [the document's unit for that field: vol, L, °C, mbar, wt %, or a count] or null
 */
export function readParam(doc: RouteDocument, stepId: string, path: string): number | null {
  const step = doc.steps.find((s) => s.id === stepId);
  if (!step) return null;
  const at = locate(step.params, path);
  return at ? ((at.holder as Record<string, number>)[at.key] ?? null) : null;
}

/**
 * A copy of the document with the given parameters set (each value in the
 * document's own unit for that field; a ± range keeps its width); the
 * original is not modified. Throws RangeError for a path that addresses no
 * number.
 * Source: this project's own bookkeeping (no external source).
 * Validity: any route document the schema accepts.
 * @param doc     the route document
 * @param values  step id, parameter path and new value [the document's unit for that field] of each parameter
 * @returns the changed copy
 */
export function withParams(
  doc: RouteDocument,
  values: ReadonlyArray<{ stepId: string; param: string; value: number }>,
): RouteDocument {
  const copy = structuredClone(doc);
  for (const v of values) {
    const step = copy.steps.find((s) => s.id === v.stepId);
    const at = step ? locate(step.params, v.param) : null;
    if (!at) throw new RangeError(`step ${v.stepId} has no number at ${v.param}`);
    (at.holder as Record<string, number>)[at.key] = v.value;
  }
  return copy;
}

/** One parameter of a route the chemist may free, as the optimiser's form offers it. */
export interface FreeParamChoice {
  stepId: string;
  stepName: string;
  /** The path inside the step's params, e.g. "addedLiquid.volume". */
  param: string;
  /** The chemist's name of the parameter, e.g. "wash volume". */
  label: string;
  /** Its value in the document, in `unit`. */
  value: number;
  /** The unit the document gives it ("vol", "L", "°C", "mbar", "wt %", "" for counts and pH). */
  unit: string;
  integer: boolean;
}

/** The unit of the number at `path`: a volume's own unit, else what the field's name says. */
function unitOf(params: unknown, path: string): string {
  let node: unknown = params;
  for (const part of path.split('.')) {
    if (node === null || typeof node !== 'object') return '';
    node = (node as Record<string, unknown>)[part];
  }
  if (node && typeof node === 'object' && typeof (node as { unit?: unknown }).unit === 'string')
    return (node as { unit: string }).unit;
  const last = path.split('.').at(-1) ?? '';
  if (/C$/.test(last)) return '°C';
  if (/Mbar$/.test(last)) return 'mbar';
  if (/wtPct$/i.test(last)) return 'wt %';
  return '';
}

/**
 * Every parameter of the document the optimiser is meant for (the table in
 * docs/route-format.md) that the document gives as a number, in step order,
 * with its label, current value and unit.
 * Source: this project's own bookkeeping (no external source).
 * Validity: any route document the schema accepts.
 * @param doc  the route document
 * @returns the choices (value in `unit`: vol, L, °C, mbar, wt %, or "" for counts and pH)
 */
export function freeParamChoices(doc: RouteDocument): FreeParamChoice[] {
  const out: FreeParamChoice[] = [];
  for (const step of doc.steps) {
    const labels = LABELS[step.kind];
    if (!labels) continue;
    for (const [param, label] of Object.entries(labels)) {
      const value = readParam(doc, step.id, param);
      if (value === null || !Number.isFinite(value)) continue;
      out.push({
        stepId: step.id,
        stepName: step.name || step.id,
        param,
        label,
        value,
        unit: unitOf(step.params, param),
        integer: isIntegerParam(param),
      });
    }
  }
  return out;
}
