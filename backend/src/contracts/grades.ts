import { z } from 'zod';

/**
 * A grade's code: a short word or letters ("sure", "B", "no-z"). Campaigns made before codes were
 * words have the digits 0–4 as codes; a number sent by an older script is read as its digits.
 */
export const gradeCodeSchema = z.union([
  z
    .string()
    .trim()
    .min(1, 'Give the grade a code.')
    .max(16, 'A grade code has at most 16 characters.')
    .regex(/^[A-Za-z0-9][A-Za-z0-9_.+-]*$/, 'A grade code is letters, digits, "-", "_", "." or "+", without spaces.'),
  z.number().int().min(0).max(99).transform(String),
]);

/** One step of a campaign's grade scheme; exports carry both the code and the label. */
export const gradeSchema = z.object({
  code: gradeCodeSchema,
  label: z.string().trim().min(1).max(40),
  meaning: z.string().trim().max(300),
});
export type Grade = z.infer<typeof gradeSchema>;

export const gradeSchemeSchema = z
  .array(gradeSchema)
  .min(2, 'A grade scheme needs at least two grades.')
  .max(20)
  .refine((grades) => new Set(grades.map((g) => g.code.toLowerCase())).size === grades.length, {
    message: 'Grade codes must be unique.',
  })
  .refine((grades) => new Set(grades.map((g) => g.label.toLowerCase())).size === grades.length, {
    message: 'Grade labels must be unique.',
  });
export type GradeScheme = z.infer<typeof gradeSchemeSchema>;

/**
 * Redward's default scheme, most confident first: each grade is named by the chance that the
 * redshift is right, so a catalogue user can weigh it. The chances are the team's stated intent
 * when grading (common practice), not a measured calibration.
 */
export const DEFAULT_GRADE_SCHEME: GradeScheme = [
  { code: 'sure', label: 'sure', meaning: 'At least 99 % sure the redshift is right: two or more clear features, or one resolved doublet or unmistakable profile.' },
  { code: 'likely', label: 'likely', meaning: 'About 90 % sure: one clear feature with support (a break, weak lines, the photo-z).' },
  { code: 'possible', label: 'possible', meaning: 'About 70 % sure: a single weak feature or break; another redshift remains possible.' },
  { code: 'no-z', label: 'no redshift', meaning: 'Signal present, but no redshift can be given.' },
  { code: 'unusable', label: 'unusable', meaning: 'No usable signal: an artefact or a reduction failure.' },
];

/**
 * A stored scheme as the API shows it: codes as text. Schemes stored before codes were words
 * hold numbers (4 … 0); they are read as "4" … "0" and never rewritten in the database.
 */
export function readStoredGradeScheme(stored: unknown): GradeScheme {
  if (!Array.isArray(stored)) return [];
  return stored.map((g: { code: unknown; label: unknown; meaning: unknown }) => ({ code: String(g.code), label: String(g.label), meaning: String(g.meaning ?? '') }));
}
