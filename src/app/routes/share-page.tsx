import { useQuery } from '@tanstack/react-query';
import { useState } from 'react';
import { Navigate, useParams } from 'react-router-dom';
import { Button } from '../../components/ui/button';
import { ChunkBoundary } from '../../components/ui/chunk-boundary';
import { ErrorState } from '../../components/ui/error-state';
import { Input } from '../../components/ui/input';
import { LoadingState } from '../../components/ui/spinner';
import { PageTitle } from '../../components/ui/page-title';
import { errorMessage } from '../../lib/api-client';
import { BoardWorkspace, useBoardSession } from '../../features/canvas';
import { BenchPanel, PulseStyle, useLiveSim } from '../../features/bench';
import { TimingStrip } from '../../features/timing';
import { LessonPanel, shareInfoQueryOptions, useJoinShare, useLesson } from '../../features/class';
import { PageColumn } from '../layout';

/**
 * `/s/<token>`: a share link. A member goes to the board with their own role; anyone else gives a
 * display name and watches the board as a guest (read-only; their input changes are a private try-out).
 */
export function SharePage() {
  const { token = '' } = useParams();
  const info = useQuery(shareInfoQueryOptions(token));
  if (info.isPending) return <LoadingState label="Opening the share link…" />;
  if (!info.data)
    return (
      <PageColumn width="narrow">
        <ErrorState error={info.error} title="This share link does not work" />
      </PageColumn>
    );
  if (info.data.memberRole) return <Navigate to={`/boards/${info.data.boardId}`} replace />;
  if (!info.data.guest) return <JoinForm token={token} title={info.data.title} />;
  return <GuestBoard token={token} boardId={info.data.boardId} title={info.data.title} name={info.data.guest.name} />;
}

function JoinForm({ token, title }: { token: string; title: string }) {
  const join = useJoinShare(token);
  const [name, setName] = useState('');
  return (
    <PageColumn width="narrow">
      <PageTitle>{title}</PageTitle>
      <form
        className="mt-10 space-y-3 rounded border border-mat-700 bg-mat-900 p-5"
        onSubmit={(e) => { e.preventDefault(); join.mutate(name); }}
      >
        <h1 className="text-lg font-semibold">Watch “{title}”</h1>
        <p className="text-sm text-slate-400">You were given a link to this board. No account needed: choose the name the class sees.</p>
        <label className="block text-sm">
          Your name
          <Input value={name} onChange={(e) => setName(e.target.value)} maxLength={40} autoFocus aria-label="Your name" />
        </label>
        {join.error && <p role="alert" className="text-sm text-rose-300">{errorMessage(join.error)}</p>}
        <Button type="submit" variant="primary" busy={join.isPending}>Join as guest</Button>
      </form>
    </PageColumn>
  );
}

function GuestBoard({ token, boardId, title, name }: { token: string; boardId: number; title: string; name: string }) {
  const session = useBoardSession(String(boardId), 'viewer', { user: { id: `guest-${name}`, name }, shareToken: token });
  const sim = useLiveSim(session, { tryOut: true });
  const lesson = useLesson(session);
  return (
    <div className="flex min-h-0 flex-1 flex-col" data-testid="guest-board">
      <PageTitle>{session.board.title || title}</PageTitle>
      <header className="flex min-h-11 shrink-0 items-center gap-4 border-b border-mat-700 bg-mat-900/90 px-4 py-1.5">
        <h1 className="font-semibold">{session.board.title || title}</h1>
        <span className="text-xs text-slate-400">guest view · {name} · read-only</span>
      </header>
      <PulseStyle wireIds={sim.pulsingWires} lampIds={sim.oscillatingOutputs} />
      <BoardWorkspace session={session} levels={sim.levels} partBadges={sim.partBadges} onTryOut={sim.tryOut.set} tryOutValues={sim.tryOut.values}
        highlight={lesson.highlight}
        // the panels and the timing strip are chunks of their own: the canvas does not wait for them
        panels={<ChunkBoundary what="bench"><BenchPanel sim={sim} session={session} /><LessonPanel lesson={lesson} session={session} /></ChunkBoundary>}
        bottom={<ChunkBoundary what="timing strip"><TimingStrip {...sim.timing} /></ChunkBoundary>} />
    </div>
  );
}
