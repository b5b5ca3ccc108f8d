import type { Campaign } from '@contracts/campaigns';
import { Z_LIMIT } from '@contracts/campaigns';
import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import { Button } from '@/components/ui/button';
import { TextAreaField, TextField } from '@/components/ui/field';
import { ErrorNotice, Notice } from '@/components/ui/notice';
import { useUpdateCampaign } from '../api/update-campaign';
import { GradeSchemeFields } from './grade-scheme-fields';
import { GridStepField } from './grid-step-field';
import { settingsFormSchema, settingsFromCampaign } from './settings-schema';
import type { SettingsFormOutput, SettingsFormValues } from './settings-schema';

/**
 * Leads only; the server refuses anyone else, this form is simply not shown to them. `onSaved` lets
 * the page refresh what depends on the settings (a new range or grid makes the scans out of date).
 */
export function CampaignSettingsForm({ campaign, onSaved }: { campaign: Campaign; onSaved?: (saved: Campaign) => void }) {
  const update = useUpdateCampaign(campaign.id);
  const { register, control, handleSubmit, formState, reset } = useForm<SettingsFormValues, unknown, SettingsFormOutput>({
    resolver: zodResolver(settingsFormSchema),
    defaultValues: settingsFromCampaign(campaign),
  });
  const errors = formState.errors;

  const onSubmit = handleSubmit((values) =>
    update.mutate(values, {
      onSuccess: (saved) => {
        reset(settingsFromCampaign(saved));
        onSaved?.(saved);
      },
    }),
  );

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4">
      <ErrorNotice error={update.error} />
      {update.isSuccess && !formState.isDirty ? (
        <Notice tone="success" role="status">
          Settings saved.
        </Notice>
      ) : null}
      <TextField label="Campaign name" error={errors.name?.message} {...register('name')} />
      <TextAreaField label="Description" error={errors.description?.message} {...register('description')} />
      <div className="grid grid-cols-1 gap-3 sm:grid-cols-3">
        <TextField label="Lowest redshift" type="number" step="any" min={0} max={Z_LIMIT} error={errors.zMin?.message} {...register('zMin', { valueAsNumber: true })} />
        <TextField label="Highest redshift" type="number" step="any" min={0} max={Z_LIMIT} error={errors.zMax?.message} {...register('zMax', { valueAsNumber: true })} />
        <TextField
          label="Agreement tolerance"
          type="number"
          step="any"
          min={0}
          hint="In |Δz|/(1+z)."
          error={errors.tolerance?.message}
          {...register('tolerance', { valueAsNumber: true })}
        />
        <GridStepField
          fieldClassName="sm:col-span-2"
          hint="Own sampling: each file's median pixel, rounded to a step between 17 and 550 km/s. Changing the range or the grid offers a re-scan."
          error={errors.gridStep?.message}
          {...register('gridStep')}
        />
      </div>
      <GradeSchemeFields control={control} register={register} errors={errors} />
      <div className="flex gap-2">
        <Button type="submit" pending={update.isPending} pendingLabel="Saving…" disabled={!formState.isDirty}>
          Save settings
        </Button>
        <Button variant="quiet" disabled={!formState.isDirty || update.isPending} onClick={() => reset()}>
          Discard changes
        </Button>
      </div>
    </form>
  );
}
