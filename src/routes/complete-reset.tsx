import { Link, useParams } from 'react-router-dom';
import { completeResetSchema } from '@shared/schemas/password-reset';
import { isApiError } from '@/api/client';
import { useCompleteReset } from '@/features/password-reset/api/complete-reset';
import { Button, ButtonLink } from '@/components/button';
import {
  NewPasswordFields,
  useRepeatedPassword,
} from '@/features/auth/components/new-password-fields';
import { FormMessage } from '@/components/error-state';
import { useForm } from '@/lib/use-form';
import { paths } from '@/paths';

export function Component() {
  const { token = '' } = useParams();
  const complete = useCompleteReset(token);
  const form = useForm(completeResetSchema, { password: '' });
  const repeat = useRepeatedPassword();

  const submit = (e: React.FormEvent) => {
    e.preventDefault();
    const input = form.validate();
    const repeated = repeat.matches(form.values.password);
    if (!input || !repeated) return;
    complete.mutate(input, {
      onError: (error) => {
        // A mistyped, used or expired link: say so plainly instead of naming the URL part.
        // A malformed token is refused as a URL part, reported under `params.token`.
        const badLink =
          isApiError(error) &&
          (error.status === 404 || error.status === 410 || 'params.token' in error.fieldErrors());
        if (badLink)
          form.setFormError(
            'This reset link is not valid any more: it may have been used already, mistyped or expired.',
          );
        else form.showServerError(error);
      },
    });
  };

  if (complete.isSuccess) {
    return (
      <>
        <h1 className="text-heading font-semibold text-ink">Password changed</h1>
        <div className="mt-4 space-y-4">
          <FormMessage tone="success">Your new password is set. Sign in with it now.</FormMessage>
          <ButtonLink to={paths.signIn.to()} variant="primary" className="w-full">
            Sign in
          </ButtonLink>
        </div>
      </>
    );
  }

  return (
    <>
      <h1 className="text-heading font-semibold text-ink">Choose a new password</h1>
      <p className="mt-1 text-body text-ink-muted">
        This link works once and expires after a while.
      </p>
      <form noValidate onSubmit={submit} className="mt-5 space-y-4">
        {form.formError ? (
          <FormMessage tone="error">
            {form.formError}{' '}
            <Link to={paths.requestReset.to()} className="font-medium underline">
              Ask for a new link
            </Link>
          </FormMessage>
        ) : null}
        <NewPasswordFields
          autoFocus
          password={form.values.password}
          onPasswordChange={(v) => form.setField('password', v)}
          passwordError={form.errors.password}
          repeat={repeat}
        />
        <Button type="submit" className="w-full" busy={complete.isPending}>
          Set new password
        </Button>
      </form>
    </>
  );
}
