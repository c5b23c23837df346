import { useParams } from 'react-router-dom';
import type { SessionWorkspace } from '@shared/schemas/session';
import { useSession } from './api/get-session';

/** The workspace of the current page; only for pages under the workspace layout, which checks membership. */
export function useWorkspace(): SessionWorkspace {
  const { workspaceId } = useParams();
  const { data } = useSession();
  const workspace = data?.workspaces.find((w) => w.id === workspaceId);
  if (!workspace) throw new Error('useWorkspace is only available on workspace pages.');
  return workspace;
}
