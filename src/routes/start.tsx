import { Navigate } from 'react-router-dom';
import { useSession } from '@/features/auth/api/get-session';
import { lastWorkspace } from '@/features/auth/last-workspace';
import { EmptyState } from '@/components/empty-state';
import { ButtonLink } from '@/components/button';
import { PageHeader } from '@/components/page-header';
import { paths } from '@/paths';

/** "/": opens the workspace last worked in, or the first one. */
export function Component() {
  const { data: session } = useSession();
  if (!session) return null;
  const remembered = lastWorkspace();
  const target = session.workspaces.find((w) => w.id === remembered) ?? session.workspaces[0];
  if (target) return <Navigate to={paths.workspace.home.to(target.id)} replace />;
  return (
    <>
      <PageHeader title={`Welcome, ${session.user.name}`} />
      <EmptyState
        title="You are not in a workspace yet"
        action={<ButtonLink to={paths.account.to()}>Open your account</ButtonLink>}
      >
        Routes, compounds and reviews live in a workspace. Ask your group's Phasewright admin to
        invite {session.user.email}; the invitation arrives by e-mail.
      </EmptyState>
    </>
  );
}
