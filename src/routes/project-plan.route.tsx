import { EmptyState } from '../components/ui/empty-state.ui';

export default function ProjectPlanRoute() {
  return (
    <section aria-labelledby="plan-heading">
      <h2 id="plan-heading" className="sr-only">
        Plan
      </h2>
      <EmptyState title="No plan to show">
        The Plan is where a level’s grid, columns, girders, beams and deck are drawn and sized. It opens for a
        scheme, and this project has no schemes yet.
      </EmptyState>
    </section>
  );
}
