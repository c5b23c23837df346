import { z } from 'zod';

/** One problem with a request field; `path` is dotted ("steps.0.name"), empty for the whole body. */
export const apiErrorDetailSchema = z.object({
  path: z.string(),
  message: z.string(),
});
export type ApiErrorDetail = z.infer<typeof apiErrorDetailSchema>;

/**
 * Every error the API returns has this shape. `code` is stable and meant for
 * programs ("validation_failed", "csrf_failed", "not_found", ...); `message`
 * is a plain sentence for people; `details` lists field problems for 400s.
 */
export const apiErrorSchema = z.object({
  error: z.object({
    code: z.string(),
    message: z.string(),
    details: z.array(apiErrorDetailSchema).optional(),
  }),
});
export type ApiError = z.infer<typeof apiErrorSchema>;
