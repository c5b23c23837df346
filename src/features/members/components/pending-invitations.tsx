import { useState } from 'react';
import type { PendingInvitation } from '@shared/schemas/members';
import { Button } from '@/components/button';
import { ConfirmDialog } from '@/components/confirm-dialog';
import { ErrorState } from '@/components/error-state';
import { RoleBadges } from '@/components/role-picker';
import { Loading } from '@/components/spinner';
import { Table, Td, Th } from '@/components/table';
import { formatDate } from '@/lib/format';
import { toast } from '@/stores/toasts';
import {
  usePendingInvitations,
  useResendInvitation,
  useRevokeInvitation,
} from '../api/pending-invitations';

/**
 * Invitations sent but not yet accepted (admins): to whom, which roles, who sent it and until
 * when the link works; _Send again_ mails a new link (the old one stops working), _Revoke_ ends
 * the link after a question.
 */
export function PendingInvitations({ workspaceId }: { workspaceId: string }) {
  const invitations = usePendingInvitations(workspaceId);
  const resend = useResendInvitation(workspaceId);
  const revoke = useRevokeInvitation(workspaceId);
  const [revoking, setRevoking] = useState<PendingInvitation | null>(null);
  if (invitations.isPending) return <Loading label="Loading invitations…" />;
  if (invitations.isError)
    return (
      <ErrorState
        error={invitations.error}
        title="Pending invitations could not be loaded"
        onRetry={() => invitations.refetch()}
      />
    );
  const items = invitations.data.items;
  return (
    <section aria-labelledby="pending-invitations" className="space-y-2">
      <h2 id="pending-invitations" className="text-title font-semibold text-ink">
        Pending invitations
      </h2>
      {items.length === 0 ? (
        <p className="text-body text-ink-muted">
          None: everyone invited has joined, or their links have expired.
        </p>
      ) : (
        <Table caption="Invitations not yet accepted">
          <thead>
            <tr>
              <Th>Invited</Th>
              <Th>Roles</Th>
              <Th>Link works until</Th>
              <Th className="text-right">
                <span className="sr-only">Actions</span>
              </Th>
            </tr>
          </thead>
          <tbody>
            {items.map((i) => (
              <tr key={i.id}>
                <Td>
                  <span className="font-medium">{i.email}</span>
                  <span className="block text-small text-ink-muted">
                    {i.invitedBy ? `by ${i.invitedBy.name}, ` : ''}
                    {formatDate(i.createdAt)}
                  </span>
                </Td>
                <Td>
                  <RoleBadges roles={i.roles} />
                </Td>
                <Td className="whitespace-nowrap text-ink-muted">{formatDate(i.expiresAt)}</Td>
                <Td className="text-right whitespace-nowrap">
                  <Button
                    variant="quiet"
                    size="sm"
                    busy={resend.isPending && resend.variables === i.id}
                    aria-label={`Send the invitation to ${i.email} again`}
                    onClick={() =>
                      resend.mutate(i.id, {
                        onSuccess: (sent) =>
                          toast.success(
                            `Invitation sent to ${sent.email} again; the new link works until ${formatDate(sent.expiresAt)}.`,
                          ),
                        onError: (e) => toast.error(e.message),
                      })
                    }
                  >
                    Send again
                  </Button>
                  <Button
                    variant="quiet"
                    size="sm"
                    className="text-caution-hazard-deep"
                    aria-label={`Revoke the invitation to ${i.email}`}
                    onClick={() => setRevoking(i)}
                  >
                    Revoke
                  </Button>
                </Td>
              </tr>
            ))}
          </tbody>
        </Table>
      )}
      <ConfirmDialog
        open={revoking !== null}
        title={revoking ? `Revoke the invitation to ${revoking.email}?` : ''}
        confirmLabel="Revoke invitation"
        busy={revoke.isPending}
        onCancel={() => setRevoking(null)}
        onConfirm={() => {
          if (!revoking) return;
          const which = revoking;
          revoke.mutate(which.id, {
            onSuccess: () => toast.success(`The invitation to ${which.email} was revoked.`),
            onError: (e) => toast.error(e.message),
            onSettled: () => setRevoking(null),
          });
        }}
      >
        The link in the e-mail to {revoking?.email} stops working at once. You can invite them again
        later.
      </ConfirmDialog>
    </section>
  );
}
