/**
 * The revision and review API: one fetcher per operation, with the query-key
 * factory every hook and invalidation shares.
 */
import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import {
  attentionListSchema,
  commentListSchema,
  commentSchema,
  createdRevisionSchema,
  decisionReplySchema,
  reviewRequestSchema,
  revisionCompareSchema,
  revisionDetailSchema,
  revisionListSchema,
  type CreateCommentInput,
  type CreateDecisionInput,
  type CreateReviewRequestInput,
} from '@shared/schemas/revisions';
import { apiRequest } from '@/api/client';
import { api } from '@/paths';
import { queryKeys } from '@/api/query-keys';

export const revisionsQueryOptions = (workspaceId: string, routeId: string) =>
  queryOptions({
    queryKey: queryKeys.revisions.list(workspaceId, routeId),
    queryFn: ({ signal }) =>
      apiRequest(`${api.revisions(workspaceId, routeId)}?limit=200`, {
        schema: revisionListSchema,
        signal,
      }),
  });
export const useRevisions = (workspaceId: string, routeId: string) =>
  useQuery(revisionsQueryOptions(workspaceId, routeId));

export const revisionQueryOptions = (workspaceId: string, routeId: string, number: number) =>
  queryOptions({
    queryKey: queryKeys.revisions.detail(workspaceId, routeId, number),
    queryFn: ({ signal }) =>
      apiRequest(api.revision(workspaceId, routeId, number), {
        schema: revisionDetailSchema,
        signal,
      }),
  });
export const useRevision = (workspaceId: string, routeId: string, number: number) =>
  useQuery(revisionQueryOptions(workspaceId, routeId, number));

export const useCompare = (workspaceId: string, routeId: string, a: number | null, b: number) =>
  useQuery({
    queryKey: queryKeys.revisions.compare(workspaceId, routeId, a ?? 0, b),
    queryFn: ({ signal }) =>
      apiRequest(api.revisionCompare(workspaceId, routeId, a!, b), {
        schema: revisionCompareSchema,
        signal,
      }),
    enabled: a !== null && a !== b,
  });

export const useComments = (workspaceId: string, routeId: string, number: number) =>
  useQuery({
    queryKey: queryKeys.revisions.comments(workspaceId, routeId, number),
    queryFn: ({ signal }) =>
      apiRequest(`${api.revisionComments(workspaceId, routeId, number)}?limit=200`, {
        schema: commentListSchema,
        signal,
      }),
  });

export const useAttention = (workspaceId: string) =>
  useQuery({
    queryKey: queryKeys.attention(workspaceId),
    queryFn: ({ signal }) =>
      apiRequest(api.attention(workspaceId), { schema: attentionListSchema, signal }),
  });

/** After any review action the revision, its list, its comments and the attention lists change. */
function useInvalidateReview(workspaceId: string) {
  const queryClient = useQueryClient();
  return () =>
    Promise.all([
      queryClient.invalidateQueries({ queryKey: queryKeys.revisions.all(workspaceId) }),
      queryClient.invalidateQueries({ queryKey: queryKeys.attention(workspaceId) }),
    ]);
}

export const useSaveRevision = (workspaceId: string, routeId: string) => {
  const invalidate = useInvalidateReview(workspaceId);
  return useMutation({
    mutationFn: (input: { message: string; baseDraftVersion: number }) =>
      apiRequest(api.revisions(workspaceId, routeId), {
        method: 'POST',
        body: input,
        schema: createdRevisionSchema,
      }),
    onSuccess: invalidate,
  });
};

export const useSubmitForReview = (workspaceId: string, routeId: string, number: number) => {
  const invalidate = useInvalidateReview(workspaceId);
  return useMutation({
    mutationFn: (input: CreateReviewRequestInput) =>
      apiRequest(api.revisionReviewRequests(workspaceId, routeId, number), {
        method: 'POST',
        body: input,
        schema: reviewRequestSchema,
      }),
    onSuccess: invalidate,
  });
};

export const useAddComment = (workspaceId: string, routeId: string, number: number) => {
  const invalidate = useInvalidateReview(workspaceId);
  return useMutation({
    mutationFn: (input: CreateCommentInput) =>
      apiRequest(api.revisionComments(workspaceId, routeId, number), {
        method: 'POST',
        body: input,
        schema: commentSchema,
      }),
    onSuccess: invalidate,
  });
};

export const useResolveComment = (workspaceId: string, routeId: string, number: number) => {
  const invalidate = useInvalidateReview(workspaceId);
  return useMutation({
    mutationFn: ({ id, resolved }: { id: string; resolved: boolean }) =>
      apiRequest(api.revisionComment(workspaceId, routeId, number, id), {
        method: 'PATCH',
        body: { resolved },
        schema: commentSchema,
      }),
    onSuccess: invalidate,
  });
};

export const useSignDecision = (workspaceId: string, routeId: string, number: number) => {
  const invalidate = useInvalidateReview(workspaceId);
  return useMutation({
    mutationFn: (input: CreateDecisionInput) =>
      apiRequest(api.revisionDecisions(workspaceId, routeId, number), {
        method: 'POST',
        body: input,
        schema: decisionReplySchema,
        // A wrong signing password answers 401 too; it does not mean the session ended.
        ignoreUnauthorized: true,
      }),
    onSuccess: invalidate,
  });
};
