import { useState } from 'react';
import type { z } from 'zod';
import { fieldInWords, messageInWords } from '@shared/engine/route/field-words';
import { isApiError } from '@/api/client';

export type FieldErrors = Record<string, string>;

/** zod issues keyed by dotted path; the first message per field wins. */
export function issuesToErrors(issues: z.core.$ZodIssue[]): FieldErrors {
  const out: FieldErrors = {};
  for (const issue of issues) {
    const key = issue.path.map(String).join('.');
    if (!(key in out)) out[key] = messageInWords(issue);
  }
  return out;
}

/**
 * A controlled form checked by a shared zod schema before it is sent, with the
 * server's field errors mapped back onto the same fields afterwards.
 */
export function useForm<S extends z.ZodType<unknown, Record<string, unknown>>>(
  schema: S,
  initial: z.input<S>,
) {
  const [values, setValues] = useState<z.input<S>>(initial);
  const [errors, setErrors] = useState<FieldErrors>({});
  const [formError, setFormError] = useState<string | undefined>();

  const setField = <K extends keyof z.input<S>>(key: K, value: z.input<S>[K]) => {
    setValues((v) => ({ ...v, [key]: value }));
    setErrors((e) => {
      if (!((key as string) in e)) return e;
      const { [key as string]: _dropped, ...rest } = e;
      return rest;
    });
  };

  /** Returns the parsed values, or null after showing the field errors. */
  const validate = (): z.output<S> | null => {
    setFormError(undefined);
    const result = schema.safeParse(values);
    if (result.success) {
      setErrors({});
      return result.data;
    }
    setErrors(issuesToErrors(result.error.issues));
    return null;
  };

  /** Shows a failed request: field details on their fields, the message above the form. */
  const showServerError = (error: unknown) => {
    if (isApiError(error)) {
      const fields = error.fieldErrors();
      const known = Object.keys(fields).filter((k) => k !== '' && k in (values as object));
      setErrors(Object.fromEntries(known.map((k) => [k, fields[k]])));
      // Problems with something other than a field of this form (the body, or
      // a part of the URL such as a token) are named and shown above the form.
      const unplaced = Object.entries(fields)
        .filter(([k]) => !known.includes(k))
        .map(([k, m]) => (k ? `${fieldInWords(k)}: ${m}` : m));
      // When every problem sits on its field, the fields say it all; a generic
      // "Some fields are not valid." above them would only repeat it vaguely.
      setFormError(
        known.length > 0 && unplaced.length === 0
          ? undefined
          : [error.message, ...unplaced].join(' '),
      );
    } else {
      setFormError(error instanceof Error ? error.message : 'Something went wrong. Try again.');
    }
  };

  const reset = (next: z.input<S> = initial) => {
    setValues(next);
    setErrors({});
    setFormError(undefined);
  };

  return {
    values,
    setField,
    errors,
    setErrors,
    formError,
    setFormError,
    validate,
    showServerError,
    reset,
  };
}
