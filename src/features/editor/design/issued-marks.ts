/**
 * Marks once issued stay put: after each live design, the marks it gave are stored on the
 * plan's members (not locked), so the next design keeps them and a new member never renames
 * another. Storing them is not an edit: no undo step, and no save of its own.
 */
import { withIssuedMarks } from '../../../../shared/engine/scheme/member-marks.scheme';
import type { Plan } from '../../../../shared/schemas/plan.schema';
import type { EditorStore } from '../store/editor.store';
import type { LiveDesignSnapshot } from './live-design';

/** Stores the issued marks of `snapshot` when it is the design of the plan being edited. */
export function keepIssuedMarks(store: EditorStore, snapshot: LiveDesignSnapshot, absorb: (from: Plan, to: Plan) => void): boolean {
  const state = store.getState();
  if (state.readOnly || snapshot.pending || !snapshot.result || snapshot.plan !== state.plan) return false;
  const temporal = store.temporal.getState();
  // During a drag the plan is mid-gesture; the design after the drop stores them.
  if (!temporal.isTracking) return false;
  const next = withIssuedMarks(state.plan, new Map(snapshot.result.members.map((m) => [m.id, m.mark])));
  if (next === state.plan) return false;
  absorb(state.plan, next);
  temporal.pause();
  store.setState({ plan: next });
  temporal.resume();
  return true;
}
