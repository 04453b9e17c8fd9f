import { zodResolver } from '@hookform/resolvers/zod';
import type { ReactNode } from 'react';
import { useForm } from 'react-hook-form';
import { Button } from '../../../components/ui/button.ui';
import { TextAreaField, TextField } from '../../../components/ui/field.ui';
import { FormAlert } from '../../../components/ui/form-alert.ui';
import { applyServerErrors } from '../../../lib/form-errors';
import { projectInputSchema, type Project, type ProjectInput } from '../api/project.schema';

const FIELDS = ['name', 'number', 'client', 'address', 'description'] as const;

type ProjectFormProps = {
  project?: Project;
  submitLabel: string;
  label: string;
  onSubmit: (values: ProjectInput) => Promise<unknown>;
  secondaryAction?: ReactNode;
  readOnly?: boolean;
};

export function ProjectForm({ project, submitLabel, label, onSubmit, secondaryAction, readOnly = false }: ProjectFormProps) {
  const {
    register,
    handleSubmit,
    setError,
    reset,
    formState: { errors, isSubmitting, isDirty },
  } = useForm<ProjectInput>({
    resolver: zodResolver(projectInputSchema),
    defaultValues: {
      name: project?.name ?? '',
      number: project?.number ?? '',
      client: project?.client ?? '',
      address: project?.address ?? '',
      description: project?.description ?? '',
    },
  });

  const submit = handleSubmit(async (values) => {
    try {
      await onSubmit(values);
      reset(values);
    } catch (error) {
      applyServerErrors(error, setError, FIELDS);
    }
  });

  return (
    <form onSubmit={submit} noValidate aria-label={label} className="flex flex-col gap-4">
      <FormAlert>{errors.root?.server?.message}</FormAlert>
      <div className="grid gap-4 sm:grid-cols-[1fr_12rem]">
        <TextField label="Project name" readOnly={readOnly} error={errors.name?.message} {...register('name')} />
        <TextField label="Project number" optional readOnly={readOnly} className="font-mono" error={errors.number?.message} {...register('number')} />
      </div>
      <TextField label="Client" optional readOnly={readOnly} error={errors.client?.message} {...register('client')} />
      <TextField label="Site address" optional readOnly={readOnly} error={errors.address?.message} {...register('address')} />
      <TextAreaField label="Description" optional readOnly={readOnly} error={errors.description?.message} {...register('description')} />
      {readOnly ? null : (
        <div className="flex items-center gap-2 pt-1">
          <Button type="submit" pending={isSubmitting} disabled={project !== undefined && !isDirty}>
            {submitLabel}
          </Button>
          {secondaryAction}
        </div>
      )}
    </form>
  );
}
