import type { ReactNode } from 'react';

type PageHeaderProps = {
  eyebrow?: ReactNode;
  title: string;
  description?: ReactNode;
  actions?: ReactNode;
};

export function PageHeader({ eyebrow, title, description, actions }: PageHeaderProps) {
  return (
    <header className="flex flex-wrap items-end justify-between gap-4 border-b-2 border-ink pb-4">
      <div className="min-w-0">
        {eyebrow ? <div className="label-caps mb-1">{eyebrow}</div> : null}
        <h1 className="truncate text-2xl font-semibold tracking-tight text-ink">{title}</h1>
        {description ? <div className="mt-1 text-sm text-ink-soft">{description}</div> : null}
      </div>
      {actions ? <div className="flex items-center gap-2">{actions}</div> : null}
    </header>
  );
}
