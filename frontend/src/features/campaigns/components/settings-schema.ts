import { gridStepSchema, updateCampaignRequestSchema } from '@contracts/campaigns';
import type { Campaign } from '@contracts/campaigns';
import { z } from 'zod';

const number = () => z.number({ error: 'Enter a number.' });

/**
 * The settings form always holds every field, so its own shape is the full one; the
 * contract's rules (ranges, unique grades, ordered redshifts) are then applied unchanged,
 * with their messages reported on the matching fields.
 */
export const settingsFormSchema = z
  .object({
    name: z.string(),
    description: z.string(),
    zMin: number(),
    zMax: number(),
    tolerance: number(),
    gridStep: gridStepSchema,
    // Friendlier wording than the contract's generic length message for the common slip.
    gradeScheme: z.array(z.object({ code: z.string().trim().min(1, 'Give the grade a code.'), label: z.string().trim().min(1, 'Give the grade a label.'), meaning: z.string() })),
  })
  .transform((values, ctx) => {
    const checked = updateCampaignRequestSchema.safeParse(values);
    if (checked.success) return checked.data;
    for (const issue of checked.error.issues) ctx.addIssue({ code: 'custom', message: issue.message, path: issue.path });
    return z.NEVER;
  });

export type SettingsFormValues = z.input<typeof settingsFormSchema>;
export type SettingsFormOutput = z.output<typeof settingsFormSchema>;

export const settingsFromCampaign = (c: Campaign): SettingsFormValues => ({
  name: c.name,
  description: c.description,
  zMin: c.zMin,
  zMax: c.zMax,
  tolerance: c.tolerance,
  gridStep: c.gridStep,
  gradeScheme: c.gradeScheme.map((g) => ({ ...g })),
});
