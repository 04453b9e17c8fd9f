/**
 * The one store of the Plan editor: the plan being edited, the level shown, the selection,
 * the active tool and its draft, the view. Undo/redo (zundo) tracks the plan only; a drag
 * pauses tracking so it lands as one step.
 */
import { temporal } from 'zundo';
import { createStore } from 'zustand/vanilla';
import type { Plan } from '../../../../shared/schemas/plan.schema';
import type { EditorState, ToolOptions } from './editor.types';

export type EditorStoreState = EditorState;

export const DEFAULT_OPTIONS: ToolOptions = {
  gridAxis: 'x',
  infillDirection: 'auto',
  infillMode: 'spacing',
  infillSpacing_ft: 10,
  infillCount: 2,
  deckMode: 'bay',
  deckSpan: 'auto',
  zoneId: '',
  pointLoad: { D_kip: 5, L_kip: 5 },
  lineLoad: { D_klf: 0.4, L_klf: 0 },
};

export function createEditorStore(init: { plan: Plan; levelId?: string; readOnly?: boolean }) {
  const levelId = init.levelId && init.plan.levels.some((l) => l.id === init.levelId) ? init.levelId : (init.plan.levels[0]?.id ?? '');
  return createStore<EditorStoreState>()(
    temporal<EditorStoreState, [], [], { plan: Plan }>(
      (): EditorStoreState => ({
        plan: init.plan,
        levelId,
        selection: [],
        tool: 'select',
        view: { scale: 8, x: 64, y: 500, width: 800, height: 560 },
        draft: { kind: 'none' },
        hover: null,
        options: { ...DEFAULT_OPTIONS, zoneId: init.plan.zones[0]?.id ?? '' },
        readOnly: init.readOnly ?? false,
        notice: null,
      }),
      {
        partialize: (state) => ({ plan: state.plan }),
        equality: (a, b) => a.plan === b.plan,
        limit: 200,
      },
    ),
  );
}

export type EditorStore = ReturnType<typeof createEditorStore>;

/** Run a continuous gesture (a drag) so the whole of it is one undo step. */
export function beginGesture(store: EditorStore): () => void {
  const before = store.getState().plan;
  store.temporal.getState().pause();
  return function endGesture() {
    const after = store.getState().plan;
    // Put the pre-drag plan back untracked, then record the drop as one change.
    store.setState({ plan: before });
    store.temporal.getState().resume();
    if (after !== before) store.setState({ plan: after });
  };
}
