import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import { Button } from '../../../components/ui/button.ui';
import { TextField } from '../../../components/ui/field.ui';
import { FormAlert } from '../../../components/ui/form-alert.ui';
import { applyServerErrors } from '../../../lib/form-errors';
import { forgotInputSchema, type ForgotInput } from '../api/password-reset.schema';
import { useRequestPasswordReset } from '../api/request-reset.api';

export function ForgotPasswordForm() {
  const request = useRequestPasswordReset();
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors },
  } = useForm<ForgotInput>({ resolver: zodResolver(forgotInputSchema), defaultValues: { email: '' } });

  const onSubmit = handleSubmit(async (values) => {
    try {
      await request.mutateAsync(values);
    } catch (error) {
      applyServerErrors(error, setError, ['email']);
    }
  });

  if (request.isSuccess) {
    return (
      <p role="status" className="rounded-[3px] border-l-4 border-accent bg-accent-wash px-3 py-2.5 text-sm text-ink">
        {request.data}
      </p>
    );
  }
  return (
    <form onSubmit={onSubmit} noValidate aria-label="Ask for a password link" className="flex flex-col gap-4">
      <FormAlert>{errors.root?.server?.message}</FormAlert>
      <TextField label="Email" type="email" autoComplete="email" error={errors.email?.message} {...register('email')} />
      <Button type="submit" pending={request.isPending} className="w-full">
        Send me a link
      </Button>
    </form>
  );
}
