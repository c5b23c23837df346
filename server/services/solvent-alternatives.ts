/**
 * The solvent substitution advisor on the server: runs in the engine pool
 * (task 'solvent.alternatives'); a step or role the route does not have
 * answers 400 in the chemist's words, a route the engine cannot evaluate 422.
 */
import type { RouteDocument } from '@shared/schemas/route';
import type { SolventAlternative, SubstitutionRole } from '@shared/schemas/solvent-alternatives';
import { solventAlternatives, SubstitutionError } from '@shared/engine/substitution';
import { badRequest } from '../errors';
import { describeFailure, RouteEvaluationFailed } from './evaluation';

/** Monte Carlo spread given with every suggestion: how many draws, which seed. */
export const ADVISOR_UNCERTAINTY = { draws: 8, seed: 1 } as const;
/**
 * The advisor evaluates the route once per library solvent and draws each
 * one's spread (about 40 × 9 evaluations): it gets this many times the engine
 * time limit of one evaluation, so a loaded server still answers.
 */
export const ADVISOR_TIME_LIMIT_FACTOR = 3;

export function computeSolventAlternatives(input: {
  document: RouteDocument;
  stepId: string;
  role: SubstitutionRole;
}): SolventAlternative[] {
  try {
    return solventAlternatives(input.document, input.stepId, input.role, {
      uncertainty: ADVISOR_UNCERTAINTY,
    }).alternatives;
  } catch (error) {
    if (error instanceof SubstitutionError)
      throw badRequest(error.message, [{ path: error.field, message: error.message }]);
    const failure = describeFailure(error, input.document);
    if (failure) throw new RouteEvaluationFailed(failure);
    throw error;
  }
}
