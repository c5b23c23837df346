import { Link, Navigate, useNavigate, useSearchParams } from 'react-router-dom';
import { signInSchema } from '@shared/schemas/session';
import { useSession } from '@/features/auth/api/get-session';
import { useSignIn } from '@/features/auth/api/sign-in';
import { clearSessionEnd, useSessionEnd } from '@/features/auth/session-end';
import { Button } from '@/components/button';
import { TextField } from '@/components/text-field';
import { FormMessage } from '@/components/error-state';
import { Loading } from '@/components/spinner';
import { useForm } from '@/lib/use-form';
import { paths, safeNext } from '@/paths';

export function Component() {
  const [params] = useSearchParams();
  const next = safeNext(params.get('next'));
  const session = useSession();
  const signIn = useSignIn();
  const navigate = useNavigate();
  const form = useForm(signInSchema, { email: '', password: '' });
  const sessionEnded = useSessionEnd((s) => s.reason === 'ended');

  if (session.isPending) return <Loading />;
  if (session.data && !signIn.isPending) return <Navigate to={next} replace />;

  const submit = (e: React.FormEvent) => {
    e.preventDefault();
    const input = form.validate();
    if (!input) return;
    signIn.mutate(input, {
      onSuccess: () => {
        clearSessionEnd();
        navigate(next, { replace: true });
      },
      onError: (error) => {
        form.showServerError(error);
        form.setField('password', '');
      },
    });
  };

  return (
    <>
      <h1 className="text-heading font-semibold text-ink">Sign in</h1>
      <p className="mt-1 text-body text-ink-muted">
        Use the e-mail address your workspace admin invited.
      </p>
      {sessionEnded ? (
        <p
          role="status"
          className="mt-4 rounded-control border border-rule-strong bg-paper-sunken px-3 py-2 text-body text-ink"
        >
          Your session has ended. Sign in again to go back to where you were.
        </p>
      ) : null}
      <form noValidate onSubmit={submit} className="mt-5 space-y-4">
        {form.formError ? <FormMessage tone="error">{form.formError}</FormMessage> : null}
        <TextField
          label="E-mail"
          type="email"
          autoComplete="username"
          autoFocus
          value={form.values.email}
          onValueChange={(v) => form.setField('email', v)}
          error={form.errors.email}
        />
        <TextField
          label="Password"
          type="password"
          autoComplete="current-password"
          value={form.values.password}
          onValueChange={(v) => form.setField('password', v)}
          error={form.errors.password}
        />
        <Button type="submit" className="w-full" busy={signIn.isPending}>
          Sign in
        </Button>
      </form>
      <p className="mt-4 text-small text-ink-muted">
        <Link
          to={paths.requestReset.to()}
          className="font-medium text-accent underline-offset-2 hover:underline"
        >
          Forgot your password?
        </Link>
      </p>
    </>
  );
}
