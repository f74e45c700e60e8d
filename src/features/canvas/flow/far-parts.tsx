/**
 * The parts while zoomed out: one SVG inside the viewport with a plain box per part (no symbol, pins or
 * label — a few pixels high at that zoom), drawn by us instead of a React Flow node each. A node costs a
 * wrapper element, a drag handler and store subscriptions that run on every pan frame; on a 1,000-part
 * board mounting them was most of opening and running them most of a pan frame. React Flow keeps the
 * parts as hidden nodes (selection, the node list), so switching to full detail on zooming in is only a
 * render of what is then in view.
 *
 * Hit testing is the browser's: each box is its own element carrying the part's id. A press on a box
 * selects it (Ctrl/⌘ adds or removes it), dragging moves the selection (positions snap to the grid and
 * go to the document once, on release, as a React Flow drag does), a double-click on an instance opens
 * its module. The boxes are `nopan`, so a press on one does not pan the view; the wheel still zooms.
 *
 * A module instance's title (another part's label) is written in its box when the box is big enough on
 * screen for text of at least FAR_TITLE_MIN_PX (zoom-detail.ts farTitle): one SVG text, no measuring. The
 * drawing reads the zoom rounded to hundredths (one subscription), so a pan frame renders nothing and a zoom
 * step re-renders only the boxes whose title appears or goes.
 */
import { memo, useCallback, useMemo, useRef, type MouseEvent, type PointerEvent } from 'react';
import { useStore, useStoreApi, ViewportPortal, type ReactFlowState } from '@xyflow/react';
import { useModulesView } from '../modules/modules-context';
import type { PartNode } from './types';
import { farTitle } from './zoom-detail';

type Title = ReturnType<typeof farTitle>;
const roundedZoom = (s: ReactFlowState) => Math.round(s.transform[2] * 100) / 100;
const boxSize = (n: PartNode) => ({ w: n.width ?? n.measured?.width ?? 0, h: n.height ?? n.measured?.height ?? 0 });

export interface FarPartsProps {
  nodes: readonly PartNode[];
  /** editors may drag parts; anybody may select them */
  draggable: boolean;
  /** select `id` only, or with `additive` add it to (or remove it from) the selection */
  onPick(id: string, additive: boolean): void;
  /** the dragged parts' positions while dragging (`done` on release, snapped by the caller) */
  onDrag(moves: { id: string; x: number; y: number }[], done: boolean): void;
  onOpenModule(moduleId: string): void;
}

interface Drag { x0: number; y0: number; zoom: number; start: { id: string; x: number; y: number }[]; moved: boolean }

/** Below this many screen pixels a press is a click, not a drag. */
const CLICK_SLOP = 3;

function FarPartsView({ nodes, draggable, onPick, onDrag, onOpenModule }: FarPartsProps) {
  const store = useStoreApi();
  const drag = useRef<Drag | null>(null);
  const nodesRef = useRef(nodes);
  nodesRef.current = nodes;
  const zoom = useStore(roundedZoom);
  // each node object's title, worked out once (a new table when a module is renamed)
  const { titles: moduleTitles } = useModulesView();
  const titles = useMemo(() => new WeakMap<PartNode, Title>(), [moduleTitles]);
  const titleOf = (n: PartNode): Title => {
    if (titles.has(n)) return titles.get(n)!;
    const part = n.data.part;
    const text = part.kind === 'module' ? (moduleTitles.get(part.module) ?? part.module) : part.label ?? '';
    const { w, h } = boxSize(n);
    const t = part.kind === 'note' ? null : farTitle(text, w, h);
    titles.set(n, t);
    return t;
  };

  const idOf = (e: { target: EventTarget }) => (e.target as Element).closest?.('[data-far-id]')?.getAttribute('data-far-id') ?? null;

  const onPointerDown = useCallback((e: PointerEvent<SVGSVGElement>) => {
    const id = idOf(e);
    if (!id || e.button !== 0) return;
    e.stopPropagation();
    const all = nodesRef.current;
    const node = all.find((n) => n.id === id);
    if (!node) return;
    const additive = e.ctrlKey || e.metaKey;
    // pressing a part that is not selected selects it (alone, unless Ctrl/⌘); a selected one drags the selection
    if (additive || !node.selected) onPick(id, additive);
    if (!draggable || (additive && node.selected)) return;
    const moving = node.selected && !additive ? all.filter((n) => n.selected) : [node];
    drag.current = { x0: e.clientX, y0: e.clientY, zoom: store.getState().transform[2] || 1, moved: false,
      start: moving.map((n) => ({ id: n.id, x: n.position.x, y: n.position.y })) };
    (e.currentTarget as Element).setPointerCapture?.(e.pointerId);
  }, [draggable, onPick, store]);

  const onPointerMove = useCallback((e: PointerEvent<SVGSVGElement>) => {
    const d = drag.current;
    if (!d) return;
    const dx = e.clientX - d.x0;
    const dy = e.clientY - d.y0;
    if (!d.moved && Math.hypot(dx, dy) < CLICK_SLOP) return;
    d.moved = true;
    onDrag(d.start.map((s) => ({ id: s.id, x: s.x + dx / d.zoom, y: s.y + dy / d.zoom })), false);
  }, [onDrag]);

  const onPointerUp = useCallback((e: PointerEvent<SVGSVGElement>) => {
    const d = drag.current;
    drag.current = null;
    if (!d?.moved) return;
    const dx = e.clientX - d.x0;
    const dy = e.clientY - d.y0;
    onDrag(d.start.map((s) => ({ id: s.id, x: s.x + dx / d.zoom, y: s.y + dy / d.zoom })), true);
  }, [onDrag]);

  const onDoubleClick = useCallback((e: MouseEvent<SVGSVGElement>) => {
    const id = idOf(e);
    const part = id ? nodesRef.current.find((n) => n.id === id)?.data.part : undefined;
    if (part?.kind === 'module') { e.stopPropagation(); onOpenModule(part.module); }
  }, [onOpenModule]);

  return (
    <ViewportPortal>
      <svg className="gf-far-parts" data-testid="far-parts" onPointerDown={onPointerDown} onPointerMove={onPointerMove}
        onPointerUp={onPointerUp} onPointerCancel={onPointerUp} onDoubleClick={onDoubleClick} onClick={(e) => { if (idOf(e)) e.stopPropagation(); }}>
        {nodes.map((n) => {
          const t = titleOf(n);
          return <FarPart key={n.id} node={n} title={t && zoom >= t.minZoom ? t : null} />;
        })}
      </svg>
    </ViewportPortal>
  );
}

/** One part's box; same object, no new render (derive-flow keeps unchanged nodes). */
const FarPart = memo(function FarPart({ node, title }: { node: PartNode; title: Title }) {
  const { part, highlight, remoteColor, mark, badge } = node.data;
  const { w, h } = boxSize(node);
  const round = part.kind === 'lamp' || part.kind === 'probe';
  const classes = ['gf-far-part', 'nopan'];
  if (node.selected) classes.push('gf-selected');
  if (highlight) classes.push('gf-highlight');
  if (mark) classes.push(`gf-mark-${mark}`);
  return (
    <g className={classes.join(' ')} data-far-id={node.id} data-testid={`part-${part.id}`} data-kind={part.kind}
      transform={`translate(${node.position.x} ${node.position.y})`}>
      <rect width={w} height={h} rx={round ? Math.min(w, h) / 2 : 4} style={remoteColor ? { stroke: remoteColor } : undefined} />
      {title && (
        <text className="gf-far-title" x={w / 2} y={h / 2} fontSize={title.size} textAnchor="middle" dominantBaseline="central"
          fill="#c9d1db" fontFamily="'JetBrains Mono', monospace" pointerEvents="none">{title.text}</text>
      )}
      {badge && <circle className={`gf-far-badge gf-badge-${badge.tone}`} cx={w} cy={0} r={8}><title>{badge.text}</title></circle>}
    </g>
  );
});

export const FarParts = memo(FarPartsView);
