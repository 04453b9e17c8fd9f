import { EmptyState } from '../components/ui/empty-state.ui';

export default function ProjectScheduleRoute() {
  return (
    <section aria-labelledby="schedule-heading">
      <h2 id="schedule-heading" className="sr-only">
        Schedule
      </h2>
      <EmptyState title="No members to schedule">
        The Schedule lists every member’s mark, size, end reactions, camber and studs. It fills in as members
        are drawn on a scheme’s Plan.
      </EmptyState>
    </section>
  );
}
