import { useSession } from '@/features/auth/api/get-session';
import { ChangePasswordForm } from '@/features/auth/components/change-password-form';
import { TokensPanel } from '@/features/tokens/components/tokens-panel';
import { PageHeader } from '@/components/page-header';
import { Card } from '@/components/card';
import { RoleBadges } from '@/components/role-picker';

export function Component() {
  const { data: session } = useSession();
  if (!session) return null;
  return (
    <>
      <PageHeader title="Account" description={`${session.user.name} · ${session.user.email}`} />
      <div className="space-y-5">
        <div className="grid grid-cols-2 items-start gap-5">
          <Card title="Your workspaces" description="Roles are set by each workspace's admin.">
            <ul className="divide-y divide-rule">
              {session.workspaces.map((w) => (
                <li key={w.id} className="flex items-center justify-between py-1.5">
                  <span className="font-medium">{w.name}</span>
                  <RoleBadges roles={w.roles} />
                </li>
              ))}
              {session.workspaces.length === 0 ? (
                <li className="py-1.5 text-ink-muted">
                  None yet. An admin's invitation adds you to a workspace.
                </li>
              ) : null}
            </ul>
          </Card>
          <Card title="Password">
            <ChangePasswordForm />
          </Card>
        </div>
        <Card
          title="API tokens"
          description="Personal tokens let scripts call the Phasewright API as you. They carry your roles."
        >
          <TokensPanel />
        </Card>
      </div>
    </>
  );
}
