import { z } from 'zod';

/** Every error response of the API has this shape, written by one middleware. */
export const errorResponseSchema = z.object({
  error: z.object({ code: z.string(), message: z.string(), details: z.unknown().optional() }),
});
export type ErrorResponse = z.infer<typeof errorResponseSchema>;
