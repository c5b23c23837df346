import { useMutation } from '@tanstack/react-query';
import { apiRequest } from '@/api/client';
import { api } from '@/paths';
import {
  solventAlternativesResponseSchema,
  type SolventAlternativesRequest,
} from '@shared/schemas/solvent-alternatives';

/** Ask the advisor for the library's alternatives to one step's solvent (nothing is stored). */
export const fetchSolventAlternatives = (input: SolventAlternativesRequest) =>
  apiRequest(api.solventAlternatives, {
    method: 'POST',
    body: input,
    schema: solventAlternativesResponseSchema,
  });

/** A mutation, not a query: every run re-evaluates the route once per library solvent. */
export const useSolventAlternatives = () => useMutation({ mutationFn: fetchSolventAlternatives });
