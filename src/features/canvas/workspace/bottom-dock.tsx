/** A bottom dock for the timing strip: drag its top edge to resize, or collapse it. */
import { useRef, useState, type PointerEvent, type ReactNode } from 'react';

const MIN = 80;
const MAX = 600;

export function BottomDock({ children }: { children: ReactNode }) {
  const [height, setHeight] = useState(200);
  const [open, setOpen] = useState(true);
  const drag = useRef<{ y: number; h: number } | null>(null);
  const down = (e: PointerEvent<HTMLDivElement>) => {
    drag.current = { y: e.clientY, h: height };
    e.currentTarget.setPointerCapture(e.pointerId);
  };
  const move = (e: PointerEvent) => {
    if (!drag.current) return;
    setHeight(Math.min(MAX, Math.max(MIN, drag.current.h + drag.current.y - e.clientY)));
  };
  const up = () => { drag.current = null; };
  return (
    <section className="shrink-0 border-t border-mat-700 bg-mat-900" data-testid="bottom-dock">
      <div className="flex h-6 items-center gap-2 px-2">
        {open && (
          <div role="separator" aria-orientation="horizontal" aria-label="Resize the dock" title="Drag to resize"
            className="h-1.5 w-16 cursor-row-resize rounded bg-mat-600 hover:bg-mat-500" onPointerDown={down} onPointerMove={move} onPointerUp={up} />
        )}
        <button type="button" className="ml-auto text-[11px] text-slate-400 hover:text-slate-100" onClick={() => setOpen((o) => !o)} aria-expanded={open}>
          {open ? 'Collapse ▾' : 'Expand ▴'}
        </button>
      </div>
      {open && <div style={{ height }} className="overflow-auto">{children}</div>}
    </section>
  );
}
