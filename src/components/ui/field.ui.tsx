import { useId, type ComponentProps, type ReactNode } from 'react';

type FieldFrameProps = {
  id: string;
  label: string;
  error?: string;
  hint?: ReactNode;
  optional?: boolean;
  children: ReactNode;
};

function FieldFrame({ id, label, error, hint, optional, children }: FieldFrameProps) {
  return (
    <div className="flex flex-col gap-1.5">
      <label htmlFor={id} className="flex items-baseline justify-between text-sm font-medium text-ink">
        <span>{label}</span>
        {optional ? <span className="label-caps normal-case tracking-normal">optional</span> : null}
      </label>
      {children}
      {error ? (
        <p id={`${id}-error`} className="flex items-start gap-1.5 text-sm text-danger">
          <span aria-hidden className="mt-1.5 inline-block size-1.5 shrink-0 rotate-45 bg-danger" />
          {error}
        </p>
      ) : hint ? (
        <p id={`${id}-hint`} className="text-xs text-ink-faint">
          {hint}
        </p>
      ) : null}
    </div>
  );
}

const CONTROL =
  'w-full rounded-[3px] border bg-paper-raised px-3 text-sm text-ink placeholder:text-ink-faint ' +
  'shadow-[inset_0_1px_0_rgb(0_0_0/0.03)] focus:outline-none focus:border-accent focus:ring-2 focus:ring-accent/25';

function describedBy(id: string, error?: string, hint?: ReactNode): string | undefined {
  if (error) return `${id}-error`;
  if (hint) return `${id}-hint`;
  return undefined;
}

type TextFieldProps = ComponentProps<'input'> & {
  label: string;
  error?: string;
  hint?: ReactNode;
  optional?: boolean;
};

export function TextField({ label, error, hint, optional, id, className = '', ...inputProps }: TextFieldProps) {
  const autoId = useId();
  const inputId = id ?? autoId;
  return (
    <FieldFrame id={inputId} label={label} error={error} hint={hint} optional={optional}>
      <input
        id={inputId}
        aria-invalid={error ? true : undefined}
        aria-describedby={describedBy(inputId, error, hint)}
        className={`${CONTROL} h-10 ${error ? 'border-danger' : 'border-line'} ${className}`}
        {...inputProps}
      />
    </FieldFrame>
  );
}

type TextAreaFieldProps = ComponentProps<'textarea'> & {
  label: string;
  error?: string;
  hint?: ReactNode;
  optional?: boolean;
};

export function TextAreaField({ label, error, hint, optional, id, className = '', ...rest }: TextAreaFieldProps) {
  const autoId = useId();
  const inputId = id ?? autoId;
  return (
    <FieldFrame id={inputId} label={label} error={error} hint={hint} optional={optional}>
      <textarea
        id={inputId}
        rows={3}
        aria-invalid={error ? true : undefined}
        aria-describedby={describedBy(inputId, error, hint)}
        className={`${CONTROL} py-2 ${error ? 'border-danger' : 'border-line'} ${className}`}
        {...rest}
      />
    </FieldFrame>
  );
}
