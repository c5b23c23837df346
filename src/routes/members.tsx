import { useWorkspace } from '@/features/auth/use-workspace';
import { useSession } from '@/features/auth/api/get-session';
import { canManageMembers } from '@/features/auth/abilities';
import { useMembers } from '@/features/members/api/get-members';
import { InviteForm } from '@/features/members/components/invite-form';
import { MemberTable } from '@/features/members/components/member-table';
import { PageHeader } from '@/components/page-header';
import { Card } from '@/components/card';
import { EmptyState } from '@/components/empty-state';
import { ErrorState } from '@/components/error-state';
import { Loading } from '@/components/spinner';

export function Component() {
  const workspace = useWorkspace();
  const { data: session } = useSession();
  const allowed = session ? canManageMembers(session, workspace.id) : false;

  return (
    <>
      <PageHeader eyebrow={workspace.name} title="Members" description="Who works in this workspace, and in which roles. One person may hold several roles." />
      {allowed && session ? (
        <div className="grid grid-cols-[minmax(0,1fr)_20rem] items-start gap-5">
          <MemberList workspaceId={workspace.id} currentUserId={session.user.id} />
          <Card title="Invite a member" description="They get an e-mail with a link to join.">
            <InviteForm workspaceId={workspace.id} />
          </Card>
        </div>
      ) : (
        <EmptyState title="Only admins manage members">
          Ask an admin of {workspace.name} to invite colleagues or change roles.
        </EmptyState>
      )}
    </>
  );
}

function MemberList({ workspaceId, currentUserId }: { workspaceId: string; currentUserId: string }) {
  const members = useMembers(workspaceId);
  if (members.isPending) return <Loading label="Loading members…" />;
  if (members.isError) return <ErrorState error={members.error} title="Members could not be loaded" onRetry={() => members.refetch()} />;
  if (members.data.length === 0) {
    return <EmptyState title="No members yet">Invite your colleagues with the form beside this list.</EmptyState>;
  }
  return <MemberTable workspaceId={workspaceId} members={members.data} currentUserId={currentUserId} />;
}
