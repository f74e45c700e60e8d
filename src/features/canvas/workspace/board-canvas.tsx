/**
 * The canvas itself: React Flow showing the board's parts and wires, wired to the named edits of
 * shared/board/edits. Drag positions travel through awareness while dragging and are written to the
 * document once, on drag stop.
 */
import { useCallback, useEffect, useLayoutEffect, useMemo, useRef, useState, type DragEvent, type PointerEvent as RPointerEvent } from 'react';
import {
  ConnectionMode, ControlButton, Controls, getNodesBounds, getViewportForBounds, ReactFlow,
  useReactFlow, useStore, type Connection, type OnSelectionChangeParams, type ReactFlowState,
} from '@xyflow/react';
import { toast } from 'sonner';
import { connect, movePart, relabelPart, setPartField } from '../../../../shared/board';
import { modulePinTable, partsMap } from '../../../../shared/board';
import { ModulesContext, type ModulesView } from '../modules/modules-context';
import { SIGNAL } from '../lib/colors';
import { GRID, snap } from '../lib/geometry';
import { labelProblem } from '../lib/labels';
import type { TrayChoice } from '../lib/new-part';
import { PartActionsContext, type PartActions } from '../flow/part-actions';
import { PartNodeComponent } from '../flow/part-node';
import { WireEdgeComponent } from '../flow/wire-edge';
import { FarWires } from '../flow/far-wires';
import { FarCanvas } from '../flow/far-canvas';
import { useFarBoxSelect } from '../flow/far-select';
import { PartsMap } from '../flow/parts-map';
import { drawsFar, leastZoom, zoomBand } from '../flow/zoom-detail';
import type { PartNode, WireEdge } from '../flow/types';
import { RemoteCursors } from '../presence/remote-cursors';
import { throttle, type PeersView } from '../session/awareness';
import type { BoardSession } from '../session/use-board-session';
import { TRAY_MIME } from '../tray/tray-items';
import { HelpSheet } from '../toolbar/help-sheet';
import { CanvasGrid } from './canvas-grid';
import { useCanvasCommands } from './use-canvas-commands';
import { useFlowState, type OverlayProps } from './use-flow-state';

const nodeTypes = { part: PartNodeComponent };
const edgeTypes = { wire: WireEdgeComponent };
const SNAP: [number, number] = [GRID, GRID];
const MINIMAP_AUTO_LIMIT = 400;

const NO_WIRES: WireEdge[] = [];
const NO_PARTS: PartNode[] = [];
const hasPanZoom = (s: ReactFlowState) => s.panZoom !== null;
const FIT_PADDING = 0.15;
const FIT_MAX_ZOOM = 1.25;
const paneWidth = (s: ReactFlowState) => s.width;
const paneHeight = (s: ReactFlowState) => s.height;

/**
 * Zoomed out the parts are drawn by FarCanvas; React Flow keeps them as hidden nodes, which it neither
 * mounts nor watches on a pan frame (with onlyRenderVisibleElements a hidden node is never "in view").
 * One hidden copy per node object, so an unchanged part stays the same object for React Flow.
 */
const hiddenCopies = new WeakMap<PartNode, PartNode>();
function hiddenNode(n: PartNode): PartNode {
  let h = hiddenCopies.get(n);
  if (!h) { h = { ...n, hidden: true }; hiddenCopies.set(n, h); }
  return h;
}

/** Most wires drawn over the far canvas for their pulse (a net that does not settle); past it they stay still. */
const PULSE_OVERLAY_LIMIT = 400;

/** The wires leaving a part marked oscillating (the drivers of a net that does not settle). */
function oscillatingWires(nodes: readonly PartNode[], edges: readonly WireEdge[]): WireEdge[] {
  const driving = new Set(nodes.filter((n) => n.data.badge?.tone === 'oscillating').map((n) => n.id));
  if (driving.size === 0) return NO_WIRES;
  const out = edges.filter((e) => driving.has(e.source));
  return out.length > PULSE_OVERLAY_LIMIT ? NO_WIRES : out;
}

export interface BoardCanvasProps extends OverlayProps {
  session: BoardSession;
  peers: PeersView;
  armed: TrayChoice | null;
  onArm(choice: TrayChoice | null): void;
  onTryOut?(partId: string, field: 'on' | 'pressed', value: boolean): void;
  helpOpen: boolean;
  onHelp(open: boolean): void;
  /** gives the toolbar the commands and the node list (for image export) */
  onReady?(api: CanvasApi): void;
  /** double-click on an instance: show its module's inside */
  onOpenModule?(moduleId: string): void;
}

export interface CanvasApi {
  run: ReturnType<typeof useCanvasCommands>['run'];
  nodes(): PartNode[];
  selectedCount(): number;
}

export function BoardCanvas(props: BoardCanvasProps) {
  const { session, peers, armed, onArm, helpOpen, onHelp, onReady } = props;
  const { readOnly, doc, origin, provider } = session;
  const rf = useReactFlow();
  const flow = useFlowState(session, props, peers);
  // Plain boxes only on a large sheet zoomed out, or on any sheet zoomed out past reading (zoom-detail.ts).
  const far = drawsFar(useStore(zoomBand), flow.nodes.length);
  const pointer = useRef<{ x: number; y: number } | null>(null);
  // The minimap redraws on every pan and zoom; on big boards it starts hidden (one click shows it).
  const [mapChoice, setMapChoice] = useState<boolean | null>(null);
  const showMap = mapChoice ?? session.board.parts.length <= MINIMAP_AUTO_LIMIT;

  const commands = useCanvasCommands({
    session, nodes: flow.nodes, edges: flow.edges, selectOnly: flow.selectOnly, pointer,
    onHelp: () => onHelp(!helpOpen), onCancel: () => { onArm(null); onHelp(false); },
  });
  const nodesRef = useRef(flow.nodes);
  nodesRef.current = flow.nodes;
  useEffect(() => {
    onReady?.({ run: commands.run, nodes: () => nodesRef.current, selectedCount: () => nodesRef.current.filter((n) => n.selected).length });
  }, [onReady, commands.run]);

  // The least zoom lets fit-to-view show the whole of a large board (see leastZoom).
  const paneW = useStore(paneWidth);
  const paneH = useStore(paneHeight);
  const bounds = useMemo(() => getNodesBounds(flow.nodes), [flow.nodes]);
  const minZoom = leastZoom(bounds, paneW, paneH, FIT_PADDING);
  // Fit the board into view once, when it first arrives: before the browser paints, so the parts are
  // drawn once, at the fitted zoom (plain boxes on a large board), not first in detail at zoom 1. React
  // Flow is given the parts only once that is done: the document usually arrives before the canvas mounts
  // (the socket opens early), and React Flow's pan and zoom exist only after its first render, so the
  // parts would otherwise be mounted as full symbols at zoom 1 first (most of an open's rendering), and
  // adopted by its store twice. `panZoom` is there from React Flow's own effect, before onInit's timer.
  const zoomReady = useStore(hasPanZoom);
  const fitted = useRef(false);
  const [fitDone, setFitDone] = useState(false);
  useLayoutEffect(() => {
    if (fitted.current || !zoomReady || !session.synced || flow.nodes.length === 0 || !paneW || !paneH) return;
    fitted.current = true;
    void rf.setViewport(getViewportForBounds(bounds, paneW, paneH, minZoom, FIT_MAX_ZOOM, FIT_PADDING));
    setFitDone(true);
  }, [zoomReady, session.synced, flow.nodes.length, rf, bounds, paneW, paneH, minZoom]);
  // While the view moves the parts and wires are one composited layer (canvas.css .gf-moving).
  const canvasRef = useRef<HTMLDivElement>(null);
  const onMoveStart = useCallback(() => canvasRef.current?.classList.add('gf-moving'), []);
  const onMoveEnd = useCallback(() => canvasRef.current?.classList.remove('gf-moving'), []);

  // Symbols act through these; the object never changes, the refs carry the current session.
  const live = useRef({ session, onTryOut: props.onTryOut, tryOut: props.tryOutValues, onOpenModule: props.onOpenModule });
  live.current = { session, onTryOut: props.onTryOut, tryOut: props.tryOutValues, onOpenModule: props.onOpenModule };
  const modules = session.board.modules;
  const modulesView = useMemo<ModulesView>(() => ({
    pins: modulePinTable(modules),
    titles: new Map((modules ?? []).map((m) => [m.id, m.title])),
  }), [modules]);
  const actions = useMemo<PartActions>(() => {
    const fail = (err: unknown) => toast.error((err as Error).message);
    const docValue = (id: string, field: 'on' | 'pressed') => partsMap(live.current.session.doc).get(id)?.get(field) === true;
    return {
      readOnly: () => live.current.session.readOnly,
      toggleSwitch: (id) => {
        const { session: s, onTryOut, tryOut } = live.current;
        const current = tryOut?.get(id) ?? docValue(id, 'on');
        if (s.readOnly) onTryOut?.(id, 'on', !current);
        else try { setPartField(s.doc, id, 'on', !docValue(id, 'on'), s.origin); } catch (err) { fail(err); }
      },
      pressButton: (id, pressed) => {
        const { session: s, onTryOut } = live.current;
        if (s.readOnly) onTryOut?.(id, 'pressed', pressed);
        else if (docValue(id, 'pressed') !== pressed) try { setPartField(s.doc, id, 'pressed', pressed, s.origin); } catch (err) { fail(err); }
      },
      editText: (id, text) => {
        const s = live.current.session;
        if (!s.readOnly) try { setPartField(s.doc, id, 'text', text, s.origin); } catch (err) { fail(err); }
      },
      relabel: (id, label) => {
        const s = live.current.session;
        if (s.readOnly) return;
        const problem = labelProblem(s.board, id, label);
        if (problem) { toast.error(problem); return; }
        try { relabelPart(s.doc, id, label, s.origin); } catch (err) { fail(err); }
      },
      openModule: (moduleId) => live.current.onOpenModule?.(moduleId),
    };
  }, []);

  const aw = provider.awareness;
  const sendCursor = useMemo(() => throttle((c: { x: number; y: number } | null) => aw.setLocalStateField('cursor', c), 50), [aw]);
  const sendDrag = useMemo(() => throttle((d: { id: string; x: number; y: number }[] | null) => aw.setLocalStateField('dragging', d), 40), [aw]);

  const onPointerMove = useCallback((e: RPointerEvent) => {
    const p = rf.screenToFlowPosition({ x: e.clientX, y: e.clientY });
    pointer.current = p;
    sendCursor({ x: Math.round(p.x), y: Math.round(p.y) });
  }, [rf, sendCursor]);
  const onPointerLeave = useCallback(() => { pointer.current = null; sendCursor(null); }, [sendCursor]);

  const onConnect = useCallback((c: Connection) => {
    if (readOnly || !c.sourceHandle || !c.targetHandle) return;
    const result = connect(doc, `${c.source}.${c.sourceHandle}`, `${c.target}.${c.targetHandle}`, origin);
    if (!result.ok) toast.error(`Cannot wire: ${result.reason}`);
    else if (result.warning) toast.warning(`Wired, but it ${result.warning}: the net will be a conflict (X) if they disagree`);
  }, [doc, origin, readOnly]);

  const onNodeDrag = useCallback((_e: unknown, _n: PartNode, dragged: PartNode[]) => {
    sendDrag(dragged.map((n) => ({ id: n.id, x: n.position.x, y: n.position.y })));
  }, [sendDrag]);
  const onNodeDragStop = useCallback((_e: unknown, _n: PartNode, dragged: PartNode[]) => {
    if (!readOnly) movePart(doc, dragged.map((n) => ({ id: n.id, x: snap(n.position.x), y: snap(n.position.y) })), origin);
    sendDrag(null);
    sendDrag.flush();
  }, [doc, origin, readOnly, sendDrag]);

  // Zoomed out, FarCanvas selects and drags the parts (React Flow has them hidden).
  const { setNodes, setEdges } = flow;
  const onFarPick = useCallback((id: string, additive: boolean) => {
    setNodes((ns) => ns.map((n) => {
      const selected = additive ? (n.id === id ? !n.selected : !!n.selected) : n.id === id;
      return selected === !!n.selected ? n : { ...n, selected };
    }));
    if (!additive) setEdges((es) => (es.some((e) => e.selected) ? es.map((e) => (e.selected ? { ...e, selected: false } : e)) : es));
  }, [setNodes, setEdges]);
  const onFarDrag = useCallback((moves: { id: string; x: number; y: number }[], done: boolean) => {
    const at = new Map(moves.map((m) => [m.id, done ? { x: snap(m.x), y: snap(m.y) } : { x: m.x, y: m.y }]));
    setNodes((ns) => ns.map((n) => { const p = at.get(n.id); return p ? { ...n, position: p, dragging: !done } : n; }));
    if (!done) { sendDrag(moves); return; }
    if (!readOnly) movePart(doc, [...at].map(([id, p]) => ({ id, ...p })), origin);
    sendDrag(null);
    sendDrag.flush();
  }, [setNodes, sendDrag, readOnly, doc, origin]);
  // Shift-drag box selection over the far boxes (React Flow's rectangle skips hidden nodes).
  const farNodes = useCallback(() => nodesRef.current, []);
  const onFarBoxSelect = useCallback((ids: Set<string>) => {
    setNodes((ns) => ns.map((n) => (ids.has(n.id) === !!n.selected ? n : { ...n, selected: ids.has(n.id) })));
    setEdges((es) => es.map((e) => {
      const selected = ids.has(e.source) || ids.has(e.target);
      return selected === !!e.selected ? e : { ...e, selected };
    }));
  }, [setNodes, setEdges]);
  useFarBoxSelect(far, farNodes, onFarBoxSelect);
  const onFarOpenModule = useCallback((moduleId: string) => live.current.onOpenModule?.(moduleId), []);
  const rfNodes = useMemo(() => (!fitDone ? NO_PARTS : far ? flow.nodes.map(hiddenNode) : flow.nodes), [fitDone, far, flow.nodes]);
  // zoomed out, the wires of a net that does not settle are also SVG paths: the bench's pulse style targets them by id
  const pulseEdges = useMemo(() => (far ? oscillatingWires(flow.nodes, flow.edges) : NO_WIRES), [far, flow.nodes, flow.edges]);

  const onSelectionChange = useCallback(({ nodes }: OnSelectionChangeParams) => {
    aw.setLocalStateField('selection', nodes.map((n) => n.id));
  }, [aw]);

  const onDragOver = useCallback((e: DragEvent) => {
    if (readOnly || !e.dataTransfer.types.includes(TRAY_MIME)) return;
    e.preventDefault();
    e.dataTransfer.dropEffect = 'copy';
  }, [readOnly]);
  const onDrop = useCallback((e: DragEvent) => {
    const raw = e.dataTransfer.getData(TRAY_MIME);
    if (readOnly || !raw) return;
    e.preventDefault();
    const choice = JSON.parse(raw) as TrayChoice;
    commands.place(choice, rf.screenToFlowPosition({ x: e.clientX - 30, y: e.clientY - 20 }));
  }, [commands, readOnly, rf]);
  const onPaneClick = useCallback((e: React.MouseEvent) => {
    if (!armed || readOnly) return;
    commands.place(armed, rf.screenToFlowPosition({ x: e.clientX - 30, y: e.clientY - 20 }));
    if (!e.shiftKey) onArm(null);
  }, [armed, commands, onArm, readOnly, rf]);

  return (
    <PartActionsContext.Provider value={actions}>
      <ModulesContext.Provider value={modulesView}>
      <div ref={canvasRef} className={`gf-canvas relative h-full w-full ${armed ? 'gf-armed' : ''}`} data-testid="board-canvas" data-readonly={readOnly ? 'true' : 'false'}
        onPointerMove={onPointerMove} onPointerLeave={onPointerLeave} onDragOver={onDragOver} onDrop={onDrop}>
        <ReactFlow<PartNode, WireEdge>
          nodes={rfNodes}
          edges={far || !fitDone ? NO_WIRES : flow.edges}
          nodeTypes={nodeTypes}
          edgeTypes={edgeTypes}
          onNodesChange={flow.onNodesChange}
          onEdgesChange={flow.onEdgesChange}
          onConnect={onConnect}
          onNodeDrag={onNodeDrag}
          onNodeDragStop={onNodeDragStop}
          onSelectionChange={onSelectionChange}
          onPaneClick={onPaneClick}
          onMoveStart={onMoveStart}
          onMoveEnd={onMoveEnd}
          connectionMode={ConnectionMode.Loose}
          snapToGrid
          snapGrid={SNAP}
          // Zoomed in, only the parts in view are in the page (full symbols are heavy). Zoomed out the parts
          // are hidden nodes (painted by FarCanvas, all of them: culling would only add and remove boxes at the
          // edges on every pan frame, each a repaint of the moving layer), which React Flow then skips.
          onlyRenderVisibleElements
          nodesDraggable={!readOnly}
          nodesConnectable={!readOnly}
          elementsSelectable
          deleteKeyCode={null}
          selectionKeyCode="Shift"
          multiSelectionKeyCode={['Control', 'Meta']}
          minZoom={minZoom}
          maxZoom={3}
          colorMode="dark"
          connectionLineStyle={{ stroke: SIGNAL.high, strokeWidth: 2 }}
          defaultEdgeOptions={{ type: 'wire' }}
          proOptions={{ hideAttribution: true }}
        >
          {/* Zoomed out, grid dots one GRID apart are a few pixels apart: a haze of tens of thousands of dots.
              Every fifth dot keeps the grid readable. */}
          <CanvasGrid far={far} />
          {/* zoomed out the parts and wires are painted on one canvas, not a React Flow node and edge each (flow/far-canvas.tsx) */}
          {far && fitDone && <FarCanvas nodes={flow.nodes} edges={flow.edges} draggable={!readOnly} onPick={onFarPick} onDrag={onFarDrag} onOpenModule={onFarOpenModule} />}
          {pulseEdges.length > 0 && <FarWires nodes={flow.nodes} edges={pulseEdges} />}
          <Controls showInteractive={false} position="bottom-left">
            <ControlButton onClick={() => setMapChoice(!showMap)} title={showMap ? 'Hide the minimap' : 'Show the minimap'}
              aria-label={showMap ? 'Hide the minimap' : 'Show the minimap'} data-testid="toggle-minimap">
              <svg viewBox="0 0 16 16" aria-hidden="true"><rect x="1.5" y="3" width="13" height="10" rx="1" fill="none" stroke="currentColor" strokeWidth="1.5" /><rect x="8" y="8" width="5" height="3.5" fill="currentColor" /></svg>
            </ControlButton>
          </Controls>
          {showMap && (
            // drawn from the part list: React Flow's minimap leaves out hidden nodes, i.e. every part while zoomed out
            <PartsMap nodes={flow.nodes} width={160} height={110} />
          )}
          <RemoteCursors peers={peers.peers} />
        </ReactFlow>
        {helpOpen && <HelpSheet readOnly={readOnly} onClose={() => onHelp(false)} />}
      </div>
      </ModulesContext.Provider>
    </PartActionsContext.Provider>
  );
}
