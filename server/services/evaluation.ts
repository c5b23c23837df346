/**
 * Route evaluation on the server: the same pure engine the client runs, with
 * its failures turned into coded API errors that name the step and field.
 */
import type { RouteIssuePayload, RouteEvaluationError } from '@shared/schemas/evaluate';
import type { KeyTotals } from '@shared/schemas/routes';
import type { RouteDocument } from '@shared/schemas/route';
import { EngineError } from '@shared/engine/errors';
import { RouteValidationError, type RouteIssue } from '@shared/engine/route/errors';
import {
  ENGINE_VERSION,
  PROCESS_SAFETY_NOTE,
  type RouteResult,
} from '@shared/engine/route/evaluate';
import { fieldInWords } from '@shared/engine/route/field-words';
import { capitalise, stepInWords } from '@shared/engine/route/step-words';
import { AppError } from '../errors';
import { evaluateWithReuse, type ReuseOptions } from './engine-reuse';

export { resultTooLarge } from '../errors';

export { ENGINE_VERSION, PROCESS_SAFETY_NOTE };

/** 422: a document that passed the schema but that the engine cannot evaluate. */
export class RouteEvaluationFailed extends AppError {
  constructor(readonly failure: RouteEvaluationError) {
    super(failure);
    this.name = 'RouteEvaluationFailed';
  }
}

/**
 * The engine's field paths ("params.contents[0].componentId", "steps[3].id")
 * as a dotted body path under `prefix` ("document.steps.2.params.contents.0.componentId").
 */
function issuePath(issue: RouteIssue, doc: RouteDocument, prefix: string): string {
  const field = issue.field.replace(/\[(\d+)\]/g, '.$1');
  const index =
    issue.stepId === null ? -1 : doc.steps.findIndex((step) => step.id === issue.stepId);
  const inDocument = index < 0 || /^(steps|connections|components|referenceInput)\b/.test(field);
  const relative = inDocument ? field : `steps.${index}.${field}`;
  return [prefix, relative].filter(Boolean).join('.');
}

/** Describes why the document cannot be evaluated, with every issue on its step. */
export function describeFailure(
  error: unknown,
  doc: RouteDocument,
  prefix = 'document',
): RouteEvaluationError | null {
  if (error instanceof RouteValidationError) {
    const details: RouteIssuePayload[] = error.issues.map((issue) => ({
      ...issue,
      path: issuePath(issue, doc, prefix),
    }));
    const first = details[0];
    // The message is read by the chemist: the step by its name, the field by its label (scripts
    // read stepId, field and path from details).
    const step = first?.stepId ? doc.steps.find((s) => s.id === first.stepId) : undefined;
    const where = first
      ? [step ? step.name.trim() || capitalise(stepInWords(step)) : '', fieldInWords(first.field)]
          .filter(Boolean)
          .join(', ')
      : '';
    // A problem that stops several steps (a recycle loop) is one problem: count messages, not steps.
    const others = new Set(details.map((d) => d.message)).size - 1;
    const more = others > 0 ? ` (and ${others} more)` : '';
    return {
      code: 'route_invalid',
      message: first
        ? `The route cannot be evaluated: ${where ? `${where}: ` : ''}${first.message}${more}`
        : 'The route cannot be evaluated.',
      details,
    };
  }
  if (error instanceof EngineError) {
    const stepId = (error.details as { stepId?: unknown } | undefined)?.stepId;
    const issue: RouteIssue = {
      stepId: typeof stepId === 'string' ? stepId : null,
      field: 'params',
      message: error.message,
    };
    return {
      code: 'route_unevaluable',
      message: `The route cannot be evaluated: ${error.message}`,
      details: [{ ...issue, path: issuePath(issue, doc, prefix) }],
    };
  }
  return null;
}

/** Evaluates a schema-valid document; throws RouteEvaluationFailed (422) when the engine cannot. */
export function evaluateDocument(
  doc: RouteDocument,
  options: ReuseOptions = {},
): {
  engineVersion: string;
  result: RouteResult;
} {
  try {
    return { engineVersion: ENGINE_VERSION, result: evaluateWithReuse(doc, options) };
  } catch (error) {
    const failure = describeFailure(error, doc);
    if (failure) throw new RouteEvaluationFailed(failure);
    throw error;
  }
}

/** The figures a routes list shows. */
export function keyTotals(result: RouteResult): KeyTotals {
  const finiteOrNull = (value: number | null) =>
    value === null || !Number.isFinite(value) ? null : value;
  return {
    yieldPct: finiteOrNull(result.totals.yieldPct),
    purityPct: finiteOrNull(result.totals.purityWtPct),
    pmi: finiteOrNull(result.totals.pmi),
    engineVersion: ENGINE_VERSION,
  };
}
