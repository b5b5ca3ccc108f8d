import { z } from 'zod';

/** One step of a campaign's grade scheme; exports carry both the code and the label. */
export const gradeSchema = z.object({
  code: z.number().int().min(0).max(99),
  label: z.string().trim().min(1).max(40),
  meaning: z.string().trim().max(300),
});
export type Grade = z.infer<typeof gradeSchema>;

export const gradeSchemeSchema = z
  .array(gradeSchema)
  .min(2, 'A grade scheme needs at least two grades.')
  .max(20)
  .refine((grades) => new Set(grades.map((g) => g.code)).size === grades.length, {
    message: 'Grade codes must be unique.',
  })
  .refine((grades) => new Set(grades.map((g) => g.label.toLowerCase())).size === grades.length, {
    message: 'Grade labels must be unique.',
  });
export type GradeScheme = z.infer<typeof gradeSchemeSchema>;

/** The default scheme of PRODUCT.md, highest confidence first. */
export const DEFAULT_GRADE_SCHEME: GradeScheme = [
  { code: 4, label: 'firm', meaning: 'Two or more clear features, or one resolved doublet / unmistakable profile.' },
  { code: 3, label: 'probable', meaning: 'One clear feature plus supporting evidence (break, weak lines, photo-z).' },
  { code: 2, label: 'tentative', meaning: 'A single weak feature or break; another redshift remains possible.' },
  { code: 1, label: 'undetermined', meaning: 'Signal present, no redshift.' },
  { code: 0, label: 'unusable', meaning: 'No usable signal, artefact or reduction failure.' },
];
