import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import { Button } from '../../../components/ui/button.ui';
import { TextField } from '../../../components/ui/field.ui';
import { FormAlert } from '../../../components/ui/form-alert.ui';
import { applyServerErrors } from '../../../lib/form-errors';
import { useAcceptInvitation, type AcceptedSession } from '../api/accept-invitation.api';
import { acceptInputSchema, PASSWORD_MIN_LENGTH, type AcceptInput } from '../api/invitation.schema';

const FIELDS = ['name', 'password'] as const;

export function AcceptInvitationForm({
  token,
  email,
  onAccepted,
}: {
  token: string;
  email: string;
  onAccepted: (session: AcceptedSession) => void;
}) {
  const accept = useAcceptInvitation(token);
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors },
  } = useForm<AcceptInput>({ resolver: zodResolver(acceptInputSchema), defaultValues: { name: '', password: '' } });

  const onSubmit = handleSubmit(async (values) => {
    try {
      onAccepted(await accept.mutateAsync(values));
    } catch (error) {
      applyServerErrors(error, setError, FIELDS);
    }
  });

  return (
    <form onSubmit={onSubmit} noValidate aria-label="Join the firm" className="flex flex-col gap-4">
      <FormAlert>{errors.root?.server?.message}</FormAlert>
      <TextField label="E-mail" value={email} readOnly disabled hint="The address the invitation was sent to." />
      <TextField label="Your name" autoComplete="name" error={errors.name?.message} {...register('name')} />
      <TextField
        label="Password"
        type="password"
        autoComplete="new-password"
        hint={`At least ${PASSWORD_MIN_LENGTH} characters.`}
        error={errors.password?.message}
        {...register('password')}
      />
      <Button type="submit" pending={accept.isPending} className="mt-1 w-full">
        Join and sign in
      </Button>
    </form>
  );
}
