import { useEffect } from 'react';
import { Outlet, useParams } from 'react-router-dom';
import { useSession } from '@/features/auth/api/get-session';
import { rememberWorkspace } from '@/features/auth/last-workspace';
import { EmptyState } from '@/components/empty-state';
import { ButtonLink } from '@/components/button';
import { paths } from '@/paths';

/** Pages inside one workspace; an unknown or foreign workspace reads as "not found". */
export function Component() {
  const { workspaceId } = useParams();
  const { data: session } = useSession();
  const workspace = session?.workspaces.find((w) => w.id === workspaceId);

  useEffect(() => {
    if (workspace) rememberWorkspace(workspace.id);
  }, [workspace]);

  if (!workspace) {
    return (
      <EmptyState
        title="Workspace not found"
        action={<ButtonLink to={paths.root.to()}>Go to your workspace</ButtonLink>}
      >
        This workspace does not exist, or you are not one of its members. Ask its admin for an
        invitation if you need it.
      </EmptyState>
    );
  }
  return <Outlet />;
}
