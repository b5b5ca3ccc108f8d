import { z } from 'zod';

/** What a feature looks like in a spectrum. */
export const lineKindSchema = z.enum(['emission', 'absorption', 'band', 'break']);
export type LineKind = z.infer<typeof lineKindSchema>;

/** The classes of the engine's templates (a line belongs to those whose templates draw it). */
export const templateClassSchema = z.enum(['galaxy', 'quasar', 'star', 'lyman-break']);

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
      /**
       * The classes whose templates draw the line, each with the line's largest strength there
       * (relative flux, depth or optical depth as in line-lists/lines.json); empty: no template draws it.
       */
      strengthByClass: z.partialRecord(templateClassSchema, z.number()),
      /** Templates that draw the line off the solution's redshift, km/s (+ = redward). */
      offsets: z.array(z.object({ template: z.string(), velocityKms: z.number() })),
    }),
  ),
});
export type LineListResponse = z.infer<typeof lineListResponseSchema>;
