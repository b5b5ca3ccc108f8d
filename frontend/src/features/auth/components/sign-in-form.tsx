import { loginRequestSchema } from '@contracts/auth';
import type { User } from '@contracts/auth';
import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import type { z } from 'zod';
import { Button } from '@/components/ui/button';
import { TextField } from '@/components/ui/field';
import { ErrorNotice } from '@/components/ui/notice';
import { useSignIn } from '../api/sign-in';

type Values = z.input<typeof loginRequestSchema>;

export function SignInForm({ onSignedIn }: { onSignedIn: (user: User) => void }) {
  const signIn = useSignIn();
  const { register, handleSubmit, formState } = useForm<Values, unknown, z.output<typeof loginRequestSchema>>({
    resolver: zodResolver(loginRequestSchema),
    defaultValues: { email: '', password: '' },
  });

  const onSubmit = handleSubmit((values) => signIn.mutate(values, { onSuccess: onSignedIn }));

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4">
      {/* The server's message covers wrong credentials and lock-outs alike ("try again in …"). */}
      <ErrorNotice error={signIn.error} />
      <TextField
        label="E-mail"
        type="email"
        autoComplete="username"
        autoFocus
        error={formState.errors.email?.message}
        {...register('email')}
      />
      <TextField
        label="Password"
        type="password"
        autoComplete="current-password"
        error={formState.errors.password?.message}
        {...register('password')}
      />
      <Button type="submit" pending={signIn.isPending} pendingLabel="Signing in…">
        Sign in
      </Button>
    </form>
  );
}
