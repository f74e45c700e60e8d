/**
 * The board workspace: presence and tools on top, the parts tray on the left (editors only), the canvas
 * in the middle, optional panels in a collapsible right column and an optional resizable bottom dock.
 */
import { useEffect, useMemo, useState, type ReactNode } from 'react';
import { ReactFlowProvider } from '@xyflow/react';
import '@xyflow/react/dist/style.css';
import '../canvas.css';
import type { Level } from '../../../../shared/sim';
import type { PartBadge } from '../flow/types';
import type { TrayChoice } from '../lib/new-part';
import { PresenceBar } from '../presence/presence-bar';
import { usePeers } from '../presence/use-peers';
import type { BoardSession } from '../session/use-board-session';
import { CanvasToolbar } from '../toolbar/canvas-toolbar';
import { PartInspector } from '../inspector/part-inspector';
import { PartsTray } from '../tray/parts-tray';
import { useModuleSession } from '../modules/use-module-session';
import { ModuleBar } from '../modules/module-bar';
import type { PeersView } from '../session/awareness';
import { BoardCanvas, type CanvasApi } from './board-canvas';
import { BottomDock } from './bottom-dock';
import type { OverlayProps } from './use-flow-state';

export interface BoardWorkspaceProps {
  session: BoardSession;
  /** keyed by "<partId>.<pin>" */
  levels?: ReadonlyMap<string, Level>;
  partBadges?: ReadonlyMap<string, PartBadge>;
  /** part ids to outline */
  highlight?: ReadonlySet<string>;
  /** called instead of a document edit when a viewer flips a switch or presses a button */
  onTryOut?(partId: string, field: 'on' | 'pressed', value: boolean): void;
  /** the viewer's private switch/button values */
  tryOutValues?: ReadonlyMap<string, boolean>;
  /** a snapshot compare's marks on parts and wires */
  marks?: OverlayProps['marks'];
  panels?: ReactNode;
  bottom?: ReactNode;
}

export function BoardWorkspace(props: BoardWorkspaceProps) {
  return (
    <ReactFlowProvider>
      <Workspace {...props} />
    </ReactFlowProvider>
  );
}

function Workspace({ session, levels, partBadges, highlight, marks, onTryOut, tryOutValues, panels, bottom }: BoardWorkspaceProps) {
  const peers = usePeers(session.provider);
  const [armed, setArmed] = useState<TrayChoice | null>(null);
  const [help, setHelp] = useState(false);
  const [panelsOpen, setPanelsOpen] = useState(true);
  const [canvas, setCanvas] = useState<CanvasApi | null>(null);
  // The modules open on the canvas, outermost first (double-click an instance; the breadcrumb goes back).
  const [path, setPath] = useState<string[]>([]);
  const scope = useModuleSession(session, path.length ? path[path.length - 1] : null);
  const inModule = scope.module !== null;
  const view = scope.session;
  // a module deleted (or undone away) while open: back to the board
  useEffect(() => { if (path.length && !inModule) setPath([]); }, [path.length, inModule]);
  // Collaborators' selections and drags name top-level parts: inside a module they would mark the wrong ones.
  const shownPeers = useMemo<PeersView>(() => (inModule ? { ...peers, selection: new Map(), dragging: new Map() } : peers), [peers, inModule]);
  const titleOf = (id: string) => session.board.modules?.find((m) => m.id === id)?.title ?? id;

  return (
    <div className="gf-workspace flex min-h-0 min-w-0 flex-1 flex-col" data-testid="board-workspace">
      <div className="flex h-10 shrink-0 items-center gap-3 border-b border-mat-700 bg-mat-900 px-3">
        <PresenceBar me={session.user} peers={peers.peers} status={session.status} refusal={session.refusal} />
        {session.readOnly && <span className="rounded bg-mat-700 px-2 py-0.5 text-[11px] text-slate-300" data-testid="read-only-note">viewing · read-only</span>}
        <div className="ml-auto">
          <CanvasToolbar session={session} canvas={canvas} onHelp={() => setHelp((h) => !h)} />
        </div>
        {panels ? (
          <button type="button" className="h-7 rounded px-2 text-xs text-slate-300 hover:bg-mat-700" data-testid="toggle-panels"
            onClick={() => setPanelsOpen((o) => !o)} aria-expanded={panelsOpen}>{panelsOpen ? 'Hide panels ⟩' : '⟨ Panels'}</button>
        ) : null}
      </div>
      <div className="flex min-h-0 flex-1">
        {!session.readOnly && (
          <PartsTray armed={armed} onArm={setArmed} inModule={inModule}
            library={{ doc: session.doc, boardId: Number(session.boardId), origin: session.origin, scope: scope.module?.id }} />
        )}
        <div className="flex min-h-0 min-w-0 flex-1 flex-col">
          <div className="relative min-h-0 flex-1">
            {/* inside a module the bench's levels, badges and marks (top-level part ids) do not apply */}
            <BoardCanvas key={path.join('/') || 'board'} session={view} peers={shownPeers} armed={armed} onArm={setArmed}
              levels={inModule ? undefined : levels} partBadges={inModule ? undefined : partBadges}
              highlight={inModule ? undefined : highlight} marks={inModule ? undefined : marks} onTryOut={onTryOut} tryOutValues={tryOutValues}
              helpOpen={help} onHelp={setHelp} onReady={setCanvas} onOpenModule={(id) => setPath((p) => (p.includes(id) ? p : [...p, id]))} />
            {scope.module && (
              <ModuleBar path={path} module={scope.module} titleOf={titleOf} onPath={setPath} boardId={Number(session.boardId)} canEdit={!session.readOnly} />
            )}
            {!(panels && panelsOpen) && <PartInspector session={view} placement="float" />}
            {!session.synced && (
              <div className="pointer-events-none absolute inset-x-0 top-3 flex justify-center">
                <span className="rounded bg-mat-800/90 px-3 py-1 text-xs text-slate-300" data-testid="sync-note">
                  {session.status === 'offline' ? 'Offline — showing what this tab has' : 'Loading the board…'}
                </span>
              </div>
            )}
          </div>
          {bottom ? <BottomDock>{bottom}</BottomDock> : null}
        </div>
        {panels && panelsOpen ? (
          <aside className="w-80 shrink-0 overflow-y-auto border-l border-mat-700 bg-mat-900" data-testid="side-panels"><PartInspector session={view} placement="panel" />{panels}</aside>
        ) : null}
      </div>
    </div>
  );
}
