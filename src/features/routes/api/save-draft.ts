import { apiRequest, isApiError } from '@/api/client';
import { saveDraftReplySchema, type DraftConflict, type SaveDraftReply } from './schemas';
import { api } from '@/paths';

export type SaveDraftOutcome =
  { kind: 'saved'; reply: SaveDraftReply } | { kind: 'conflict'; conflict: DraftConflict };

/**
 * PUT the draft against the version it was based on. A draft_conflict means
 * someone else saved meanwhile: the reply carries the current draft and who
 * saved it, so the editor can show it and let the chemist choose — it is never
 * overwritten silently. Any other failure (an archived route, no permission)
 * is thrown as it is.
 */
export async function saveDraft(
  workspaceId: string,
  routeId: string,
  document: unknown,
  baseVersion: number,
): Promise<SaveDraftOutcome> {
  try {
    const reply = await apiRequest(api.routeDraft(workspaceId, routeId), {
      method: 'PUT',
      body: { document, baseVersion },
      schema: saveDraftReplySchema,
    });
    return { kind: 'saved', reply };
  } catch (error) {
    if (isApiError(error) && error.reply.code === 'draft_conflict')
      return { kind: 'conflict', conflict: error.reply.details };
    throw error;
  }
}
