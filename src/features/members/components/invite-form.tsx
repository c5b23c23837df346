import { inviteSchema } from '@shared/schemas/members';
import { useInviteMember } from '../api/invite-member';
import { Button } from '@/components/button';
import { TextField } from '@/components/text-field';
import { RolePicker } from '@/components/role-picker';
import { FormMessage } from '@/components/error-state';
import { useForm } from '@/lib/use-form';
import { toast } from '@/stores/toasts';

export function InviteForm({ workspaceId }: { workspaceId: string }) {
  const invite = useInviteMember(workspaceId);
  const form = useForm(inviteSchema, { email: '', roles: ['chemist'] });

  const submit = (e: React.FormEvent) => {
    e.preventDefault();
    const input = form.validate();
    if (!input) return;
    invite.mutate(input, {
      onSuccess: (invitation) => {
        toast.success(`Invitation sent to ${invitation.email}.`);
        form.reset();
      },
      onError: form.showServerError,
    });
  };

  return (
    <form noValidate onSubmit={submit} className="space-y-4" aria-label="Invite a member">
      {form.formError ? <FormMessage tone="error">{form.formError}</FormMessage> : null}
      <TextField
        label="E-mail address"
        type="email"
        autoComplete="off"
        value={form.values.email}
        onValueChange={(v) => form.setField('email', v)}
        error={form.errors.email}
      />
      <RolePicker
        legend="Roles"
        value={form.values.roles}
        onChange={(roles) => form.setField('roles', roles)}
        error={form.errors.roles}
      />
      <Button type="submit" busy={invite.isPending}>
        Send invitation
      </Button>
      <p className="text-caption text-ink-muted">The link in the e-mail works once and expires.</p>
    </form>
  );
}
