import { PageHeader } from '@/components/page-header';
import { useWorkspace } from '@/features/auth/use-workspace';
import { canInWorkspace } from '@/features/auth/abilities';
import { useSession } from '@/features/auth/api/get-session';
import { AuditTrail } from '@/features/audit';

/** The workspace's audit trail (whoever the server allows to read it: admins). */
export function Component() {
  const workspace = useWorkspace();
  const { data: session } = useSession();
  if (!session || !canInWorkspace(session, workspace.id, 'audit.read'))
    return (
      <div className="p-6">
        <PageHeader
          title="Audit trail"
          description="Only admins of this workspace read the audit trail."
        />
      </div>
    );
  return (
    <div className="p-6">
      <PageHeader
        title="Audit trail"
        description="Every change in this workspace and every sign-in of its members: who, when (database clock, UTC), old and new values. Nobody can edit it."
      />
      <AuditTrail workspaceId={workspace.id} />
    </div>
  );
}
