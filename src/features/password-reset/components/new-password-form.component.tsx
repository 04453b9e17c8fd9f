import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import { Button } from '../../../components/ui/button.ui';
import { TextField } from '../../../components/ui/field.ui';
import { FormAlert } from '../../../components/ui/form-alert.ui';
import { applyServerErrors } from '../../../lib/form-errors';
import { useCompletePasswordReset } from '../api/complete-reset.api';
import { newPasswordInputSchema, PASSWORD_MIN_LENGTH, type NewPasswordInput } from '../api/password-reset.schema';

export function NewPasswordForm({ token, onDone }: { token: string; onDone: (email: string) => void }) {
  const complete = useCompletePasswordReset(token);
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors },
  } = useForm<NewPasswordInput>({
    resolver: zodResolver(newPasswordInputSchema),
    defaultValues: { password: '', confirm: '' },
  });

  const onSubmit = handleSubmit(async (values) => {
    try {
      onDone(await complete.mutateAsync(values.password));
    } catch (error) {
      applyServerErrors(error, setError, ['password']);
    }
  });

  return (
    <form onSubmit={onSubmit} noValidate aria-label="Choose a new password" className="flex flex-col gap-4">
      <FormAlert>{errors.root?.server?.message}</FormAlert>
      <TextField
        label="New password"
        type="password"
        autoComplete="new-password"
        hint={`At least ${PASSWORD_MIN_LENGTH} characters.`}
        error={errors.password?.message}
        {...register('password')}
      />
      <TextField label="Type it again" type="password" autoComplete="new-password" error={errors.confirm?.message} {...register('confirm')} />
      <Button type="submit" pending={complete.isPending} className="w-full">
        Set the new password
      </Button>
    </form>
  );
}
