import { Button } from '../../../components/ui/button';
import { plural } from '../../../lib/plural';
import { useRef } from 'react';
import { useViewportFollow, useViewportPublish, type BoardSession } from '../../canvas';
import { useHands } from '../use-audience';
import type { Lesson } from '../use-lesson';

/**
 * The lesson panel: lead / follow (start leading, follow again, how many follow, spotlight) and
 * explain, step by step (pick an input row; back, forward, play; the reason of each output change).
 * Mounted among the workspace's panels (under its canvas provider, for the viewport).
 */
export function LessonPanel({ lesson, session }: { lesson: Lesson; session: BoardSession }) {
  useViewportPublish(lesson.leading, lesson.setViewport);
  useViewportFollow(lesson.leader?.lead.viewport ?? null, lesson.following, () => lesson.setFollowing(false));
  return (
    <section aria-label="Lesson" data-testid="lesson-panel" className="space-y-3 border-t border-mat-700 p-3 text-sm">
      <LeadFollow lesson={lesson} session={session} />
      <Hands session={session} />
      <Explain lesson={lesson} />
    </section>
  );
}

function LeadFollow({ lesson: l, session }: { lesson: Lesson; session: BoardSession }) {
  const selection = () => {
    const s = (session.provider.awareness.getLocalState() as { selection?: unknown } | null)?.selection;
    return Array.isArray(s) ? s.filter((x): x is string => typeof x === 'string') : [];
  };
  if (l.leading) {
    return (
      <div className="space-y-2" data-testid="leading">
        <div className="flex items-center gap-2">
          <span className="font-semibold text-amber-300">Leading</span>
          <span className="text-xs text-slate-400" data-testid="follower-count">
            {plural(l.audience, 'viewer')} watching{l.editorFollowers ? ` · ${plural(l.editorFollowers, 'editor')} following` : ''}
          </span>
          <Button size="sm" variant="ghost" className="ml-auto" onClick={() => l.setLeading(false)}>Stop leading</Button>
        </div>
        <div className="flex items-center gap-2">
          <Button size="sm" onClick={() => l.setSpotlight(selection())}>Spotlight selection</Button>
          {l.spotlight.length > 0 && <Button size="sm" variant="ghost" onClick={() => l.setSpotlight([])}>Clear spotlight ({l.spotlight.length})</Button>}
        </div>
        <p className="text-[11px] text-slate-500">Everyone following sees your view, your spotlight and your explain step.</p>
      </div>
    );
  }
  if (l.leader) {
    return l.following ? (
      <div className="flex items-center gap-2" data-testid="following">
        <span className="text-xs">Following <b>{l.leader.name}</b></span>
        <Button size="sm" variant="ghost" className="ml-auto" onClick={() => l.setFollowing(false)}>Stop following</Button>
      </div>
    ) : (
      <div className="flex items-center gap-2" data-testid="not-following">
        <span className="text-xs text-slate-400">{l.leader.name} is leading</span>
        <Button size="sm" className="ml-auto" onClick={() => l.setFollowing(true)}>Follow again</Button>
      </div>
    );
  }
  return l.canLead ? (
    <div className="flex items-center gap-2">
      <span className="text-xs text-slate-400">Show the class your view</span>
      <Button size="sm" className="ml-auto" onClick={() => { l.setLeading(true); l.setFollowing(true); }}>Start leading</Button>
    </div>
  ) : null;
}

/**
 * Raise hand. A viewer (guest) raises or lowers its hand through its own presence field `hand`; the
 * server gathers the raised hands into its audience entry, which every screen gets. Editors see the
 * list and clear one hand or all (presence field `clearHands`); a cleared hand stays down until its
 * viewer raises it again.
 */
function Hands({ session }: { session: BoardSession }) {
  const aw = session.provider.awareness;
  const hands = useHands(aw);
  const seq = useRef(0);
  if (session.readOnly) {
    const mine = hands.some((h) => h.id === aw.clientID);
    const toggle = () => {
      if (mine) return aw.setLocalStateField('hand', false);
      // a hand the leader cleared is still `true` here: lower it first so the server takes the new raise
      aw.setLocalStateField('hand', false);
      aw.setLocalStateField('hand', true);
    };
    return (
      <div className="flex items-center gap-2" data-testid="raise-hand">
        <span className="text-xs text-slate-400">{mine ? 'Your hand is up' : 'A question?'}</span>
        <Button size="sm" className="ml-auto" aria-pressed={mine} onClick={toggle}>{mine ? 'Lower hand' : 'Raise hand'}</Button>
      </div>
    );
  }
  const clear = (ids: number[] | 'all') => aw.setLocalStateField('clearHands', { seq: Date.now() * 10 + (seq.current++ % 10), ids });
  return (
    <div className="space-y-1" data-testid="hands">
      <div className="flex items-center gap-2">
        <span className="text-xs font-semibold">Hands up</span>
        <span className="text-xs text-slate-400" data-testid="hand-count">{hands.length}</span>
        {hands.length > 1 && <Button size="sm" variant="ghost" className="ml-auto" onClick={() => clear('all')}>Clear all</Button>}
      </div>
      {hands.length > 0 && (
        <ul aria-label="Raised hands" className="space-y-1">
          {hands.map((h) => (
            <li key={h.id} className="flex items-center gap-2 text-xs" data-testid="hand-row">
              <span>✋ {h.name}</span>
              <Button size="sm" variant="ghost" className="ml-auto" onClick={() => clear([h.id])}>Clear</Button>
            </li>
          ))}
        </ul>
      )}
    </div>
  );
}

function rowLabel(names: string[], row: number): string {
  return names.map((n, i) => `${n}=${(row >> (names.length - 1 - i)) & 1}`).join(' ');
}

function Explain({ lesson: l }: { lesson: Lesson }) {
  if (!l.open) {
    return (
      <div className="flex items-center gap-2">
        <h2 className="font-semibold text-amber-300">Explain</h2>
        <span className="text-xs text-slate-400">the settle of one input row, step by step</span>
        <Button size="sm" className="ml-auto" onClick={() => l.setOpen(true)}>Open</Button>
      </div>
    );
  }
  const ex = l.explanation;
  const total = ex?.steps.length ?? 0;
  const cur = ex && l.step > 0 ? ex.steps[l.step - 1] : null;
  return (
    <div className="space-y-2" data-testid="explain">
      <header className="flex items-center gap-2">
        <h2 className="font-semibold text-amber-300">Explain</h2>
        <Button size="sm" variant="ghost" className="ml-auto" onClick={() => { l.setPlaying(false); l.setOpen(false); }}>Close</Button>
      </header>
      {l.problem && <p className="text-xs text-red-300">{l.problem}</p>}
      {!l.problem && l.rowCount <= 1 && l.inputNames.length === 0 && <p className="text-xs text-slate-400">This board has no switches or buttons: its one row is the power-on settle.</p>}
      <label className="flex items-center gap-2 text-xs">
        Input row
        <select aria-label="Input row" data-testid="explain-row" value={l.row} onChange={(e) => l.setRow(Number(e.target.value))}
          className="h-7 min-w-0 flex-1 rounded border border-mat-600 bg-mat-800 px-1 font-mono text-xs">
          {Array.from({ length: l.rowCount }, (_, r) => <option key={r} value={r}>{r}: {rowLabel(l.inputNames, r)}</option>)}
        </select>
      </label>
      <div className="flex items-center gap-1">
        <Button size="sm" variant="ghost" aria-label="Back" data-testid="explain-back" disabled={l.step === 0} onClick={() => l.setStep(l.step - 1)}>◀ Back</Button>
        <Button size="sm" aria-label="Forward" data-testid="explain-forward" disabled={l.step >= total} onClick={() => l.setStep(l.step + 1)}>Forward ▶</Button>
        <Button size="sm" variant="ghost" data-testid="explain-play" disabled={l.step >= total && !l.playing} onClick={() => l.setPlaying(!l.playing)}>{l.playing ? 'Pause' : 'Play'}</Button>
        <span className="ml-auto text-xs text-slate-400" data-testid="explain-position">step {l.step} of {total}</span>
      </div>
      <p className="min-h-10 rounded border border-mat-600 bg-mat-900 p-2 text-xs" data-testid="explain-reason" aria-live="polite">
        {cur ? cur.reason : l.step === 0 ? 'Start: every gate output unknown (X), the row\'s inputs about to be set. Step forward.' : ''}
      </p>
      {ex && l.step >= total && total > 0 && (
        <p className="text-[11px] text-slate-400" data-testid="explain-done">{ex.settled ? 'Settled: nothing changes any more.' : 'Still changing: this row oscillates.'}</p>
      )}
    </div>
  );
}
