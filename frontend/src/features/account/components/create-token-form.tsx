import { createTokenRequestSchema } from '@contracts/auth';
import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import type { z } from 'zod';
import { Button } from '@/components/ui/button';
import { TextField } from '@/components/ui/field';
import { ErrorNotice } from '@/components/ui/notice';
import { useCreateToken } from '../api/create-token';

type Values = z.input<typeof createTokenRequestSchema>;

/** Names a new token; the secret comes back once and is handed to the caller to show. */
export function CreateTokenForm({ onCreated }: { onCreated: (token: string, name: string) => void }) {
  const create = useCreateToken();
  const { register, handleSubmit, formState, reset } = useForm<Values, unknown, z.output<typeof createTokenRequestSchema>>({
    resolver: zodResolver(createTokenRequestSchema),
    defaultValues: { name: '' },
  });

  const onSubmit = handleSubmit(({ name }) =>
    create.mutate(name, {
      onSuccess: ({ token, apiToken }) => {
        onCreated(token, apiToken.name);
        reset({ name: '' });
      },
    }),
  );

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-wrap items-start gap-3">
      <TextField label="Token name" hint="Say where it is used, e.g. “nightly catalogue pull”." fieldClassName="min-w-64 flex-1" error={formState.errors.name?.message} {...register('name')} />
      {/* Level with the input, not with its hint below. */}
      <Button type="submit" className="mt-6" pending={create.isPending} pendingLabel="Creating…">
        Create token
      </Button>
      <div className="basis-full empty:hidden">
        <ErrorNotice error={create.error} />
      </div>
    </form>
  );
}
