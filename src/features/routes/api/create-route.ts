import { useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { apiRequest } from '@/api/client';
import { routeDetailSchema } from './schemas';
import { api } from '@/paths';
import { queryKeys } from '@/api/query-keys';

/** A route's name as New route and Rename both check it. */
export const routeNameInputSchema = z
  .string()
  .trim()
  .min(1, 'Give the route a name.')
  .max(200, 'Keep the name under 200 characters.');

export const createRouteInputSchema = z.object({
  name: routeNameInputSchema,
  projectName: z.string().trim().max(200, 'Keep the project name under 200 characters.').optional(),
  document: z.record(z.string(), z.unknown()).optional(),
});
export const renameRouteInputSchema = z.object({ name: routeNameInputSchema });

export type CreateRouteInput = z.infer<typeof createRouteInputSchema>;

export const createRoute = (workspaceId: string, input: CreateRouteInput) =>
  apiRequest(api.routes(workspaceId), {
    method: 'POST',
    body: input,
    schema: routeDetailSchema,
  });

export const useCreateRoute = (workspaceId: string) => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: CreateRouteInput) => createRoute(workspaceId, input),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: queryKeys.routes.all(workspaceId) }),
  });
};
