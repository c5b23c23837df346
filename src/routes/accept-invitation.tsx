import { useNavigate, useParams } from 'react-router-dom';
import { acceptInvitationSchema, type InvitationInfo } from '@shared/schemas/members';
import { ROLE_LABELS } from '@shared/schemas/session';
import { PASSWORD_MIN_LENGTH } from '@shared/schemas/limits';
import { useInvitation } from '@/features/invitations/api/get-invitation';
import { useAcceptInvitation } from '@/features/invitations/api/accept-invitation';
import { isApiError } from '@/api/client';
import { Button, ButtonLink } from '@/components/button';
import { TextField } from '@/components/text-field';
import { ErrorState, FormMessage } from '@/components/error-state';
import { Loading } from '@/components/spinner';
import { useForm } from '@/lib/use-form';
import { formatDateTime } from '@/lib/format';
import { paths } from '@/paths';

export function Component() {
  const { token = '' } = useParams();
  const invitation = useInvitation(token);

  if (invitation.isPending) return <Loading label="Opening the invitation…" />;
  if (invitation.isError) {
    const gone = isApiError(invitation.error) && [400, 404, 410].includes(invitation.error.status);
    return (
      <>
        <h1 className="text-heading font-semibold text-ink">Invitation</h1>
        <ErrorState
          className="mt-4"
          error={invitation.error}
          title={gone ? 'This invitation cannot be used' : 'The invitation could not be loaded'}
          onRetry={gone ? undefined : () => invitation.refetch()}
        >
          {gone ? (
            <p className="mt-1 text-small text-ink-muted">
              Invitations work once and expire. Ask the workspace admin to send you a new one.
            </p>
          ) : null}
        </ErrorState>
        <ButtonLink to={paths.signIn.to()} className="mt-4">
          Go to sign-in
        </ButtonLink>
      </>
    );
  }
  return <AcceptForm token={token} info={invitation.data} />;
}

function AcceptForm({ token, info }: { token: string; info: InvitationInfo }) {
  const accept = useAcceptInvitation(token);
  const navigate = useNavigate();
  const form = useForm(
    acceptInvitationSchema,
    info.existingUser ? { password: '' } : { name: '', password: '' },
  );

  const submit = (e: React.FormEvent) => {
    e.preventDefault();
    if (!info.existingUser && !form.values.name?.trim()) {
      form.setErrors({ name: 'Enter your name.' });
      return;
    }
    const input = form.validate();
    if (!input) return;
    accept.mutate(input, {
      // Accepting signs the person in: open the workspace they joined.
      onSuccess: (session) => {
        const joined =
          session.workspaces.find((w) => w.name === info.workspaceName) ?? session.workspaces[0];
        navigate(joined ? paths.workspace.home.to(joined.id) : paths.root.to(), { replace: true });
      },
      onError: form.showServerError,
    });
  };

  return (
    <>
      <h1 className="text-heading font-semibold text-ink">Join {info.workspaceName}</h1>
      <dl className="mt-3 grid grid-cols-[auto_1fr] gap-x-3 gap-y-1 text-body">
        <dt className="text-ink-muted">E-mail</dt>
        <dd className="font-medium">{info.email}</dd>
        <dt className="text-ink-muted">Roles</dt>
        <dd>{info.roles.map((r) => ROLE_LABELS[r]).join(', ')}</dd>
        <dt className="text-ink-muted">Expires</dt>
        <dd>{formatDateTime(info.expiresAt)}</dd>
      </dl>
      <form noValidate onSubmit={submit} className="mt-5 space-y-4">
        {form.formError ? <FormMessage tone="error">{form.formError}</FormMessage> : null}
        {info.existingUser ? (
          <p className="text-body text-ink-muted">
            You already have a Phasewright account. Confirm with its password to join.
          </p>
        ) : (
          <TextField
            label="Your name"
            autoComplete="name"
            autoFocus
            value={form.values.name ?? ''}
            onValueChange={(v) => form.setField('name', v)}
            error={form.errors.name}
          />
        )}
        <TextField
          label={info.existingUser ? 'Your password' : 'Choose a password'}
          type="password"
          autoComplete={info.existingUser ? 'current-password' : 'new-password'}
          autoFocus={info.existingUser}
          hint={info.existingUser ? undefined : `At least ${PASSWORD_MIN_LENGTH} characters.`}
          value={form.values.password}
          onValueChange={(v) => form.setField('password', v)}
          error={form.errors.password}
        />
        <Button type="submit" className="w-full" busy={accept.isPending}>
          Accept and join
        </Button>
      </form>
    </>
  );
}
