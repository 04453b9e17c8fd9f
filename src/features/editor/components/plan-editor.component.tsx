import { useEffect, useLayoutEffect, useRef, useState, useSyncExternalStore, type ReactNode } from 'react';
import { useStore } from 'zustand';
import type { SchemeMember, SchemeResult } from '../../../../shared/engine/index';
import type { Plan, PlanMember } from '../../../../shared/schemas/plan.schema';
import { Button } from '../../../components/ui/button.ui';
import { EngineerCaution } from '../../../components/ui/engineer-caution.ui';
import { UnitsSwitch } from '../../../lib/units-context';
import { ACTIONS, actionForKey, dispatch, keyOf, type ActionId } from '../actions/action-registry';
import { savePlan } from '../api/save-plan.api';
import { PlanCanvas, type PlanViewArgs } from '../canvas/plan-canvas.component';
import { LiveDesign } from '../design/live-design';
import { keepIssuedMarks } from '../design/issued-marks';
import { MemberList } from '../members/member-list.component';
import { createEditorStore, type EditorStore } from '../store/editor.store';
import type { StudyPreview } from '../store/editor.types';
import { PlanAutosave, type AutosaveSnapshot } from '../sync/plan-autosave';
import { createToolController } from '../tools/tool-controller';
import { ConflictBanner, MergedBanner } from './conflict-banner.component';
import { EditMenu } from './edit-menu.component';
import { LevelBar } from './level-bar.component';
import { PlanToolbar } from './plan-toolbar.component';
import { SelectionInspector } from './selection-inspector.component';
import { ToolOptionsBar } from './tool-options.component';

export interface MemberSheetSlotArgs {
  member: SchemeMember;
  planMember: PlanMember;
  plan: Plan;
  result: SchemeResult;
  canEdit: boolean;
  lockShape: (shape: string | null) => void;
  setConstraints: (c: { maxDepth_in: number | null; minDepth_in: number | null; allowedNominalDepths: number[] | null }) => void;
  /** Bracing, Lb override and deflection limits set on the member (null: follow the framing / design basis). */
  setMemberSettings: (s: { bracing: PlanMember['bracing'] | null; Lb_override_ft: number | null; deflectionLimits: PlanMember['deflectionLimits'] | null }) => void;
  /** Whether the plan on screen is the saved revision (exports are of the saved one). */
  saved: boolean;
  /** null follows the design basis; true/false forces composite or bare steel (plan file members[].composite). */
  setComposite: (composite: boolean | null) => void;
  close: () => void;
}

export interface ColumnSheetSlotArgs {
  /** The selected column's id (its design is in `result.columns`). */
  columnId: string;
  plan: Plan;
  result: SchemeResult;
  close: () => void;
}

export interface DesignBasisSlotArgs {
  designBasis: Plan['designBasis'];
  canEdit: boolean;
  submit: (next: Plan['designBasis']) => void;
}

export interface StudyPanelSlotArgs {
  plan: Plan;
  levelId: string;
  /** Ids selected on the Plan (a deck or member selects its bay). */
  selection: string[];
  /** The revision on the server and whether the plan on screen is that revision. */
  savedRevision: number;
  saved: boolean;
  canEdit: boolean;
  /** Draw a trial option (or only its bays) over the plan; null clears it. */
  setPreview: (preview: StudyPreview | null) => void;
  close: () => void;
}

export interface BuildingViewSlotArgs {
  plan: Plan;
  /** The live design of the plan (null until the first one arrives). */
  result: SchemeResult | null;
  selection: readonly string[];
  /** Selects a plan element (a member or column) on its level, as a click on the Plan would; null clears. */
  select: (piece: { elementId: string; level: string } | null) => void;
}

export type PlanEditorView = 'plan' | 'building';

export interface PlanEditorProps {
  schemeId: string;
  schemeName: string;
  plan: Plan;
  revision: number;
  canEdit: boolean;
  initialLevelId?: string | null;
  onLevelChange?: (levelId: string) => void;
  onSaved?: (revision: number, plan: Plan) => void;
  /** The Member sheet for one selected member (composed by the page). */
  renderMemberSheet?: (args: MemberSheetSlotArgs) => ReactNode;
  /** A column's sheet for one selected column (composed by the page). */
  renderColumnSheet?: (args: ColumnSheetSlotArgs) => ReactNode;
  /** The Design basis form (composed by the page). */
  renderDesignBasis?: (args: DesignBasisSlotArgs) => ReactNode;
  /** Underlay controls for the level shown (composed by the page). */
  renderUnderlayPanel?: (levelId: string) => ReactNode;
  /** Underlay images (Konva nodes) for the level shown, under the plan. */
  renderUnderlayImages?: (levelId: string, view: PlanViewArgs) => ReactNode;
  /** The trial framings panel (bay study, composed by the page). */
  renderStudyPanel?: (args: StudyPanelSlotArgs) => ReactNode;
  /** The 3D Building view (composed by the page); offers the Plan / Building switch. */
  renderBuildingView?: (args: BuildingViewSlotArgs) => ReactNode;
  initialView?: PlanEditorView;
  onViewChange?: (view: PlanEditorView) => void;
  /** Save function (tests pass their own); defaults to PUT /api/schemes/:id/plan. */
  save?: typeof savePlan;
}

function isTyping(target: EventTarget | null): boolean {
  const el = target as HTMLElement | null;
  return !!el && (el.tagName === 'INPUT' || el.tagName === 'SELECT' || el.tagName === 'TEXTAREA' || el.isContentEditable);
}

/** The Plan: level bar, tools, canvas, member list and the selected member's sheet. */
export function PlanEditor(props: PlanEditorProps) {
  const { schemeId, canEdit } = props;
  const propsRef = useRef(props);
  propsRef.current = props;
  const [store] = useState(() => createEditorStore({ plan: props.plan, levelId: props.initialLevelId ?? undefined, readOnly: !canEdit }));
  const [design] = useState(() => new LiveDesign());
  const [controller] = useState(() => createToolController(store));
  const [autosave] = useState(
    () =>
      new PlanAutosave(store, props.revision, {
        save: (revision, plan) => (propsRef.current.save ?? savePlan)(schemeId, revision, plan),
        onSaved: (revision, plan) => propsRef.current.onSaved?.(revision, plan),
        storage: typeof localStorage === 'undefined' ? null : localStorage,
        storageKey: `baywright.plan-draft.${schemeId}`,
      }),
  );
  const rootRef = useRef<HTMLDivElement>(null);
  const levelId = useStore(store, (s) => s.levelId);
  const notice = useStore(store, (s) => s.notice);
  const selection = useStore(store, (s) => s.selection);
  const plan = useStore(store, (s) => s.plan);
  const canUndo = useStore(store.temporal, (t) => t.pastStates.length > 0);
  const canRedo = useStore(store.temporal, (t) => t.futureStates.length > 0);
  const saveState = useSyncExternalStore(autosave.subscribe, autosave.getSnapshot);
  const designState = useSyncExternalStore(design.subscribe, design.getSnapshot);
  const [recovered, setRecovered] = useState(() => autosave.readLocalDraft());
  const [showBasis, setShowBasis] = useState(false);
  const [showUnderlay, setShowUnderlay] = useState(false);
  const [showStudy, setShowStudy] = useState(false);
  const closeStudy = () => (setShowStudy(false), store.setState({ studyPreview: null }));
  const [view, setView] = useState<PlanEditorView>(props.renderBuildingView ? (props.initialView ?? 'plan') : 'plan');
  const building = view === 'building' && !!props.renderBuildingView;
  const changeView = (next: PlanEditorView) => {
    setView(next);
    propsRef.current.onViewChange?.(next);
  };

  // Design after every change of the plan; publish the edit → sizes time for tests and the status line.
  useEffect(() => {
    design.onMeasured = (ms) => {
      rootRef.current?.setAttribute('data-edit-to-sizes-ms', ms.toFixed(1));
      rootRef.current?.setAttribute('data-engine-ms', (design.getSnapshot().lastEngineMs ?? 0).toFixed(1));
      rootRef.current?.setAttribute('data-design-count', String((Number(rootRef.current.getAttribute('data-design-count')) || 0) + 1));
      console.info(`[plan] edit → sizes on screen: ${ms.toFixed(1)} ms (engine ${design.getSnapshot().lastEngineMs?.toFixed(1)} ms)`);
    };
    design.request(store.getState().plan);
    let previous = store.getState().plan;
    const unsub = store.subscribe((s) => {
      if (s.plan === previous) return;
      previous = s.plan;
      design.request(s.plan);
    });
    const unsubMarks = design.subscribe(() => keepIssuedMarks(store, design.getSnapshot(), (from, to) => autosave.absorb(from, to)));
    autosave.start();
    return () => {
      unsub();
      unsubMarks();
      autosave.stop();
      design.dispose();
    };
  }, [store, design, autosave]);

  useEffect(() => {
    propsRef.current.onLevelChange?.(levelId);
  }, [levelId]);

  // Fit the level once the canvas has its size.
  useEffect(() => {
    const id = requestAnimationFrame(() => dispatch(store, 'view.fit'));
    return () => cancelAnimationFrame(id);
  }, [store, levelId]);

  const onKeyDown = (e: React.KeyboardEvent) => {
    if (isTyping(e.target)) return;
    if (e.key === ' ') {
      controller.setSpace(true);
      e.preventDefault();
      return;
    }
    if (e.key === 'Enter') {
      controller.commitDraft();
      return;
    }
    const id = actionForKey(keyOf(e));
    if (!id) return;
    const a = ACTIONS[id];
    if (a.edits && !canEdit) return;
    e.preventDefault();
    dispatch(store, id as 'tool.select');
  };

  const selectedMember = selection.length === 1 ? plan.members.find((m) => m.id === selection[0] && m.level === levelId) : undefined;
  const schemeMember = selectedMember ? designState.byId.get(selectedMember.id) : undefined;
  const levelName = plan.levels.find((l) => l.id === levelId)?.name ?? 'no level';
  const selectedColumn = selection.length === 1 && !selectedMember ? plan.columns.find((c) => c.id === selection[0] && c.levels.includes(levelId)) : undefined;
  const columnDesigned = !!selectedColumn && !!designState.result?.columns?.some((c) => c.id === selectedColumn.id);
  const side: 'basis' | 'member' | 'column' | 'list' =
    showBasis && props.renderDesignBasis
      ? 'basis'
      : selectedMember && schemeMember && designState.result && props.renderMemberSheet
        ? 'member'
        : selectedColumn && columnDesigned && props.renderColumnSheet
          ? 'column'
          : 'list';
  const fillHeight = useFillWindowHeight(rootRef);

  return (
    <div
      ref={rootRef}
      data-testid="plan-editor"
      data-read-only={!canEdit || undefined}
      className="flex flex-col border-2 border-ink bg-paper-raised"
      style={{ height: fillHeight }}
      onKeyDown={onKeyDown}
      onKeyUp={(e) => e.key === ' ' && controller.setSpace(false)}
    >
      <div className="flex flex-wrap items-center justify-between gap-3 border-b border-ink bg-paper px-3 py-2">
        <div className="flex flex-wrap items-center gap-3">
          {props.renderBuildingView ? (
            <div role="group" aria-label="View" className="inline-flex border border-ink/70">
              <Button variant={building ? 'quiet' : 'primary'} className="h-8 rounded-none px-3 text-xs" aria-pressed={!building} onClick={() => changeView('plan')}>
                Plan
              </Button>
              <Button variant={building ? 'primary' : 'quiet'} className="h-8 rounded-none px-3 text-xs" aria-pressed={building} onClick={() => changeView('building')}>
                Building (3D)
              </Button>
            </div>
          ) : null}
          <LevelBar store={store} canEdit={canEdit} />
        </div>
        <div className="flex flex-wrap items-center gap-1">
          {canEdit ? (
            <>
              <ActionButton store={store} id="edit.undo" disabled={!canUndo} />
              <ActionButton store={store} id="edit.redo" disabled={!canRedo} />
              <span className="mx-1 h-5 w-px bg-line" aria-hidden />
            </>
          ) : null}
          <ActionButton store={store} id="view.zoomOut" text="−" />
          <ActionButton store={store} id="view.zoomIn" text="+" />
          <ActionButton store={store} id="view.fit" />
          <EditMenu store={store} canEdit={canEdit} />
          <UnitsSwitch className="mx-1" />
          <ReactionsToggle store={store} />
          {props.renderUnderlayPanel ? (
            <Button variant="quiet" className="h-8 text-xs" aria-expanded={showUnderlay} onClick={() => setShowUnderlay((v) => !v)}>
              Underlay
            </Button>
          ) : null}
          {props.renderStudyPanel ? (
            <Button variant="quiet" className="h-8 text-xs" aria-expanded={showStudy} onClick={() => (showStudy ? closeStudy() : setShowStudy(true))}>
              Trial framings
            </Button>
          ) : null}
          {props.renderDesignBasis ? (
            <Button variant="quiet" className="h-8 text-xs" aria-expanded={showBasis} onClick={() => setShowBasis((v) => !v)}>
              Design basis
            </Button>
          ) : null}
        </div>
      </div>
      {saveState.conflict ? (
        <ConflictBanner
          key={`${saveState.conflict.revision}:${saveState.conflict.items.map((i) => i.key).join(',')}`}
          conflict={saveState.conflict}
          onResolve={(choices) => void autosave.resolve(choices)}
          onKeepMine={() => void autosave.keepMine()}
          onTakeTheirs={() => autosave.takeTheirs()}
        />
      ) : null}
      {saveState.merged && !saveState.conflict ? <MergedBanner merged={saveState.merged} onDismiss={() => autosave.dismissMerged()} /> : null}
      {recovered && canEdit ? (
        <div role="alert" className="flex flex-wrap items-center gap-3 border-b-2 border-notice bg-notice-wash px-4 py-2 text-sm">
          <span className="flex-1">Changes to this scheme from {new Date(recovered.keptAt).toLocaleString()} were kept on this device but not saved.</span>
          <Button variant="primary" className="h-8 text-xs" onClick={() => (store.setState({ plan: recovered.plan }), setRecovered(null))}>
            Restore them
          </Button>
          <Button variant="secondary" className="h-8 text-xs" onClick={() => (autosave.discardLocalDraft(), setRecovered(null))}>
            Discard
          </Button>
        </div>
      ) : null}
      {showStudy && props.renderStudyPanel ? (
        <div className="max-h-[45vh] shrink-0 overflow-auto border-b border-ink bg-paper px-4 py-3" data-testid="study-panel-slot">
          {props.renderStudyPanel({
            plan,
            levelId,
            selection,
            savedRevision: saveState.revision,
            saved: saveState.status === 'saved' || saveState.status === 'readonly',
            canEdit,
            setPreview: (studyPreview) => store.setState({ studyPreview }),
            close: closeStudy,
          })}
        </div>
      ) : null}
      {canEdit ? <ToolOptionsBar store={store} /> : null}
      {showUnderlay && props.renderUnderlayPanel ? <div className="border-b border-ink bg-paper px-4 py-3">{props.renderUnderlayPanel(levelId)}</div> : null}
      <div className="flex min-h-0 flex-1">
        {canEdit && !building ? <PlanToolbar store={store} /> : null}
        <div className="relative min-w-0 flex-1">
          {building ? (
            props.renderBuildingView!({
              plan,
              result: designState.result,
              selection,
              select: (piece) => {
                if (!piece) return dispatch(store, 'selection.set', { ids: [] });
                if (piece.level !== store.getState().levelId) dispatch(store, 'level.show', { levelId: piece.level });
                dispatch(store, 'selection.set', { ids: [piece.elementId] });
              },
            })
          ) : (
            <PlanCanvas
              store={store}
              design={design}
              controller={controller}
              label={`Plan of ${levelName}, ${props.schemeName}`}
              renderUnderlay={props.renderUnderlayImages ? (v) => props.renderUnderlayImages!(levelId, v) : undefined}
            />
          )}
        </div>
        {/* The side panel beside the canvas: the Design basis when open, else the selected
            member's sheet, else the member list; the plan stays in view beside each. */}
        {side === 'basis' ? (
          <aside className="flex w-[36rem] shrink-0 flex-col border-l border-ink bg-paper" aria-label="Design basis panel">
            <div className="min-h-0 flex-1 overflow-auto px-4 py-3">
              {props.renderDesignBasis!({ designBasis: plan.designBasis, canEdit, submit: (designBasis) => dispatch(store, 'plan.setDesignBasis', { designBasis }) })}
            </div>
          </aside>
        ) : side === 'member' && selectedMember && schemeMember && designState.result ? (
          <aside className="flex w-[38rem] shrink-0 flex-col border-l border-ink bg-paper" aria-label="Member sheet panel">
            <div className="min-h-0 flex-1 overflow-auto px-4 py-3" data-testid="member-sheet-slot">
              {props.renderMemberSheet!({
                member: schemeMember,
                planMember: selectedMember,
                plan,
                result: designState.result,
                canEdit,
                lockShape: (shape) => dispatch(store, 'member.setShape', { id: selectedMember.id, shape }),
                setConstraints: (c) => dispatch(store, 'member.setConstraints', { id: selectedMember.id, ...c }),
                setMemberSettings: (c) => dispatch(store, 'member.setBracing', { id: selectedMember.id, ...c }),
                saved: saveState.status === 'saved' || saveState.status === 'readonly',
                setComposite: (composite) => dispatch(store, 'member.setComposite', { id: selectedMember.id, composite }),
                close: () => dispatch(store, 'selection.set', { ids: [] }),
              })}
            </div>
          </aside>
        ) : side === 'column' && selectedColumn && designState.result ? (
          <aside className="flex w-[38rem] shrink-0 flex-col border-l border-ink bg-paper" aria-label="Column sheet panel">
            <div className="min-h-0 flex-1 overflow-auto px-4 py-3" data-testid="column-sheet-slot">
              {props.renderColumnSheet!({
                columnId: selectedColumn.id,
                plan,
                result: designState.result,
                close: () => dispatch(store, 'selection.set', { ids: [] }),
              })}
            </div>
          </aside>
        ) : (
          <aside className="flex w-[26rem] shrink-0 flex-col border-l border-ink bg-paper-raised" aria-label="Members and selection">
            <MemberList store={store} design={design} />
            <SelectionInspector store={store} canEdit={canEdit} />
          </aside>
        )}
      </div>
      <div className="flex flex-wrap items-center justify-between gap-3 border-t border-ink bg-paper px-3 py-1.5 text-xs">
        <p role="status" aria-live="polite" className={notice?.tone === 'error' ? 'text-danger' : 'text-ink-soft'} data-testid="plan-notice">
          {notice?.text ?? (canEdit ? '' : 'Read only: your role can view this plan but not change it.')}
        </p>
        <div className="flex items-center gap-4 text-ink-soft">
          <span data-testid="design-status">
            {designState.pending ? 'Designing…' : designState.error ? `Design stopped: ${designState.error}` : designState.result ? `${designState.result.members.length} members sized` : ''}
            {designState.lastEditToSizesMs !== null ? <span className="figures font-mono"> · {designState.lastEditToSizesMs.toFixed(0)} ms</span> : null}
          </span>
          <SaveStatus state={saveState} />
        </div>
      </div>
      {saveState.status === 'invalid' ? (
        <div role="alert" className="border-t border-danger bg-danger-wash px-3 py-2 text-xs text-danger">
          {saveState.message} {saveState.problems.slice(0, 5).join(' ')}
        </div>
      ) : null}
      <EngineerCaution className="border-t border-line px-3 py-2" />
    </div>
  );
}

/**
 * The editor fills the window below where it starts (so the canvas, its status line and the
 * side panel are all in view), never shorter than MIN_EDITOR_PX.
 */
const MIN_EDITOR_PX = 520;
function useFillWindowHeight(ref: React.RefObject<HTMLDivElement | null>): number {
  const [height, setHeight] = useState(MIN_EDITOR_PX);
  useLayoutEffect(() => {
    const measure = () => {
      const el = ref.current;
      if (!el || typeof window === 'undefined') return;
      const top = el.getBoundingClientRect().top + window.scrollY;
      setHeight(Math.max(MIN_EDITOR_PX, Math.floor(window.innerHeight - top - 4)));
    };
    measure();
    window.addEventListener('resize', measure);
    return () => window.removeEventListener('resize', measure);
  }, [ref]);
  return height;
}

/** Shows or hides end reactions on the Plan (a view choice, for every role). */
function ReactionsToggle({ store }: { store: EditorStore }) {
  const on = useStore(store, (s) => !!s.showReactions);
  return (
    <Button variant={on ? 'primary' : 'quiet'} className="h-8 text-xs" aria-pressed={on} title="Show end reactions at each member end" onClick={() => store.setState({ showReactions: !on })}>
      Reactions
    </Button>
  );
}

function ActionButton({ store, id, disabled, text }: { store: EditorStore; id: ActionId; disabled?: boolean; text?: string }) {
  const a = ACTIONS[id];
  return (
    <Button variant="quiet" className="h-8 px-2.5 text-xs" disabled={disabled} title={`${a.label} (${a.shortcut})`} aria-label={a.label} aria-keyshortcuts={a.shortcut} onClick={() => dispatch(store, id as 'view.fit')}>
      {text ?? a.label}
    </Button>
  );
}

function SaveStatus({ state }: { state: AutosaveSnapshot }) {
  const text: Record<AutosaveSnapshot['status'], string> = {
    saved: `Saved · revision ${state.revision}`,
    pending: 'Unsaved changes · saving shortly',
    saving: 'Saving…',
    conflict: 'Not saved: someone else saved first',
    invalid: 'Not saved: the server refused the plan',
    offline: `Not saved: ${state.message ?? 'server unreachable'} Retrying.`,
    readonly: 'Read only',
  };
  return (
    <span data-testid="save-status" data-status={state.status} className={state.status === 'conflict' || state.status === 'invalid' || state.status === 'offline' ? 'text-danger' : ''}>
      {text[state.status]}
    </span>
  );
}
