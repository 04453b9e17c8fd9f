import type { ReactNode } from 'react';

/** A form-level message (wrong credentials, rate limit, a failed save), announced to readers. */
export function FormAlert({ children, tone = 'danger' }: { children: ReactNode; tone?: 'danger' | 'notice' }) {
  if (!children) return null;
  const colours = tone === 'danger' ? 'border-danger bg-danger-wash text-danger' : 'border-notice bg-notice-wash text-notice';
  return (
    <div role="alert" className={`rounded-[3px] border-l-4 px-3 py-2.5 text-sm ${colours}`}>
      {children}
    </div>
  );
}
