import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import { Button } from '../../../components/ui/button.ui';
import { TextField } from '../../../components/ui/field.ui';
import { FormAlert } from '../../../components/ui/form-alert.ui';
import { applyServerErrors } from '../../../lib/form-errors';
import type { Session } from '../api/session.schema';
import { PASSWORD_MIN_LENGTH, signUpInputSchema, useSignUp, type SignUpInput } from '../api/sign-up.api';

const FIELDS = ['firmName', 'name', 'email', 'password'] as const;

export function SignUpForm({ onSignedUp }: { onSignedUp: (session: Session) => void }) {
  const signUp = useSignUp();
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors },
  } = useForm<SignUpInput>({
    resolver: zodResolver(signUpInputSchema),
    defaultValues: { firmName: '', name: '', email: '', password: '' },
  });

  const onSubmit = handleSubmit(async (values) => {
    try {
      onSignedUp(await signUp.mutateAsync(values));
    } catch (error) {
      applyServerErrors(error, setError, FIELDS);
    }
  });

  return (
    <form onSubmit={onSubmit} noValidate aria-label="Create your firm" className="flex flex-col gap-4">
      <FormAlert>{errors.root?.server?.message}</FormAlert>
      <TextField label="Firm name" autoComplete="organization" error={errors.firmName?.message} {...register('firmName')} />
      <TextField label="Your name" autoComplete="name" error={errors.name?.message} {...register('name')} />
      <TextField label="Email" type="email" autoComplete="email" error={errors.email?.message} {...register('email')} />
      <TextField
        label="Password"
        type="password"
        autoComplete="new-password"
        hint={`At least ${PASSWORD_MIN_LENGTH} characters.`}
        error={errors.password?.message}
        {...register('password')}
      />
      <Button type="submit" pending={signUp.isPending} className="mt-1 w-full">
        Create firm and sign in
      </Button>
    </form>
  );
}
