import { useState } from 'react';
import { changePasswordSchema } from '@shared/schemas/session';
import { useChangePassword } from '../api/change-password';
import { Button } from '@/components/button';
import { TextField } from '@/components/text-field';
import { FormMessage } from '@/components/error-state';
import { NewPasswordFields, useRepeatedPassword } from './new-password-fields';
import { useForm } from '@/lib/use-form';

export function ChangePasswordForm() {
  const change = useChangePassword();
  const form = useForm(changePasswordSchema, { currentPassword: '', newPassword: '' });
  const repeat = useRepeatedPassword();
  const [done, setDone] = useState(false);

  const submit = (e: React.FormEvent) => {
    e.preventDefault();
    setDone(false);
    const input = form.validate();
    const repeated = repeat.matches(form.values.newPassword);
    if (!input || !repeated) return;
    change.mutate(input, {
      onSuccess: () => {
        form.reset();
        repeat.clear();
        setDone(true);
      },
      onError: form.showServerError,
    });
  };

  return (
    <form
      noValidate
      onSubmit={submit}
      className="max-w-form space-y-4"
      aria-label="Change password"
    >
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
      <NewPasswordFields
        password={form.values.newPassword}
        onPasswordChange={(v) => form.setField('newPassword', v)}
        passwordError={form.errors.newPassword}
        repeat={repeat}
      />
      <Button type="submit" busy={change.isPending}>
        Change password
      </Button>
    </form>
  );
}
