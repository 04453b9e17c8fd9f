import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import { Button } from '../../../components/ui/button.ui';
import { TextField } from '../../../components/ui/field.ui';
import { FormAlert } from '../../../components/ui/form-alert.ui';
import { applyServerErrors } from '../../../lib/form-errors';
import type { Session } from '../api/session.schema';
import { signInInputSchema, useSignIn, type SignInInput } from '../api/sign-in.api';

const FIELDS = ['email', 'password'] as const;

export function SignInForm({ onSignedIn }: { onSignedIn: (session: Session) => void }) {
  const signIn = useSignIn();
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors },
  } = useForm<SignInInput>({
    resolver: zodResolver(signInInputSchema),
    defaultValues: { email: '', password: '' },
  });

  const onSubmit = handleSubmit(async (values) => {
    try {
      onSignedIn(await signIn.mutateAsync(values));
    } catch (error) {
      applyServerErrors(error, setError, FIELDS);
    }
  });

  return (
    <form onSubmit={onSubmit} noValidate aria-label="Sign in" className="flex flex-col gap-4">
      <FormAlert>{errors.root?.server?.message}</FormAlert>
      <TextField
        label="Email"
        type="email"
        autoComplete="username"
        error={errors.email?.message}
        {...register('email')}
      />
      <TextField
        label="Password"
        type="password"
        autoComplete="current-password"
        error={errors.password?.message}
        {...register('password')}
      />
      <Button type="submit" pending={signIn.isPending} className="mt-1 w-full">
        Sign in
      </Button>
    </form>
  );
}
