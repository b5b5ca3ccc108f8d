import { z } from 'zod';

/** What a feature looks like in a spectrum. */
export const lineKindSchema = z.enum(['emission', 'absorption', 'band', 'break']);
export type LineKind = z.infer<typeof lineKindSchema>;

/** GET /api/line-list: the rest-frame features the comb draws, vacuum wavelengths in Å, with their sources. */
export const lineListResponseSchema = z.object({
  medium: z.literal('vacuum'),
  unit: z.literal('Angstrom'),
  lines: z.array(
    z.object({
      name: z.string(),
      species: z.string(),
      rest: z.number(),
      kind: lineKindSchema,
      source: z.string(),
      /** Rest-frame extent of a broad feature, Å. */
      widthA: z.number().optional(),
    }),
  ),
});
export type LineListResponse = z.infer<typeof lineListResponseSchema>;
