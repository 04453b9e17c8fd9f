import { EmptyState } from '../components/ui/empty-state.ui';

export default function ProjectSchemesRoute() {
  return (
    <section aria-labelledby="schemes-heading" className="flex flex-col gap-4">
      <h2 id="schemes-heading" className="sr-only">
        Schemes
      </h2>
      <EmptyState title="No schemes yet">
        A scheme is one way to frame this building: its levels, grid, members, deck and loads. Schemes are
        started from here once the framing editor is part of Baywright; this version cannot create them yet.
      </EmptyState>
    </section>
  );
}
