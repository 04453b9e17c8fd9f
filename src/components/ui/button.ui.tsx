import type { ComponentProps } from 'react';
import { Link, type LinkProps } from 'react-router-dom';

export type ButtonVariant = 'primary' | 'secondary' | 'quiet' | 'danger';

const BASE =
  'inline-flex items-center justify-center gap-2 rounded-[3px] px-3.5 h-9 text-sm font-medium ' +
  'transition-colors disabled:cursor-not-allowed disabled:opacity-55 whitespace-nowrap';

const VARIANTS: Record<ButtonVariant, string> = {
  primary: 'bg-accent text-white hover:bg-accent-strong border border-accent-strong/40',
  secondary: 'bg-paper-raised text-ink border border-ink/70 hover:bg-paper-sunk',
  quiet: 'text-ink-soft hover:text-ink hover:bg-paper-sunk',
  danger: 'bg-danger text-white hover:bg-danger/90 border border-danger',
};

export function buttonClasses(variant: ButtonVariant = 'primary', extra = ''): string {
  return `${BASE} ${VARIANTS[variant]} ${extra}`.trim();
}

type ButtonProps = ComponentProps<'button'> & { variant?: ButtonVariant; pending?: boolean };

export function Button({
  variant = 'primary',
  pending = false,
  className = '',
  type = 'button',
  disabled,
  children,
  ...rest
}: ButtonProps) {
  return (
    <button
      type={type}
      className={buttonClasses(variant, className)}
      disabled={disabled || pending}
      aria-busy={pending || undefined}
      {...rest}
    >
      {pending ? <span aria-hidden className="size-3 animate-spin rounded-full border-2 border-current border-r-transparent" /> : null}
      {children}
    </button>
  );
}

type ButtonLinkProps = LinkProps & { variant?: ButtonVariant };

export function ButtonLink({ variant = 'primary', className = '', ...rest }: ButtonLinkProps) {
  return <Link className={buttonClasses(variant, className)} {...rest} />;
}
