import { z } from 'zod';
import { emailSchema, newPasswordSchema } from './session';

export const requestResetSchema = z.object({
  email: emailSchema,
});
export type RequestResetInput = z.infer<typeof requestResetSchema>;

export const completeResetSchema = z.object({
  password: newPasswordSchema,
});
export type CompleteResetInput = z.infer<typeof completeResetSchema>;
