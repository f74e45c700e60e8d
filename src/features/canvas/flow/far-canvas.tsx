/**
 * The board while zoomed out: the parts as plain boxes and the wires, all painted on ONE <canvas> inside
 * the viewport (far-paint.ts), instead of a React Flow node and edge each or an SVG element per part and
 * wire. The canvas moves with the viewport's transform: a pan repaints nothing (the viewport is one
 * composited layer while it moves), and the canvas is painted again only when the parts, wires, levels or
 * selection change, the zoom changes, or — on a board too large to hold whole at this zoom — the view
 * leaves the rectangle painted around it (far-scene.ts farRegion).
 *
 * React Flow keeps the parts as hidden nodes (the selection, the node list): switching to full detail on
 * zooming in is only a render of what is then in view.
 *
 * Pointer: presses are looked at on React Flow's root before React Flow sees them (capture). A press on a
 * part (hit-tested against the boxes, with a few pixels of slop) selects it (Ctrl/⌘ adds or removes it);
 * dragging moves the selection (positions snap and go to the document once, on release, as a React Flow
 * drag does); a double-click on an instance opens its module. A press beside the parts, or any press
 * with Shift, goes on to React Flow: a pan, or the selection rectangle (far-select.ts picks the boxes).
 *
 * Accessibility: the canvas is an image whose label says what it shows; the selection is read out by a
 * polite live region; the parts' list and their details are one zoom step away (full symbols, keyboard
 * commands and the inspector work on the same selection).
 */
import { memo, useCallback, useEffect, useLayoutEffect, useMemo, useRef } from 'react';
import { useStoreApi, ViewportPortal, type ReactFlowState } from '@xyflow/react';
import { displayNames, type BoardFile } from '../../../../shared/board';
import { useModulesView } from '../modules/modules-context';
import type { PartNode, WireEdge } from './types';
import { coversView, farRegion, hitPart, packBoxes, sceneBounds, selectionSummary, viewRect, type Rect } from './far-scene';
import { paintFar, type Title, type WireCache } from './far-paint';
import { farTitle } from './zoom-detail';

export interface FarCanvasProps {
  nodes: readonly PartNode[];
  edges: readonly WireEdge[];
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
/** A press this close (screen px) to a box picks it: zoomed out a lamp is a few pixels across. */
const HIT_SLOP = 4;

/** Painted region (flow units), the zoom and device scale it was painted at. */
interface Painted { region: Rect | null; zoom: number; scale: number }

function FarCanvasView({ nodes, edges, draggable, onPick, onDrag, onOpenModule }: FarCanvasProps) {
  const store = useStoreApi();
  const canvasRef = useRef<HTMLCanvasElement>(null);
  const live = useRef({ nodes, edges, draggable, onPick, onDrag, onOpenModule });
  live.current = { nodes, edges, draggable, onPick, onDrag, onOpenModule };
  const boxes = useMemo(() => packBoxes(nodes), [nodes]);
  const byId = useMemo(() => new Map(nodes.map((n) => [n.id, n])), [nodes]);
  const scene = useRef({ boxes, byId });
  scene.current = { boxes, byId };
  const wireCache = useRef<WireCache>(new Map());
  const painted = useRef<Painted>({ region: null, zoom: 0, scale: 0 });

  // each node object's title, worked out once (a new table when a module is renamed)
  const { titles: moduleTitles } = useModulesView();
  const titles = useMemo(() => new WeakMap<PartNode, Title>(), [moduleTitles]);
  const titleOf = useCallback((n: PartNode): Title => {
    if (titles.has(n)) return titles.get(n)!;
    const part = n.data.part;
    const text = part.kind === 'module' ? (moduleTitles.get(part.module) ?? part.module) : part.label ?? '';
    const t = part.kind === 'note' ? null : farTitle(text, n.width ?? 0, n.height ?? 0);
    titles.set(n, t);
    return t;
  }, [titles, moduleTitles]);

  /** Paints the canvas for the view as the store has it now. */
  const paint = useCallback((s: ReactFlowState = store.getState()) => {
    const canvas = canvasRef.current;
    const ctx = canvas?.getContext('2d');
    if (!canvas || !ctx) return;
    const [tx, ty, zoom] = s.transform;
    const dpr = window.devicePixelRatio || 1;
    const scale = zoom * dpr;
    const bounds = sceneBounds(scene.current.boxes, 16 + 8 / zoom);
    const region = bounds && s.width && s.height ? farRegion(bounds, viewRect(tx, ty, zoom, s.width, s.height), scale) : null;
    painted.current = { region, zoom, scale };
    if (!region) { canvas.width = 0; canvas.height = 0; canvas.dataset.parts = '0'; return; }
    const w = Math.max(1, Math.ceil(region.width * scale));
    const h = Math.max(1, Math.ceil(region.height * scale));
    if (canvas.width !== w) canvas.width = w;
    if (canvas.height !== h) canvas.height = h;
    // CSS size in flow units, exactly the bitmap at this zoom: the viewport's scale maps one to one
    canvas.style.left = `${region.x}px`;
    canvas.style.top = `${region.y}px`;
    canvas.style.width = `${w / scale}px`;
    canvas.style.height = `${h / scale}px`;
    const { nodes: ns, edges: es } = live.current;
    const stats = paintFar(ctx, ns, scene.current.byId, es, region, zoom, scale, titleOf, wireCache.current);
    canvas.dataset.parts = String(stats.parts);
    canvas.dataset.wires = String(stats.wires);
    canvas.dataset.titles = String(stats.titles);
    canvas.dataset.region = `${region.x} ${region.y} ${region.width} ${region.height}`;
  }, [store, titleOf]);

  // the document, levels or selection changed: paint before the browser shows the frame
  useLayoutEffect(() => { paint(); }, [paint, nodes, edges]);

  // the view changed: paint again when the zoom changed or the view left the painted rectangle (one frame later, once)
  useEffect(() => {
    let frame = 0;
    const unsubscribe = store.subscribe((s, prev) => {
      if (s.transform === prev.transform && s.width === prev.width && s.height === prev.height) return;
      const p = painted.current;
      const [tx, ty, zoom] = s.transform;
      const bounds = sceneBounds(scene.current.boxes, 16 + 8 / zoom);
      const stale = zoom * (window.devicePixelRatio || 1) !== p.scale || (bounds && !coversView(p.region, bounds, viewRect(tx, ty, zoom, s.width, s.height)));
      if (stale && !frame) frame = requestAnimationFrame(() => { frame = 0; paint(); });
    });
    // the title font may arrive after the first paint
    if (document.fonts && document.fonts.status !== 'loaded') void document.fonts.ready.then(() => paint());
    return () => { unsubscribe(); cancelAnimationFrame(frame); };
  }, [store, paint]);

  // pointer handling on React Flow's root, ahead of its pan and selection (see the header)
  useEffect(() => {
    const root = store.getState().domNode;
    if (!root) return undefined;
    let drag: Drag | null = null;
    let swallowClick = false;
    const at = (e: MouseEvent): number => {
      const target = e.target as Element | null;
      if (!target?.closest?.('.react-flow__pane')) return -1;
      const { transform: [tx, ty, zoom] } = store.getState();
      const r = root.getBoundingClientRect();
      return hitPart(scene.current.boxes, (e.clientX - r.left - tx) / zoom, (e.clientY - r.top - ty) / zoom, HIT_SLOP / zoom);
    };
    const nodeAt = (e: MouseEvent) => { const i = e.shiftKey || e.button !== 0 ? -1 : at(e); return i < 0 ? undefined : live.current.nodes[i]; };

    const move = (e: PointerEvent) => {
      const d = drag;
      if (!d) return;
      const dx = e.clientX - d.x0;
      const dy = e.clientY - d.y0;
      if (!d.moved && Math.hypot(dx, dy) < CLICK_SLOP) return;
      d.moved = true;
      live.current.onDrag(d.start.map((s) => ({ id: s.id, x: s.x + dx / d.zoom, y: s.y + dy / d.zoom })), false);
    };
    const up = (e: PointerEvent) => {
      const d = drag;
      drag = null;
      window.removeEventListener('pointermove', move);
      window.removeEventListener('pointerup', up);
      window.removeEventListener('pointercancel', up);
      if (!d?.moved) return;
      swallowClick = true; // the click after a drag is not a click on the pane
      const dx = e.clientX - d.x0;
      const dy = e.clientY - d.y0;
      live.current.onDrag(d.start.map((s) => ({ id: s.id, x: s.x + dx / d.zoom, y: s.y + dy / d.zoom })), true);
    };
    const down = (e: PointerEvent) => {
      swallowClick = false;
      const node = nodeAt(e);
      if (!node) return;
      // the press is ours: no pan, no React Flow selection, no mouse events after it
      e.stopPropagation();
      e.preventDefault();
      const { nodes: all, draggable: canDrag, onPick: pick } = live.current;
      const additive = e.ctrlKey || e.metaKey;
      // pressing a part that is not selected selects it (alone, unless Ctrl/⌘); a selected one drags the selection
      if (additive || !node.selected) pick(node.id, additive);
      if (!canDrag || (additive && node.selected)) return;
      const moving = node.selected && !additive ? all.filter((n) => n.selected) : [node];
      drag = { x0: e.clientX, y0: e.clientY, zoom: store.getState().transform[2] || 1, moved: false,
        start: moving.map((n) => ({ id: n.id, x: n.position.x, y: n.position.y })) };
      window.addEventListener('pointermove', move);
      window.addEventListener('pointerup', up);
      window.addEventListener('pointercancel', up);
    };
    const mouseDown = (e: MouseEvent) => { if (nodeAt(e)) e.stopPropagation(); };
    const click = (e: MouseEvent) => {
      if (swallowClick || nodeAt(e)) e.stopPropagation();
      swallowClick = false;
    };
    const dblclick = (e: MouseEvent) => {
      const part = nodeAt(e)?.data.part;
      if (part?.kind === 'module') { e.stopPropagation(); live.current.onOpenModule(part.module); }
    };
    // a pointer over a part shows that it can be picked
    const hover = (e: PointerEvent) => {
      if (e.buttons || drag) return;
      root.classList.toggle('gf-over-part', at(e) >= 0);
    };
    root.addEventListener('pointerdown', down, true);
    root.addEventListener('mousedown', mouseDown, true);
    root.addEventListener('click', click, true);
    root.addEventListener('dblclick', dblclick, true);
    root.addEventListener('pointermove', hover, true);
    return () => {
      root.removeEventListener('pointerdown', down, true);
      root.removeEventListener('mousedown', mouseDown, true);
      root.removeEventListener('click', click, true);
      root.removeEventListener('dblclick', dblclick, true);
      root.removeEventListener('pointermove', hover, true);
      window.removeEventListener('pointermove', move);
      window.removeEventListener('pointerup', up);
      window.removeEventListener('pointercancel', up);
      root.classList.remove('gf-over-part');
    };
  }, [store]);

  const summary = useMemo(() => {
    if (!nodes.some((n) => n.selected)) return selectionSummary(nodes);
    const names = displayNames({ parts: nodes.map((n) => n.data.part) } as Pick<BoardFile, 'parts'> as BoardFile);
    return selectionSummary(nodes, (n) => names.get(n.id));
  }, [nodes]);
  return (
    <ViewportPortal>
      <canvas ref={canvasRef} className="gf-far-canvas" data-testid="far-canvas" role="img"
        aria-label={`Board zoomed out: ${nodes.length.toLocaleString('en')} parts and ${edges.length.toLocaleString('en')} wires drawn as plain boxes and lines. Zoom in to read the symbols.`} />
      <p className="sr-only" aria-live="polite" data-testid="far-selection">{summary}</p>
    </ViewportPortal>
  );
}

export const FarCanvas = memo(FarCanvasView);
