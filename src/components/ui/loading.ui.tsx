/** A quiet loading line for page regions. */
export function Loading({ label = 'Loading…' }: { label?: string }) {
  return (
    <div role="status" className="flex items-center gap-2 py-10 text-sm text-ink-soft">
      <span aria-hidden className="size-3 animate-spin rounded-full border-2 border-ink/60 border-r-transparent" />
      {label}
    </div>
  );
}
