import { useStore } from 'zustand';
import { ACTIONS, TOOL_ACTIONS, dispatch, type ActionId } from '../actions/action-registry';
import type { EditorStore } from '../store/editor.store';

/** The tools, each dispatching its named action (the same one its shortcut runs). */
export function PlanToolbar({ store }: { store: EditorStore }) {
  const tool = useStore(store, (s) => s.tool);
  return (
    <div role="toolbar" aria-label="Plan tools" aria-orientation="vertical" className="flex flex-col gap-0.5 border-r border-ink bg-paper p-1">
      {TOOL_ACTIONS.map((id) => {
        const a = ACTIONS[id];
        const active = `tool.${tool}` === id;
        return (
          <button
            key={id}
            type="button"
            aria-pressed={active}
            title={`${a.label} (${a.shortcut})`}
            aria-keyshortcuts={a.shortcut}
            onClick={() => dispatch(store, id as ActionId & `tool.${string}`)}
            className={`flex h-8 w-28 items-center justify-between rounded-[3px] px-2 text-left text-xs ${
              active ? 'bg-accent text-white' : 'text-ink hover:bg-paper-sunk'
            }`}
          >
            <span>{a.label}</span>
            <kbd className={`font-mono text-[10px] ${active ? 'text-white/80' : 'text-ink-faint'}`}>{a.shortcut}</kbd>
          </button>
        );
      })}
    </div>
  );
}
