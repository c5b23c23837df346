import { useState } from 'react';
import { useWorkspace } from '@/features/auth/use-workspace';
import { useSession } from '@/features/auth/api/get-session';
import { canInWorkspace } from '@/features/auth/abilities';
import { useMemberPages } from '@/features/members/api/get-members';
import { ListMore, ListSearch } from '@/components/list-controls';
import { InviteForm } from '@/features/members/components/invite-form';
import { MemberTable } from '@/features/members/components/member-table';
import { PendingInvitations } from '@/features/members/components/pending-invitations';
import { PageHeader } from '@/components/page-header';
import { Card } from '@/components/card';
import { EmptyState } from '@/components/empty-state';
import { ErrorState } from '@/components/error-state';
import { Loading } from '@/components/spinner';

export function Component() {
  const workspace = useWorkspace();
  const { data: session } = useSession();
  if (!session) return null;
  const can = {
    invite: canInWorkspace(session, workspace.id, 'member.invite'),
    updateRoles: canInWorkspace(session, workspace.id, 'member.updateRoles'),
    remove: canInWorkspace(session, workspace.id, 'member.remove'),
    pending: canInWorkspace(session, workspace.id, 'invitation.list'),
  };

  return (
    <>
      <PageHeader
        eyebrow={workspace.name}
        title="Members"
        description="Who works in this workspace, and in which roles. One person may hold several roles."
      />
      {can.invite ? (
        <div className="grid grid-cols-[minmax(0,1fr)_20rem] items-start gap-5">
          <div className="min-w-0 space-y-6">
            <MemberList workspaceId={workspace.id} currentUserId={session.user.id} can={can} />
            {can.pending ? <PendingInvitations workspaceId={workspace.id} /> : null}
          </div>
          <Card title="Invite a member" description="They get an e-mail with a link to join.">
            <InviteForm workspaceId={workspace.id} />
          </Card>
        </div>
      ) : (
        <div className="space-y-3">
          <p className="text-body text-ink-muted">
            Only admins invite colleagues or change roles. Ask an admin of {workspace.name} if
            something here is wrong.
          </p>
          <MemberList workspaceId={workspace.id} currentUserId={session.user.id} can={can} />
        </div>
      )}
    </>
  );
}

type Can = { updateRoles: boolean; remove: boolean };

function MemberList({
  workspaceId,
  currentUserId,
  can,
}: {
  workspaceId: string;
  currentUserId: string;
  can: Can;
}) {
  const [q, setQ] = useState('');
  const members = useMemberPages(workspaceId, q);
  const search = <ListSearch label="Search members" placeholder="Name or e-mail" onSearch={setQ} />;
  if (members.isPending) return <Loading label="Loading members…" />;
  if (members.isError)
    return (
      <ErrorState
        error={members.error}
        title="Members could not be loaded"
        onRetry={() => members.refetch()}
      />
    );
  if (members.items.length === 0 && q) {
    return (
      <div className="space-y-3">
        {search}
        <p className="px-3 py-2 text-body text-ink-muted">
          No member matches “{q}”. Clear the search to see them all.
        </p>
      </div>
    );
  }
  if (members.items.length === 0) {
    return (
      <EmptyState title="No members yet">
        {can.updateRoles
          ? 'Invite your colleagues with the form beside this list.'
          : 'Ask an admin to invite your colleagues.'}
      </EmptyState>
    );
  }
  return (
    <div className="space-y-3">
      {search}
      <MemberTable
        workspaceId={workspaceId}
        members={members.items}
        currentUserId={currentUserId}
        canUpdateRoles={can.updateRoles}
        canRemove={can.remove}
      />
      <ListMore
        shown={members.items.length}
        noun={['member', 'members']}
        hasMore={members.hasNextPage}
        loading={members.isFetchingNextPage}
        onMore={() => members.fetchNextPage()}
      />
    </div>
  );
}
