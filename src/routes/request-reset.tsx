import { Link } from 'react-router-dom';
import { requestResetSchema } from '@shared/schemas/password-reset';
import { useRequestReset } from '@/features/password-reset/api/request-reset';
import { Button } from '@/components/button';
import { TextField } from '@/components/text-field';
import { FormMessage } from '@/components/error-state';
import { useForm } from '@/lib/use-form';
import { paths } from '@/paths';

export function Component() {
  const request = useRequestReset();
  const form = useForm(requestResetSchema, { email: '' });

  const submit = (e: React.FormEvent) => {
    e.preventDefault();
    const input = form.validate();
    if (!input) return;
    request.mutate(input, { onError: form.showServerError });
  };

  return (
    <>
      <h1 className="text-heading font-semibold text-ink">Reset your password</h1>
      {request.isSuccess ? (
        <div className="mt-4 space-y-4">
          <FormMessage tone="success">
            If an account exists for {form.values.email.trim()}, an e-mail with a reset link is on
            its way. The link works once and expires.
          </FormMessage>
          <p className="text-body text-ink-muted">
            No e-mail after a few minutes? Check the spam folder, or ask your workspace admin.
          </p>
        </div>
      ) : (
        <>
          <p className="mt-1 text-body text-ink-muted">
            Enter your e-mail address and we will send you a link to choose a new password.
          </p>
          <form noValidate onSubmit={submit} className="mt-5 space-y-4">
            {form.formError ? <FormMessage tone="error">{form.formError}</FormMessage> : null}
            <TextField
              label="E-mail"
              type="email"
              autoComplete="email"
              autoFocus
              value={form.values.email}
              onValueChange={(v) => form.setField('email', v)}
              error={form.errors.email}
            />
            <Button type="submit" className="w-full" busy={request.isPending}>
              Send reset link
            </Button>
          </form>
        </>
      )}
      <p className="mt-4 text-small">
        <Link
          to={paths.signIn.to()}
          className="font-medium text-accent underline-offset-2 hover:underline"
        >
          Back to sign-in
        </Link>
      </p>
    </>
  );
}
