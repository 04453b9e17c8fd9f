import { useQueryClient } from '@tanstack/react-query';
import { useEffect, useRef, useState } from 'react';
import { Link, useNavigate, useParams, useSearchParams } from 'react-router-dom';
import type { Plan } from '../../shared/schemas/plan.schema';
import { describeProblem, planNamer } from '../../shared/drafting/element-names.drafting';
import { Button } from '../components/ui/button.ui';
import { EmptyState } from '../components/ui/empty-state.ui';
import { FormAlert } from '../components/ui/form-alert.ui';
import { Loading } from '../components/ui/loading.ui';
import { paths } from '../config/paths';
import { useCurrentSession } from '../features/auth/hooks/use-current-session.hook';
import { DesignBasisForm } from '../features/design-basis/components/design-basis-form.component';
import { designStoredScheme } from '../features/editor/api/design-scheme.api';
import { editorSchemeQueryKey, useEditorScheme, type EditorScheme } from '../features/editor/api/get-scheme.api';
import { PlanEditor } from '../features/editor/components/plan-editor.component';
import { MemberSheet } from '../features/member-sheet/components/member-sheet.component';
import { ColumnSheet } from '../features/column-stack/components/column-sheet.component';
import { buildColumnSchedule } from '../../shared/drafting/column-schedule.drafting';
import { memberCalcSheetHref } from '../features/member-sheet/api/member-calc-sheet.api';
import { useCreateScheme } from '../features/schemes/api/create-scheme.api';
import { useSchemes } from '../features/schemes/api/get-schemes.api';
import { BuildingView } from '../features/building-view/components/building-view.component';
import { useUnderlays } from '../features/underlay/api/get-underlays.api';
import { UnderlayImage } from '../features/underlay/components/underlay-image.component';
import { UnderlayPanel } from '../features/underlay/components/underlay-panel.component';
import { StudyPanel } from '../features/bay-study/components/study-panel.component';
import { useUnitPrices } from '../features/unit-prices/api/unit-prices.api';
import { isApiError } from '../lib/api-client';
import { invalidatePlanResults } from '../lib/plan-change-queries';
import { canEditProjects } from '../lib/permissions';
import { useUnits } from '../lib/units-context';

/** After a save, the stored design follows (debounced: one request for a burst of saves). */
const STORED_DESIGN_DELAY_MS = 2500;

export default function ProjectPlanRoute() {
  const { projectId = '' } = useParams();
  const [search, setSearch] = useSearchParams();
  const schemeId = search.get('scheme') ?? '';
  return (
    <section aria-labelledby="plan-heading" className="flex flex-col gap-3">
      <h2 id="plan-heading" className="sr-only">
        Plan
      </h2>
      {schemeId ? (
        <SchemePlan
          key={schemeId}
          projectId={projectId}
          schemeId={schemeId}
          levelId={search.get('level')}
          view={search.get('view') === 'building' ? 'building' : 'plan'}
          onLevel={(level) => {
            if (search.get('level') === level) return;
            const next = new URLSearchParams(search);
            next.set('level', level);
            setSearch(next, { replace: true });
          }}
          onView={(view) => {
            setSearch(
              (prev) => {
                const next = new URLSearchParams(prev);
                if (view === 'building') next.set('view', 'building');
                else next.delete('view');
                return next;
              },
              { replace: true },
            );
          }}
        />
      ) : (
        <SchemeChooser projectId={projectId} />
      )}
    </section>
  );
}

function SchemePlan({
  projectId, schemeId, levelId, view, onLevel, onView,
}: {
  projectId: string;
  schemeId: string;
  levelId: string | null;
  view: 'plan' | 'building';
  onLevel: (l: string) => void;
  onView: (v: 'plan' | 'building') => void;
}) {
  const session = useCurrentSession();
  const scheme = useEditorScheme(schemeId);
  const queryClient = useQueryClient();
  const { system } = useUnits();
  const prices = useUnitPrices();
  const designTimer = useRef<ReturnType<typeof setTimeout> | null>(null);
  useEffect(() => () => void (designTimer.current && clearTimeout(designTimer.current)), []);

  if (scheme.isPending) return <Loading label="Opening the plan…" />;
  if (scheme.isError) {
    const notFound = isApiError(scheme.error) && scheme.error.status === 404;
    return (
      <div className="flex flex-col gap-2">
        <FormAlert>{notFound ? 'This scheme was not found. It may have been deleted.' : scheme.error.message}</FormAlert>
        <Link className="text-sm text-accent underline" to={paths.projectPlan.href(projectId)}>
          Choose another scheme
        </Link>
      </div>
    );
  }
  const data = scheme.data;
  if (!data.plan) {
    return (
      <FormAlert>
        The plan of “{data.name}” could not be read: {data.problems.join(' ')}
      </FormAlert>
    );
  }
  const canEdit = canEditProjects(session.role);
  const onSaved = (revision: number, plan: Plan) => {
    // The server's copy now matches the editor's: keep TanStack Query in step.
    queryClient.setQueryData<EditorScheme>(editorSchemeQueryKey(schemeId), (old) => (old ? { ...old, revision, plan } : old));
    void invalidatePlanResults(queryClient, projectId, schemeId);
    if (designTimer.current) clearTimeout(designTimer.current);
    designTimer.current = setTimeout(() => {
      designStoredScheme(schemeId)
        .then(() => invalidatePlanResults(queryClient, projectId, schemeId))
        .catch(() => undefined); // the live design on screen is unaffected; the next save retries
    }, STORED_DESIGN_DELAY_MS);
  };

  return (
    <>
      <div className="flex flex-wrap items-baseline justify-between gap-2">
        <p className="text-sm text-ink-soft">
          Scheme <strong className="text-ink">{data.name}</strong>
          <Link className="ml-3 text-xs text-accent underline" to={paths.projectPlan.href(projectId)}>
            other schemes
          </Link>
        </p>
        {data.problems.length ? <p className="text-xs text-notice">On opening: {data.problems.slice(0, 3).join(' ')}</p> : null}
      </div>
      <div className="relative left-1/2 w-[calc(100vw-2rem)] max-w-[1800px] -translate-x-1/2">
        <PlanEditor
          schemeId={schemeId}
          schemeName={data.name}
          plan={data.plan}
          revision={data.revision}
          canEdit={canEdit}
          initialLevelId={levelId}
          onLevelChange={onLevel}
          onSaved={onSaved}
          initialView={view}
          onViewChange={onView}
          renderBuildingView={({ plan, result, selection, select }) => <BuildingView plan={plan} design={result} selection={selection} onSelect={select} />}
          renderUnderlayPanel={(level) => <UnderlayPanel schemeId={schemeId} levelId={level} canEdit={canEdit} units={system} />}
          renderUnderlayImages={(level, view) => <LevelUnderlays schemeId={schemeId} levelId={level} view={view} />}
          renderStudyPanel={(args) => (
            <StudyPanel
              {...args}
              projectId={projectId}
              schemeId={schemeId}
              prices={prices.data?.prices ? { steel_usd_per_ton: prices.data.prices.steel_usd_per_ton, connection_usd_each: prices.data.prices.connection_usd_each } : null}
              tonnageHref={paths.projectTonnage.href(projectId)}
            />
          )}
          renderDesignBasis={({ designBasis, canEdit: can, submit }) => <DesignBasisForm value={designBasis} canEdit={can} onSubmit={submit} units={system} />}
          renderColumnSheet={({ columnId, plan, result, close }) => {
            const schedule = buildColumnSchedule(result, plan);
            const column = schedule.columns.find((c) => c.id === columnId);
            if (!column) return null;
            return (
              <div className="flex flex-col gap-2">
                <Link className="text-xs text-accent underline" to={paths.projectColumns.href(projectId, { scheme: schemeId, column: columnId })}>
                  {canEdit ? 'Splices and tier sizes on the Column stack' : 'Open on the Column stack'}
                </Link>
                <ColumnSheet schedule={schedule} column={column} units={system} onClose={close} />
              </div>
            );
          }}
          renderMemberSheet={({ member, planMember, plan, result, canEdit: can, lockShape, setConstraints, setMemberSettings, saved, setComposite, close }) => (
            <MemberSheet
              member={member}
              designBasis={plan.designBasis}
              planMember={planMember}
              units={system}
              canEdit={can}
              onLockShape={lockShape}
              onConstraints={setConstraints}
              onMemberSettings={setMemberSettings}
              calcSheetHref={memberCalcSheetHref(schemeId, member.id)}
              saved={saved}
              onComposite={setComposite}
              onClose={close}
              names={planNamer(plan, new Map(result.members.map((m) => [m.id, m.mark])))}
              problems={result.problems.filter((p) => p.elementId === member.id).map((p) => describeProblem(p.message, planNamer(plan, new Map(result.members.map((m) => [m.id, m.mark])))))}
            />
          )}
        />
      </div>
    </>
  );
}

/** Konva nodes: the level's visible underlays beneath the plan. */
function LevelUnderlays({ schemeId, levelId, view }: { schemeId: string; levelId: string; view: { scale: number; x: number; y: number } }) {
  const underlays = useUnderlays(schemeId, levelId);
  return <>{(underlays.data ?? []).map((u) => <UnderlayImage key={u.id} underlay={u} view={view} />)}</>;
}

function SchemeChooser({ projectId }: { projectId: string }) {
  const session = useCurrentSession();
  const schemes = useSchemes(projectId);
  const create = useCreateScheme(projectId);
  const navigate = useNavigate();
  const [name, setName] = useState('');
  const canEdit = canEditProjects(session.role);

  if (schemes.isPending) return <Loading label="Loading schemes…" />;
  if (schemes.isError) return <FormAlert>{schemes.error.message}</FormAlert>;
  const list = schemes.data.filter((s) => !s.archived);
  return (
    <div className="flex flex-col gap-4">
      {list.length === 0 ? (
        <EmptyState title="No plan to show">
          The Plan is where a level’s grid, columns, girders, beams and deck are drawn and sized. It opens for a scheme, and this project has no schemes yet.
        </EmptyState>
      ) : (
        <nav aria-label="Schemes to open" className="flex flex-col gap-1">
          <h3 className="label-caps">Open a scheme on the Plan</h3>
          <ul className="flex flex-col divide-y divide-line border border-ink bg-paper-raised">
            {list.map((s) => (
              <li key={s.id} className="flex items-center justify-between px-4 py-2 text-sm">
                <Link className="font-medium text-accent underline" to={paths.projectPlan.href(projectId, { scheme: s.id })}>
                  {s.name}
                </Link>
                <span className="figures font-mono text-xs text-ink-soft">revision {s.revision}</span>
              </li>
            ))}
          </ul>
        </nav>
      )}
      {canEdit ? (
        <form
          className="flex flex-wrap items-end gap-2"
          aria-label="New scheme"
          onSubmit={(e) => {
            e.preventDefault();
            if (!name.trim()) return;
            create.mutate(name.trim(), { onSuccess: (s) => navigate(paths.projectPlan.href(projectId, { scheme: s.id })) });
          }}
        >
          <label className="flex flex-col gap-1 text-sm font-medium">
            New scheme name
            <input className="h-9 w-64 rounded-[3px] border border-line bg-paper-raised px-3 text-sm" value={name} onChange={(e) => setName(e.target.value)} placeholder="Scheme A — 30 ft bays" />
          </label>
          <Button type="submit" pending={create.isPending} disabled={!name.trim()}>
            Start scheme
          </Button>
          {create.isError ? <FormAlert>{create.error.message}</FormAlert> : null}
        </form>
      ) : null}
    </div>
  );
}
