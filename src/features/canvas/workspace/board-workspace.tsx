/**
 * The board workspace: presence and tools on top, the parts tray on the left (editors only), the canvas
 * in the middle, optional panels in a collapsible right column and an optional resizable bottom dock.
 */
import { useState, type ReactNode } from 'react';
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
        {!session.readOnly && <PartsTray armed={armed} onArm={setArmed} />}
        <div className="flex min-h-0 min-w-0 flex-1 flex-col">
          <div className="relative min-h-0 flex-1">
            <BoardCanvas session={session} peers={peers} armed={armed} onArm={setArmed} levels={levels} partBadges={partBadges}
              highlight={highlight} marks={marks} onTryOut={onTryOut} tryOutValues={tryOutValues} helpOpen={help} onHelp={setHelp} onReady={setCanvas} />
            {!(panels && panelsOpen) && <PartInspector session={session} placement="float" />}
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
          <aside className="w-80 shrink-0 overflow-y-auto border-l border-mat-700 bg-mat-900" data-testid="side-panels"><PartInspector session={session} placement="panel" />{panels}</aside>
        ) : null}
      </div>
    </div>
  );
}
