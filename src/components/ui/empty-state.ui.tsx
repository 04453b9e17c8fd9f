import type { ReactNode } from 'react';

type EmptyStateProps = {
  title: string;
  children?: ReactNode;
  action?: ReactNode;
};

/** An honest "nothing here yet": says what will appear and how it gets there. */
export function EmptyState({ title, children, action }: EmptyStateProps) {
  return (
    <section
      aria-label={title}
      className="drafting-grid flex flex-col items-center justify-center gap-3 rounded-[3px] border border-dashed border-ink/35 px-6 py-14 text-center"
    >
      <svg aria-hidden viewBox="0 0 48 32" className="h-8 w-12 text-ink/50">
        <path d="M2 4h44M2 28h44" stroke="currentColor" strokeWidth="2.5" fill="none" />
        <path d="M12 4v24M24 4v24M36 4v24" stroke="currentColor" strokeWidth="1" strokeDasharray="2 2" fill="none" />
      </svg>
      <h2 className="text-base font-semibold text-ink">{title}</h2>
      {children ? <div className="max-w-md text-sm text-ink-soft">{children}</div> : null}
      {action ? <div className="mt-2">{action}</div> : null}
    </section>
  );
}
