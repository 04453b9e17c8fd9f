import { useCallback, useRef, useState, type ReactNode } from 'react';
import { Button, buttonClasses } from '../../../components/ui/button.ui';
import { EmptyState } from '../../../components/ui/empty-state.ui';
import { EngineerCaution } from '../../../components/ui/engineer-caution.ui';
import { FormAlert } from '../../../components/ui/form-alert.ui';
import { Loading } from '../../../components/ui/loading.ui';
import { isApiError } from '../../../lib/api-client';
import { UnitsSwitch, useUnits } from '../../../lib/units-context';
import { useEditMarks, useRenumberMarks } from '../api/edit-marks.api';
import { exportLinks, useSchedule } from '../api/get-schedule.api';
import { ScheduleTable } from './schedule-table.component';
import { ScheduleMarkTable } from './schedule-mark-table.component';
import { ColumnScheduleTable } from './column-schedule.component';

export interface SchemeChoice {
  id: string;
  name: string;
  status: string;
}

/** The chosen scheme by default, else the first. */
export function defaultSchemeId(schemes: readonly SchemeChoice[]): string {
  return (schemes.find((s) => s.status === 'chosen') ?? schemes[0])?.id ?? '';
}

export interface ScheduleScreenProps {
  schemes: SchemeChoice[];
  mayEditMarks: boolean;
  /** The on-screen plan sheet (drawn by the plan-sheet feature; the route passes it in). */
  renderSheet?: (schemeId: string, levels: { id: string; name: string }[]) => ReactNode;
}

/** Schedule: marks, sizes, end reactions, camber and studs of a scheme, with its exports. */
export function ScheduleScreen({ schemes, mayEditMarks, renderSheet }: ScheduleScreenProps) {
  const [schemeId, setSchemeId] = useState(() => defaultSchemeId(schemes));
  const [showSheet, setShowSheet] = useState(false);
  const [keepManual, setKeepManual] = useState(true);
  const [notice, setNotice] = useState<string | null>(null);
  const { system } = useUnits();
  const schedule = useSchedule(schemeId);
  const editMarks = useEditMarks(schemeId);
  const renumber = useRenumberMarks(schemeId);
  const revision = schedule.data?.scheme.revision;

  // The table's columns hold this callback: keep it stable so they are not rebuilt on every render.
  const latest = useRef({ editMarks, revision, rows: schedule.data?.rows });
  latest.current = { editMarks, revision, rows: schedule.data?.rows };
  const saveMarks = useCallback(async (memberIds: string[], mark: string | null) => {
    const { editMarks: edit, revision: rev, rows } = latest.current;
    if (rev === undefined || memberIds.length === 0) return;
    setNotice(null);
    // Said in the words of the drawing: the member's kind and grid location, never its id.
    const one = memberIds.length === 1 ? rows?.find((r) => r.memberId === memberIds[0]) : undefined;
    const what = one ? `the ${one.kind} at ${one.gridLocation ?? one.levelName}${one.mark ? ` (was ${one.mark})` : ''}` : `${memberIds.length} members`;
    try {
      await edit.mutateAsync({ revision: rev, marks: memberIds.map((memberId) => ({ memberId, mark })) });
      setNotice(mark ? `Mark ${mark} saved for ${what}.` : `${what[0].toUpperCase()}${what.slice(1)} marked by the rule again.`);
    } catch (err) {
      setNotice(isApiError(err) ? err.message : 'The mark could not be saved.');
    }
  }, []);
  const saveMark = useCallback((memberId: string, mark: string | null) => saveMarks([memberId], mark), [saveMarks]);
  const [rowsBy, setRowsBy] = useState<'mark' | 'member'>('mark');

  if (schemes.length === 0) {
    return (
      <EmptyState title="No members to schedule">
        The Schedule lists every member’s mark, size, end reactions, camber and studs. It fills in when a scheme has
        framing on its Plan.
      </EmptyState>
    );
  }
  const links = exportLinks(schemeId);
  const view = schedule.data;

  return (
    <div className="flex flex-col gap-4">
      <div className="flex flex-wrap items-end justify-between gap-3">
        <label className="flex flex-col gap-1 text-sm">
          <span className="label-caps">Scheme</span>
          <select
            className="h-9 min-w-64 rounded-[3px] border border-ink/60 bg-paper px-2"
            value={schemeId}
            onChange={(e) => {
              setSchemeId(e.target.value);
              setNotice(null);
            }}
          >
            {schemes.map((s) => (
              <option key={s.id} value={s.id}>
                {s.name}
                {s.status === 'chosen' ? ' (chosen)' : ''}
              </option>
            ))}
          </select>
        </label>
        <div className="flex flex-wrap items-center gap-2">
          <UnitsSwitch />
          <label className="flex items-center gap-2 text-sm">
            <span className="label-caps">Rows</span>
            <select className="h-9 rounded-[3px] border border-ink/60 bg-paper px-2" value={rowsBy} onChange={(e) => setRowsBy(e.target.value as 'mark' | 'member')}>
              <option value="mark">One per mark</option>
              <option value="member">One per member</option>
            </select>
          </label>
          <a className={buttonClasses('secondary')} href={rowsBy === 'mark' ? `${links.csv}?by=mark` : links.csv} download>
            Download CSV
          </a>
          <a className={buttonClasses('secondary')} href={links.pdf} download>
            Download plan sheet (PDF)
          </a>
          <a className={buttonClasses('secondary')} href={links.calcBook} download>
            Calc book (PDF)
          </a>
          <a className={buttonClasses('secondary')} href={links.ifc} download title="Members and columns with their I-shape profiles, marks, sizes and end reactions, for building-model software (IFC4, ISO 16739)">
            Download model (IFC)
          </a>
          {renderSheet ? (
            <Button variant={showSheet ? 'primary' : 'secondary'} aria-pressed={showSheet} onClick={() => setShowSheet((v) => !v)}>
              {showSheet ? 'Hide plan sheet' : 'View plan sheet'}
            </Button>
          ) : null}
        </div>
      </div>

      {schedule.isPending ? (
        <Loading label="Reading the design…" />
      ) : schedule.isError ? (
        <FormAlert>The schedule could not be loaded: {schedule.error.message}</FormAlert>
      ) : view ? (
        <>
          <div className="flex flex-wrap items-baseline justify-between gap-2 text-sm text-ink-soft">
            <p>
              Revision <span className="figures font-mono text-ink">{view.scheme.revision}</span> · design basis{' '}
              <strong className="text-ink">{view.basis.method}</strong>. End reactions are unfactored D and L (L reduced
              where allowed); <strong className="text-ink">{view.basis.method === 'LRFD' ? 'Factored' : 'ASD D+L'}</strong> is{' '}
              {view.basis.method === 'LRFD'
                ? '1.2D+1.6L for floors (ASCE 7-16 §2.3.1; roof live and snow combinations where present, largest governs).'
                : 'D+L for floors (ASCE 7-16 §2.4.1; roof live and snow combinations where present, largest governs).'}
            </p>
          </div>
          {view.compositeNote ? <p className="rounded-[3px] border border-notice/40 bg-notice-wash px-3 py-2 text-sm text-notice">{view.compositeNote}</p> : null}
          {view.problems.length > 0 ? (
            <FormAlert>
              {view.problems.length} design problem{view.problems.length === 1 ? '' : 's'}: {view.problems[0].message}
            </FormAlert>
          ) : null}
          {mayEditMarks ? (
            <div className="flex flex-wrap items-center gap-3 text-sm">
              <Button
                variant="secondary"
                pending={renumber.isPending}
                onClick={async () => {
                  setNotice(null);
                  try {
                    const r = await renumber.mutateAsync({ keepManual });
                    setNotice(r.changed ? `Marks renumbered (revision ${r.revision}).` : 'Marks already follow the rule.');
                  } catch (err) {
                    setNotice(isApiError(err) ? err.message : 'Marks could not be renumbered.');
                  }
                }}
              >
                Renumber marks
              </Button>
              <label className="flex items-center gap-2">
                <input type="checkbox" checked={keepManual} onChange={(e) => setKeepManual(e.target.checked)} />
                Keep marks set by hand
              </label>
            </div>
          ) : null}
          {notice ? (
            <p role="status" className="text-sm text-ink">
              {notice}
            </p>
          ) : null}
          {showSheet && renderSheet ? renderSheet(schemeId, view.levels) : null}
          {rowsBy === 'mark' ? (
            <ScheduleMarkTable
              rows={view.rows}
              levels={view.levels}
              basis={view.basis}
              units={system}
              mayEditMarks={mayEditMarks}
              onSaveMarks={saveMarks}
              savingMark={editMarks.isPending}
            />
          ) : (
            <ScheduleTable
              rows={view.rows}
              levels={view.levels}
              basis={view.basis}
              units={system}
              mayEditMarks={mayEditMarks}
              onSaveMark={saveMark}
              savingMark={editMarks.isPending}
            />
          )}
          {view.columnSchedule ? <ColumnScheduleTable schedule={view.columnSchedule} method={view.basis.method} units={system} /> : null}
          <EngineerCaution />
        </>
      ) : null}
    </div>
  );
}
