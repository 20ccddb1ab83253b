import { z } from 'zod';

/** The one error body every API route answers with. `line` is the 1-based file line of a CSV error. */
export const ApiErrorBody = z.object({
  error: z.object({
    code: z.string(),
    message: z.string(),
    line: z.number().int().optional(),
  }),
});
export type ApiErrorBody = z.infer<typeof ApiErrorBody>;
