// Keyboard shortcuts on a wide screen. Every one has a button too (nothing is keyboard-only). Ignored while a
// field has the focus, so typing a value never deletes the selection.
export interface ShortcutHandlers {
  undo(): void;
  redo(): void;
  deleteSelection(): void;
  duplicate(): void;
  rotate(): void;
  escape(): void;
  selectTool(): void;
  cutTool(): void;
  nudge(dx: number, dy: number): void;
  fit(): void;
}

function typing(target: EventTarget | null): boolean {
  const el = target as HTMLElement | null;
  if (!el || !el.tagName) return false;
  return el.isContentEditable || ['INPUT', 'TEXTAREA', 'SELECT'].includes(el.tagName);
}

export function attachShortcuts(target: Window, h: ShortcutHandlers, editable: () => boolean): () => void {
  const onKey = (e: KeyboardEvent) => {
    if (typing(e.target)) return;
    const mod = e.ctrlKey || e.metaKey;
    const key = e.key.toLowerCase();
    let handled = true;
    if (mod && key === 'z' && !e.shiftKey) h.undo();
    else if ((mod && key === 'z' && e.shiftKey) || (mod && key === 'y')) h.redo();
    else if (mod && key === 'd') h.duplicate();
    else if (mod) handled = false;
    else if ((key === 'delete' || key === 'backspace') && editable()) h.deleteSelection();
    else if (key === 'r' && editable()) h.rotate();
    else if (key === 'escape') h.escape();
    else if (key === 'v') h.selectTool();
    else if (key === 'x') h.cutTool();
    else if (key === 'f') h.fit();
    else if (key.startsWith('arrow') && editable()) {
      const step = e.shiftKey ? 100 : 20;
      h.nudge(key === 'arrowleft' ? -step : key === 'arrowright' ? step : 0, key === 'arrowup' ? -step : key === 'arrowdown' ? step : 0);
    } else handled = false;
    if (handled) e.preventDefault();
  };
  target.addEventListener('keydown', onKey);
  return () => target.removeEventListener('keydown', onKey);
}
