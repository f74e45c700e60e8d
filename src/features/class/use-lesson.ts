/**
 * A lesson on the board: explain, step by step (one input row's settle replayed, one output change at a
 * time, with its reason), and lead / follow (the leader's viewport, spotlight and explain step go out
 * through awareness at most ten times a second; followers move with them until they pan by hand).
 */
import { useCallback, useEffect, useMemo, useRef, useState } from 'react';
import { compileBoard, explainInputs, explainRow, explainRowCount, type Explanation } from '../../../shared/sim';
import type { BoardSession, SizedViewport } from '../canvas';
import { editorsFollowing, readLeader, type Lead, type Leader } from './lead';
import { useAudience } from './use-audience';

/** Interval of play and of the leader's awareness updates (10 Hz). */
const PLAY_MS = 700;
const PUBLISH_MS = 100;

export interface Lesson {
  // explain
  open: boolean;
  setOpen(open: boolean): void;
  inputNames: string[];
  rowCount: number;
  row: number;
  setRow(row: number): void;
  /** 0: the start (inputs set, nothing settled yet); k: the k-th change shown */
  step: number;
  setStep(step: number): void;
  playing: boolean;
  setPlaying(playing: boolean): void;
  explanation: Explanation | null;
  problem: string | null;
  // lead / follow
  canLead: boolean;
  leading: boolean;
  setLeading(leading: boolean): void;
  leader: Leader | null;
  following: boolean;
  setFollowing(following: boolean): void;
  /** viewers and guests in the room (the server's audience count; their states are not fanned out) */
  audience: number;
  /** editors whose awareness says they follow this leader */
  editorFollowers: number;
  spotlight: string[];
  setSpotlight(ids: string[]): void;
  /** the leader's canvas viewport, given by the panel (under the canvas provider) */
  setViewport(v: SizedViewport): void;
  /** part ids to outline on the canvas, or undefined */
  highlight: ReadonlySet<string> | undefined;
}

export function useLesson(session: BoardSession): Lesson {
  const aw = session.provider.awareness;
  const canLead = !session.readOnly;
  const audience = useAudience(aw);
  const [open, setOpen] = useState(false);
  const [row, setRowState] = useState(0);
  const [step, setStep] = useState(0);
  const [playing, setPlaying] = useState(false);
  const [leading, setLeading] = useState(false);
  const [following, setFollowing] = useState(true);
  const [spotlight, setSpotlight] = useState<string[]>([]);
  const [leader, setLeader] = useState<Leader | null>(null);
  const [editorFollowers, setEditorFollowers] = useState(0);
  const viewport = useRef<SizedViewport | null>(null);

  // the leader, re-read at most once per frame
  useEffect(() => {
    let raf = 0;
    const read = () => {
      raf = 0;
      const states = aw.getStates();
      const next = readLeader(states, aw.clientID);
      setLeader((prev) => (prev && next && prev.clientId === next.clientId && JSON.stringify(prev.lead) === JSON.stringify(next.lead) && prev.name === next.name ? prev : next));
      setEditorFollowers(editorsFollowing(states, aw.clientID));
    };
    const onChange = () => { if (!raf) raf = requestAnimationFrame(read); };
    aw.on('change', onChange);
    read();
    return () => { aw.off('change', onChange); if (raf) cancelAnimationFrame(raf); };
  }, [aw]);

  const activeLeader = leading ? null : leader;
  const followingNow = following && activeLeader !== null;

  // editors say whom they follow (viewers' states stay on the server: the audience count covers them)
  useEffect(() => {
    if (session.readOnly) return;
    aw.setLocalStateField('follow', followingNow ? activeLeader.clientId : null);
  }, [aw, session.readOnly, followingNow, activeLeader?.clientId]);

  const setRow = useCallback((r: number) => { setRowState(r); setStep(0); setPlaying(false); }, []);

  // a follower takes the leader's explain row and step when they change
  const leadRow = activeLeader?.lead.explain?.row;
  const leadStep = activeLeader?.lead.explain?.step;
  useEffect(() => {
    if (!following || leadRow === undefined || leadStep === undefined) return;
    setOpen(true);
    setRowState(leadRow);
    setStep(leadStep);
    setPlaying(false);
  }, [following, leadRow, leadStep]);

  const compiled = useMemo(() => {
    if (!open) return { netlist: null, problem: null };
    try {
      return { netlist: compileBoard(session.board), problem: null };
    } catch (e) {
      return { netlist: null, problem: e instanceof Error ? e.message : String(e) };
    }
  }, [open, session.board]);
  const netlist = compiled.netlist;
  const rowCount = netlist ? explainRowCount(netlist) : 0;
  const inputNames = useMemo(() => (netlist ? explainInputs(netlist).map((p) => p.name) : []), [netlist]);
  const explanation = useMemo(() => (netlist && row < rowCount ? explainRow(netlist, row) : null), [netlist, row, rowCount]);
  const total = explanation?.steps.length ?? 0;

  useEffect(() => {
    if (!playing) return;
    if (step >= total) { setPlaying(false); return; }
    const t = setTimeout(() => setStep((s) => Math.min(total, s + 1)), PLAY_MS);
    return () => clearTimeout(t);
  }, [playing, step, total]);

  // the leader's state, sent at most every 100 ms (10 Hz) while it changes; null when leading stops
  const now = useRef({ spotlight, open, row, step });
  now.current = { spotlight, open, row, step };
  const setViewport = useCallback((v: SizedViewport) => { viewport.current = { x: v.x, y: v.y, zoom: v.zoom, w: v.w, h: v.h }; }, []);
  useEffect(() => {
    if (!leading) return;
    let sent = '';
    const send = () => {
      if (!viewport.current) return;
      const { spotlight: spot, open: o, row: r, step: s } = now.current;
      const lead: Lead = { viewport: viewport.current, spotlight: spot.length ? spot : undefined, explain: o ? { row: r, step: s } : null };
      const json = JSON.stringify(lead);
      if (json === sent) return;
      sent = json;
      aw.setLocalStateField('lead', lead);
    };
    send();
    const t = setInterval(send, PUBLISH_MS);
    return () => { clearInterval(t); aw.setLocalStateField('lead', null); };
  }, [leading, aw]);

  const current = explanation && step > 0 ? explanation.steps[step - 1] : null;
  const shownSpotlight = leading ? spotlight : followingNow ? activeLeader.lead.spotlight ?? [] : [];
  const highlight = useMemo(() => {
    const ids = [...shownSpotlight];
    if (open && current) ids.push(current.partId);
    return ids.length ? new Set(ids) : undefined;
  }, [open, current, shownSpotlight.join('\n')]);

  return {
    open, setOpen, inputNames, rowCount, row, setRow, step, setStep: (s: number) => setStep(Math.max(0, Math.min(total, s))), playing, setPlaying,
    explanation, problem: compiled.problem,
    canLead, leading, setLeading, leader: activeLeader, following: followingNow, setFollowing,
    audience, editorFollowers, spotlight, setSpotlight, setViewport, highlight,
  };
}
