/**
 * React Flow's nodes and edges for the canvas: derived from the session's board (plus levels, badges,
 * highlights, try-out values and collaborators' selections and drags), joined with the local view
 * state React Flow keeps (selection, measured size, a drag in progress), which never enters the document.
 */
import { useCallback, useLayoutEffect, useMemo, useRef, useState } from 'react';
import { applyEdgeChanges, applyNodeChanges, type EdgeChange, type NodeChange } from '@xyflow/react';
import { flattenWithPins, modulePinTable, type BoardFile } from '../../../../shared/board';
import type { Level } from '../../../../shared/sim';
import type { CompareMark } from '../../../../shared/render';
import { byId, deriveEdges, deriveNodes, mergeLocal } from '../flow/derive-flow';
import type { PartBadge, PartNode, WireEdge } from '../flow/types';
import type { PeersView } from '../session/awareness';
import type { BoardSession } from '../session/use-board-session';

export interface OverlayProps {
  levels?: ReadonlyMap<string, Level>;
  partBadges?: ReadonlyMap<string, PartBadge>;
  highlight?: ReadonlySet<string>;
  tryOutValues?: ReadonlyMap<string, boolean>;
  /** a snapshot compare's marks on parts and wires */
  marks?: { parts: ReadonlyMap<string, CompareMark>; wires: ReadonlyMap<string, CompareMark> };
}

/**
 * The levels with the ones an instance's pins show: each pin of an instance (`u3.A`) takes the level of
 * the real pin of the flat board on its net (flattenWithPins), which is where the bench reads levels.
 */
export function withInstanceLevels(board: BoardFile, levels: ReadonlyMap<string, Level> | undefined): ReadonlyMap<string, Level> | undefined {
  if (!levels || levels.size === 0 || !board.parts.some((p) => p.kind === 'module')) return levels;
  let junctions: Map<string, string | null>;
  try {
    junctions = flattenWithPins(board).junctions;
  } catch {
    return levels; // a board that cannot be flattened shows no levels on its instances (the checks name why)
  }
  const out = new Map(levels);
  for (const [pin, real] of junctions) {
    const level = real === null ? undefined : levels.get(real);
    if (level !== undefined && !out.has(pin)) out.set(pin, level);
  }
  return out;
}

export function useFlowState(session: BoardSession, overlay: OverlayProps, peers: PeersView) {
  const { board, readOnly } = session;
  const modulePins = useMemo(() => modulePinTable(board.modules), [board.modules]);
  const levels = useMemo(() => withInstanceLevels(board, overlay.levels), [board, overlay.levels]);
  const nodeCache = useRef(new Map<string, PartNode>());
  const edgeCache = useRef(new Map<string, WireEdge>());
  const derivedNodes = useMemo(() => {
    const list = deriveNodes({
      parts: board.parts, levels, modulePins, badges: overlay.partBadges, highlight: overlay.highlight,
      tryOut: overlay.tryOutValues, remoteSelection: peers.selection, remoteDrag: peers.dragging, readOnly, marks: overlay.marks?.parts,
    }, nodeCache.current);
    nodeCache.current = byId(list);
    return list;
  }, [board.parts, levels, modulePins, overlay.partBadges, overlay.highlight, overlay.tryOutValues, peers.selection, peers.dragging, readOnly, overlay.marks?.parts]);
  const derivedEdges = useMemo(() => {
    const list = deriveEdges(board.wires, levels, readOnly, edgeCache.current, overlay.marks?.wires);
    edgeCache.current = byId(list);
    return list;
  }, [board.wires, levels, readOnly, overlay.marks?.wires]);

  const [nodes, setNodes] = useState<PartNode[]>([]);
  const [edges, setEdges] = useState<WireEdge[]>([]);
  const nodeBases = useRef(new Map<string, PartNode>());
  const edgeBases = useRef(new Map<string, WireEdge>());
  /** parts to select once they appear (after a paste or a placement) */
  const pendingSelect = useRef<Set<string> | null>(null);

  useLayoutEffect(() => {
    setNodes((local) => {
      const merged = mergeLocal(derivedNodes, local, nodeBases.current) as PartNode[];
      const want = pendingSelect.current;
      if (!want || ![...want].every((id) => merged.some((n) => n.id === id))) return merged;
      pendingSelect.current = null;
      return merged.map((n) => (want.has(n.id) === !!n.selected ? n : { ...n, selected: want.has(n.id) }));
    });
  }, [derivedNodes]);
  useLayoutEffect(() => {
    setEdges((local) => mergeLocal(derivedEdges, local, edgeBases.current) as WireEdge[]);
  }, [derivedEdges]);

  const onNodesChange = useCallback((changes: NodeChange<PartNode>[]) => {
    // Removal goes through the document (deleteSelection), never straight into the local view.
    const kept = changes.filter((c) => c.type !== 'remove' && c.type !== 'add' && c.type !== 'replace');
    if (kept.length) setNodes((ns) => applyNodeChanges(kept, ns));
  }, []);
  const onEdgesChange = useCallback((changes: EdgeChange<WireEdge>[]) => {
    const kept = changes.filter((c) => c.type === 'select');
    if (kept.length) setEdges((es) => applyEdgeChanges(kept, es));
  }, []);

  const selectOnly = useCallback((ids: Iterable<string>) => {
    const want = new Set(ids);
    pendingSelect.current = want;
    setNodes((ns) => ns.map((n) => (want.has(n.id) === !!n.selected ? n : { ...n, selected: want.has(n.id) })));
    setEdges((es) => es.map((e) => (e.selected ? { ...e, selected: false } : e)));
  }, []);

  return { nodes, edges, setNodes, setEdges, onNodesChange, onEdgesChange, selectOnly };
}
