import { apiRequest, isApiError } from '@/api/client';
import { saveDraftReplySchema, type DraftConflict, type SaveDraftReply } from './schemas';
import { getRoute } from './get-route';
import { routesApi } from './urls';

export type SaveDraftOutcome =
  { kind: 'saved'; reply: SaveDraftReply } | { kind: 'conflict'; conflict: DraftConflict };

/**
 * PUT the draft against the version it was based on. A 409 means someone else
 * saved meanwhile: the current draft is read back so the editor can show who
 * changed it and let the chemist choose — it is never overwritten silently.
 */
export async function saveDraft(
  workspaceId: string,
  routeId: string,
  document: unknown,
  baseVersion: number,
): Promise<SaveDraftOutcome> {
  try {
    const reply = await apiRequest(routesApi.draft(workspaceId, routeId), {
      method: 'PUT',
      body: { document, baseVersion },
      schema: saveDraftReplySchema,
    });
    return { kind: 'saved', reply };
  } catch (error) {
    if (isApiError(error, 409)) {
      const current = await getRoute(workspaceId, routeId);
      return { kind: 'conflict', conflict: { current: current.draft } };
    }
    throw error;
  }
}
