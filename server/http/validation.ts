import { messageInWords } from '@shared/engine/route/field-words';
import type { z } from 'zod';
import type { ApiErrorDetail } from '@shared/schemas/errors';

/** Every zod issue as {path:"a.b", message}, so a form can mark each field. */
export function zodIssuesToDetails(
  issues: readonly z.core.$ZodIssue[],
  prefix: string[] = [],
): ApiErrorDetail[] {
  return issues.map((issue) => ({
    path: [...prefix, ...issue.path.map(String)].join('.'),
    // The schema's default wording ("Too big: expected …") said as what to enter instead.
    message: messageInWords(issue),
  }));
}
