import { updateAccountRequestSchema } from '@contracts/auth';
import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import type { z } from 'zod';
import { Button } from '@/components/ui/button';
import { TextField } from '@/components/ui/field';
import { ErrorNotice, Notice } from '@/components/ui/notice';
import { useUpdateName } from '../api/update-name';

type Values = z.input<typeof updateAccountRequestSchema>;

export function NameForm({ currentName }: { currentName: string }) {
  const update = useUpdateName();
  const { register, handleSubmit, formState, reset } = useForm<Values, unknown, z.output<typeof updateAccountRequestSchema>>({
    resolver: zodResolver(updateAccountRequestSchema),
    defaultValues: { name: currentName },
  });

  const onSubmit = handleSubmit((values) =>
    update.mutate(values, { onSuccess: (user) => reset({ name: user.name }) }),
  );

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-3">
      <ErrorNotice error={update.error} />
      {update.isSuccess && !formState.isDirty ? (
        <Notice tone="success" role="status">
          Name saved.
        </Notice>
      ) : null}
      <TextField label="Your name" autoComplete="name" error={formState.errors.name?.message} {...register('name')} />
      <div>
        <Button type="submit" pending={update.isPending} pendingLabel="Saving…">
          Save name
        </Button>
      </div>
    </form>
  );
}
