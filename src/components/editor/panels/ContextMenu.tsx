/** The long-press (or right-click) menu: big rows for a finger, closed by a tap anywhere else or Escape. */
import { useEffect, useRef } from 'react';

export interface MenuItem { label: string; onSelect: () => void; disabled?: boolean }

export function ContextMenu({ x, y, title, items, onClose }: { x: number; y: number; title?: string; items: MenuItem[]; onClose: () => void }) {
  const ref = useRef<HTMLDivElement>(null);
  useEffect(() => {
    ref.current?.querySelector('button')?.focus();
    const down = (e: PointerEvent) => {
      if (!ref.current?.contains(e.target as Node)) onClose();
    };
    const key = (e: KeyboardEvent) => e.key === 'Escape' && onClose();
    window.addEventListener('pointerdown', down, true);
    window.addEventListener('keydown', key);
    return () => {
      window.removeEventListener('pointerdown', down, true);
      window.removeEventListener('keydown', key);
    };
  }, [onClose]);
  const left = Math.min(x, window.innerWidth - 240);
  const top = Math.min(y, window.innerHeight - (items.length * 48 + 48));
  return (
    <div ref={ref} role="menu" aria-label={title ?? 'Actions'} className="fixed z-40 w-56 rounded-lg border border-line bg-white py-1 shadow-lg" style={{ left, top }} data-testid="context-menu">
      {title && <p className="px-4 py-1 text-sm font-semibold text-note">{title}</p>}
      {items.map((item) => (
        <button key={item.label} type="button" role="menuitem" disabled={item.disabled}
          className="flex min-h-touch w-full items-center px-4 text-left font-semibold hover:bg-paper disabled:text-line"
          onClick={() => { item.onSelect(); onClose(); }}>
          {item.label}
        </button>
      ))}
    </div>
  );
}
