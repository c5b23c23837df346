/**
 * Shapes shared by the step models and the route evaluator.
 *
 * A stream is what a connection carries: the mass of every component (kg),
 * the part of it that is solid, the temperature, the phase and the volume.
 * Volumes come from the component densities by ideal mixing (no excess
 * volume): V = Σ m_i / ρ_i(T). Moles are derivable from the molar masses in
 * the evaluation context.
 */
import type { EngineWarning, MethodUsed, PortPhase, StepKind } from '../document';

export type { EngineWarning, MethodUsed } from '../document';

export interface Stream {
  phase: PortPhase;
  /** Temperature [K]. */
  temperatureK: number;
  /** Total mass of each component [kg] (dissolved, liquid and solid). */
  kg: Record<string, number>;
  /** The part of `kg` present as solid [kg]. */
  solidKg: Record<string, number>;
  /** Volume by ideal mixing [m³]. */
  volumeM3: number;
}

/** Cycle-time contribution of a step, with its basis. */
export interface StepDuration {
  hours: number;
  basis: string;
}

/** The record every step model returns beside its output streams. */
export interface StepResultBase {
  stepId: string;
  kind: StepKind;
  name: string;
  /** The few numbers a node card shows (label → value). */
  summary: Record<string, number | string | null>;
  warnings: EngineWarning[];
  methods: MethodUsed[];
  /** Material charged by the step itself (wash liquid, antisolvent, reagent ...) [kg]. */
  addedKg: Record<string, number>;
  /** Volume of liquid charged by the step [m³] (for solvent use). */
  addedVolumeM3: number;
  /** Materials charged that are not route components (activated carbon) [kg], for PMI. */
  auxiliaryKg: number;
  /** Formed and consumed by reaction [kg]. */
  generatedKg: Record<string, number>;
  consumedKg: Record<string, number>;
  /** Largest volume the step's vessel holds [m³]. */
  peakVolumeM3: number;
  duration: StepDuration;
  /** Per-component closure, filled by the evaluator: in + added + generated − consumed vs out [kg]. */
  balance?: Record<string, { inKg: number; outKg: number; relativeError: number }>;
  /**
   * Per impurity, filled by the evaluator: amount entering the step, amount
   * leaving with the product, and their ratio (null: none leaves with it).
   */
  purge?: Record<string, { inKg: number; outKg: number; purgeFactor: number | null }>;
  /** Kind-specific details (profiles, distribution ratios, ...). */
  details: Record<string, unknown>;
}

export type StepResult = StepResultBase;

export interface StepOutput {
  outputs: Record<string, Stream>;
  result: StepResult;
}
