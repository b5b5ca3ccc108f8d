import { changePasswordRequestSchema } from '@contracts/auth';
import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import { z } from 'zod';
import { Button } from '@/components/ui/button';
import { TextField } from '@/components/ui/field';
import { ErrorNotice, Notice } from '@/components/ui/notice';
import { useChangePassword } from '../api/change-password';

// The repeat field exists only to catch typos, so it is checked here and never sent.
const passwordFormSchema = changePasswordRequestSchema
  .extend({ repeatPassword: z.string() })
  .refine((v) => v.newPassword === v.repeatPassword, {
    message: 'The two new passwords differ.',
    path: ['repeatPassword'],
  });

type Values = z.input<typeof passwordFormSchema>;

export function PasswordForm() {
  const change = useChangePassword();
  const { register, handleSubmit, formState, reset } = useForm<Values, unknown, z.output<typeof passwordFormSchema>>({
    resolver: zodResolver(passwordFormSchema),
    defaultValues: { currentPassword: '', newPassword: '', repeatPassword: '' },
  });

  const onSubmit = handleSubmit(({ currentPassword, newPassword }) =>
    change.mutate({ currentPassword, newPassword }, { onSuccess: () => reset() }),
  );

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-3">
      <ErrorNotice error={change.error} />
      {change.isSuccess && !formState.isDirty ? (
        <Notice tone="success" role="status">
          Password changed.
        </Notice>
      ) : null}
      <TextField
        label="Current password"
        type="password"
        autoComplete="current-password"
        error={formState.errors.currentPassword?.message}
        {...register('currentPassword')}
      />
      <TextField
        label="New password"
        type="password"
        autoComplete="new-password"
        hint="At least 10 characters. A long phrase is easier to remember than symbols."
        error={formState.errors.newPassword?.message}
        {...register('newPassword')}
      />
      <TextField
        label="Repeat new password"
        type="password"
        autoComplete="new-password"
        error={formState.errors.repeatPassword?.message}
        {...register('repeatPassword')}
      />
      <div>
        <Button type="submit" pending={change.isPending} pendingLabel="Changing…">
          Change password
        </Button>
      </div>
    </form>
  );
}
