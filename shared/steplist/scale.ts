/**
 * Scaling a route document to a batch. Amounts given per kg of the reference
 * input ("vol", "equiv", wt % of the crude) follow the reference input by
 * themselves; absolute amounts (kg, L, the crude mass) are multiplied by the
 * factor. Temperatures, pressures, stage counts, fractions, times and
 * equipment parameters (filter area, cake resistance, drying coefficient)
 * stay as they are. The engine's models are homogeneous in the amounts, so
 * the scaled route's charges and volumes are the factor times the original's
 * and its yields, purities and purge factors are the same.
 */
import type { RouteDocument } from '../engine/document';
import type { Equipment } from '../schemas/equipment';
import type { StepListBasis } from '../schemas/step-list';

type Json = null | boolean | number | string | Json[] | { [key: string]: Json };

const scaleUncertain = (value: Json, factor: number): Json => {
  if (typeof value === 'number') return value * factor;
  if (value && typeof value === 'object' && !Array.isArray(value) && 'value' in value)
    return {
      ...value,
      value: (value.value as number) * factor,
      plusMinus: (value.plusMinus as number) * factor,
    };
  return value;
};

/** Scales every absolute amount inside a step's parameters (walks the whole object). */
function scaleParams(node: Json, factor: number): Json {
  if (Array.isArray(node)) return node.map((item) => scaleParams(item, factor));
  if (!node || typeof node !== 'object') return node;
  const out: { [key: string]: Json } = {};
  for (const [key, value] of Object.entries(node)) out[key] = scaleParams(value, factor);
  // A volume in litres: { value, unit: 'L' }.
  if (node.unit === 'L' && 'value' in node) out.value = scaleUncertain(node.value, factor);
  // A charge entry in kg or L: { amount, unit }.
  if ((node.unit === 'kg' || node.unit === 'L') && 'amount' in node)
    out.amount = scaleUncertain(node.amount, factor);
  if ('crudeMassKg' in node) out.crudeMassKg = scaleUncertain(node.crudeMassKg, factor);
  return out;
}

/** The same route for a batch `factor` times the document's own. */
export function scaleDocument(document: RouteDocument, factor: number): RouteDocument {
  if (!(factor > 0) || !Number.isFinite(factor))
    throw new RangeError('The scale factor must be a positive number.');
  const copy = structuredClone(document);
  copy.referenceInput.massKg = document.referenceInput.massKg * factor;
  copy.steps = copy.steps.map(
    (step) =>
      ({ ...step, params: scaleParams(step.params as unknown as Json, factor) }) as typeof step,
  );
  return copy;
}

/**
 * The factor that brings the document to the batch: on the input basis the
 * batch is kg of the reference input; on the product basis it is kg of
 * isolated product, so the factor divides by what the unscaled route
 * isolates. Null when the product basis is asked of a route that isolates
 * nothing.
 */
export function scaleFactorFor(
  document: RouteDocument,
  basis: StepListBasis,
  batchKg: number,
  isolatedProductKg: number | null,
): number | null {
  if (basis === 'input') return batchKg / document.referenceInput.massKg;
  if (!isolatedProductKg || !(isolatedProductKg > 0)) return null;
  return batchKg / isolatedProductKg;
}

/** The filter areas the route document accepts, m² (filtrationParamsSchema). */
const FILTER_AREA_RANGE = [1e-4, 100] as const;

/**
 * The route as run in the chosen equipment: a filtration step on a filter of
 * the workspace takes that filter's area, so the cake-filtration time is the
 * plant filter's. Everything else stays.
 */
export function applyEquipment(
  document: RouteDocument,
  assignments: Record<string, Pick<Equipment, 'kind'> & { areaM2?: number }>,
): RouteDocument {
  const copy = structuredClone(document);
  copy.steps = copy.steps.map((step) => {
    const item = assignments[step.id];
    if (step.kind !== 'filtration' || item?.kind !== 'filter' || item.areaM2 === undefined)
      return step;
    const area = Math.min(FILTER_AREA_RANGE[1], Math.max(FILTER_AREA_RANGE[0], item.areaM2));
    return { ...step, params: { ...step.params, filterAreaM2: area } };
  });
  return copy;
}
