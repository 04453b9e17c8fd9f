import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { Button } from '../../../components/ui/button.ui';
import { TextField } from '../../../components/ui/field.ui';
import { FormAlert } from '../../../components/ui/form-alert.ui';
import { applyServerErrors } from '../../../lib/form-errors';
import { ROLE_LABELS, ROLES } from '../../../lib/permissions';
import { useCreateInvitation } from '../api/create-invitation.api';
import { inviteInputSchema, type InviteInput } from '../api/invitation.schema';

const FIELDS = ['email', 'role'] as const;

export function InviteForm() {
  const create = useCreateInvitation();
  const [sentTo, setSentTo] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    reset,
    formState: { errors },
  } = useForm<InviteInput>({ resolver: zodResolver(inviteInputSchema), defaultValues: { email: '', role: 'engineer' } });

  const onSubmit = handleSubmit(async (values) => {
    setSentTo(null);
    try {
      const invitation = await create.mutateAsync(values);
      setSentTo(invitation.email);
      reset({ email: '', role: values.role });
    } catch (error) {
      applyServerErrors(error, setError, FIELDS);
    }
  });

  return (
    <form onSubmit={onSubmit} noValidate aria-label="Invite a person" className="flex flex-col gap-4">
      <FormAlert>{errors.root?.server?.message}</FormAlert>
      {sentTo ? (
        <p role="status" className="rounded-[3px] border-l-4 border-accent bg-accent-wash px-3 py-2 text-sm text-ink">
          Invitation sent to <strong className="font-medium">{sentTo}</strong>. The link works once, for 7 days.
        </p>
      ) : null}
      <div className="grid gap-4 sm:grid-cols-[1fr_12rem_auto] sm:items-start">
        <TextField label="E-mail" type="email" autoComplete="off" error={errors.email?.message} {...register('email')} />
        <div className="flex flex-col gap-1.5">
          <label htmlFor="invite-role" className="text-sm font-medium text-ink">
            Role
          </label>
          <select
            id="invite-role"
            aria-invalid={errors.role ? true : undefined}
            className="h-10 rounded-[3px] border border-line bg-paper-raised px-2 text-sm"
            {...register('role')}
          >
            {ROLES.map((r) => (
              <option key={r} value={r}>
                {ROLE_LABELS[r]}
              </option>
            ))}
          </select>
          {errors.role ? <p className="text-sm text-danger">{errors.role.message}</p> : null}
        </div>
        <Button type="submit" pending={create.isPending} className="sm:mt-[1.6rem]">
          Send invitation
        </Button>
      </div>
    </form>
  );
}
