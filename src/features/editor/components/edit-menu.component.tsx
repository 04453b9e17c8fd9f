import { useEffect, useId, useRef, useState } from 'react';
import { ACTIONS, dispatch, type ActionId } from '../actions/action-registry';
import type { EditorStore } from '../store/editor.store';

const MENU: readonly ActionId[] = [
  'edit.undo', 'edit.redo', 'edit.deleteSelection', 'edit.selectAll', 'edit.cancel', 'column.allIntersections', 'view.fit', 'view.zoomIn', 'view.zoomOut',
];

/** The Plan menu: the same named actions as the toolbar and the keys, listed with their shortcuts. */
export function EditMenu({ store, canEdit }: { store: EditorStore; canEdit: boolean }) {
  const [open, setOpen] = useState(false);
  const id = useId();
  const ref = useRef<HTMLDivElement>(null);
  useEffect(() => {
    if (!open) return;
    const close = (e: MouseEvent) => !ref.current?.contains(e.target as Node) && setOpen(false);
    document.addEventListener('mousedown', close);
    return () => document.removeEventListener('mousedown', close);
  }, [open]);
  const items = MENU.filter((a) => canEdit || !ACTIONS[a].edits);
  return (
    <div ref={ref} className="relative" onKeyDown={(e) => e.key === 'Escape' && (setOpen(false), e.stopPropagation())}>
      <button
        type="button"
        aria-haspopup="menu"
        aria-expanded={open}
        aria-controls={id}
        className="h-8 rounded-[3px] px-2.5 text-xs text-ink-soft hover:bg-paper-sunk hover:text-ink"
        onClick={() => setOpen((v) => !v)}
      >
        Plan menu ▾
      </button>
      {open ? (
        <div id={id} role="menu" aria-label="Plan menu" className="absolute right-0 z-20 mt-1 flex w-64 flex-col border border-ink bg-paper-raised py-1 shadow-lg">
          {items.map((a) => (
            <button
              key={a}
              type="button"
              role="menuitem"
              className="flex items-center justify-between px-3 py-1.5 text-left text-xs text-ink hover:bg-accent-wash"
              onClick={() => {
                setOpen(false);
                dispatch(store, a as 'view.fit');
              }}
            >
              <span>{ACTIONS[a].label}</span>
              {ACTIONS[a].shortcut ? <kbd className="font-mono text-[10px] text-ink-faint">{ACTIONS[a].shortcut}</kbd> : null}
            </button>
          ))}
        </div>
      ) : null}
    </div>
  );
}
