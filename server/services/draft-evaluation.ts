/**
 * What the engine says about a draft document: totals and cautions, or the
 * reason it cannot be evaluated. Pure (runs in the engine pool's workers).
 */
import type { RouteEvaluationError } from '@shared/schemas/evaluate';
import type { DraftDocument } from '@shared/schemas/routes';
import type { EngineWarning } from '@shared/schemas/route';
import type { RouteTotals } from '@shared/engine/route/evaluate';
import { evaluateWithReuse } from './engine-reuse';
import { describeFailure } from './evaluation';

export interface DraftEvaluation {
  totals: RouteTotals | null;
  evaluationError: RouteEvaluationError | { code: string; message: string; details: [] } | null;
  warnings: Array<EngineWarning & { stepId: string | null }>;
  stepCount: number;
}

/** What the engine says about a draft document; never throws for a document the engine rejects. */
export function evaluateDraft(document: DraftDocument): DraftEvaluation {
  const stepCount = document.steps.length;
  if (document.steps.length === 0 || document.components.length === 0) {
    return incomplete(
      stepCount,
      'route_incomplete',
      'Add the components and at least one step to evaluate the route.',
    );
  }
  try {
    const result = evaluateWithReuse(document);
    return { totals: result.totals, evaluationError: null, warnings: result.warnings, stepCount };
  } catch (error) {
    const failure = describeFailure(error, document as Parameters<typeof describeFailure>[1]);
    if (!failure) throw error;
    return { totals: null, evaluationError: failure, warnings: [], stepCount };
  }
}

/** A draft saved without totals, and why. */
export function incomplete(stepCount: number, code: string, message: string): DraftEvaluation {
  return { totals: null, evaluationError: { code, message, details: [] }, warnings: [], stepCount };
}
