import { createCampaignRequestSchema, Z_LIMIT } from '@contracts/campaigns';
import type { Campaign } from '@contracts/campaigns';
import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import type { z } from 'zod';
import { Button } from '@/components/ui/button';
import { TextAreaField, TextField } from '@/components/ui/field';
import { ErrorNotice } from '@/components/ui/notice';
import { useCreateCampaign } from '../api/create-campaign';
import { GridStepField } from './grid-step-field';

type Values = z.input<typeof createCampaignRequestSchema>;

export function CreateCampaignForm({ onCreated }: { onCreated: (campaign: Campaign) => void }) {
  const create = useCreateCampaign();
  const { register, handleSubmit, formState } = useForm<Values, unknown, z.output<typeof createCampaignRequestSchema>>({
    resolver: zodResolver(createCampaignRequestSchema),
    defaultValues: { name: '', description: '', zMin: 0, zMax: Z_LIMIT, tolerance: 0.003, gridStep: 'default' },
  });
  const errors = formState.errors;

  const onSubmit = handleSubmit((values) => create.mutate(values, { onSuccess: onCreated }));

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-3">
      <ErrorNotice error={create.error} />
      <TextField label="Campaign name" error={errors.name?.message} {...register('name')} />
      <TextAreaField label="Description" hint="Targets, instruments, science goal." error={errors.description?.message} {...register('description')} />
      {/* Most campaigns search the full range on the default grid; changing either is an informed choice, so it is tucked away. */}
      <details className="rounded-control border border-paper-300 px-3 py-2">
        <summary className="cursor-pointer text-sm font-medium text-ink-700">Search range, scan grid and agreement tolerance</summary>
        <div className="mt-3 grid grid-cols-2 gap-3">
          <TextField label="Lowest redshift" type="number" step="any" min={0} max={Z_LIMIT} error={errors.zMin?.message} {...register('zMin', { valueAsNumber: true })} />
          <TextField label="Highest redshift" type="number" step="any" min={0} max={Z_LIMIT} error={errors.zMax?.message} {...register('zMax', { valueAsNumber: true })} />
          <TextField
            label="Agreement tolerance"
            type="number"
            step="any"
            min={0}
            hint="|Δz|/(1+z) within which two readings agree."
            fieldClassName="col-span-2"
            error={errors.tolerance?.message}
            {...register('tolerance', { valueAsNumber: true })}
          />
          <GridStepField fieldClassName="col-span-2" error={errors.gridStep?.message} {...register('gridStep')} />
        </div>
        <p className="mt-2 text-sm text-ink-500">The default grade scheme is used; leads can edit it on the campaign page.</p>
      </details>
      <div>
        <Button type="submit" pending={create.isPending} pendingLabel="Creating…">
          Create campaign
        </Button>
      </div>
    </form>
  );
}
