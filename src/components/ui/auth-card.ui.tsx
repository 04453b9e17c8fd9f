import type { ReactNode } from 'react';

type AuthCardProps = { sheet: string; title: string; intro?: string; children: ReactNode; footer: ReactNode };

/** A card drawn like a sheet's title block: a ruled strip on top, the form below. */
export function AuthCard({ sheet, title, intro, children, footer }: AuthCardProps) {
  return (
    <div className="w-full max-w-sm">
      <div className="border-2 border-ink bg-paper-raised shadow-[6px_6px_0_rgb(28_34_40/0.08)]">
        <div className="flex items-stretch border-b border-ink text-ink">
          <span className="label-caps border-r border-ink px-3 py-1.5">Sheet</span>
          <span className="label-caps flex-1 px-3 py-1.5 text-ink">{sheet}</span>
        </div>
        <div className="p-6">
          <h1 className="text-xl font-semibold tracking-tight text-ink">{title}</h1>
          {intro ? <p className="mt-1.5 text-sm text-ink-soft">{intro}</p> : null}
          <div className="mt-5">{children}</div>
        </div>
      </div>
      <p className="mt-4 text-center text-sm text-ink-soft">{footer}</p>
    </div>
  );
}
