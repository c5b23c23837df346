/**
 * Errors of route validation and evaluation. Each issue names the step and
 * the field, so that the editor can put the message on the right node and
 * the API can answer 422 with the reason.
 */
import { EngineError } from '../errors';

export interface RouteIssue {
  /** The step the issue belongs to, or null for the document (components, reference input). */
  stepId: string | null;
  /** Path of the field inside the step or document, e.g. "params.mode.targetVolume". */
  field: string;
  message: string;
}

/** A document that is valid against the schema but cannot be evaluated. Code 'route-invalid'. */
export class RouteValidationError extends EngineError {
  constructor(public issues: RouteIssue[]) {
    super(
      'route-invalid',
      `The route cannot be evaluated: ${issues.map((i) => (i.stepId ? `step ${i.stepId}: ` : '') + `${i.field}: ${i.message}`).join('; ')}`,
      issues,
    );
    this.name = 'RouteValidationError';
  }
}

/**
 * Thrown by a step model when its parameters cannot be applied to its input (e.g. wt% without a
 * crude mass). `inStep`, when given, says the message with the step named ("The distillation
 * “Strip” cannot …"): the model does not know the step, the evaluation that catches it does.
 */
export class StepError extends Error {
  constructor(
    public field: string,
    message: string,
    public inStep?: (stepWords: string) => string,
  ) {
    super(message);
    this.name = 'StepError';
  }
}
