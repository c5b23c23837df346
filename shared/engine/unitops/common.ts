/** Helpers shared by the step models. */
import type { RouteStep } from '../document';
import type { StepDuration, StepResult } from '../route/types';
import { idRecord } from '../text';

/**
 * Empty result of a step (no masses, no warnings) with its duration basis.
 * Source: this project's own bookkeeping (no external source).
 * Validity: any step the schema accepts.
 * @param step      the step's id, kind and name
 * @param duration  the step's duration estimate and its basis
 * @returns a fresh StepResult with empty records
 */
export function newResult(
  step: Pick<RouteStep, 'id' | 'kind' | 'name'>,
  duration: StepDuration,
): StepResult {
  return {
    stepId: step.id,
    kind: step.kind,
    name: step.name,
    summary: idRecord(),
    warnings: [],
    methods: [],
    addedKg: idRecord(),
    addedVolumeM3: 0,
    auxiliaryKg: 0,
    generatedKg: idRecord(),
    consumedKg: idRecord(),
    peakVolumeM3: 0,
    duration,
    details: {},
  };
}

/**
 * Add kg of one component to a record of masses: target[id] += kg.
 * Source: this project's own bookkeeping (no external source).
 * Validity: any finite mass.
 * @param target  masses by component id [kg] (modified)
 * @param id      component id
 * @param kg      mass to add [kg]
 */
export function addTo(target: Record<string, number>, id: string, kg: number) {
  target[id] = (target[id] ?? 0) + kg;
}

/**
 * Round for display in summaries (the streams keep full precision):
 * round(x · 10^digits) / 10^digits; non-finite values pass through.
 * Source: this project's own bookkeeping (no external source).
 * Validity: any number; |x| · 10^digits below 2^53 for an exact result.
 * @param x       value to round [any unit, kept]
 * @param digits  decimal places [–] (default 4)
 * @returns x rounded to `digits` decimals [unit of x]
 */
export function round(x: number, digits = 4): number {
  if (!Number.isFinite(x)) return x;
  const f = 10 ** digits;
  return Math.round(x * f) / f;
}

/**
 * Typical durations of operations at pilot and plant scale, in hours
 * (common practice, for a first cycle-time estimate only; sites replace
 * them with their own vessel data).
 */
export const COMMON_PRACTICE_HOURS = {
  charge: 0.5,
  washStage: 1.5, // charge, stir 30 min, settle 30 min, separate 30 min
  distillationSetup: 1.0,
  /** Distillation rate, L of distillate per hour per L of working volume (common practice: about 1 vol/h at 10 L/kg). */
  distillateVolumesPerHour: 0.1,
  coolingKPerHour: 10,
  crystallisationAge: 2,
  antisolventAddition: 1,
  filtrationSetup: 0.5,
  cakeWash: 0.5,
  quench: 1,
  phAdjust: 1,
  carbonTreatment: 2,
  polishFiltration: 1,
  transfer: 0.25,
} as const;

export const COMMON_PRACTICE_BASIS = 'common-practice durations (docs/methods.md, cycle time)';
