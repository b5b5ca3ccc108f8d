import { newPasswordSchema, updateAccountRequestSchema } from '@contracts/auth';
import type { AcceptInvitationResponse } from '@contracts/invitations';
import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import { z } from 'zod';
import { Button } from '@/components/ui/button';
import { TextField } from '@/components/ui/field';
import { ErrorNotice } from '@/components/ui/notice';
import { useAcceptInvitation } from '../api/accept-invitation';

const newAccountSchema = z
  .object({
    name: updateAccountRequestSchema.shape.name,
    password: newPasswordSchema,
    repeatPassword: z.string(),
  })
  .refine((v) => v.password === v.repeatPassword, { message: 'The two passwords differ.', path: ['repeatPassword'] });

type Values = z.input<typeof newAccountSchema>;

interface Props {
  token: string;
  email: string;
  onAccepted: (result: AcceptInvitationResponse) => void;
}

export function NewAccountForm({ token, email, onAccepted }: Props) {
  const accept = useAcceptInvitation(token);
  const { register, handleSubmit, formState } = useForm<Values, unknown, z.output<typeof newAccountSchema>>({
    resolver: zodResolver(newAccountSchema),
    defaultValues: { name: '', password: '', repeatPassword: '' },
  });

  const onSubmit = handleSubmit(({ name, password }) => accept.mutate({ name, password }, { onSuccess: onAccepted }));

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-3">
      <ErrorNotice error={accept.error} />
      {/* Lets password managers file the new password under the invited address. */}
      <input type="email" name="username" autoComplete="username" value={email} readOnly hidden />
      <TextField label="Your name" autoComplete="name" autoFocus error={formState.errors.name?.message} {...register('name')} />
      <TextField
        label="New password"
        type="password"
        autoComplete="new-password"
        hint="At least 10 characters."
        error={formState.errors.password?.message}
        {...register('password')}
      />
      <TextField
        label="Repeat password"
        type="password"
        autoComplete="new-password"
        error={formState.errors.repeatPassword?.message}
        {...register('repeatPassword')}
      />
      <div>
        <Button type="submit" pending={accept.isPending} pendingLabel="Creating account…">
          Create account and join
        </Button>
      </div>
    </form>
  );
}
