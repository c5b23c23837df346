import { useState } from 'react';
import type { Member } from '@shared/schemas/members';
import type { Role } from '@shared/schemas/session';
import { useUpdateMemberRoles } from '../api/update-member-roles';
import { useRemoveMember } from '../api/remove-member';
import { Button } from '@/components/button';
import { Table, Td, Th } from '@/components/table';
import { RoleBadges, RolePicker } from '@/components/role-picker';
import { FieldError } from '@/components/text-field';
import { ConfirmDialog } from '@/components/confirm-dialog';
import { formatDate } from '@/lib/format';
import { toast } from '@/stores/toasts';

type MemberTableProps = {
  workspaceId: string;
  members: Member[];
  currentUserId: string;
  canUpdateRoles: boolean;
  canRemove: boolean;
};

export function MemberTable({
  workspaceId,
  members,
  currentUserId,
  canUpdateRoles,
  canRemove,
}: MemberTableProps) {
  const [editing, setEditing] = useState<string | null>(null);
  const [removing, setRemoving] = useState<Member | null>(null);
  const remove = useRemoveMember(workspaceId);

  return (
    <>
      <Table caption="Workspace members">
        <thead>
          <tr>
            <Th>Member</Th>
            <Th>Roles</Th>
            <Th>Joined</Th>
            <Th className="text-right">
              <span className="sr-only">Actions</span>
            </Th>
          </tr>
        </thead>
        <tbody>
          {members.map((m) =>
            editing === m.userId ? (
              <EditRow
                key={m.userId}
                workspaceId={workspaceId}
                member={m}
                onDone={() => setEditing(null)}
              />
            ) : (
              <tr key={m.userId}>
                <Td>
                  <span className="font-medium">{m.name}</span>
                  {m.userId === currentUserId ? (
                    <span className="ml-1.5 text-caption text-ink-muted">(you)</span>
                  ) : null}
                  <span className="block text-small text-ink-muted">{m.email}</span>
                </Td>
                <Td>
                  <RoleBadges roles={m.roles} />
                </Td>
                <Td className="whitespace-nowrap text-ink-muted">{formatDate(m.joinedAt)}</Td>
                <Td className="text-right whitespace-nowrap">
                  {canUpdateRoles ? (
                    <Button
                      variant="quiet"
                      size="sm"
                      onClick={() => setEditing(m.userId)}
                      aria-label={`Change roles of ${m.name}`}
                    >
                      Change roles
                    </Button>
                  ) : null}
                  {canRemove ? (
                    <Button
                      variant="quiet"
                      size="sm"
                      className="text-caution-hazard-deep"
                      onClick={() => setRemoving(m)}
                      aria-label={`Remove ${m.name}`}
                    >
                      Remove
                    </Button>
                  ) : null}
                </Td>
              </tr>
            ),
          )}
        </tbody>
      </Table>
      <ConfirmDialog
        open={removing !== null}
        title={removing ? `Remove ${removing.name}?` : ''}
        confirmLabel="Remove member"
        busy={remove.isPending}
        onCancel={() => setRemoving(null)}
        onConfirm={() => {
          if (!removing) return;
          const who = removing;
          remove.mutate(who.userId, {
            onSuccess: () => toast.success(`${who.name} was removed from the workspace.`),
            onError: (e) => toast.error(e.message),
            onSettled: () => setRemoving(null),
          });
        }}
      >
        {removing?.name} ({removing?.email}) loses access to this workspace at once. Their routes
        and signatures stay in the record. You can invite them again later.
      </ConfirmDialog>
    </>
  );
}

function EditRow({
  workspaceId,
  member,
  onDone,
}: {
  workspaceId: string;
  member: Member;
  onDone: () => void;
}) {
  const [roles, setRoles] = useState<Role[]>(member.roles);
  const [error, setError] = useState<string>();
  const update = useUpdateMemberRoles(workspaceId);
  const save = () => {
    if (roles.length === 0) {
      setError('Choose at least one role.');
      return;
    }
    update.mutate(
      { userId: member.userId, roles },
      {
        onSuccess: () => {
          toast.success(`Roles of ${member.name} saved.`);
          onDone();
        },
        onError: (e) => setError(e.message),
      },
    );
  };
  return (
    <tr className="bg-accent-soft/40">
      <Td>
        <span className="font-medium">{member.name}</span>
        <span className="block text-small text-ink-muted">{member.email}</span>
      </Td>
      <Td colSpan={2}>
        <RolePicker
          compact
          legend={`Roles of ${member.name}`}
          value={roles}
          onChange={(r) => {
            setRoles(r);
            setError(undefined);
          }}
        />
        {error ? (
          <div className="mt-1">
            <FieldError>{error}</FieldError>
          </div>
        ) : null}
      </Td>
      <Td className="text-right whitespace-nowrap">
        <Button size="sm" onClick={save} busy={update.isPending}>
          Save
        </Button>{' '}
        <Button size="sm" variant="secondary" onClick={onDone}>
          Cancel
        </Button>
      </Td>
    </tr>
  );
}
