import { useQuery, useQueryClient } from '@tanstack/react-query';
import { Fragment, useEffect, useState, type ReactNode } from 'react';
import { Link } from 'react-router-dom';
import { ErrorState } from '../../components/ui/error-state';
import { RoleBadge } from '../../components/ui/role-badge';
import { LoadingState } from '../../components/ui/spinner';
import { ChunkBoundary } from '../../components/ui/chunk-boundary';
import { isApiError } from '../../lib/api-client';
import { meQueryOptions } from '../../features/auth';
import { boardKeys, boardQueryOptions, BoardTitleEditor, DeleteBoardButton, SafetyCaution } from '../../features/boards';
import { MemberAvatars, MemberListPanel } from '../../features/members';
import { canEdit, isOwner } from '../../lib/roles';
import { PageColumn } from '../layout';
import { useIdParam } from '../../lib/use-id-param';
import { useIdle } from '../../lib/use-idle';
import { BoardWorkspace, useBoardSession, type BoardSession } from '../../features/canvas';
// The side panels and the timing strip are lazy (chunks of their own, loaded when they mount once the page
// is idle after the canvas's first draw): each waits for its code behind its own Suspense boundary below.
import { BenchPanel, PulseStyle, useLiveSim } from '../../features/bench';
import { TimingStrip } from '../../features/timing';
import { AnalysisPanel, useAnalysis } from '../../features/analysis';
import { BuildPanel, useBuildSheet } from '../../features/build';
import { BringupPanel, useBringup } from '../../features/bringup';
import { useBoardHistory } from '../../features/snapshots';
import type { ApiBoard } from '../../../shared/api';
import { PageTitle } from '../../components/ui/page-title';
import { ClassPanel, LessonPanel, useAudience, useLesson } from '../../features/class';

/**
 * One board: a compact header (title, role, family, members, owner actions) and below it the whole
 * remaining area for the workspace.
 */
export function BoardPage() {
  const boardId = useIdParam();
  const board = useQuery({ ...boardQueryOptions(boardId ?? 0), enabled: boardId !== null });
  const me = useQuery(meQueryOptions);

  if (boardId === null) return <BadId />;
  // A failed refresh keeps the open board (a dropped Wi-Fi must not unmount the live canvas);
  // only "no longer a member" or "deleted" closes it.
  const gone = isApiError(board.error) && (board.error.status === 403 || board.error.status === 404);
  if (board.isPending) return <LoadingState label="Opening the board…" />;
  if (!board.data || gone)
    return (
      <PageColumn width="narrow">
        <ErrorState error={board.error} onRetry={() => board.refetch()} />
      </PageColumn>
    );

  return <BoardView board={board.data} me={me.data ?? null} />;
}

/** Socket close codes after which the board row (role, membership, existence) is asked for again. */
const ROW_CHANGED_CLOSE_CODES = new Set([4001, 4403, 4404]);

/**
 * The open board. Its title and family come from the live document (renamed anywhere, every screen
 * shows it at once); the board row gives the role, asked for again only when the server closes the
 * socket because that changed.
 */
function BoardView({ board: b, me }: { board: ApiBoard; me: { id: number; name: string } | null }) {
  const session = useBoardSession(String(b.id), b.role, me ? { user: me } : {});
  const title = session.board.title || b.title;
  const qc = useQueryClient();
  useEffect(() => {
    const onClose = (event: CloseEvent | null) => {
      if (event && ROW_CHANGED_CLOSE_CODES.has(event.code)) void qc.invalidateQueries({ queryKey: boardKeys.detail(b.id) });
    };
    session.provider.on('connection-close', onClose);
    return () => session.provider.off('connection-close', onClose);
  }, [session.provider, qc, b.id]);
  return (
    <div className="flex min-h-0 flex-1 flex-col" data-testid="board-page">
      <PageTitle>{title}</PageTitle>
      <header className="flex min-h-11 shrink-0 flex-wrap items-center gap-x-4 gap-y-1 border-b border-mat-700 bg-mat-900/90 px-4 py-1.5">
        <BoardTitleEditor board={b} title={title} editable={canEdit(b.role)} />
        <span className="flex items-center gap-1.5 text-xs text-slate-400">
          you are <RoleBadge role={b.role} />
        </span>
        <div className="ml-auto flex items-center gap-3">
          <MemberAvatars boardId={b.id} />
          {isOwner(b.role) && (
            <>
              <Link to={`/boards/${b.id}/members`} className="rounded px-2 py-1 text-sm text-amber-300 hover:bg-mat-800">
                Members
              </Link>
              <DeleteBoardButton board={{ ...b, title }} />
            </>
          )}
        </div>
      </header>
      <div className="flex min-h-0 flex-1 flex-col">
        {/* board workspace: canvas, bench and analysis panels mount here */}
        <LiveBoard board={b} me={me} session={session} />
      </div>
    </div>
  );
}

/** The live canvas of the board (its session lives as long as the board view is shown). */
function LiveBoard({ board, me, session }: { board: ApiBoard; me: { id: number; name: string } | null; session: BoardSession }) {
  const sim = useLiveSim(session, { tryOut: session.readOnly });
  const analysis = useAnalysis(session.board);
  const build = useBuildSheet(session.board);
  // the bring-up's test vectors (a fault simulation of the whole board) are worked out in a worker once
  // its panel is on screen, or once the page is idle when the record holds observations
  const bringup = useBringup(board.id, board.role, session.board);
  const lesson = useLesson(session);
  const highlight = lesson.highlight ?? bringup.highlight ?? build.highlight ?? analysis.highlight;
  // preview and compare show a snapshot read-only on the canvas, without the live levels
  const history = useBoardHistory(board.id, board.role, session);
  const live = !history.viewing;
  const viewers = useAudience(session.provider.awareness);
  // The family is part of the live document (the bench's family select edits it for everyone), so the
  // caution follows the document, not the board row.
  return (
    <>
      <SafetyCaution family={session.board.family} />
      <PulseStyle wireIds={live ? sim.pulsingWires : []} lampIds={live ? sim.oscillatingOutputs : []} />
      {history.banner}
      <BoardWorkspace session={history.session} levels={live ? sim.levels : undefined} partBadges={live ? sim.partBadges : undefined} onTryOut={live ? sim.tryOut.set : undefined}
        tryOutValues={live ? sim.tryOut.values : undefined} highlight={live ? highlight : undefined} marks={history.marks}
        // the panels and the timing strip (500 waveforms on a large board) are drawn once the browser is
        // idle after the canvas; their places (the side column, the dock) are there from the start
        panels={<IdleSteps preload={preloadPanels}>{[
          <PanelChunk key="bench"><BenchPanel sim={sim} session={session} /></PanelChunk>,
          <PanelChunk key="analysis"><AnalysisPanel analysis={analysis} /></PanelChunk>,
          <PanelChunk key="build"><BuildPanel build={build} boardId={board.id} onWarmUp={sim.warmUp} /></PanelChunk>,
          <PanelChunk key="bringup"><BringupPanel bringup={bringup} me={me?.id ?? null} /></PanelChunk>,
          <Fragment key="history">{history.panel}</Fragment>,
          <PanelChunk key="lesson"><LessonPanel lesson={lesson} session={session} /></PanelChunk>,
          isOwner(board.role) ? <PanelChunk key="class"><ClassPanel boardId={board.id} viewers={viewers} /></PanelChunk> : null,
          <div key="members" className="p-3"><PanelChunk><MemberListPanel boardId={board.id} currentUserId={me?.id} /></PanelChunk></div>,
        ]}</IdleSteps>}
        bottom={<WhenIdle><ChunkBoundary what="timing strip"><TimingStrip {...sim.timing} /></ChunkBoundary></WhenIdle>} />
    </>
  );
}

/** The code of the side panels, fetched together once the page is idle after the canvas's first draw. */
const preloadPanels = () =>
  Promise.all([BenchPanel, AnalysisPanel, BuildPanel, BringupPanel, LessonPanel, ClassPanel, MemberListPanel].map((panel) => panel.preload()));

/** One lazily loaded panel: a small spinner in its place while its code loads, a note and a retry if it cannot be fetched, the rest of the page unaffected. */
function PanelChunk({ children }: { children: ReactNode }) {
  return <ChunkBoundary>{children}</ChunkBoundary>;
}

/** Its children, from the browser's first idle moment after it mounts (nothing before). */
function WhenIdle({ children }: { children: ReactNode }) {
  return useIdle() ? <>{children}</> : null;
}

/**
 * The panels one by one, each at an idle moment after the one before (the first after the canvas has
 * drawn and the panels' code has loaded, `preload`), so that mounting them is a few short tasks rather
 * than one long one a drag could meet; the later ones wait at most a few tenths of a second for idle.
 * With their code loaded first, the panels mount in order at their full size (a panel further down is
 * not briefly in view, and so "seen", while the ones above it still wait for their code).
 */
function IdleSteps({ children, preload }: { children: ReactNode[]; preload: () => Promise<unknown> }) {
  const idle = useIdle();
  const [loaded, setLoaded] = useState(false);
  useEffect(() => {
    if (!idle) return;
    let live = true;
    // a chunk that failed to load: the panels mount anyway and ask for their code again
    const done = () => { if (live) setLoaded(true); };
    preload().then(done, done);
    return () => { live = false; };
  }, [idle, preload]);
  const first = idle && loaded;
  const [shown, setShown] = useState(1);
  const more = first && shown < children.length;
  useEffect(() => {
    if (!more) return;
    if (typeof requestIdleCallback !== 'function') { setShown(children.length); return; }
    const handle = requestIdleCallback(() => setShown((n) => n + 1), { timeout: 300 });
    return () => cancelIdleCallback(handle);
  }, [more, shown, children.length]);
  return first ? <>{children.slice(0, shown)}</> : null;
}

function BadId() {
  return (
    <PageColumn width="narrow">
      <ErrorState error={new Error('A board address ends in its number, like /boards/12.')} title="Not a board address" />
    </PageColumn>
  );
}
