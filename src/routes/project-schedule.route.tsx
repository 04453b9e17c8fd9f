import { useParams } from 'react-router-dom';
import { FormAlert } from '../components/ui/form-alert.ui';
import { Loading } from '../components/ui/loading.ui';
import { useCurrentSession } from '../features/auth/hooks/use-current-session.hook';
import { PlanSheetViewer } from '../features/plan-sheet/components/plan-sheet-viewer.component';
import { ScheduleScreen } from '../features/schedule/components/schedule-screen.component';
import { useSchemes } from '../features/schemes/api/get-schemes.api';

/** Drafters, engineers and owners edit marks; the server enforces it ('marks:edit'). */
const MARK_EDITORS = new Set(['owner', 'engineer', 'drafter']);

export default function ProjectScheduleRoute() {
  const { projectId = '' } = useParams();
  const session = useCurrentSession();
  const schemes = useSchemes(projectId);
  return (
    <section aria-labelledby="schedule-heading" className="flex flex-col gap-4">
      <h2 id="schedule-heading" className="sr-only">
        Schedule
      </h2>
      {schemes.isPending ? (
        <Loading label="Loading schemes…" />
      ) : schemes.isError ? (
        <FormAlert>Schemes could not be loaded: {schemes.error.message}</FormAlert>
      ) : (
        <ScheduleScreen
          schemes={schemes.data.filter((s) => !s.archived).map((s) => ({ id: s.id, name: s.name, status: s.status }))}
          mayEditMarks={MARK_EDITORS.has(session.role)}
          renderSheet={(schemeId, levels) => <PlanSheetViewer key={schemeId} schemeId={schemeId} levels={levels} />}
        />
      )}
    </section>
  );
}
