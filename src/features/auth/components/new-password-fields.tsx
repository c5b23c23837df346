import { useState } from 'react';
import { PASSWORD_MIN_LENGTH } from '@shared/schemas/limits';
import { TextField } from '@/components/text-field';

export const PASSWORDS_DIFFER = 'The two passwords differ.';

/** The "repeat new password" entry of a form: its value, its error and the check against the new password. */
export function useRepeatedPassword() {
  const [value, setValue] = useState('');
  const [error, setError] = useState<string>();
  return {
    value,
    error,
    change(next: string) {
      setValue(next);
      setError(undefined);
    },
    /** True when the repeat matches; otherwise shows the mismatch on the field. */
    matches(password: string): boolean {
      const ok = value === password;
      setError(ok ? undefined : PASSWORDS_DIFFER);
      return ok;
    },
    clear() {
      setValue('');
      setError(undefined);
    },
  };
}

export type RepeatedPassword = ReturnType<typeof useRepeatedPassword>;

/** A new password and its repeat, with the shared length rule as the hint. */
export function NewPasswordFields({
  password,
  onPasswordChange,
  passwordError,
  repeat,
  autoFocus,
}: {
  password: string;
  onPasswordChange: (value: string) => void;
  passwordError?: string;
  repeat: RepeatedPassword;
  autoFocus?: boolean;
}) {
  return (
    <>
      <TextField
        label="New password"
        type="password"
        autoComplete="new-password"
        autoFocus={autoFocus}
        hint={`At least ${PASSWORD_MIN_LENGTH} characters.`}
        value={password}
        onValueChange={onPasswordChange}
        error={passwordError}
      />
      <TextField
        label="Repeat new password"
        type="password"
        autoComplete="new-password"
        value={repeat.value}
        onValueChange={repeat.change}
        error={repeat.error}
      />
    </>
  );
}
