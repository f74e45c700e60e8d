/**
 * The parts tray (left column): search by name, drag an entry onto the canvas, or click it and then
 * click the canvas. Gates carry an input-count choice (2–8). The team library's drawer sits at its foot.
 */
import { memo, useMemo, useState, type DragEvent } from 'react';
import { useStoreApi } from '@xyflow/react';
import type * as Y from 'yjs';
import { LibraryDrawer } from '../../library';
import { newPart, type TrayChoice } from '../lib/new-part';
import { GRID, placedShape, snap } from '../lib/geometry';
import { PartSymbol } from '../symbols';
import { TRAY_ITEMS, TRAY_MIME, searchTray, trayItemsFor, type TrayItem } from './tray-items';

interface Props {
  armed: TrayChoice | null;
  onArm(choice: TrayChoice | null): void;
  /** a module is open on the canvas: offer ports, leave out switches, buttons and clocks */
  inModule?: boolean;
  /** the board for the library drawer (its top-level document) and the module open on the canvas */
  library?: { doc: Y.Doc; boardId: number; origin: unknown; scope?: string };
}

const noLevel = () => undefined;

const Preview = memo(function Preview({ item, inputs }: { item: TrayItem; inputs: number }) {
  const part = newPart({ ...item, inputs }, 0, 0, []);
  const { baseW: w, baseH: h } = placedShape(part);
  if (part.kind === 'note') return <span className="font-mono text-[10px] text-slate-400">Aa</span>;
  return (
    <svg width={44} height={30} viewBox={`-4 -4 ${w + 8} ${h + 8}`} aria-hidden="true">
      <PartSymbol part={part} w={w} h={h} level={noLevel} shown={false} />
    </svg>
  );
});

/** The middle of the canvas's view in board coordinates, on the grid, less half a module box. */
function useViewMiddle(): () => { x: number; y: number } {
  const store = useStoreApi();
  return () => {
    const { width, height, transform: [tx, ty, zoom] } = store.getState();
    return { x: snap((width / 2 - tx) / zoom - 3 * GRID), y: snap((height / 2 - ty) / zoom - 2 * GRID) };
  };
}

export function PartsTray({ armed, onArm, inModule = false, library }: Props) {
  const viewMiddle = useViewMiddle();
  const [query, setQuery] = useState('');
  const [inputs, setInputs] = useState<Record<string, number>>({});
  const items = useMemo(() => searchTray(query, trayItemsFor(inModule)), [query, inModule]);
  const groups = useMemo(() => {
    const m = new Map<string, TrayItem[]>();
    for (const it of items) m.set(it.group, [...(m.get(it.group) ?? []), it]);
    return [...m];
  }, [items]);
  const choiceOf = (it: TrayItem): TrayChoice => ({ kind: it.kind, value: it.value, dir: it.dir, inputs: it.multiInput ? inputs[it.key] ?? 2 : undefined });
  const isArmed = (it: TrayItem) => armed?.kind === it.kind && (armed.value ?? null) === (it.value ?? null) && (armed.dir ?? null) === (it.dir ?? null);
  const onDragStart = (e: DragEvent, it: TrayItem) => {
    e.dataTransfer.setData(TRAY_MIME, JSON.stringify(choiceOf(it)));
    e.dataTransfer.effectAllowed = 'copy';
  };
  return (
    <aside className="gf-tray flex w-56 shrink-0 flex-col border-r border-mat-700 bg-mat-900" data-testid="parts-tray" aria-label="Parts tray">
      <div className="border-b border-mat-700 p-2">
        <div className="mb-1 text-[11px] font-semibold uppercase tracking-wider text-slate-400">Parts tray</div>
        <input type="search" value={query} onChange={(e) => setQuery(e.target.value)} placeholder="Search parts…"
          aria-label="Search parts" data-testid="tray-search"
          className="h-7 w-full rounded border border-mat-600 bg-mat-800 px-2 text-xs text-slate-100 placeholder:text-slate-500 focus:border-amber-glow focus:outline-none" />
      </div>
      <div className="flex-1 overflow-y-auto p-2">
        {groups.length === 0 && <p className="px-1 text-xs text-slate-500">No part matches “{query}”.</p>}
        {groups.map(([group, list]) => (
          <section key={group} className="mb-3">
            <h3 className="mb-1 px-1 text-[10px] font-semibold uppercase tracking-wider text-slate-500">{group}</h3>
            <ul className="space-y-0.5">
              {list.map((it) => (
                <li key={it.key}>
                  <div draggable onDragStart={(e) => onDragStart(e, it)} role="button" tabIndex={0} data-testid={`tray-${it.key}`}
                    aria-pressed={isArmed(it)} title="Drag onto the canvas, or click here and then on the canvas"
                    onClick={() => onArm(isArmed(it) ? null : choiceOf(it))}
                    onKeyDown={(e) => { if (e.key === 'Enter' || e.key === ' ') { e.preventDefault(); onArm(choiceOf(it)); } }}
                    className={`flex cursor-grab items-center gap-2 rounded px-1.5 py-1 text-xs hover:bg-mat-800 ${isArmed(it) ? 'bg-mat-700 ring-1 ring-amber-glow' : ''}`}>
                    <Preview item={it} inputs={inputs[it.key] ?? 2} />
                    <span className="flex-1 truncate text-slate-200">{it.title}</span>
                    {it.multiInput && (
                      <select value={inputs[it.key] ?? 2} aria-label={`${it.title} inputs`} data-testid={`tray-inputs-${it.key}`}
                        onClick={(e) => e.stopPropagation()} onMouseDown={(e) => e.stopPropagation()}
                        onChange={(e) => {
                          const n = Number(e.target.value);
                          setInputs((m) => ({ ...m, [it.key]: n }));
                          if (isArmed(it)) onArm({ ...choiceOf(it), inputs: n });
                        }}
                        className="h-5 rounded border border-mat-600 bg-mat-800 px-0.5 font-mono text-[10px] text-slate-200">
                        {[2, 3, 4, 5, 6, 7, 8].map((n) => <option key={n} value={n}>{n} in</option>)}
                      </select>
                    )}
                  </div>
                </li>
              ))}
            </ul>
          </section>
        ))}
      </div>
      {armed && <div className="border-t border-mat-700 p-2 text-[11px] text-amber-300" data-testid="tray-armed">Click the canvas to place · Esc to cancel</div>}
      {library && <LibraryDrawer doc={library.doc} boardId={library.boardId} origin={library.origin} scope={library.scope} canEdit placeAt={viewMiddle} />}
    </aside>
  );
}

export { TRAY_ITEMS };
