import { EmptyState } from '../components/ui/empty-state.ui';

export default function ProjectTonnageRoute() {
  return (
    <section aria-labelledby="tonnage-heading">
      <h2 id="tonnage-heading" className="sr-only">
        Tonnage
      </h2>
      <EmptyState title="Nothing to compare yet">
        Tonnage compares schemes by steel weight, weight per square foot, piece count and cost, level by
        level. It needs at least one scheme with sized members.
      </EmptyState>
    </section>
  );
}
