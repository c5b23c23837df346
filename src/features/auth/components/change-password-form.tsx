import { useState } from 'react';
import { changePasswordSchema } from '@shared/schemas/session';
import { PASSWORD_MIN_LENGTH } from '@shared/schemas/limits';
import { useChangePassword } from '../api/change-password';
import { Button } from '@/components/button';
import { TextField } from '@/components/text-field';
import { FormMessage } from '@/components/error-state';
import { useForm } from '@/lib/use-form';

export function ChangePasswordForm() {
  const change = useChangePassword();
  const form = useForm(changePasswordSchema, { currentPassword: '', newPassword: '' });
  const [repeat, setRepeat] = useState('');
  const [repeatError, setRepeatError] = useState<string>();
  const [done, setDone] = useState(false);

  const submit = (e: React.FormEvent) => {
    e.preventDefault();
    setDone(false);
    const input = form.validate();
    const mismatch = repeat !== form.values.newPassword ? 'The two new passwords differ.' : undefined;
    setRepeatError(mismatch);
    if (!input || mismatch) return;
    change.mutate(input, {
      onSuccess: () => {
        form.reset();
        setRepeat('');
        setDone(true);
      },
      onError: form.showServerError,
    });
  };

  return (
    <form noValidate onSubmit={submit} className="max-w-form space-y-4" aria-label="Change password">
      {form.formError ? <FormMessage tone="error">{form.formError}</FormMessage> : null}
      {done ? <FormMessage tone="success">Your password was changed.</FormMessage> : null}
      <TextField
        label="Current password"
        type="password"
        autoComplete="current-password"
        value={form.values.currentPassword}
        onValueChange={(v) => form.setField('currentPassword', v)}
        error={form.errors.currentPassword}
      />
      <TextField
        label="New password"
        type="password"
        autoComplete="new-password"
        hint={`At least ${PASSWORD_MIN_LENGTH} characters.`}
        value={form.values.newPassword}
        onValueChange={(v) => form.setField('newPassword', v)}
        error={form.errors.newPassword}
      />
      <TextField
        label="Repeat new password"
        type="password"
        autoComplete="new-password"
        value={repeat}
        onValueChange={(v) => {
          setRepeat(v);
          setRepeatError(undefined);
        }}
        error={repeatError}
      />
      <Button type="submit" busy={change.isPending}>
        Change password
      </Button>
    </form>
  );
}
