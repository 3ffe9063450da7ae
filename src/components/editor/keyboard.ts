/**
 * Editing shortcuts, as one pure mapping from a key event to a store verb so it can be tested:
 * undo/redo, delete, copy/paste/duplicate, select all, nudge, and moving between elements.
 */
export type Command =
  | 'undo' | 'redo' | 'delete' | 'copy' | 'paste' | 'duplicate' | 'select-all' | 'escape' | 'fit'
  | 'next' | 'previous' | 'left' | 'right' | 'up' | 'down'
  | 'nudge-left' | 'nudge-right' | 'nudge-up' | 'nudge-down';

export interface KeyLike { key: string; ctrlKey?: boolean; metaKey?: boolean; shiftKey?: boolean; altKey?: boolean }

export function commandFor(e: KeyLike): Command | null {
  const mod = e.ctrlKey || e.metaKey;
  const k = e.key.length === 1 ? e.key.toLowerCase() : e.key;
  if (mod && k === 'z') return e.shiftKey ? 'redo' : 'undo';
  if (mod && k === 'y') return 'redo';
  if (mod && k === 'c') return 'copy';
  if (mod && k === 'v') return 'paste';
  if (mod && k === 'd') return 'duplicate';
  if (mod && k === 'a') return 'select-all';
  if (mod) return null;
  if (k === 'Delete' || k === 'Backspace') return 'delete';
  if (k === 'Escape') return 'escape';
  if (k === 'Tab') return e.shiftKey ? 'previous' : 'next';
  if (k === 'f' && e.shiftKey) return 'fit';
  const dir = ({ ArrowLeft: 'left', ArrowRight: 'right', ArrowUp: 'up', ArrowDown: 'down' } as const)[k as 'ArrowLeft'];
  if (dir) return e.shiftKey ? (`nudge-${dir}` as Command) : dir;
  return null;
}

/** Keys typed into a form field are the field's, not the canvas's. */
export function isTypingTarget(target: EventTarget | null): boolean {
  const el = target as HTMLElement | null;
  if (!el || !el.tagName) return false;
  return el.tagName === 'INPUT' || el.tagName === 'TEXTAREA' || el.tagName === 'SELECT' || el.isContentEditable;
}
